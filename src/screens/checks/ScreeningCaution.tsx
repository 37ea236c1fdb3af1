/**
 * The screening notice for feed checks and the calculator (docs/domain.md: these are
 * screening checks, not a coverage prediction; defer to a full path-profile study and to
 * the licensing authority's rules).
 */
import { StyleSheet, Text } from 'react-native';
import { Caution } from '@/src/components/Caution';
import { type } from '@/src/theme';

export const SCREENING_DETAIL =
  'They are for planning conversations, not a coverage prediction or a licence study. Free space over a smooth earth (k = 4/3, heights above sea level) is an optimistic bound: terrain, clutter and interference are left out. Defer to a full path profile, the local codes and licensed practice.';

export function ScreeningCaution({ testID }: { testID?: string }) {
  return (
    <Caution testID={testID ?? 'screening-caution'}>
      <Text style={styles.body}>{SCREENING_DETAIL}</Text>
    </Caution>
  );
}

const styles = StyleSheet.create({
  body: { ...type.body, fontSize: 16, lineHeight: 22 },
});

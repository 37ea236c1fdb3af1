/**
 * Previous and next page, with where the person is in words:
 * "Page 2 of 13, sites 26-50 of 312".
 */
import { StyleSheet, Text, View } from 'react-native';
import { Button } from '@/src/components/Button';
import { useBreakpoints } from '@/src/hooks/useBreakpoints';
import { space, type } from '@/src/theme';
import { pageCount, rangeText } from '../listQuery';

export interface PagerProps {
  page: number;
  pageSize: number;
  total: number;
  /** "sites" */
  noun: string;
  onPage: (page: number) => void;
  testID?: string;
}

export function Pager({ page, pageSize, total, noun, onPage, testID = 'pager' }: PagerProps) {
  const { wide } = useBreakpoints();
  const pages = pageCount(total, pageSize);
  const where = (
    <Text style={[styles.where, wide && styles.whereWide]} accessibilityLiveRegion="polite" testID={`${testID}-where`}>
      {`Page ${page} of ${pages}, ${noun} ${rangeText(page, pageSize, total)}`}
    </Text>
  );
  const previous = <Button label="Previous page" variant="secondary" disabled={page <= 1} onPress={() => onPage(page - 1)} testID={`${testID}-previous`} />;
  const next = <Button label="Next page" variant="secondary" disabled={page >= pages} onPress={() => onPage(page + 1)} testID={`${testID}-next`} />;
  // On a phone the words take their own line above the two buttons.
  return wide ? (
    <View style={styles.row} testID={testID}>
      {previous}
      {where}
      {next}
    </View>
  ) : (
    <View style={styles.column} testID={testID}>
      {where}
      <View style={styles.row}>
        {previous}
        {next}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.sm },
  column: { gap: space.sm },
  where: { ...type.small, fontVariant: ['tabular-nums'] },
  whereWide: { flexShrink: 1, textAlign: 'center' },
});

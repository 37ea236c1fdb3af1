/**
 * One feed check as a row: its name in words, the value with its unit, the limit, the state
 * in words and shape, how sure the limit is, and the server's note on what was compared.
 * On a phone the parts stack; on a wide window name, value, limit and state line up.
 */
import { StyleSheet, Text, View } from 'react-native';
import type { FeedCheck } from '@/shared/schemas/checks';
import { useBreakpoints } from '@/src/hooks/useBreakpoints';
import { colors, space, type } from '@/src/theme';
import { CHECK_TITLES, confidenceWords, limitWords, stateWords, valueWords } from './checkWords';
import { StateTag } from './StateTag';

export function CheckRow({ check }: { check: FeedCheck }) {
  const { wide } = useBreakpoints();
  const state = stateWords(check);
  const limit = limitWords(check);
  const sure = limit ? confidenceWords(check.limitConfidence) : null;
  const quiet = state.state === 'notApplicable';
  // The note repeats "not applicable:" or "not computed:" that the tag already says.
  const note = state.state === 'notApplicable' ? state.reason : state.state === 'notComputed' ? null : check.note;
  const testID = `check-${check.name}`;

  const value = (
    <Text style={[styles.value, quiet && styles.muted]} testID={`${testID}-value`}>
      {check.value === null ? '—' : valueWords(check)}
    </Text>
  );
  const limitText = limit ? (
    <Text style={styles.limit}>
      {limit}
      {sure ? <Text style={styles.sure}>{` (${sure})`}</Text> : null}
    </Text>
  ) : wide && state.state === 'figure' ? (
    <Text style={[styles.limit, styles.muted]}>no limit</Text>
  ) : null;
  const tag = <StateTag words={state.words} shape={state.shape} tone={state.tone} testID={`${testID}-state`} />;

  return (
    <View style={[styles.row, state.state === 'fails' && styles.failing]} role="listitem" testID={testID}>
      {wide ? (
        <View style={styles.line}>
          <Text style={[styles.name, styles.nameWide]}>{CHECK_TITLES[check.name]}</Text>
          <View style={styles.valueWide}>{value}</View>
          <View style={styles.limitWide}>{limitText}</View>
          <View style={styles.stateWide}>{tag}</View>
        </View>
      ) : (
        <>
          <Text style={styles.name}>{CHECK_TITLES[check.name]}</Text>
          {tag}
          {check.value !== null || limitText ? (
            <View style={styles.figures}>
              {check.value !== null ? value : null}
              {limitText}
            </View>
          ) : null}
        </>
      )}
      {note ? (
        <Text style={styles.note} selectable>
          {note}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { paddingVertical: space.md, paddingHorizontal: space.md, gap: space.xs, borderBottomWidth: 1, borderBottomColor: colors.line },
  failing: { borderLeftWidth: 6, borderLeftColor: colors.bad, backgroundColor: colors.badSoft },
  line: { flexDirection: 'row', alignItems: 'flex-start', gap: space.md },
  name: { ...type.label, fontSize: 17, lineHeight: 22 },
  nameWide: { flex: 3 },
  valueWide: { flex: 2, alignItems: 'flex-end' },
  limitWide: { flex: 3 },
  stateWide: { flex: 3 },
  figures: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.md, rowGap: space.xxs },
  value: { ...type.figure, fontSize: 17 },
  limit: { ...type.body, fontSize: 16, lineHeight: 22 },
  sure: { ...type.small, fontStyle: 'italic' },
  muted: { color: colors.inkMuted },
  note: { ...type.small, fontSize: 14, lineHeight: 19 },
});

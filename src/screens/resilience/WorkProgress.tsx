/**
 * How far a piece of work the server does in the background has got (the
 * critical pairs, the proposals ranking): a sentence with the percentage in
 * words and a bar, announced as a progress bar. The rest of the screen stays
 * usable meanwhile.
 */
import { StyleSheet, Text, View } from 'react-native';
import { formatCount } from '@/shared/format';
import { colors, space, type } from '@/src/theme';

export function WorkProgress({ what, label, progress, testID }: { what: string; label: string; progress: { done: number; total: number; percent: number }; testID: string }) {
  const { percent, done, total } = progress;
  return (
    <View style={styles.wrap} testID={testID} accessibilityRole="progressbar" accessibilityLabel={label} accessibilityValue={{ min: 0, max: 100, now: percent }}>
      <Text style={styles.body}>{`${what}: ${percent} % done (${formatCount(done)} of ${formatCount(total)} steps). The rest of this screen works meanwhile.`}</Text>
      <View style={styles.track}>
        <View style={[styles.bar, { width: `${Math.max(2, percent)}%` }]} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  body: { ...type.body, fontSize: 16 },
  track: { height: 12, borderRadius: 6, backgroundColor: colors.accentSoft, overflow: 'hidden' },
  bar: { height: 12, backgroundColor: colors.accent },
});

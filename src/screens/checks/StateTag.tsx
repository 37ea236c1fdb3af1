/**
 * A check's state or a failure's severity as a tag: shape, then words. Unlike Badge it wraps,
 * because "not computed: ..." names the missing field and can be long on a phone.
 */
import { StyleSheet, Text, View } from 'react-native';
import { StatusShape } from '@/src/components/StatusShape';
import { colors, radius, space, type } from '@/src/theme';
import type { StateShape, StateTone } from './checkWords';

const TONES: Record<StateTone, { ink: string; fill: string }> = {
  good: { ink: colors.good, fill: colors.goodSoft },
  bad: { ink: colors.bad, fill: colors.badSoft },
  warn: { ink: colors.warn, fill: colors.warnSoft },
  neutral: { ink: colors.inkMuted, fill: colors.sunken },
};

export function StateTag({ words, shape, tone, testID }: { words: string; shape: StateShape; tone: StateTone; testID?: string }) {
  const t = TONES[tone];
  return (
    <View style={[styles.tag, { backgroundColor: t.fill, borderColor: t.ink }]} testID={testID}>
      {shape ? (
        <View style={styles.shape}>
          <StatusShape shape={shape} color={t.ink} />
        </View>
      ) : (
        // A dash keeps "does not apply" and "for reference" from looking like a missing shape.
        <Text style={[styles.dash, { color: t.ink }]} aria-hidden>
          –
        </Text>
      )}
      <Text style={[styles.words, { color: t.ink }]}>{words}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  tag: {
    flexDirection: 'row',
    alignItems: 'flex-start',
    alignSelf: 'flex-start',
    maxWidth: '100%',
    gap: space.xs + 2,
    paddingHorizontal: space.sm + 2,
    paddingVertical: space.xxs + 1,
    borderRadius: radius.md,
    borderWidth: 1,
  },
  shape: { paddingTop: 3 },
  dash: { ...type.label, fontSize: 14, lineHeight: 18 },
  words: { ...type.label, fontSize: 14, lineHeight: 18, flexShrink: 1 },
});

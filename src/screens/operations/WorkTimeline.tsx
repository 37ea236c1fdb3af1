/**
 * Planned works on a week or month timeline (wide screens): overlapping
 * works stacked in lanes; a clashing work carries a triangle and the word
 * "clash", never colour alone.
 */
import { useRouter } from 'expo-router';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import type { WorkAnswer } from '@/shared/schemas/operations';
import { StatusShape } from '@/src/components/StatusShape';
import { colors, radius, space, type } from '@/src/theme';
import { lanes } from './lanes';

const DAY = 86_400_000;

export function WorkTimeline({ works, from, days }: { works: readonly WorkAnswer[]; from: Date; days: number }) {
  const router = useRouter();
  const t0 = from.getTime();
  const span = days * DAY;
  const visible = works.filter((w) => Date.parse(w.end) > t0 && Date.parse(w.start) < t0 + span);
  const stacked = lanes(visible);
  const ticks = Array.from({ length: days }, (_, i) => new Date(t0 + i * DAY));
  const pct = (ms: number) => `${Math.max(0, Math.min(100, ((ms - t0) / span) * 100))}%` as `${number}%`;
  return (
    <View style={styles.wrap} testID="works-timeline">
      <View style={styles.ticks}>
        {ticks.map((d, i) =>
          days <= 7 || d.getDate() === 1 || d.getDay() === 1 ? (
            <Text key={i} style={[styles.tick, { left: pct(d.getTime()) }]}>
              {d.toLocaleDateString('en-GB', { weekday: days <= 7 ? 'short' : undefined, day: 'numeric', month: 'short' })}
            </Text>
          ) : null,
        )}
      </View>
      {stacked.length === 0 ? <Text style={styles.none}>No planned work in this period.</Text> : null}
      {stacked.map((lane, i) => (
        <View key={i} style={styles.lane}>
          {lane.map((w) => {
            const left = pct(Date.parse(w.start));
            const right = Math.max(0, Math.min(100, ((Date.parse(w.end) - t0) / span) * 100));
            const width = `${Math.max(1.5, right - parseFloat(left))}%` as `${number}%`;
            const clash = w.clashes.length > 0;
            return (
              <Pressable
                key={w.code}
                onPress={() => router.push(`/works/${w.code}`)}
                accessibilityRole="link"
                accessibilityLabel={`${w.code} ${w.title}, ${w.stateLabel}${clash ? `, clashes with ${w.clashes.map((c) => c.work).join(', ')}` : ''}`}
                style={[styles.bar, { left, width }, clash && styles.clashBar, w.state === 'draft' && styles.draftBar]}
                testID={`timeline-${w.code}`}
              >
                {clash ? <StatusShape shape="triangle" color={colors.warn} size={14} /> : null}
                <Text numberOfLines={1} style={styles.barText}>{`${w.code}${clash ? ' clash' : ''} · ${w.title}`}</Text>
              </Pressable>
            );
          })}
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, padding: space.md, gap: space.xs, backgroundColor: colors.surface },
  ticks: { height: 22, position: 'relative' },
  tick: { position: 'absolute', ...type.small, fontSize: 12 },
  lane: { height: 44, position: 'relative' },
  bar: {
    position: 'absolute',
    top: 2,
    bottom: 2,
    borderRadius: radius.sm,
    borderWidth: 1,
    borderColor: colors.accent,
    backgroundColor: colors.accentSoft,
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.xs,
    paddingHorizontal: space.xs,
    overflow: 'hidden',
  },
  clashBar: { borderColor: colors.warn, borderWidth: 2, backgroundColor: colors.warnSoft },
  draftBar: { borderStyle: 'dashed' },
  barText: { ...type.small, color: colors.ink, flexShrink: 1 },
  none: { ...type.small },
});

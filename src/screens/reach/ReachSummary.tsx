/**
 * The four figures an operations desk reads first: carriages off air and on
 * reserve, households off air and on reserve (docs/domain.md rules 4, 5 and 7).
 * Each figure's text is the bare number, so it can be read out and tested.
 */
import { StyleSheet, Text, View } from 'react-native';
import type { BriefReachShown } from '@/src/api/queries/analysis';
import { formatCount } from '@/shared/format';
import { Columns } from '@/src/components/layout/Columns';
import { StatusShape, type ShapeName } from '@/src/components/StatusShape';
import { colors, fonts, radius, space, type } from '@/src/theme';

function Figure({ label, value, unit, shape, color, testID }: { label: string; value: number; unit: string; shape: ShapeName; color: string; testID: string }) {
  return (
    <View style={[styles.tile, { borderLeftColor: color }]} accessibilityLabel={`${label}: ${formatCount(value)} ${unit}`}>
      <View style={styles.head}>
        <StatusShape shape={shape} color={color} size={16} />
        <Text style={styles.label}>{label}</Text>
      </View>
      <Text style={styles.figure} testID={testID}>
        {formatCount(value)}
      </Text>
      <Text style={styles.unit}>{unit}</Text>
    </View>
  );
}

export function ReachSummary({ reach }: { reach: BriefReachShown }) {
  return (
    <Columns max={2} phone={2} testID="reach-summary">
      <Figure label="Off air" value={reach.counts?.lost ?? reach.lost.length} unit="carriages" shape="cross" color={colors.bad} testID="reach-lost-count" />
      <Figure label="On reserve" value={reach.counts?.fallback ?? reach.fallback.length} unit="carriages" shape="half" color={colors.warn} testID="reach-fallback-count" />
      <Figure label="Off air" value={reach.households.lost} unit="households" shape="cross" color={colors.bad} testID="reach-households-lost" />
      <Figure label="On reserve" value={reach.households.fallback} unit="households" shape="half" color={colors.warn} testID="reach-households-fallback" />
    </Columns>
  );
}

const styles = StyleSheet.create({
  tile: {
    backgroundColor: colors.surface,
    borderWidth: 1,
    borderColor: colors.line,
    borderLeftWidth: 6,
    borderRadius: radius.lg,
    padding: space.md,
    gap: space.xxs,
    flexGrow: 1,
  },
  head: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  label: { ...type.label },
  figure: { fontFamily: fonts.monoBold, fontSize: 30, lineHeight: 38, color: colors.ink, fontVariant: ['tabular-nums'] },
  unit: { ...type.small },
});

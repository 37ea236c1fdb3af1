/**
 * A short status label: a shape, then words, on a tinted pill. The words carry
 * the meaning; shape and colour repeat it for a quick glance.
 *
 *   <Badge label="admin" tone="accent" />
 *   <Badge label="3 warnings" tone="warn" shape="triangle" />
 */
import { StyleSheet, Text, View } from 'react-native';
import { colors, radius, space, type } from '@/src/theme';
import { StatusShape, type ShapeName } from './StatusShape';

export type Tone = 'neutral' | 'accent' | 'good' | 'warn' | 'bad';

const TONES: Record<Tone, { ink: string; fill: string }> = {
  neutral: { ink: colors.inkMuted, fill: colors.sunken },
  accent: { ink: colors.accent, fill: colors.accentSoft },
  good: { ink: colors.good, fill: colors.goodSoft },
  warn: { ink: colors.warn, fill: colors.warnSoft },
  bad: { ink: colors.bad, fill: colors.badSoft },
};

export interface BadgeProps {
  label: string;
  tone?: Tone;
  /** Omit for a plain word badge (a role, a kind). */
  shape?: ShapeName;
  testID?: string;
}

export function Badge({ label, tone = 'neutral', shape, testID }: BadgeProps) {
  const t = TONES[tone];
  return (
    <View style={[styles.pill, { backgroundColor: t.fill, borderColor: t.ink }]} testID={testID}>
      {shape && <StatusShape shape={shape} color={t.ink} />}
      <Text style={[styles.text, { color: t.ink }]}>{label}</Text>
    </View>
  );
}

export type AirStatus = 'on-air' | 'off-air' | 'on-reserve';

const AIR: Record<AirStatus, { label: string; tone: Tone; shape: ShapeName }> = {
  'on-air': { label: 'on air', tone: 'good', shape: 'solid' },
  'on-reserve': { label: 'on reserve', tone: 'warn', shape: 'half' },
  'off-air': { label: 'off air', tone: 'bad', shape: 'cross' },
};

/** A carriage's or site's state in plain words: "on air", "on reserve", "off air". */
export function StatusPill({ status, testID }: { status: AirStatus; testID?: string }) {
  const s = AIR[status];
  return <Badge label={s.label} tone={s.tone} shape={s.shape} testID={testID} />;
}

const styles = StyleSheet.create({
  pill: {
    flexDirection: 'row',
    alignItems: 'center',
    alignSelf: 'flex-start',
    gap: space.xs + 2,
    paddingHorizontal: space.sm + 2,
    paddingVertical: space.xxs + 1,
    borderRadius: radius.pill,
    borderWidth: 1,
  },
  text: { ...type.label, fontSize: 14, lineHeight: 18 },
});

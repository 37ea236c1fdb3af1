/**
 * Horizontal bars with their values written on them (inside a long bar,
 * after a short one) and the labels on the left: react-native-svg, sized to
 * the width it is given. The figures are also in the accessible name, so
 * the chart is not only a picture.
 *
 *   <BarChart title="Top 10 by households" unit="households" rows={[{ key: 'O-LPC', label: 'O-LPC', value: 851490 }]} />
 */
import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import Svg, { Line, Rect, Text as SvgText } from 'react-native-svg';
import { colors, fonts, space, type } from '@/src/theme';
import { barScale, valuePlacement } from './barScale';
import { formatCompact, formatCount } from '@/shared/format';

export interface BarRow {
  key: string;
  label: string;
  value: number;
}

const ROW = 30;
const BAR = 20;
const CHAR_PX = 7.8; // 13 px monospaced digits are about 0.6 em wide
const TOP = 20;

export function BarChart({ title, unit, rows, testID }: { title: string; unit: string; rows: readonly BarRow[]; testID?: string }) {
  const [width, setWidth] = useState(0);
  const labelPx = Math.min(160, Math.max(60, Math.max(...rows.map((r) => r.label.length), 4) * 7.5 + 8));
  const track = Math.max(40, width - labelPx - 12);
  // About one tick label per 90 px of track, so labels never run into each other.
  const scale = barScale(
    rows.map((r) => r.value),
    track,
    Math.max(1, Math.min(4, Math.floor(track / 90))),
  );
  const height = TOP + rows.length * ROW + 6;
  const described = `${title} (${unit}): ${rows.map((r) => `${r.label} ${formatCount(r.value)}`).join('; ')}`;
  return (
    <View style={styles.wrap} testID={testID}>
      <Text style={styles.title}>{`${title} (${unit})`}</Text>
      <View onLayout={(e) => setWidth(Math.floor(e.nativeEvent.layout.width))} accessibilityRole="image" accessibilityLabel={described}>
        {width > 0 && rows.length > 0 ? (
          <Svg width={width} height={height} aria-hidden accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
            {scale.ticks.map((t) => {
              const x = labelPx + scale.length(t);
              return (
                <Line key={`t${t}`} x1={x} y1={TOP - 4} x2={x} y2={height - 4} stroke={colors.line} strokeWidth={1} strokeDasharray={t === 0 ? undefined : '3 3'} />
              );
            })}
            {scale.ticks.map((t, i) => (
              <SvgText key={`l${t}`} x={labelPx + scale.length(t)} y={12} fontFamily={fonts.mono} fontSize={11} fill={colors.inkMuted} textAnchor={i === 0 ? 'start' : i === scale.ticks.length - 1 ? 'end' : 'middle'}>
                {formatCompact(t)}
              </SvgText>
            ))}
            {rows.map((r, i) => {
              const y = TOP + i * ROW;
              return (
                <SvgText key={`n${r.key}`} x={labelPx - 8} y={y + BAR / 2 + 4} fontFamily={fonts.mono} fontSize={12} fill={colors.ink} textAnchor="end">
                  {r.label.length > 20 ? `${r.label.slice(0, 19)}…` : r.label}
                </SvgText>
              );
            })}
            {rows.map((r, i) => {
              const y = TOP + i * ROW;
              const len = scale.length(r.value);
              const text = formatCount(r.value);
              const place = valuePlacement(len, text, CHAR_PX);
              return [
                <Rect key={`b${r.key}`} x={labelPx} y={y} width={Math.max(len, 1)} height={BAR} fill={colors.mark} />,
                <SvgText
                  key={`v${r.key}`}
                  x={labelPx + place.x}
                  y={y + BAR / 2 + 4.5}
                  fontFamily={fonts.monoBold}
                  fontSize={13}
                  fill={place.inside ? colors.markInk : colors.ink}
                  textAnchor={place.inside ? 'end' : 'start'}
                >
                  {text}
                </SvgText>,
              ];
            })}
          </Svg>
        ) : null}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  title: { ...type.label },
});

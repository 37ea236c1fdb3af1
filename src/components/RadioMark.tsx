/**
 * The mark of a radio option: a ring, with a dot inside when chosen. Its own
 * shape, so the status shapes (StatusShape: a filled disc is "on air", a ring
 * "unknown") keep their one meaning each.
 */
import Svg, { Circle } from 'react-native-svg';
import { colors } from '@/src/theme';

export function RadioMark({ chosen, size = 14 }: { chosen: boolean; size?: number }) {
  const ink = chosen ? colors.accent : colors.lineStrong;
  return (
    <Svg width={size} height={size} viewBox="0 0 16 16" accessibilityElementsHidden importantForAccessibility="no-hide-descendants" aria-hidden>
      <Circle cx={8} cy={8} r={6.75} fill={colors.surface} stroke={ink} strokeWidth={1.5} />
      {chosen ? <Circle cx={8} cy={8} r={3.5} fill={ink} /> : null}
    </Svg>
  );
}

/** A short sample of a feed's line (./feedStyle.ts), for legends and feed lists. Decorative: the words beside it say the same. */
import Svg, { Line } from 'react-native-svg';
import type { FeedRole, Medium } from '@/shared/schemas/network';
import { colors } from '@/src/theme';
import { feedStrokes } from './feedStyle';

export function FeedSwatch({ medium, role, width = 48, scale = 1.4, background = colors.surface }: { medium: Medium; role: FeedRole; width?: number; scale?: number; background?: string }) {
  const h = 14;
  return (
    <Svg width={width} height={h} aria-hidden accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
      {feedStrokes(medium, role, scale, background).map((l, i) => (
        <Line key={i} x1={2} y1={h / 2} x2={width - 2} y2={h / 2} stroke={l.stroke} strokeWidth={l.width} strokeDasharray={l.dash} />
      ))}
    </Svg>
  );
}

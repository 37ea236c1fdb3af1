/**
 * Feed lines for a dense view, where dash patterns are dropped (see
 * showPatterns in ./viewport.ts): main stays a single dark line and reserve
 * a double line (a wide `mark` stroke with a background core), the role
 * marks the patterned lines use too (src/components/charts/feedStyle.ts).
 * So main and reserve differ by line shape at every density, not by colour
 * alone; no dashes, so thousands of lines stay cheap to draw.
 */
import type { FeedRole } from '@/shared/schemas/network';
import { colors } from '@/src/theme/colors';

export interface PlainStroke {
  stroke: string;
  width: number;
}

export function plainStrokes(role: FeedRole): PlainStroke[] {
  return role === 'main'
    ? [{ stroke: colors.ink, width: 1 }]
    : [
        { stroke: colors.mark, width: 2.6 },
        { stroke: colors.surface, width: 0.9 },
      ];
}

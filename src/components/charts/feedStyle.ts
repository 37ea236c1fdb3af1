/**
 * How a feed is drawn on the chain tree and the network diagram. Meaning is
 * carried by line pattern and words first, colour second (docs/screens.md):
 *   medium -> dash pattern: line solid, microwave dash-dot, satellite long
 *             dashes, off-air dots;
 *   role   -> main is one solid stroke; reserve is a double line (a wide
 *             stroke with a thin gap of background drawn down its middle).
 * The patterns are our own choice (common practice, no source).
 */
import type { FeedRole, Medium } from '@/shared/schemas/network';
import { FEED_ROLE_WORDS } from '@/shared/words';
import { colors } from '@/src/theme/colors';

export const MEDIUM_ORDER: readonly Medium[] = ['line', 'microwave', 'satellite', 'off-air'];
export const ROLE_ORDER: readonly FeedRole[] = ['main', 'reserve'];

/** Dash arrays in px at a 1 px base width, scaled by the stroke's width. */
const DASH: Record<Medium, number[] | null> = {
  line: null,
  microwave: [8, 3, 1.5, 3],
  satellite: [10, 5],
  'off-air': [1.5, 3.5],
};

export const MEDIUM_LABEL: Record<Medium, string> = {
  line: 'line',
  microwave: 'microwave',
  satellite: 'satellite',
  'off-air': 'off-air',
};

export const ROLE_LABEL: Record<FeedRole, string> = FEED_ROLE_WORDS;

export interface StrokeLayer {
  stroke: string;
  width: number;
  dash?: string;
}

/** Stroke width scale: 1 on the diagram, larger on the chain tree. */
export function feedStrokes(medium: Medium, role: FeedRole, scale = 1, background: string = colors.surface): StrokeLayer[] {
  if (!(medium in DASH)) throw new Error(`feedStrokes: unknown medium ${JSON.stringify(medium)}`);
  const outer = role === 'main' ? 2 * scale : 3.6 * scale;
  const dashOf = (w: number) => {
    const pattern = DASH[medium];
    // Dots and dashes grow with the line so the pattern stays readable when thick.
    return pattern ? pattern.map((n) => +(n * Math.max(1, w / 2)).toFixed(2)).join(' ') : undefined;
  };
  const ink = role === 'main' ? colors.ink : colors.mark;
  const layers: StrokeLayer[] = [{ stroke: ink, width: outer, dash: dashOf(outer) }];
  if (role === 'reserve') layers.push({ stroke: background, width: outer / 3, dash: dashOf(outer) });
  return layers;
}

/** "off-air, reserve feed": the words that go with the pattern. */
export function feedWords(medium: Medium, role: FeedRole): string {
  return `${MEDIUM_LABEL[medium]}, ${ROLE_LABEL[role]}`;
}

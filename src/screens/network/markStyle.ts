/**
 * How the diagram's marks are filled and stroked, in one place for every
 * drawing of them: the canvas painter (./paintGeo.ts), the SVG drawing
 * (./NetworkDiagram.tsx), the schematic (./SchematicView.tsx) and the legend
 * (./diagramMarks.tsx). Drawn data takes the `mark` colours; the accent is
 * kept for actions and the current place. Shape carries the meaning (square,
 * diamond, open circle, numbered circle with a double outline, cross,
 * half-filled ring); colour only repeats it.
 */
import type { SiteRole } from '@/shared/schemas/network';
import { colors } from '@/src/theme/colors';

/** A site's mark radius at zoom 1, px, by role. */
export const SITE_R: Record<SiteRole, number> = { origin: 5, main: 5, relay: 3.5 };

export const ROLE_MARK: Record<SiteRole, { fill: string; stroke: string; width: number }> = {
  origin: { fill: colors.ink, stroke: colors.ink, width: 1.2 },
  main: { fill: colors.mark, stroke: colors.ink, width: 1.2 },
  relay: { fill: colors.surface, stroke: colors.ink, width: 1.5 },
};

/** Painted in this order, so origins and main stations stay on top of relays. */
export const ROLE_PAINT_ORDER: readonly SiteRole[] = ['relay', 'main', 'origin'];

/** Nearby sites drawn together: a tinted circle, a wide outline with a thin light line inside it (the double outline). */
export const GROUP_MARK = { fill: colors.markSoft, outer: colors.mark, outerWidth: 3, inner: colors.surface, innerWidth: 1 } as const;

/** Failure marks: off air a cross, on reserve a ring with its left half filled; drawn this far outside the site's mark. */
export const FAIL_MARK = { gap: 4, offStroke: colors.bad, offWidth: 3, reserveStroke: colors.warn, reserveWidth: 2 } as const;

/** The chosen site's ring. */
export const SELECTED_RING = { r: 14, stroke: colors.focus, width: 3 } as const;

/**
 * One pure rule turns a window width into named layout flags, so the shell,
 * the layout primitives and any screen agree on where the layout changes.
 *
 * Boundaries (docs/architecture.md, Client; docs/screens.md):
 * - below 800 px: phone layout, bottom tabs, one column;
 * - `wide` from 800 px: side navigation, two columns;
 * - `roomy` from 1200 px: three columns where a screen asks for them.
 */
export const WIDE_MIN_PX = 800;
export const ROOMY_MIN_PX = 1200;

/** Widest the content column grows; beyond it the column is centred. */
export const CONTENT_MAX_PX = 1120;

export interface Breakpoints {
  /** Side navigation and multi-column screens (>= 800 px). */
  wide: boolean;
  /** Room for a third column (>= 1200 px). */
  roomy: boolean;
  /** How many columns a `Columns` layout may use at most. */
  columns: 1 | 2 | 3;
}

export function breakpointsFor(width: number): Breakpoints {
  if (typeof width !== 'number' || !Number.isFinite(width) || width < 0) {
    throw new RangeError(`breakpointsFor: width must be a finite number >= 0, got ${String(width)}`);
  }
  const wide = width >= WIDE_MIN_PX;
  const roomy = width >= ROOMY_MIN_PX;
  return { wide, roomy, columns: roomy ? 3 : wide ? 2 : 1 };
}

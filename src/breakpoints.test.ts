import { describe, expect, it } from 'vitest';
import { breakpointsFor, ROOMY_MIN_PX, WIDE_MIN_PX } from './breakpoints';

describe('breakpointsFor', () => {
  it('refuses widths that are not a finite number >= 0', () => {
    expect(() => breakpointsFor(-1)).toThrow(/width must be a finite number/);
    expect(() => breakpointsFor(Number.NaN)).toThrow(/width must be a finite number/);
    expect(() => breakpointsFor(Number.POSITIVE_INFINITY)).toThrow(/width must be a finite number/);
  });

  it('keeps the documented boundaries (docs/architecture.md, Client: bottom tabs under 800 px)', () => {
    expect(WIDE_MIN_PX).toBe(800);
    expect(ROOMY_MIN_PX).toBe(1200);
  });

  it('is a phone at 0 and at 390 px', () => {
    expect(breakpointsFor(0)).toEqual({ wide: false, roomy: false, columns: 1 });
    expect(breakpointsFor(390)).toEqual({ wide: false, roomy: false, columns: 1 });
  });

  it('turns wide at exactly 800 px, not at 799', () => {
    expect(breakpointsFor(WIDE_MIN_PX - 1)).toEqual({ wide: false, roomy: false, columns: 1 });
    expect(breakpointsFor(WIDE_MIN_PX)).toEqual({ wide: true, roomy: false, columns: 2 });
  });

  it('turns roomy at exactly 1200 px, not at 1199', () => {
    expect(breakpointsFor(ROOMY_MIN_PX - 1)).toEqual({ wide: true, roomy: false, columns: 2 });
    expect(breakpointsFor(ROOMY_MIN_PX)).toEqual({ wide: true, roomy: true, columns: 3 });
  });

  it('handles fractional widths from zoomed browsers on the right side of a boundary', () => {
    expect(breakpointsFor(799.5).wide).toBe(false);
    expect(breakpointsFor(1440).roomy).toBe(true);
  });
});

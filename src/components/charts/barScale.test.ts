import { describe, expect, it } from 'vitest';
import { barScale, niceCeiling, valuePlacement } from './barScale';

describe('niceCeiling', () => {
  it('refuses negative and non-finite values', () => {
    expect(() => niceCeiling(-1)).toThrow(/finite number >= 0, got -1/);
    expect(() => niceCeiling(Number.NaN)).toThrow(/NaN/);
  });

  it('rounds up to 1, 2, 5 x 10^k (Heckbert 1990)', () => {
    expect(niceCeiling(0)).toBe(1);
    expect(niceCeiling(1)).toBe(1);
    expect(niceCeiling(1.2)).toBe(2);
    expect(niceCeiling(3)).toBe(5);
    expect(niceCeiling(5)).toBe(5);
    expect(niceCeiling(7)).toBe(10);
    expect(niceCeiling(200)).toBe(200);
    expect(niceCeiling(201)).toBe(500);
    expect(niceCeiling(48_213)).toBe(50_000);
    expect(niceCeiling(0.013)).toBe(0.02);
  });

  it('never falls below the value and stays under 2.5 times it (the widest 1-2-5 step)', () => {
    for (const v of [1, 3, 7, 12, 45, 99, 250, 999, 4321, 77_777]) {
      const ours = niceCeiling(v);
      expect(ours).toBeGreaterThanOrEqual(v);
      expect(ours).toBeLessThanOrEqual(2.5 * v);
    }
  });
});

describe('barScale', () => {
  it('checks its arguments', () => {
    expect(() => barScale([1], 0)).toThrow(/trackPx must be a number > 0/);
    expect(() => barScale([1, -2], 100)).toThrow(/got -2/);
  });

  it('maps values to lengths on a nice scale with ticks', () => {
    const s = barScale([120, 60, 0], 300);
    expect(s.max).toBe(200);
    expect(s.length(120)).toBeCloseTo(180, 9);
    expect(s.length(0)).toBe(0);
    expect(s.length(999)).toBe(300);
    expect(s.ticks).toEqual([0, 50, 100, 150, 200]);
  });

  it('copes with all-zero and empty value lists', () => {
    expect(barScale([], 100).max).toBe(1);
    expect(barScale([0, 0], 100).length(0)).toBe(0);
  });
});

describe('valuePlacement', () => {
  it('puts the text inside a long bar and after a short one', () => {
    expect(valuePlacement(200, '12,345', 9)).toEqual({ inside: true, x: 194 });
    expect(valuePlacement(40, '12,345', 9)).toEqual({ inside: false, x: 46 });
    // 6 chars x 9 px + 2 x 6 px padding = 66 px: exactly enough.
    expect(valuePlacement(66, '12,345', 9).inside).toBe(true);
    expect(valuePlacement(65, '12,345', 9).inside).toBe(false);
  });
});

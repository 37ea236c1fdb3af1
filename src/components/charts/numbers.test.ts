import { describe, expect, it } from 'vitest';
import { countOf, formatCompact, formatCount, formatKm } from './numbers';

describe('formatCount', () => {
  it('groups thousands with commas and rounds', () => {
    expect(formatCount(0)).toBe('0');
    expect(formatCount(999)).toBe('999');
    expect(formatCount(1000)).toBe('1,000');
    expect(formatCount(851490)).toBe('851,490');
    expect(formatCount(1234567.6)).toBe('1,234,568');
    expect(formatCount(-4200)).toBe('-4,200');
  });

  it('refuses what is not a number', () => {
    expect(() => formatCount(Number.POSITIVE_INFINITY)).toThrow(/Infinity is not a finite number/);
  });
});

describe('countOf', () => {
  it('says one or many', () => {
    expect(countOf(1, 'carriage')).toBe('1 carriage');
    expect(countOf(2500, 'household')).toBe('2,500 households');
    expect(countOf(0, 'loss', 'losses')).toBe('0 losses');
  });
});

describe('formatKm', () => {
  it('gives one decimal with the unit, or a dash', () => {
    expect(formatKm(41.9999832)).toBe('42.0 km');
    expect(formatKm(null)).toBe('— km');
  });
});

describe('formatCompact', () => {
  it('shortens thousands and millions', () => {
    expect(formatCompact(0)).toBe('0');
    expect(formatCompact(950)).toBe('950');
    expect(formatCompact(1500)).toBe('1.5k');
    expect(formatCompact(250_000)).toBe('250k');
    expect(formatCompact(1_000_000)).toBe('1M');
    expect(formatCompact(2_500_000)).toBe('2.5M');
    expect(formatCompact(0.5)).toBe('0.5');
  });
});

import { describe, expect, it } from 'vitest';
import { countOf, formatCount, formatKm } from './numbers';

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

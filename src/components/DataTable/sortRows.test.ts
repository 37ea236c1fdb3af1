import { describe, expect, it } from 'vitest';
import { compareValues, nextSort, sortRows } from './sortRows';

describe('sortRows', () => {
  const rows = [
    { code: 'S10', km: 12.5 },
    { code: 'S2', km: null },
    { code: 's1', km: 3 },
    { code: 'S3', km: 12.5 },
  ];

  it('refuses an unknown direction', () => {
    expect(() => sortRows(rows, (r) => r.code, 'up' as never)).toThrow(/direction is "asc" or "desc", got "up"/);
  });

  it('orders codes with embedded numbers numerically and ignores case', () => {
    expect(sortRows(rows, (r) => r.code, 'asc').map((r) => r.code)).toEqual(['s1', 'S2', 'S3', 'S10']);
    expect(sortRows(rows, (r) => r.code, 'desc').map((r) => r.code)).toEqual(['S10', 'S3', 'S2', 's1']);
  });

  it('puts blanks last in both directions and keeps ties in their original order', () => {
    expect(sortRows(rows, (r) => r.km, 'asc').map((r) => r.code)).toEqual(['s1', 'S10', 'S3', 'S2']);
    expect(sortRows(rows, (r) => r.km, 'desc').map((r) => r.code)).toEqual(['S10', 'S3', 's1', 'S2']);
  });

  it('does not change the rows it was given', () => {
    const copy = rows.map((r) => ({ ...r }));
    sortRows(rows, (r) => r.code, 'desc');
    expect(rows).toEqual(copy);
  });
});

describe('compareValues', () => {
  it('compares numbers as numbers, not as text', () => {
    expect(compareValues(9, 10)).toBeLessThan(0);
  });
  it('compares dates by time and booleans false before true', () => {
    expect(compareValues(new Date('2024-01-02'), new Date('2024-01-01'))).toBeGreaterThan(0);
    expect(compareValues(false, true)).toBeLessThan(0);
  });
  it('treats NaN and empty text as blank', () => {
    expect(compareValues(Number.NaN, 1)).toBeGreaterThan(0);
    expect(compareValues('', 'a')).toBeGreaterThan(0);
    expect(compareValues(null, undefined)).toBe(0);
  });
});

describe('nextSort', () => {
  it('starts a new column ascending and flips the same column', () => {
    expect(nextSort(null, 'code')).toEqual({ column: 'code', direction: 'asc' });
    expect(nextSort({ column: 'code', direction: 'asc' }, 'code')).toEqual({ column: 'code', direction: 'desc' });
    expect(nextSort({ column: 'code', direction: 'desc' }, 'code')).toEqual({ column: 'code', direction: 'asc' });
    expect(nextSort({ column: 'code', direction: 'desc' }, 'km')).toEqual({ column: 'km', direction: 'asc' });
  });
});

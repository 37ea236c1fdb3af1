import { describe, expect, it } from 'vitest';
import { pageKey } from './useApiPages';

const rowsOf = (a: { rows: number[] }) => a.rows;
const page = (offset: number, n: number, total: number) => ({ offset, total, rows: Array.from({ length: n }, (_, i) => offset + i) });

describe('pageKey', () => {
  it('asks page after page with limit and offset, after the filters already in the address', () => {
    expect(pageKey<ReturnType<typeof page>>('/api/checks', 200, 0, null, rowsOf)).toBe('/api/checks?limit=200&offset=0');
    expect(pageKey('/api/checks?severity=error', 200, 1, page(0, 200, 450), rowsOf)).toBe('/api/checks?severity=error&limit=200&offset=200');
    expect(pageKey('/api/checks', 200, 2, page(200, 200, 450), rowsOf)).toBe('/api/checks?limit=200&offset=400');
  });

  it('stops after a short page, or when the last page ended exactly at the total, and waits without an address', () => {
    expect(pageKey('/api/checks', 200, 3, page(400, 50, 450), rowsOf)).toBeNull();
    expect(pageKey('/api/checks', 200, 2, page(200, 200, 400), rowsOf)).toBeNull();
    expect(pageKey<ReturnType<typeof page>>(null, 200, 0, null, rowsOf)).toBeNull();
  });
});

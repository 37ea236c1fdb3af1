/**
 * The failing checks sorted on the server (GET /api/checks?sort=&direction=):
 * on a generated network with faults of several kinds, pages put together in each order are the whole
 * worst-first list sorted by that column here (ties keeping their worst-first
 * order, yes/no checks without a margin last either way), the counts do not
 * change with the order, and an unknown order is a 400 naming it.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CHECK_NAMES, type CheckFailure } from '@/shared/schemas/checks';
import { generateNetwork } from '@/scripts/generator';
import { appWithNetwork, type TestApp } from '../helpers/testApp';

let t: TestApp;
let worstFirst: CheckFailure[];
beforeAll(async () => {
  // Channel clashes (errors, no margin) from the generator's deliberate faults, and recorded bearings
  // set wrong on some off-air feeds (warnings with a margin in degrees), so every column has something to order.
  const net = generateNetwork({ sites: 300, seed: 5, faultShare: 0.1 });
  net.feeds.forEach((f, i) => {
    if (f.medium === 'off-air' && i % 4 === 0) f.bearingDeg = (i * 37) % 360;
  });
  t = await appWithNetwork(net);
  worstFirst = (await get('/api/checks')).body.failures;
}, 120_000);
afterAll(async () => t?.close());

const get = (p: string) => request(t.app).get(p).set(t.auth('viewer'));

async function allPages(q: string, size: number) {
  const rows: CheckFailure[] = [];
  const counts: unknown[] = [];
  for (let offset = 0; ; offset += size) {
    const r = await get(`/api/checks?${q}&limit=${size}&offset=${offset}`);
    expect(r.status).toBe(200);
    expect(r.body.total).toBe(worstFirst.length);
    counts.push(r.body.counts);
    rows.push(...r.body.failures);
    if (r.body.failures.length < size) return { rows, counts };
  }
}

const text = (a: string, b: string) => a.localeCompare(b, 'en', { numeric: true, sensitivity: 'base' });
const ascending: Record<string, (a: CheckFailure, b: CheckFailure) => number> = {
  severity: (a, b) => (a.severity === b.severity ? 0 : a.severity === 'error' ? -1 : 1),
  feed: (a, b) => text(a.feed, b.feed),
  route: (a, b) => text(a.from, b.from) || text(a.to, b.to),
  check: (a, b) => CHECK_NAMES.indexOf(a.check.name) - CHECK_NAMES.indexOf(b.check.name),
};

/** The worst-first list sorted here by `sort`, ties broken by the worst-first position. */
function expected(sort: string, direction: 'asc' | 'desc'): CheckFailure[] {
  const sign = direction === 'asc' ? 1 : -1;
  const indexed = worstFirst.map((f, i) => ({ f, i }));
  indexed.sort((x, y) => {
    if (sort === 'margin') {
      const xb = x.f.margin === undefined;
      const yb = y.f.margin === undefined;
      if (xb || yb) return xb === yb ? x.i - y.i : xb ? 1 : -1;
      return sign * (x.f.margin! - y.f.margin!) || x.i - y.i;
    }
    return sign * ascending[sort](x.f, y.f) || x.i - y.i;
  });
  return indexed.map((e) => e.f);
}

describe('failing checks sorted on the server', () => {
  it('has failures of more than one kind and severity to sort', () => {
    expect(worstFirst.length).toBeGreaterThan(20);
    expect(new Set(worstFirst.map((f) => f.check.name)).size).toBeGreaterThan(1);
    expect(new Set(worstFirst.map((f) => f.severity)).size).toBe(2);
    expect(worstFirst.some((f) => f.margin === undefined) && worstFirst.some((f) => f.margin !== undefined)).toBe(true);
  });

  it.each(['severity', 'feed', 'route', 'check', 'margin'].flatMap((s) => [[s, 'asc'], [s, 'desc']] as [string, 'asc' | 'desc'][]))('sort=%s&direction=%s: the pages are the whole list in that order, the counts unchanged', async (sort, direction) => {
    const { rows, counts } = await allPages(`sort=${sort}&direction=${direction}`, 13);
    expect(rows).toEqual(expected(sort, direction));
    const unsorted = (await get('/api/checks?limit=1')).body.counts;
    for (const c of counts) expect(c).toEqual(unsorted);
  });

  it('the default order is worst first, and sort=worst&direction=desc its reverse', async () => {
    expect((await allPages('sort=worst&direction=asc', 50)).rows).toEqual(worstFirst);
    expect((await allPages('sort=worst&direction=desc', 50)).rows).toEqual([...worstFirst].reverse());
  });

  it('sorts a filtered list too', async () => {
    const r = await get('/api/checks?severity=error&sort=feed&direction=desc');
    expect(r.status).toBe(200);
    const errors = expected('feed', 'desc').filter((f) => f.severity === 'error');
    expect(r.body.failures).toEqual(errors);
    expect(r.body.counts.total).toBe(errors.length);
  });

  it.each([
    ['sort=households', /sort is one of worst, severity, feed, route, check, margin/],
    ['sort=feed&direction=up', /direction is asc or desc/],
    ['sort=feed&sort=margin', /sort is one of/],
    ['sort=__proto__', /sort is one of/],
  ])('refuses ?%s with a 400 naming it', async (q, words) => {
    const r = await get(`/api/checks?${q}`);
    expect(r.status).toBe(400);
    expect(r.body.error.message).toMatch(words);
  });
});

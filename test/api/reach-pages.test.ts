/**
 * The fault reach as the reach screen reads it (server/services/reachLists.ts):
 * `?first=N` answers the counts and the first rows of each list, and
 * /reach/sites and /reach/carriages page the rest. On a generated network,
 * the pages put together are the whole answer's lists (sites in the fault
 * desk's order, named from the stored sites), the counts are the whole
 * lists' lengths, and bad asks are a 400 or a 404 naming what is wrong.
 * Also the critical pairs' `sample=N`.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Element, ReachAnswer, ReachSiteRow } from '@/shared/schemas/analysis';
import { generateNetwork } from '@/scripts/generator';
import { appWithNetwork, type TestApp } from '../helpers/testApp';

const net = generateNetwork({ sites: 300, seed: 5 });
let t: TestApp;
let failed: Element[];
let whole: ReachAnswer & { siteInfo: Record<string, { name: string; households: number }> };
beforeAll(async () => {
  t = await appWithNetwork(net);
  // the element whose failure alone takes most households off air, so the lists are long
  const top = await request(t.app).get('/api/analysis/exposure?limit=1').set(t.auth('viewer'));
  failed = [top.body.elements[0].element];
  whole = (await post('/api/analysis/reach?with=sites', { failed })).body;
}, 120_000);
afterAll(async () => t?.close());

const post = (p: string, body: unknown) => request(t.app).post(p).set(t.auth('viewer')).send(body as object);

/** All the pages of a list put together, `size` rows at a time. */
async function pages<T>(path: string, key: 'sites' | 'carriages', size: number): Promise<{ rows: T[]; totals: number[] }> {
  const rows: T[] = [];
  const totals: number[] = [];
  for (let offset = 0; ; offset += size) {
    const r = await post(`${path}${path.includes('?') ? '&' : '?'}limit=${size}&offset=${offset}`, { failed });
    expect(r.status).toBe(200);
    expect(r.body.offset).toBe(offset);
    totals.push(r.body.total);
    rows.push(...r.body[key]);
    if (r.body[key].length < size) return { rows, totals };
  }
}

/** Off air first, then most households, most carriages off air, code. */
function deskOrder(): ReachSiteRow[] {
  const stored = new Map(net.sites.map((s) => [s.code, s]));
  return whole.sites
    .map((s) => ({ site: s.site, name: stored.get(s.site)!.name, households: stored.get(s.site)!.households ?? 0, lost: s.lost, fallback: s.fallback ?? [] }))
    .sort((a, b) => Number(b.lost.length > 0) - Number(a.lost.length > 0) || b.households - a.households || b.lost.length - a.lost.length || (a.site < b.site ? -1 : 1));
}

describe('the fault reach, brief and paged', () => {
  it('is long enough here to need paging', () => {
    expect(whole.sites.length).toBeGreaterThan(40);
    expect(whole.lost.length).toBeGreaterThan(40);
  });

  it('?first=N answers the counts of the whole lists and only their first rows', async () => {
    const r = await post('/api/analysis/reach?with=sites&first=20', { failed });
    expect(r.status).toBe(200);
    expect(r.body.counts).toEqual({ sites: whole.sites.length, lost: whole.lost.length, fallback: whole.fallback.length });
    expect(r.body.households).toEqual(whole.households);
    expect(r.body.byService).toEqual(whole.byService);
    expect(r.body.lost).toEqual(whole.lost.slice(0, 20));
    expect(r.body.fallback).toEqual(whole.fallback.slice(0, 20));
    const first = deskOrder().slice(0, 20);
    expect(r.body.sites).toEqual(first.map(({ site, lost, fallback }) => ({ site, lost, fallback })));
    expect(Object.keys(r.body.siteInfo).sort()).toEqual(first.map((s) => s.site).sort());
    for (const s of first) expect(r.body.siteInfo[s.site]).toEqual({ name: s.name, households: s.households });
  });

  it('pages the sites in the fault desk order, each named, adding up to the whole list', async () => {
    const { rows, totals } = await pages<ReachSiteRow>('/api/analysis/reach/sites', 'sites', 17);
    expect(new Set(totals)).toEqual(new Set([whole.sites.length]));
    expect(rows).toEqual(deskOrder());
  });

  it('pages the carriages off air and on reserve, adding up to the whole lists', async () => {
    const lost = await pages<string>('/api/analysis/reach/carriages?state=lost', 'carriages', 50);
    expect(lost.rows).toEqual(whole.lost);
    expect(new Set(lost.totals)).toEqual(new Set([whole.lost.length]));
    const fallback = await pages<string>('/api/analysis/reach/carriages?state=fallback', 'carriages', 50);
    expect(fallback.rows).toEqual(whole.fallback);
  });

  it.each([
    ['/api/analysis/reach?first=0', { failed: 'F' }, 400, /failed must be an array/],
    ['/api/analysis/reach?first=0', 'F', 400, /first is at least 1/],
    ['/api/analysis/reach?first=99999', 'F', 400, /first is at most 5000/],
    ['/api/analysis/reach/sites?limit=10&sort=x', 'F', 400, /sort/],
    ['/api/analysis/reach/sites?offset=-1', 'F', 400, /offset is at least 0/],
    ['/api/analysis/reach/carriages?limit=10', 'F', 400, /state is lost or fallback/],
    ['/api/analysis/reach/carriages?state=gone', 'F', 400, /state is lost or fallback/],
    ['/api/analysis/reach/sites', { failed: [] }, 400, /at least one element/],
    ['/api/analysis/reach/sites?limit=5', { failed: [{ kind: 'site', code: 'NO-SUCH' }] }, 404, /NO-SUCH/],
    ['/api/analysis/reach/carriages?state=lost', { failed: [{ kind: 'site', code: 'NO-SUCH' }] }, 404, /NO-SUCH/],
    ['/api/analysis/reach?first=5', { failed: [{ kind: 'group', code: 'NO-SUCH' }] }, 404, /NO-SUCH/],
  ])('POST %s with %j is a %i naming the fault', async (path, body, status, words) => {
    const r = await post(path, body === 'F' ? { failed } : body);
    expect(r.status).toBe(status);
    expect(r.body.error.message).toMatch(words);
  });

  it('keeps the whole answer unchanged without first=', async () => {
    const r = await post('/api/analysis/reach', { failed });
    expect(r.status).toBe(200);
    expect(r.body.counts).toBeUndefined();
    expect(r.body.lost).toEqual(whole.lost);
    expect(r.body.sites).toEqual(whole.sites);
  });
});

describe('critical pairs with sample=N', () => {
  async function done(q: string) {
    for (let i = 0; i < 200; i++) {
      const r = await request(t.app).get(`/api/analysis/pairs?${q}`).set(t.auth('viewer'));
      if (r.status === 200) return r;
      expect(r.status).toBe(202);
      await new Promise((f) => setTimeout(f, 50));
    }
    throw new Error('the pairs did not finish');
  }

  it('names the first N carriages of each pair and counts them all', async () => {
    const full = await done('limit=10');
    const sampled = await done('limit=10&sample=2');
    expect(full.body.pairs.length).toBeGreaterThan(0);
    expect(sampled.body.pairs.length).toBe(full.body.pairs.length);
    full.body.pairs.forEach((p: { elements: Element[]; jointLost: string[]; households: number }, i: number) => {
      const s = sampled.body.pairs[i];
      expect(s.elements).toEqual(p.elements);
      expect(s.households).toBe(p.households);
      expect(s.jointLost).toEqual(p.jointLost.slice(0, 2));
      expect(s.jointLostCount).toBe(p.jointLost.length);
    });
    expect(full.body.pairs[0].jointLostCount).toBeUndefined();
  });

  it('refuses a sample that is not a whole number from 0 to 1000', async () => {
    const r = await request(t.app).get('/api/analysis/pairs?sample=1001').set(t.auth('viewer'));
    expect(r.status).toBe(400);
    expect(r.body.error.message).toMatch(/sample is at most 1000/);
  });
});

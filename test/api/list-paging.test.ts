/**
 * Paging of the long lists (diversity gaps, unfed carriages, failing checks):
 * pages put together give the whole list in its order, every answer says the
 * total, the old unpaged form answers as before, and bad paging is a 400.
 */
import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { NetworkDocument } from '@/shared/schemas/network';
import { BruteForce } from '../helpers/bruteforce';
import { appWithNetwork, type TestApp } from '../helpers/testApp';

const demo: NetworkDocument = JSON.parse(fs.readFileSync(path.join(__dirname, '..', 'fixtures', 'demo-network.json'), 'utf8'));
const brute = new BruteForce(demo);

let t: TestApp;
beforeAll(async () => {
  t = await appWithNetwork(demo);
});
afterAll(async () => t?.close());

const get = (p: string) => request(t.app).get(p).set(t.auth('viewer'));

/** Every page of `size` rows, in order, until the list ends. */
async function allPages(base: string, key: string, size: number) {
  const rows: unknown[] = [];
  const totals = new Set<number>();
  for (let offset = 0; offset < 10_000; offset += size) {
    const r = await get(`${base}${base.includes('?') ? '&' : '?'}limit=${size}&offset=${offset}`);
    expect(r.status).toBe(200);
    expect(r.body.offset).toBe(offset);
    totals.add(r.body.total);
    const page = r.body[key] as unknown[];
    expect(page.length).toBeLessThanOrEqual(size);
    rows.push(...page);
    if (page.length < size) break;
  }
  return { rows, totals: [...totals] };
}

describe('paged analysis lists', () => {
  it.each([
    ['/api/analysis/diversity', 'carriages', () => brute.diversity().length],
    ['/api/analysis/unfed', 'carriages', () => brute.unfed().length],
  ])('%s: pages of 2 make up the whole list, with its total', async (route, key, expected) => {
    expect(expected()).toBeGreaterThan(0);
    const whole = await get(route);
    expect(whole.status).toBe(200);
    expect(whole.body.total).toBe(expected());
    expect(whole.body.offset).toBe(0);
    expect(whole.body[key]).toHaveLength(expected());
    const paged = await allPages(route, key, 2);
    expect(paged.rows).toEqual(whole.body[key]);
    expect(paged.totals).toEqual([expected()]);
  });

  it('answers an empty page past the end, still with the total', async () => {
    const r = await get('/api/analysis/diversity?limit=5&offset=100000');
    expect(r.status).toBe(200);
    expect(r.body.carriages).toEqual([]);
    expect(r.body.total).toBe(brute.diversity().length);
  });

  it.each([
    ['limit=0', 'limit is at least 1'],
    ['limit=5001', 'limit is at most 5000'],
    ['limit=abc', 'limit must be a number'],
    ['offset=-1', 'offset is at least 0'],
    ['limit=2.5', 'limit is a whole number'],
    ['page=2', 'page'],
  ])('refuses ?%s with a 400 naming the fault', async (q, words) => {
    for (const route of ['/api/analysis/diversity', '/api/analysis/unfed', '/api/checks']) {
      const r = await get(`${route}?${q}`);
      expect(r.status, `${route}?${q}`).toBe(400);
      expect(r.body.error.message).toContain(words);
    }
  });
});

describe('paged failing checks', () => {
  it('pages the worst-first list and filters by kind of check on the server', async () => {
    const whole = await get('/api/checks');
    expect(whole.status).toBe(200);
    const failures = whole.body.failures as { feed: string; severity: string; check: { name: string } }[];
    expect(failures.length).toBeGreaterThan(1);
    expect(whole.body.total).toBe(failures.length);
    const paged = await allPages('/api/checks', 'failures', 1);
    expect(paged.rows).toEqual(failures);

    const clashes = await get('/api/checks?check=channel-clash&limit=100');
    expect(clashes.status).toBe(200);
    const expected = failures.filter((f) => f.check.name === 'channel-clash');
    expect(expected.length).toBeGreaterThan(0);
    expect(clashes.body.failures).toEqual(expected);
    expect(clashes.body.total).toBe(expected.length);

    const errors = await get('/api/checks?severity=error&limit=1');
    expect(errors.body.total).toBe(failures.filter((f) => f.severity === 'error').length);
    expect(errors.body.failures).toEqual(failures.filter((f) => f.severity === 'error').slice(0, 1));

    const bad = await get('/api/checks?check=channel-clash,loudness');
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toContain('check is a comma-separated list of');
  });
});

describe('failing checks counted on the server', () => {
  type Row = { feed: string; severity: 'error' | 'warning'; check: { name: string } };
  /** Counted here from the unpaged list, independently of the server's counting. */
  function countHere(rows: Row[]) {
    const names = ['free-space-loss', 'field-strength', 'horizon', 'earth-bulge', 'fresnel-f1', 'clearance', 'channel-clash', 'bearing-record'];
    const errors = rows.filter((f) => f.severity === 'error').length;
    return {
      total: rows.length,
      errors,
      warnings: rows.length - errors,
      feeds: new Set(rows.map((f) => f.feed)).size,
      byCheck: names.map((name) => ({ name, count: rows.filter((f) => f.check.name === name).length })).filter((b) => b.count > 0),
    };
  }

  it('every page carries the counts of the whole filtered list, the chips per kind and the unfiltered total', async () => {
    const whole = await get('/api/checks');
    const all = whole.body.failures as Row[];
    expect(new Set(all.map((f) => f.severity))).toEqual(new Set(['error', 'warning']));
    const kinds = [...new Set(all.map((f) => f.check.name))];
    expect(kinds.length).toBeGreaterThan(1);
    expect(whole.body.counts).toEqual(countHere(all));
    expect(whole.body.unfiltered).toBe(all.length);

    const errorsOnly = all.filter((f) => f.severity === 'error');
    const one = kinds[0];
    const cases: [string, Row[], Row[]][] = [
      ['', all, all],
      ['severity=error', errorsOnly, errorsOnly],
      [`check=${one}`, all.filter((f) => f.check.name === one), all],
      [`severity=error&check=${kinds.join(',')}`, errorsOnly, errorsOnly],
    ];
    for (const [q, rows, chipBase] of cases) {
      for (const offset of [0, 1, rows.length - 1, rows.length, rows.length + 3]) {
        const r = await get(`/api/checks?${q}${q ? '&' : ''}limit=1&offset=${offset}`);
        expect(r.status, q).toBe(200);
        expect(r.body.failures, `${q} at ${offset}`).toEqual(rows.slice(offset, offset + 1));
        expect(r.body.total).toBe(rows.length);
        expect(r.body.offset).toBe(offset);
        expect(r.body.counts, q).toEqual(countHere(rows));
        expect(r.body.kinds, q).toEqual(countHere(chipBase).byCheck);
        expect(r.body.unfiltered).toBe(all.length);
      }
    }
  });

  it('pages of 2 join into the filtered list, the last page short when the total is odd', async () => {
    const all = (await get('/api/checks?severity=error')).body.failures as Row[];
    const paged = await allPages('/api/checks?severity=error', 'failures', 2);
    expect(paged.rows).toEqual(all);
    expect(paged.totals).toEqual([all.length]);
  });

  it.each([
    ['limit=0&severity=error', 'limit is at least 1'],
    ['limit=10&offset=1.5', 'offset is a whole number'],
    ['offset=-3&check=horizon', 'offset is at least 0'],
    ['limit=99999', 'limit is at most 5000'],
    ['limit=1&limit=2', 'limit must be a number'],
    ['severity=fatal&limit=5', 'severity is one of warning, error'],
  ])('refuses ?%s with a 400 naming the fault', async (q, words) => {
    const r = await get(`/api/checks?${q}`);
    expect(r.status).toBe(400);
    expect(r.body.error.message).toContain(words);
    expect(JSON.stringify(r.body)).not.toMatch(/select|constraint/i);
  });

  it('the CSV download stays the whole filtered list, whatever the page asked', async () => {
    const all = (await get('/api/checks?severity=error')).body.failures as Row[];
    const r = await get('/api/checks?severity=error&format=csv&limit=1&offset=1');
    expect(r.status).toBe(200);
    expect(r.text.trim().split('\n')).toHaveLength(all.length + 1);
  });
});

describe('POST /api/analysis/reach?with=sites', () => {
  it('adds the name and households of each listed site, and nothing without it', async () => {
    const main = demo.sites.find((s) => s.role === 'main')!;
    const body = { failed: [{ kind: 'site', code: main.code }] };
    const plain = await request(t.app).post('/api/analysis/reach').set(t.auth('operator')).send(body);
    expect(plain.status).toBe(200);
    expect(plain.body.siteInfo).toBeUndefined();
    const r = await request(t.app).post('/api/analysis/reach?with=sites').set(t.auth('operator')).send(body);
    expect(r.status).toBe(200);
    const { siteInfo, ...rest } = r.body;
    expect(rest).toEqual(plain.body);
    const listed = (rest.sites as { site: string }[]).map((s) => s.site);
    expect(listed.length).toBeGreaterThan(0);
    expect(Object.keys(siteInfo).sort()).toEqual([...listed].sort());
    for (const code of listed) {
      const s = demo.sites.find((x) => x.code === code)!;
      expect(siteInfo[code]).toEqual({ name: s.name, households: s.households ?? 0 });
    }
    const bad = await request(t.app).post('/api/analysis/reach?with=everything').set(t.auth('operator')).send(body);
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toContain('with is sites');
  });
});

describe('GET /api/analysis/exposure?with=names', () => {
  it('names each listed element, and answers as before without it', async () => {
    const plain = await get('/api/analysis/exposure?limit=20');
    const named = await get('/api/analysis/exposure?limit=20&with=names');
    expect(named.status).toBe(200);
    expect(plain.body.names).toBeUndefined();
    const { names, ...rest } = named.body;
    expect(rest).toEqual(plain.body);
    const rows = rest.elements as { element: { kind: string; code: string } }[];
    expect(rows.length).toBeGreaterThan(0);
    for (const { element: e } of rows) {
      const expected =
        e.kind === 'site'
          ? demo.sites.find((s) => s.code === e.code)!.name
          : e.kind === 'group'
            ? demo.groups.find((g) => g.code === e.code)!.name
            : (() => {
                const f = demo.feeds.find((x) => x.code === e.code)!;
                return `${f.from} → ${f.to}`;
              })();
      expect(names[`${e.kind}:${e.code}`], `${e.kind} ${e.code}`).toBe(expected);
    }
    expect((await get('/api/analysis/exposure?with=all')).status).toBe(400);
  });
});

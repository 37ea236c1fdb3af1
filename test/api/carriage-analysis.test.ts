/**
 * A carriage (one transmitter) as an element over HTTP: reach, spof and
 * exposure with kinds=, the grouped exposure ranking, the carriage search,
 * planned works and incidents that fail a carriage, and the CSV files of
 * exposure, diversity gaps, unfed carriages and failing checks.
 *
 * The network is test/helpers/ops-network.ts plus a reserve feed FX
 * (OA.TV -> RA.TV, off-air, passing via site MA) and a carriage RB.FM with no
 * feed. Worked by hand:
 * - carriage MA.TV alone: only MA.TV (1,000 households); RA.TV keeps FX,
 *   which leaves from OA.TV and only passes MA's site.
 * - site MA alone: MA.TV, RA.TV, RB.TV (1,250 households).
 * - RB.TV's single points of failure: sites MA, RA, feed FB, group PWR; with
 *   carriages also RA.TV (not MA.TV: FX avoids it).
 * - site RB, carriage RB.TV, feed FB and group PWR each take off RB.TV alone.
 * - diversity gap: RA.TV (reserve FX, avoidable weak point site MA); unfed: RB.FM.
 */
import request from 'supertest';
import { parse } from 'csv-parse/sync';
import { describe, expect, it } from 'vitest';
import type { NetworkDocument } from '@/shared/schemas/network';
import { ELEMENT_KINDS } from '@/shared/schemas/network';
import { Incident, PlannedWork } from '@/server/db/models/operations';
import { BruteForce } from '../helpers/bruteforce';
import { opsNetwork } from '../helpers/ops-network';
import { useTestApp } from '../helpers/testApp';

function network(): NetworkDocument {
  const doc = opsNetwork();
  doc.carriages.push({ code: 'RB.FM', site: 'RB', service: 'FM' });
  doc.feeds.push({ code: 'FX', from: 'OA.TV', to: 'RA.TV', medium: 'off-air', role: 'reserve', via: ['MA'] });
  return doc;
}
const brute = new BruteForce(network());
const app = useTestApp({ network });
const get = (path: string) => request(app().app).get(path).set(app().auth('viewer'));
const carriage = (code: string) => ({ kind: 'carriage' as const, code });
const site = (code: string) => ({ kind: 'site' as const, code });
const csvRows = (text: string) => parse(text, { columns: true }) as Record<string, string>[];

describe('reach of a carriage', () => {
  it('takes off the transmitter and what only it feeds, not its site', async () => {
    const r = await request(app().app).post('/api/analysis/reach').set(app().auth('operator')).send({ failed: [carriage('MA.TV')] });
    expect(r.status).toBe(200);
    expect(r.body.lost).toEqual(['MA.TV']);
    expect(r.body.households.lost).toBe(1000);
    const { networkVersion: _v, ...answer } = r.body;
    expect(answer).toEqual(brute.reach([carriage('MA.TV')]));
    const bySite = await request(app().app).post('/api/analysis/reach').set(app().auth('operator')).send({ failed: [site('MA')] });
    expect(bySite.body.lost).toEqual(['MA.TV', 'RA.TV', 'RB.TV']);
  });

  it('answers 404 naming a carriage the network does not have, 400 for an unknown kind', async () => {
    const r = await request(app().app).post('/api/analysis/reach').set(app().auth('operator')).send({ failed: [carriage('ZZ.TV')] });
    expect(r.status).toBe(404);
    expect(r.body.error.message).toMatch(/ZZ\.TV/);
    const bad = await request(app().app).post('/api/analysis/reach').set(app().auth('operator')).send({ failed: [{ kind: 'mast', code: 'MA' }] });
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/site, carriage, feed, group/);
  });
});

describe('GET /api/analysis/spof and /exposure with kinds=', () => {
  it('lists sites, feeds and groups by default and adds parent transmitters with carriage', async () => {
    const plain = await get('/api/analysis/spof');
    expect(plain.status).toBe(200);
    expect(plain.body.carriages.find((c: { carriage: string }) => c.carriage === 'RB.TV').spof).toEqual([
      site('MA'),
      site('RA'),
      { kind: 'feed', code: 'FB' },
      { kind: 'group', code: 'PWR' },
    ]);
    const all = await get('/api/analysis/spof?kinds=site,carriage,feed,group');
    expect(all.status).toBe(200);
    expect(all.body.carriages.find((c: { carriage: string }) => c.carriage === 'RB.TV').spof).toEqual([
      site('MA'),
      site('RA'),
      carriage('RA.TV'),
      { kind: 'feed', code: 'FB' },
      { kind: 'group', code: 'PWR' },
    ]);
    expect(all.body.carriages).toEqual(brute.spof(ELEMENT_KINDS));
    const only = await get('/api/analysis/spof?kinds=carriage');
    expect(only.body.carriages).toEqual(brute.spof(['carriage']));
  });

  it('ranks carriages in exposure only when asked', async () => {
    const plain = await get('/api/analysis/exposure');
    expect(plain.body.elements.some((r: { element: { kind: string } }) => r.element.kind === 'carriage')).toBe(false);
    const r = await get('/api/analysis/exposure?kinds=carriage&limit=2');
    expect(r.status).toBe(200);
    expect(r.body.elements).toEqual(brute.exposure(['carriage']).slice(0, 2));
    expect(r.body.elements[0]).toEqual({ element: carriage('MA.TV'), households: 1000, carriages: 1 });
    // with=names names a carriage as its site and service, as the CSV files do
    const named = await get('/api/analysis/exposure?kinds=carriage&limit=2&with=names');
    expect(named.status).toBe(200);
    expect(named.body.names['carriage:MA.TV']).toBe('MA test site, Test multiplex');
    expect(Object.keys(named.body.names)).toHaveLength(2);
  });

  it('refuses unknown kinds with a message naming the four', async () => {
    for (const q of ['kinds=mast', 'kinds=', 'kinds=site,,feed']) {
      const r = await get(`/api/analysis/spof?${q}`);
      expect(r.status, q).toBe(400);
      expect(r.body.error.message).toMatch(/site, carriage, feed, group/);
    }
    expect((await get('/api/analysis/exposure?kinds=site&format=xml')).status).toBe(400);
  });
});

describe('GET /api/analysis/exposure-groups', () => {
  it('puts elements that take off exactly the same carriages in one row', async () => {
    const r = await get('/api/analysis/exposure-groups?kinds=site,carriage,feed,group');
    expect(r.status).toBe(200);
    const rb = r.body.groups.find((g: { elements: { code: string }[] }) => g.elements[0].code === 'RB');
    expect(rb).toEqual({ elements: [site('RB'), carriage('RB.TV'), { kind: 'feed', code: 'FB' }, { kind: 'group', code: 'PWR' }], households: 50, carriages: 1 });
    // MA's site and its transmitter take off different carriages (FX passes the site, not the transmitter)
    expect(r.body.groups[0]).toEqual({ elements: [site('MA')], households: 1250, carriages: 3 });
    const listed = r.body.groups.flatMap((g: { elements: unknown[] }) => g.elements);
    expect(listed).toHaveLength(brute.exposure(ELEMENT_KINDS).length);
    // every row's elements really take off the same carriages
    for (const g of r.body.groups as { elements: { kind: 'site' | 'carriage' | 'feed' | 'group'; code: string }[]; carriages: number }[]) {
      if (g.carriages === 0) continue;
      const sets = g.elements.map((e) => brute.reach([e]).lost.join(','));
      expect(new Set(sets).size, JSON.stringify(g.elements)).toBe(1);
    }
  });

  it('gives the grouped ranking as a CSV file, one line per element', async () => {
    const r = await get('/api/analysis/exposure-groups?kinds=site,carriage,feed,group&format=csv');
    expect(r.status).toBe(200);
    expect(r.headers['content-type']).toMatch(/text\/csv/);
    expect(r.headers['content-disposition']).toMatch(/attachment; filename="?headwater-exposure-grouped-v\d+-\d{4}-\d\d-\d\d\.csv/);
    const rows = csvRows(r.text);
    const fb = rows.find((row) => row.code === 'FB')!;
    expect(fb).toEqual({ rank: fb.rank, kind: 'feed', code: 'FB', name: 'RA.TV → RB.TV', same_loss_as: 'site RB', households_lost: '50', carriages_lost: '1' });
    expect(rows.find((row) => row.code === 'RB')).toMatchObject({ rank: fb.rank, same_loss_as: '', name: 'RB test site' });
    expect(rows.find((row) => row.code === 'RB.TV')).toMatchObject({ rank: fb.rank, name: 'RB test site, Test multiplex' });
    expect(rows).toHaveLength(brute.exposure(ELEMENT_KINDS).length);
  });
});

describe('CSV files of the resilience lists', () => {
  it('diversity gaps', async () => {
    const r = await get('/api/analysis/diversity?format=csv');
    expect(r.status).toBe(200);
    expect(r.headers['content-disposition']).toMatch(/headwater-diversity-gaps-v\d+/);
    expect(csvRows(r.text)).toEqual([
      { carriage: 'RA.TV', site: 'RA', site_name: 'RA test site', service: 'TV', avoidable_weak_points: 'site MA', all_weak_points: 'site MA' },
    ]);
    expect((await get('/api/analysis/diversity')).body.carriages.map((c: { carriage: string }) => c.carriage)).toEqual(['RA.TV']);
  });

  it('unfed carriages', async () => {
    const r = await get('/api/analysis/unfed?format=csv');
    expect(r.status).toBe(200);
    expect(r.text.split('\n')[0]).toBe('carriage,site,site_name,service');
    expect(csvRows(r.text)).toEqual([{ carriage: 'RB.FM', site: 'RB', site_name: 'RB test site', service: 'FM' }]);
  });

  it('failing checks, the same rows as the list', async () => {
    const list = await get('/api/checks');
    const r = await get('/api/checks?format=csv');
    expect(r.status).toBe(200);
    expect(r.headers['content-disposition']).toMatch(/headwater-failing-checks-v\d+/);
    const rows = csvRows(r.text);
    expect(rows.map((row) => [row.feed, row.check, row.severity])).toEqual(
      list.body.failures.map((f: { feed: string; check: { name: string }; severity: string }) => [f.feed, f.check.name, f.severity]),
    );
    expect(r.text.split('\n')[0]).toBe('feed,from,to,medium,check,severity,value,limit,unit,margin,value_shown,margin_shown,note');
  });
});

describe('GET /api/analysis/carriage-search', () => {
  it('finds a carriage by site and service words together, and by code', async () => {
    const r = await get('/api/analysis/carriage-search?q=RA%20multiplex');
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({ total: 1, items: [{ code: 'RA.TV', site: 'RA', siteName: 'RA test site', service: 'TV', serviceName: 'Test multiplex' }] });
    const byCode = await get('/api/analysis/carriage-search?q=ra.fm&pageSize=1');
    expect(byCode.body.items.map((i: { code: string }) => i.code)).toEqual(['RA.FM']);
    expect((await get('/api/analysis/carriage-search?q=nothing-like-it')).body).toMatchObject({ items: [], total: 0 });
    expect((await get('/api/analysis/carriage-search?q=ra&pageSize=500')).status).toBe(400);
  });
});

describe('planned works and incidents that fail a carriage', () => {
  it('stores a work with a carriage and shows its reach', async () => {
    const r = await request(app().app)
      .post('/api/works')
      .set(app().auth('operator'))
      .send({ title: 'Transmitter swap', elements: [carriage('MA.TV')], start: '2027-03-01T08:00:00Z', end: '2027-03-01T12:00:00Z' });
    expect(r.status).toBe(201);
    expect(r.body.reach.lost).toEqual(['MA.TV']);
    const row = await PlannedWork.findOne({ where: { code: r.body.code } });
    expect(row!.elements).toEqual([carriage('MA.TV')]);
    const unknown = await request(app().app)
      .post('/api/works')
      .set(app().auth('operator'))
      .send({ title: 'Nowhere', elements: [carriage('ZZ.TV')], start: '2027-03-01T08:00:00Z', end: '2027-03-01T12:00:00Z' });
    expect(unknown.status).toBe(422);
    expect(unknown.body.error.message).toMatch(/carriage ZZ\.TV/);
  });

  it('opens an incident on a carriage', async () => {
    const r = await request(app().app).post('/api/incidents').set(app().auth('operator')).send({ title: 'Transmitter tripped', elements: [carriage('RA.TV')] });
    expect(r.status).toBe(201);
    const row = await Incident.findOne({ where: { code: r.body.code } });
    expect(row!.elements).toEqual([carriage('RA.TV')]);
  });
});

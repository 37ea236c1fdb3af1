/**
 * The rules for records typed in by hand and what record pages ask
 * (server/services/inventory/editRules.ts, server/routes/recordTools.ts):
 * channels against the service kind's bands, a second main feed only when
 * confirmed, the delete preview from the fault reach, a record's own
 * history, and source carriages nearest first. Each checks status, body and
 * the stored rows.
 */
import request from 'supertest';
import { beforeEach, describe, expect, it } from 'vitest';
import { smallNetwork } from '../fixtures/small-network';
import { BruteForce } from '../helpers/bruteforce';
import { useTestApp, type TestApp } from '../helpers/testApp';

const app = useTestApp({ network: smallNetwork });
let t: TestApp;
beforeEach(() => {
  t = app();
});

const get = (path: string, role: 'viewer' | 'engineer' | 'operator' | 'admin' = 'viewer') => request(t.app).get(`/api${path}`).set(t.auth(role));
const post = (path: string, body: object) => request(t.app).post(`/api${path}`).set(t.auth('engineer')).send(body);
const patch = (path: string, body: object) => request(t.app).patch(`/api${path}`).set(t.auth('engineer')).send(body);
const rows = async (sql: string) => (await t.db.sequelize.query(sql))[0];

describe('channels against the service kind bands', () => {
  it('refuses a TV carriage on a channel outside UHF 21-69 and VHF 5-12, with 400 naming the field and range', async () => {
    const r = await post('/carriages', { code: 'H1.TV9', site: 'H1', service: 'TV1', channel: '70' });
    expect(r.status).toBe(400);
    expect(r.body.error.message).toMatch(/channel 70 .*VHF channels 5-12 or UHF channels 21-69/);
    expect(r.body.error.details).toEqual([{ field: 'channel', message: expect.stringMatching(/UHF channels 21-69/) }]);
    expect(await rows(`SELECT code FROM carriages WHERE code = 'H1.TV9'`)).toEqual([]);
  });

  it('refuses an FM frequency outside 87.5-108 MHz on a change, leaving the row as it was', async () => {
    const r = await patch('/carriages/M1.FM1', { version: 1, frequencyMHz: 546 });
    expect(r.status).toBe(400);
    expect(r.body.error.details).toEqual([{ field: 'frequencyMHz', message: 'frequency 546 MHz is outside what an FM service uses: 87.5-108 MHz' }]);
    expect(await rows(`SELECT frequency_mhz::float AS f, version FROM carriages WHERE code = 'M1.FM1'`)).toEqual([{ f: 97.3, version: 1 }]);
  });

  it('accepts a channel of the kind', async () => {
    const r = await post('/carriages', { code: 'H1.TV1', site: 'H1', service: 'TV1', channel: '41', frequencyMHz: 634 });
    expect(r.status).toBe(201);
    expect(await rows(`SELECT channel FROM carriages WHERE code = 'H1.TV1'`)).toEqual([{ channel: '41' }]);
  });

  it('refuses an off-air feed whose receive channel is not one of its service', async () => {
    const r = await patch('/feeds/R1.TV1.M', { version: 1, rxChannel: '12B' });
    expect(r.status).toBe(400);
    expect(r.body.error.details[0].field).toBe('rxChannel');
    expect(await rows(`SELECT rx_channel FROM feeds WHERE code = 'R1.TV1.M'`)).toEqual([{ rx_channel: '30' }]);
  });
});

describe('a second main feed into one carriage', () => {
  const second = { code: 'M1.TV1.M2', from: 'O1.TV1', to: 'M1.TV1', medium: 'microwave', role: 'main' };

  it('is refused with 409 naming the main feed already there, and nothing is stored', async () => {
    const r = await post('/feeds', second);
    expect(r.status).toBe(409);
    expect(r.body.error.code).toBe('second-main-feed');
    expect(r.body.error.message).toMatch(/carriage M1\.TV1 already has a main feed \(M1\.TV1\.M\)/);
    expect(r.body.error.details).toMatchObject({ field: 'role', mainFeeds: ['M1.TV1.M'], confirm: 'second-main-feed' });
    expect(await rows(`SELECT code FROM feeds WHERE code = 'M1.TV1.M2'`)).toEqual([]);
  });

  it('is stored when confirmed', async () => {
    const r = await post('/feeds?confirm=second-main-feed', second);
    expect(r.status).toBe(201);
    expect(await rows(`SELECT role FROM feeds WHERE code = 'M1.TV1.M2'`)).toEqual([{ role: 'main' }]);
  });

  it('asks again when a reserve becomes main, and a confirmed change is stored', async () => {
    const r = await patch('/feeds/R1.TV1.R', { version: 1, role: 'main' });
    expect(r.status).toBe(409);
    expect(r.body.error.details.mainFeeds).toEqual(['R1.TV1.M']);
    expect(await rows(`SELECT role FROM feeds WHERE code = 'R1.TV1.R'`)).toEqual([{ role: 'reserve' }]);
    const ok = await request(t.app).patch('/api/feeds/R1.TV1.R?confirm=second-main-feed').set(t.auth('engineer')).send({ version: 1, role: 'main' });
    expect(ok.status).toBe(200);
    expect(await rows(`SELECT role, version FROM feeds WHERE code = 'R1.TV1.R'`)).toEqual([{ role: 'main', version: 2 }]);
  });

  it('refuses a confirm it does not know', async () => {
    const r = await post('/feeds?confirm=everything', second);
    expect(r.status).toBe(400);
    expect(r.body.error.message).toMatch(/confirm is second-main-feed/);
  });
});

describe('GET /api/<kind>/:code/impact', () => {
  const brute = new BruteForce(smallNetwork());
  const lostOf = (failed: { kind: 'site' | 'feed' | 'group'; code: string }[]) => brute.reach(failed);

  it('a site: its fault reach', async () => {
    const r = await get('/sites/M1/impact');
    expect(r.status).toBe(200);
    const expected = lostOf([{ kind: 'site', code: 'M1' }]);
    expect(r.body.offAir).toMatchObject({ carriages: expected.lost.length, households: expected.households.lost, shown: expected.lost });
    expect(r.body.offAir.shown).toEqual(['M1.FM1', 'M1.TV1']);
    expect(r.body.offAir.households).toBe(120000);
  });

  it('a carriage: itself and the reach of the feeds it sources', async () => {
    const r = await get('/carriages/R2.TV1/impact');
    expect(r.status).toBe(200);
    const expected = lostOf([{ kind: 'feed', code: 'R1.TV1.R' }]);
    expect(r.body.offAir.shown).toEqual([...new Set([...expected.lost, 'R2.TV1'])].sort());
    expect(r.body.offAir).toMatchObject({ carriages: 1, households: 1800, sites: 1 });
    expect(r.body.byService).toEqual([{ service: 'TV1', lost: 1 }]);
  });

  it('a service: every fed carriage of it; a group: nothing', async () => {
    const s = await get('/services/FM1/impact');
    expect(s.body.offAir).toMatchObject({ carriages: 2, households: 120000, sites: 2, shown: ['M1.FM1', 'O1.FM1'] });
    const g = await get('/groups/G-PWR/impact');
    expect(g.status).toBe(200);
    expect(g.body.offAir).toMatchObject({ carriages: 0, households: 0 });
    expect(g.body.basis).toMatch(/leave the group/);
  });

  it('404 for an unknown code', async () => {
    const r = await get('/feeds/NOPE/impact');
    expect(r.status).toBe(404);
    expect(r.body.error.message).toBe('no feed with code NOPE');
  });
});

describe('GET /api/<kind>/:code/history', () => {
  it('shows engineers the record changes, newest first and paged, with the fields that changed', async () => {
    expect((await patch('/sites/R1', { version: 1, name: 'Relay One North' })).status).toBe(200);
    expect((await patch('/sites/R1', { version: 2, households: 2600 })).status).toBe(200);
    const r = await get('/sites/R1/history?pageSize=1', 'engineer');
    expect(r.status).toBe(200);
    // the import keeps one row for the whole network; the two edits have one each
    expect(r.body).toMatchObject({ total: 2, page: 1, pageSize: 1 });
    expect(r.body.items[0]).toMatchObject({ action: 'update', userEmail: 'engineer@test.example', changes: [{ field: 'households', before: 2500, after: 2600 }] });
    const p2 = await get('/sites/R1/history?pageSize=1&page=2', 'admin');
    expect(p2.body.items[0].changes).toEqual([{ field: 'name', before: 'Relay One', after: 'Relay One North' }]);
    const stored = await rows(`SELECT count(*)::int AS n FROM audit_log WHERE entity_kind = 'sites' AND entity_code = 'R1'`);
    expect(stored).toEqual([{ n: 2 }]);
  });

  it('is for engineers and admins only, and 404 for a code never used', async () => {
    expect((await get('/sites/R1/history', 'viewer')).status).toBe(403);
    expect((await get('/sites/R1/history', 'operator')).status).toBe(403);
    expect((await get('/sites/NOPE/history', 'engineer')).status).toBe(404);
    expect((await get('/sites/R1/history?pageSize=500', 'engineer')).status).toBe(400);
  });
});

describe('GET /api/carriages/:code/sources', () => {
  it('lists the other carriages of the service nearest first', async () => {
    const r = await get('/carriages/R1.TV1/sources');
    expect(r.status).toBe(200);
    expect(r.body.items.map((i: { carriage: string }) => i.carriage)).toEqual(['R2.TV1', 'M1.TV1', 'O1.TV1']);
    expect(r.body.total).toBe(3);
    const km = r.body.items.map((i: { distanceKm: number }) => i.distanceKm);
    expect([...km].sort((a, b) => a - b)).toEqual(km);
    expect((await get('/carriages/R1.TV1/sources?q=main')).body.items.map((i: { carriage: string }) => i.carriage)).toEqual(['M1.TV1']);
  });

  it('gives distance and bearing from the receiving site as GeographicLib does', async () => {
    // GeographicLib test suite, GeodSolve0: Inverse(40.6, -73.8, 49.01666667, 2.55) gives
    // azi1 53.47022 deg and s12 5853226 m (geographiclib-js geodesic/test/geodesictest.js).
    expect((await post('/sites', { code: 'GA', name: 'Test West', role: 'relay', lat: 40.6, lon: -73.8 })).status).toBe(201);
    expect((await post('/sites', { code: 'GB', name: 'Test East', role: 'relay', lat: 49.01666667, lon: 2.55 })).status).toBe(201);
    expect((await post('/services', { code: 'SX', name: 'Test service', kind: 'other' })).status).toBe(201);
    expect((await post('/carriages', { code: 'GA.SX', site: 'GA', service: 'SX' })).status).toBe(201);
    expect((await post('/carriages', { code: 'GB.SX', site: 'GB', service: 'SX' })).status).toBe(201);
    const r = await get('/carriages/GA.SX/sources');
    expect(r.body.items).toHaveLength(1);
    expect(Math.abs(r.body.items[0].distanceKm * 1000 - 5853226)).toBeLessThanOrEqual(0.5);
    expect(Math.abs(r.body.items[0].bearingDeg - 53.47022)).toBeLessThanOrEqual(0.5e-5);
  });

  it('refuses a limit over 100 and answers 404 for an unknown carriage', async () => {
    expect((await get('/carriages/R1.TV1/sources?limit=1000')).status).toBe(400);
    expect((await get('/carriages/NOPE/sources')).status).toBe(404);
  });
});

/**
 * Inventory CRUD for each kind: create, read with neighbours, list with
 * search, sort, paging and filters, update, delete; and the 4xx answers for
 * bad input (docs/api.md: 404 naming the code, 400
 * naming the field, never a 500).
 */
import request from 'supertest';
import { beforeEach, describe, expect, it } from 'vitest';
import { smallNetwork } from '../fixtures/small-network';
import { useTestApp, type TestApp } from '../helpers/testApp';

const app = useTestApp({ network: smallNetwork });
let t: TestApp;
beforeEach(() => {
  t = app();
});

const get = (path: string) => request(t.app).get(`/api${path}`).set(t.auth('viewer'));
const post = (path: string, body: object) => request(t.app).post(`/api${path}`).set(t.auth('engineer')).send(body);
const patch = (path: string, body: object) => request(t.app).patch(`/api${path}`).set(t.auth('engineer')).send(body);
const del = (path: string) => request(t.app).delete(`/api${path}`).set(t.auth('engineer'));
const codes = (r: request.Response) => r.body.items.map((i: { code: string }) => i.code);

describe('sites', () => {
  it('creates, reads, updates and deletes a site', async () => {
    const created = await post('/sites', { code: 'R9', name: 'Relay Nine', role: 'relay', lat: -38.05, lon: -29.05, households: 900, groups: ['G-PWR'] });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ code: 'R9', name: 'Relay Nine', households: 900, groups: ['G-PWR'], version: 1 });
    expect(typeof created.body.updatedAt).toBe('string');
    expect(Number(created.headers['x-network-version'])).toBeGreaterThan(1);

    const read = await get('/sites/R9');
    expect(read.status).toBe(200);
    expect(read.body.site).toEqual(created.body);
    expect(read.body).toMatchObject({ carriages: [], feedsIn: [], feedsOut: [], feedsVia: [] });

    const changed = await patch('/sites/R9', { version: 1, name: 'Relay Nine North', households: null });
    expect(changed.status).toBe(200);
    expect(changed.body).toMatchObject({ name: 'Relay Nine North', version: 2 });
    expect(changed.body).not.toHaveProperty('households');
    const [rows] = await t.db.sequelize.query(`SELECT name, households, version FROM sites WHERE code = 'R9'`);
    expect(rows).toEqual([{ name: 'Relay Nine North', households: null, version: 2 }]);

    const gone = await del('/sites/R9?version=2');
    expect(gone.status).toBe(200);
    expect(gone.body.deleted).toEqual({ sites: ['R9'] });
    expect((await get('/sites/R9')).status).toBe(404);
  });

  it('shows a site with its carriages and the feeds in, out and via', async () => {
    const m1 = await get('/sites/M1');
    expect(m1.body.carriages.map((c: { code: string }) => c.code)).toEqual(['M1.FM1', 'M1.TV1']);
    expect(m1.body.feedsIn.map((f: { code: string }) => f.code)).toEqual(['M1.FM1.M', 'M1.TV1.M', 'M1.TV1.R']);
    expect(m1.body.feedsOut.map((f: { code: string }) => f.code)).toEqual(['R1.TV1.M', 'R2.TV1.M']);
    const h1 = await get('/sites/H1');
    expect(h1.body.feedsVia.map((f: { code: string }) => f.code)).toEqual(['M1.FM1.M']);
  });

  it('lists with search, sort, paging and filters', async () => {
    expect(codes(await get('/sites?q=relay'))).toEqual(['R1', 'R2']);
    expect(codes(await get('/sites?q=HOP'))).toEqual(['H1']);
    expect(codes(await get('/sites?q=r1'))).toEqual(['R1']);
    expect(codes(await get('/sites?role=origin'))).toEqual(['O1']);
    expect(codes(await get('/sites?group=G-PWR'))).toEqual(['M1']);
    expect(codes(await get('/sites?sort=households&order=desc'))).toEqual(['M1', 'R1', 'R2', 'H1', 'O1']);
    const page = await get('/sites?pageSize=2&page=2');
    expect(page.body).toMatchObject({ total: 5, page: 2, pageSize: 2 });
    expect(codes(page)).toEqual(['O1', 'R1']);
    // a search text is text, not a pattern
    expect((await get('/sites?q=%25')).body.total).toBe(0);
  });

  it('refuses bad list parameters with 400 naming them', async () => {
    const big = await get('/sites?pageSize=500');
    expect(big.status).toBe(400);
    expect(big.body.error.message).toMatch(/pageSize/);
    const sort = await get('/sites?sort=password');
    expect(sort.status).toBe(400);
    expect(sort.body.error.message).toMatch(/sort is one of/);
    expect((await get('/sites?role=tower')).status).toBe(400);
    const unknown = await get('/sites?colour=red');
    expect(unknown.status).toBe(400);
    // an issue with the query as a whole is named as the query's, not the body's
    expect(unknown.body.error.message).toMatch(/^query: .*colour/);
    expect(unknown.body.error.message).not.toContain('(body)');
    expect(unknown.body.error.details[0].field).toBe('(query)');
  });

  it('sorts by every field the models describe, references by their codes', async () => {
    const { CARRIAGE_ATTRIBUTES, FEED_ATTRIBUTES, SITE_ATTRIBUTES } = await import('@/server/db/models/inventory');
    const fields = (attrs: object, refs: string[]) => Object.keys(attrs).filter((k) => !['id', 'createdAt', 'version', ...refs].includes(k));
    const cases: [string, string[]][] = [
      ['sites', fields(SITE_ATTRIBUTES, [])],
      ['carriages', [...fields(CARRIAGE_ATTRIBUTES, ['siteId', 'serviceId']), 'site', 'service']],
      ['feeds', [...fields(FEED_ATTRIBUTES, ['fromCarriageId', 'toCarriageId']), 'from', 'to', 'service', 'fromSite', 'toSite']],
    ];
    for (const [kind, sorts] of cases) {
      for (const sort of sorts) {
        const r = await get(`/${kind}?sort=${sort}&order=desc`);
        expect(r.status, `${kind} sort=${sort}`).toBe(200);
      }
    }
    // a field no hand-written list named before: carriages by ERP, highest first, then by polarisation
    const byErp = await get('/carriages?sort=erpW&order=desc');
    const erps = (byErp.body.items as { erpW?: number }[]).map((c) => c.erpW).filter((e): e is number => e !== undefined);
    expect(erps.length).toBeGreaterThan(1);
    expect(erps).toEqual([...erps].sort((a, b) => b - a));
    expect((await get('/carriages?sort=polarisation')).status).toBe(200);
    expect((await get('/feeds?sort=rxChannel')).status).toBe(200);
  });
});

describe('services and groups', () => {
  it('creates, lists, shows, updates and deletes a service', async () => {
    expect((await post('/services', { code: 'DAB1', name: 'Ensemble Kestle', kind: 'dab' })).status).toBe(201);
    // by name: Corran Air, Ensemble Kestle, Multiplex One
    expect(codes(await get('/services?sort=name'))).toEqual(['FM1', 'DAB1', 'TV1']);
    const tv1 = await get('/services/TV1');
    expect(tv1.body).toMatchObject({ service: { code: 'TV1', kind: 'dtt' }, counts: { carriages: 4, feeds: 6 } });
    expect((await patch('/services/DAB1', { version: 1, kind: 'other' })).body.kind).toBe('other');
    expect((await del('/services/DAB1?version=2')).status).toBe(200);
  });

  it('creates a group, shows its members, clears a note', async () => {
    const g = await post('/groups', { code: 'G-NEW', name: 'New route', note: 'spare' });
    expect(g.status).toBe(201);
    expect((await patch('/groups/G-NEW', { version: 1, note: null })).body).not.toHaveProperty('note');
    const tel = await get('/groups/G-TEL');
    expect(tel.body.members).toEqual({ sites: [], feeds: ['M1.TV1.M', 'R2.TV1.R'] });
    // sites in code order, with a member added by an edit
    expect((await post('/sites', { code: 'A0', name: 'Alpha Zero', role: 'relay', lat: -38.2, lon: -29.2, groups: ['G-PWR'] })).status).toBe(201);
    expect((await get('/groups/G-PWR')).body.members).toEqual({ sites: ['A0', 'M1'], feeds: [] });
    expect((await get('/groups/G-NEW')).body.members).toEqual({ sites: [], feeds: [] });
  });
});

describe('carriages', () => {
  it('creates one, and refuses unknown references (422) and a second carriage of a service at a site (409)', async () => {
    const ok = await post('/carriages', { code: 'R1.FM1', site: 'R1', service: 'FM1', frequencyMHz: 99.1, erpW: 50 });
    expect(ok.status).toBe(201);
    expect(ok.body).toMatchObject({ code: 'R1.FM1', site: 'R1', service: 'FM1', version: 1 });

    const unknown = await post('/carriages', { code: 'X.TV1', site: 'NOWHERE', service: 'TV9' });
    expect(unknown.status).toBe(422);
    expect(unknown.body.error.details.map((d: { field: string }) => d.field)).toEqual(['site', 'service']);
    expect(unknown.body.error.message).toMatch(/site NOWHERE does not exist/);

    const twice = await post('/carriages', { code: 'R1.TV1.b', site: 'R1', service: 'TV1' });
    expect(twice.status).toBe(409);
    expect(twice.body.error.message).toMatch(/already has carriage R1\.TV1/);
  });

  it('lists by service and site, searches site codes, and shows feeds in and out', async () => {
    expect(codes(await get('/carriages?service=FM1'))).toEqual(['M1.FM1', 'O1.FM1']);
    expect(codes(await get('/carriages?site=R2'))).toEqual(['R2.TV1']);
    expect(codes(await get('/carriages?q=O1&sort=service&order=desc'))).toEqual(['O1.TV1', 'O1.FM1']);
    const r2 = await get('/carriages/R2.TV1');
    expect(r2.body.carriage).toMatchObject({ code: 'R2.TV1', onChannelRepeater: false });
    expect(r2.body.site.code).toBe('R2');
    expect(r2.body.service.code).toBe('TV1');
    expect(r2.body.feedsIn.map((f: { code: string }) => f.code)).toEqual(['R2.TV1.M', 'R2.TV1.R']);
    expect(r2.body.feedsOut.map((f: { code: string }) => f.code)).toEqual(['R1.TV1.R']);
  });

  it('refuses a change of service that would break its feeds', async () => {
    const r = await patch('/carriages/R2.TV1', { version: 1, service: 'FM1' });
    expect(r.status).toBe(422);
    expect(r.body.error.details.map((d: { message: string }) => d.message).join(' ')).toMatch(/feed R1\.TV1\.R/);
  });
});

describe('feeds', () => {
  const feed = { code: 'R1.TV1.X', from: 'O1.TV1', to: 'R1.TV1', medium: 'microwave', role: 'reserve', via: ['H1'], groups: ['G-TEL'] };

  it('creates one with via-sites and groups, and shows its ends', async () => {
    const r = await post('/feeds', feed);
    expect(r.status).toBe(201);
    expect(r.body).toMatchObject({ ...feed, version: 1 });
    const d = await get('/feeds/R1.TV1.X');
    expect(d.body.source).toMatchObject({ carriage: { code: 'O1.TV1' }, site: { code: 'O1' } });
    expect(d.body.target).toMatchObject({ carriage: { code: 'R1.TV1' }, site: { code: 'R1' } });
    expect(d.body.via.map((s: { code: string }) => s.code)).toEqual(['H1']);
  });

  it('refuses a service mismatch, a self-feed and a via-site at an end (422)', async () => {
    const mismatch = await post('/feeds', { ...feed, from: 'O1.FM1' });
    expect(mismatch.status).toBe(422);
    expect(mismatch.body.error.message).toMatch(/carries service FM1 but receiving carriage R1\.TV1 carries TV1/);
    const self = await post('/feeds', { ...feed, from: 'R1.TV1' });
    expect(self.status).toBe(422);
    expect(self.body.error.details.map((d: { rule: string }) => d.rule)).toContain('self-feed');
    const viaEnd = await post('/feeds', { ...feed, via: ['R1'] });
    expect(viaEnd.status).toBe(422);
    expect(viaEnd.body.error.details[0]).toMatchObject({ field: 'via[0]', rule: 'via-endpoint' });
    const unknown = await post('/feeds', { ...feed, groups: ['G-NONE'] });
    expect(unknown.status).toBe(422);
    expect(unknown.body.error.message).toMatch(/group G-NONE does not exist/);
  });

  it('lists with filters on medium, role, service and the sites at each end', async () => {
    expect(codes(await get('/feeds?medium=off-air'))).toEqual(['R1.TV1.M', 'R1.TV1.R', 'R2.TV1.M']);
    expect(codes(await get('/feeds?role=reserve&service=TV1'))).toEqual(['M1.TV1.R', 'R1.TV1.R', 'R2.TV1.R']);
    expect(codes(await get('/feeds?fromSite=O1&toSite=R2'))).toEqual(['R2.TV1.R']);
    expect(codes(await get('/feeds?group=G-SAT'))).toEqual(['M1.TV1.R']);
    expect(codes(await get('/feeds?q=H1'))).toEqual([]);
    expect(codes(await get('/feeds?q=m1.fm1'))).toEqual(['M1.FM1.M']);
    expect(codes(await get('/feeds?sort=to&order=asc&pageSize=1'))).toEqual(['M1.FM1.M']);
  });

  it('replaces via-sites and groups on update', async () => {
    const r = await patch('/feeds/M1.FM1.M', { version: 1, via: [], groups: ['G-TEL', 'G-SAT'] });
    expect(r.status).toBe(200);
    expect(r.body).not.toHaveProperty('via');
    expect(r.body.groups).toEqual(['G-SAT', 'G-TEL']);
    expect((await get('/sites/H1')).body.feedsVia).toEqual([]);
  });
});

describe('bad input', () => {
  it('answers 409 for a code in use, 400 naming the field, 404 naming the code, 400 for a code change', async () => {
    const dup = await post('/sites', { code: 'R1', name: 'Again', role: 'relay', lat: 0, lon: 0 });
    expect(dup.status).toBe(409);
    expect(dup.body.error.message).toMatch(/R1 already exists/);
    const bad = await post('/sites', { code: 'R8', name: 'Eight', role: 'relay', lat: 91, lon: 0 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/lat/);
    const extra = await post('/services', { code: 'S8', name: 'Eight', kind: 'fm', id: 7 });
    expect(extra.status).toBe(400);
    expect(extra.body.error.message).toMatch(/id/);
    const missing = await get('/carriages/NOPE');
    expect(missing.status).toBe(404);
    expect(missing.body.error.message).toMatch(/NOPE/);
    const rename = await patch('/sites/R1', { version: 1, code: 'R1b' });
    expect(rename.status).toBe(400);
    expect(rename.body.error.message).toMatch(/code cannot be changed/);
    expect((await patch('/sites/R1', { name: 'no version' })).status).toBe(400);
    expect((await patch('/sites/R1', { version: 1, lat: 'north' })).status).toBe(400);
    expect((await del('/sites/R1')).status).toBe(400);
    expect((await patch('/sites/NOPE', { version: 1, name: 'x' })).status).toBe(404);
  });

  it('changes nothing and moves no version for an update that sets the same values', async () => {
    const before = (await get('/sites/R1')).body.site;
    const same = await patch('/sites/R1', { version: before.version, name: before.name });
    expect(same.status).toBe(200);
    expect(same.body).toEqual(before);
  });
});

describe('every field the model and the schema name', () => {
  // one record of each kind with every field of its schema set (test/unit/inventory/model-schema.test.ts
  // pins that the model names the same fields); a new field needs a value here
  const full = {
    groups: { code: 'G-ALL', name: 'Every field', note: 'a note' },
    services: { code: 'TV8', name: 'Multiplex Eight', kind: 'dtt' },
    sites: { code: 'R8', name: 'Relay Eight', role: 'relay', lat: -38.15, lon: -29.2, groundHeightM: 310.5, mastHeightM: 42, households: 3100, groups: ['G-ALL', 'G-PWR'] },
    carriages: { code: 'R8.TV1', site: 'R8', service: 'TV1', channel: '41', frequencyMHz: 634, erpW: 125.5, polarisation: 'V', antennaHeightM: 38, onChannelRepeater: true },
    feeds: { code: 'R8.TV1.M', from: 'M1.TV1', to: 'R8.TV1', medium: 'off-air', role: 'main', rxFrequencyMHz: 546, rxChannel: '30', rxAntenna: 'UHF yagi', bearingDeg: 201.25, via: ['H1'], groups: ['G-ALL'] },
  } as const;
  const change = { groups: { name: 'Renamed' }, services: { name: 'Renamed' }, sites: { name: 'Renamed' }, carriages: { polarisation: 'H' }, feeds: { rxAntenna: 'log periodic' } };
  const detailKey = { sites: 'site', services: 'service', groups: 'group', carriages: 'carriage', feeds: 'feed' } as const;

  it('are stored, answered on create, read, list and change, and kept in the stored row', async () => {
    const { entitySchemas } = await import('@/shared/schemas/network');
    for (const kind of ['groups', 'services', 'sites', 'carriages', 'feeds'] as const) {
      const fields = Object.keys(entitySchemas[kind].shape).sort();
      const body = full[kind] as Record<string, unknown>;
      expect(Object.keys(body).sort(), `${kind}: the record here sets every field of the schema`).toEqual(fields);

      const created = await post(`/${kind}`, body);
      expect(created.status, `${kind} ${JSON.stringify(created.body)}`).toBe(201);
      expect(created.body).toEqual({ ...body, version: 1, updatedAt: expect.any(String) });

      const read = await get(`/${kind}/${body.code as string}`);
      expect(read.status).toBe(200);
      expect(read.body[detailKey[kind]]).toEqual(created.body);
      const listed = await get(`/${kind}?q=${encodeURIComponent(body.code as string)}`);
      expect(listed.body.items.find((i: { code: string }) => i.code === body.code)).toEqual(created.body);

      // a change to one field answers all of them, the others as they were
      const changed = await patch(`/${kind}/${body.code as string}`, { version: 1, ...change[kind] });
      expect(changed.status).toBe(200);
      expect(Object.keys(changed.body).sort()).toEqual([...fields, 'updatedAt', 'version'].sort());
      expect(changed.body).toEqual({ ...created.body, ...change[kind], version: 2, updatedAt: expect.any(String) });
      expect((await get(`/${kind}/${body.code as string}`)).body[detailKey[kind]]).toEqual(changed.body);
    }
    const [[site]] = (await t.db.sequelize.query(`SELECT ground_height_m, mast_height_m, households, version FROM sites WHERE code = 'R8'`)) as [unknown[], unknown];
    expect(site).toEqual({ ground_height_m: 310.5, mast_height_m: 42, households: 3100, version: 2 });
    const [[feed]] = (await t.db.sequelize.query(
      `SELECT f.rx_antenna, f.bearing_deg, f.version, (SELECT count(*)::int FROM feed_via_sites v WHERE v.feed_id = f.id) AS hops,
              (SELECT count(*)::int FROM feed_groups g WHERE g.feed_id = f.id) AS groups FROM feeds f WHERE f.code = 'R8.TV1.M'`,
    )) as [unknown[], unknown];
    expect(feed).toEqual({ rx_antenna: 'log periodic', bearing_deg: 201.25, version: 2, hops: 1, groups: 1 });
  });
});

/**
 * GET /api/audit: who changed what, newest first, paged and filtered; admin
 * only. Imports leave one row each; dry runs and refused imports leave none.
 */
import request from 'supertest';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { smallNetwork } from '../fixtures/small-network';
import { makeTestApp, type TestApp } from '../helpers/testApp';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => t?.close());
beforeEach(async () => t.reset());

const audit = (query = '') => request(t.app).get(`/api/audit${query}`).set(t.auth('admin'));
const importDoc = (doc: object, query = '') => request(t.app).post(`/api/network/import${query}`).set(t.auth('engineer')).send(doc);

describe('GET /api/audit', () => {
  it('records one row per import with the counts, and none for a dry run or a refused import', async () => {
    expect((await importDoc(smallNetwork(), '?dryRun=true')).status).toBe(200);
    expect((await importDoc({ format: 'network/1', sites: [{ code: 'X' }] })).status).toBe(422);
    expect((await audit()).body.total).toBe(0);

    const done = await importDoc(smallNetwork());
    const r = await audit();
    expect(r.status).toBe(200);
    expect(r.body.total).toBe(1);
    const [row] = r.body.items;
    expect(row).toMatchObject({
      action: 'import',
      entityKind: 'network',
      entityCode: null,
      userEmail: 'engineer@test.example',
      before: null,
      networkVersion: done.body.networkVersion,
    });
    expect(row.after.counts.sites).toMatchObject({ created: 5 });
    expect(new Date(row.at).getTime()).toBeGreaterThan(Date.now() - 60_000);
  });

  it('pages newest first and filters by kind, code and action', async () => {
    await importDoc(smallNetwork());
    for (let i = 1; i <= 3; i++) {
      const r = await request(t.app).patch('/api/sites/R1').set(t.auth('engineer')).send({ version: i, name: `Relay One v${i + 1}` });
      expect(r.status).toBe(200);
    }
    await request(t.app).post('/api/groups').set(t.auth('admin')).send({ code: 'G-X', name: 'Extra' });

    const all = await audit('?pageSize=2');
    expect(all.body).toMatchObject({ total: 5, page: 1, pageSize: 2 });
    expect(all.body.items.map((i: { action: string; entityCode: string }) => `${i.action} ${i.entityCode}`)).toEqual(['create G-X', 'update R1']);
    expect(all.body.items[0].userEmail).toBe('admin@test.example');
    const last = await audit('?pageSize=2&page=3');
    expect(last.body.items.map((i: { action: string }) => i.action)).toEqual(['import']);

    const r1 = await audit('?kind=sites&code=R1');
    expect(r1.body.total).toBe(3);
    expect(r1.body.items.map((i: { after: { name: string } }) => i.after.name)).toEqual(['Relay One v4', 'Relay One v3', 'Relay One v2']);
    expect(r1.body.items[2].before.name).toBe('Relay One');
    const versions = r1.body.items.map((i: { networkVersion: number }) => i.networkVersion);
    expect(versions).toEqual([...versions].sort((a, b) => b - a));
    expect(new Set(versions).size).toBe(3);

    expect((await audit('?action=create')).body.total).toBe(1);
    expect((await audit('?kind=feeds')).body.total).toBe(0);
  });

  it('refuses bad filters with 400 and everyone but an admin with 403', async () => {
    expect((await audit('?kind=stations')).status).toBe(400);
    expect((await audit('?pageSize=1000')).status).toBe(400);
    for (const role of ['engineer', 'operator', 'viewer'] as const) {
      expect((await request(t.app).get('/api/audit').set(t.auth(role))).status).toBe(403);
    }
  });
});

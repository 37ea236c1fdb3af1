/**
 * While the in-memory network is not there yet (a process starting, or one
 * whose first build failed), every route that answers from it says so the
 * same way: 503 with code "starting". Once the model is back, the summary's
 * counts are the stored rows'.
 */
import request from 'supertest';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { smallNetwork } from '../fixtures/small-network';
import { useTestApp, type TestApp } from '../helpers/testApp';

const app = useTestApp({ network: smallNetwork });
let t: TestApp;
beforeEach(() => {
  t = app();
});
afterEach(() => {
  vi.restoreAllMocks();
});

const starting = { error: { code: 'starting', message: 'the network is still loading; try again in a moment' } };

async function count(table: string): Promise<number> {
  const [rows] = await t.db.sequelize.query(`SELECT count(*)::int AS n FROM ${table}`);
  return (rows as { n: number }[])[0].n;
}

describe('before the network model is loaded', () => {
  it('answers 503 "starting" on the summary, the analysis and the checks alike', async () => {
    vi.spyOn(t.ctx.network, 'model', 'get').mockReturnValue(null);
    for (const path of ['/api/network/summary', '/api/analysis/spof', '/api/analysis/exposure', '/api/checks', '/api/feeds/M1.TV1.M/checks']) {
      const r = await request(t.app).get(path).set(t.auth('viewer'));
      expect(r.status, path).toBe(503);
      expect(r.body, path).toEqual(starting);
    }
  });

  it('answers the summary from the model again once it is there, with the stored counts', async () => {
    const spy = vi.spyOn(t.ctx.network, 'model', 'get').mockReturnValue(null);
    expect((await request(t.app).get('/api/network/summary').set(t.auth('viewer'))).status).toBe(503);
    spy.mockRestore();
    const r = await request(t.app).get('/api/network/summary').set(t.auth('viewer'));
    expect(r.status).toBe(200);
    expect(r.body.counts).toEqual({
      sites: await count('sites'),
      services: await count('services'),
      groups: await count('risk_groups'),
      carriages: await count('carriages'),
      feeds: await count('feeds'),
    });
    expect(r.body.counts.sites).toBeGreaterThan(0);
    const [roles] = await t.db.sequelize.query(`SELECT role, count(*)::int AS n FROM sites GROUP BY role`);
    const byRole = { origin: 0, main: 0, relay: 0 } as Record<string, number>;
    for (const { role, n } of roles as { role: string; n: number }[]) byRole[role] = n;
    expect(r.body.sitesByRole).toEqual(byRole);
  });
});

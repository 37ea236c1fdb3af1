/**
 * A committed write is never answered with an error because the rebuild of
 * the in-memory model after it failed: the write's answer stands, health
 * calls the model stale, and the rebuild is retried until it succeeds.
 */
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { buildServedNetwork } from '@/server/services/servedNetwork';
import { smallNetwork } from '../fixtures/small-network';
import { makeTestApp } from '../helpers/testApp';
import { waitFor } from '../helpers/cluster';
import { afterAll, beforeAll, beforeEach } from 'vitest';

let failures = 0;
const builds: number[] = [];
/** the real builder, made to fail `failures` more times */
const flakyBuild: typeof buildServedNetwork = (doc, version) => {
  builds.push(version);
  if (failures > 0) {
    failures -= 1;
    throw new Error('injected builder fault');
  }
  return buildServedNetwork(doc, version);
};

let t: Awaited<ReturnType<typeof makeTestApp>>;
beforeAll(async () => {
  // the first retry comes after 1.5 s, so health can be seen stale in between;
  // without an update function every edit rebuilds, so the rebuild's failure is what these tests meet
  t = await makeTestApp({ build: flakyBuild, store: { retryMinMs: 1500, retryMaxMs: 3000, checkEveryMs: 600_000, update: undefined } });
});
afterAll(async () => t?.close());
beforeEach(async () => {
  failures = 0;
  await t.reset();
  const r = await request(t.app).post('/api/network/import').set(t.auth('engineer')).send(smallNetwork());
  expect(r.status).toBe(200);
});

describe('a rebuild that fails after a committed write', () => {
  it('leaves the 201 standing, health stale meanwhile, and is retried until the model has the change', async () => {
    const modelBefore = t.ctx.network.model!;
    failures = 1;
    builds.length = 0;
    const r = await request(t.app).post('/api/sites').set(t.auth('engineer')).send({ code: 'R9', name: 'Relay Nine', role: 'relay', lat: -38, lon: -29 });
    expect(r.status).toBe(201);
    expect(r.body.code).toBe('R9');
    const version = Number(r.headers['x-network-version']);
    expect(version).toBeGreaterThan(modelBefore.networkVersion);
    const [rows] = await t.db.sequelize.query(`SELECT name FROM sites WHERE code = 'R9'`);
    expect(rows).toEqual([{ name: 'Relay Nine' }]);
    expect(builds).toEqual([version]);

    // the last good model still answers; health says it is behind and why
    expect(t.ctx.network.model).toBe(modelBefore);
    const health = await request(t.app).get('/api/health');
    expect(health.status).toBe(503);
    expect(health.body).toMatchObject({ ok: false, db: 'up', model: 'stale', networkVersion: modelBefore.networkVersion, databaseVersion: version });
    expect(health.body.reason).toMatch(/rebuild failed \(injected builder fault\); retrying/);

    await waitFor('the retried rebuild', () => (t.ctx.network.model!.networkVersion === version ? true : undefined), 10_000);
    expect(t.ctx.network.model!.document.sites.map((s) => s.code)).toContain('R9');
    expect(builds).toEqual([version, version]);
    const after = await request(t.app).get('/api/health');
    expect(after.status).toBe(200);
    expect(after.body).toMatchObject({ ok: true, model: 'current', networkVersion: version });
  });

  it('keeps retrying with growing pauses while the builder keeps failing', async () => {
    failures = 3;
    builds.length = 0;
    const t0 = Date.now();
    const r = await request(t.app).patch('/api/sites/R1').set(t.auth('engineer')).send({ version: 1, name: 'Relay One renamed' });
    expect(r.status).toBe(200);
    expect(r.body.name).toBe('Relay One renamed');
    const version = Number(r.headers['x-network-version']);
    await waitFor('the fourth build', () => (t.ctx.network.model!.networkVersion === version ? true : undefined), 20_000, 100);
    // 1.5 s, 3 s, 3 s between the four attempts
    expect(Date.now() - t0).toBeGreaterThanOrEqual(7000);
    expect(builds).toEqual([version, version, version, version]);
    expect(t.ctx.network.status().rebuildFailure).toBeNull();
  });
});

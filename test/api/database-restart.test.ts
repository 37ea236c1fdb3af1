/**
 * PostgreSQL stops and starts under a running server: while it is down,
 * health says so and writes fail fast with 503; when it is back, the server
 * recovers by itself with exactly one change listener, and the model catches
 * up with a change it was never told about. This file stops and starts the
 * test cluster (test/helpers/cluster.ts starts it again even on failure).
 */
import request from 'supertest';
import { Client } from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { smallNetwork } from '../fixtures/small-network';
import { makeTestApp, type TestApp } from '../helpers/testApp';
import { waitFor, whileDatabaseDown } from '../helpers/cluster';

let t: TestApp;
beforeAll(async () => {
  // the periodic check is far off, so any catching up seen here comes from the reconnection
  t = await makeTestApp({ store: { checkEveryMs: 600_000, retryMinMs: 100, retryMaxMs: 800 } });
  await t.reset();
  const r = await request(t.app).post('/api/network/import').set(t.auth('engineer')).send(smallNetwork());
  expect(r.status).toBe(200);
});
afterAll(async () => t?.close());

/** The store's listening connections as PostgreSQL sees them. */
async function listenersInDatabase(): Promise<number> {
  const [rows] = await t.db.sequelize.query('SELECT count(*)::int AS n FROM pg_stat_activity WHERE application_name = $1', {
    bind: [t.ctx.network.listenerName],
  });
  return (rows as { n: number }[])[0].n;
}

/** A change committed behind the server's back: the version moves, no notification is sent. */
async function silentChange(name: string): Promise<number> {
  const c = new Client({ connectionString: t.db.url });
  await c.connect();
  try {
    await c.query('BEGIN');
    await c.query(`UPDATE sites SET name = $1, version = version + 1 WHERE code = 'R2'`, [name]);
    const r = await c.query('UPDATE network_state SET version = version + 1 WHERE id = 1 RETURNING version');
    await c.query('COMMIT');
    return Number(r.rows[0].version);
  } finally {
    await c.end();
  }
}

const siteName = (code: string) => t.ctx.network.model!.document.sites.find((s) => s.code === code)?.name;

async function timed<R>(fn: () => Promise<R>): Promise<{ value: R; ms: number }> {
  const t0 = Date.now();
  const value = await fn();
  return { value, ms: Date.now() - t0 };
}

describe('PostgreSQL restarts under a running server', () => {
  it('health 503 and fast 503 writes while down; recovery with one listener and a model that catches up', async () => {
    const healthy = await request(t.app).get('/api/health');
    expect(healthy.status).toBe(200);
    expect(healthy.body).toMatchObject({ ok: true, db: 'up', model: 'current', listener: 'listening' });
    expect(await listenersInDatabase()).toBe(1);

    // a change nobody was told about: health calls the model stale at once
    const missed = await silentChange('Relay Two, renamed unseen');
    const stale = await request(t.app).get('/api/health');
    expect(stale.status).toBe(503);
    expect(stale.body).toMatchObject({ ok: false, db: 'up', model: 'stale', databaseVersion: missed });
    expect(stale.body.networkVersion).toBeLessThan(missed);
    expect(stale.body.reason).toMatch(/version/);
    const modelBefore = t.ctx.network.model!;

    for (let round = 1; round <= 2; round++) {
      await whileDatabaseDown(async () => {
        const health = await timed(() => request(t.app).get('/api/health'));
        expect(health.value.status).toBe(503);
        expect(health.value.body).toMatchObject({ ok: false, db: 'down' });
        expect(health.value.body.reason).toMatch(/database is not reachable/);
        expect(health.ms).toBeLessThan(4000);

        const created = await timed(() =>
          request(t.app).post('/api/sites').set(t.auth('engineer')).send({ code: `DOWN${round}`, name: 'Written while down', role: 'relay', lat: -38, lon: -29 }),
        );
        expect(created.value.status).toBe(503);
        expect(created.value.body.error.code).toBe('database-unavailable');
        expect(JSON.stringify(created.value.body)).not.toMatch(/ECONNREFUSED|SELECT|INSERT|sequelize/i);
        expect(created.ms).toBeLessThan(4000);

        // analysis keeps its model: the last complete one is still in service
        expect(t.ctx.network.model).not.toBeNull();
        await waitFor('the listener to notice', () => (t.ctx.network.status().listener === 'reconnecting' ? true : undefined), 5000);
        expect(t.ctx.network.status().openListeners).toBe(0);
      });

      await waitFor('health to come back', async () => ((await request(t.app).get('/api/health')).status === 200 ? true : undefined), 15_000, 200);
      expect(t.ctx.network.status()).toMatchObject({ listener: 'listening', openListeners: 1, rebuildFailure: null });
      expect(await listenersInDatabase()).toBe(1);
    }

    // the change made while nobody listened is in the model now
    expect(t.ctx.network.model).not.toBe(modelBefore);
    expect(t.ctx.network.model!.networkVersion).toBeGreaterThanOrEqual(missed);
    expect(siteName('R2')).toBe('Relay Two, renamed unseen');

    // notifications reach the one listener again: a silent change plus a notify from elsewhere
    const c = new Client({ connectionString: t.db.url });
    await c.connect();
    try {
      const v = await silentChange('Relay Two, renamed again');
      await c.query(`SELECT pg_notify('network_changed', $1)`, [String(v)]);
    } finally {
      await c.end();
    }
    await waitFor('the notified change', () => (siteName('R2') === 'Relay Two, renamed again' ? true : undefined), 5000);

    // writes work again, and nothing written during the outage exists
    const ok = await request(t.app).post('/api/sites').set(t.auth('engineer')).send({ code: 'BACK', name: 'Written after', role: 'relay', lat: -38, lon: -29 });
    expect(ok.status).toBe(201);
    const [rows] = await t.db.sequelize.query(`SELECT code FROM sites WHERE code IN ('DOWN1', 'DOWN2', 'BACK') ORDER BY code`);
    expect(rows).toEqual([{ code: 'BACK' }]);
    const health = await request(t.app).get('/api/health');
    expect(health.body).toMatchObject({ ok: true, model: 'current', networkVersion: health.body.databaseVersion });
  });
});

/**
 * What WORKERS=N relies on (scripts/lib/workers.ts): two server instances on
 * one database, each with its own network model, its own listener and its
 * own user-row cache, stay coherent through PostgreSQL notifications alone.
 * An edit through one is answered by the other once its notification is in,
 * and a sign-out through one is refused by the other.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signToken } from '@/server/auth/tokens';
import { makeTestApp, useTestApp, type TestApp } from '../helpers/testApp';
import { smallNetwork } from '../fixtures/small-network';

const first = useTestApp({ network: smallNetwork });
let second: TestApp;
beforeAll(async () => {
  second = await makeTestApp();
});
afterAll(async () => second?.close());

/** A token of the second instance (its own secret) for an account the first one's reset made. */
async function headersFor(a: TestApp, role: 'viewer' | 'operator') {
  const [ids] = await a.db.sequelize.query(`SELECT id FROM users WHERE email = '${role}@test.example'`);
  const token = signToken({ sub: String((ids as { id: number }[])[0].id), email: `${role}@test.example`, role }, second.config.JWT_SECRET, '10m');
  return { Authorization: `Bearer ${token}` };
}

async function until(what: string, check: () => Promise<boolean> | boolean, ms = 10_000) {
  const t0 = Date.now();
  while (!(await check())) {
    if (Date.now() - t0 > ms) throw new Error(`not within ${ms} ms: ${what}`);
    await new Promise((r) => setTimeout(r, 25));
  }
}

describe('two server instances on one database', () => {
  it('answers an edit made through the other one, from its own model', async () => {
    const a = first();
    const site = { code: 'TWO1', name: 'Seen twice', role: 'relay', lat: -38.3, lon: -29.2 };
    const created = await request(a.app).post('/api/sites').set(a.auth('engineer')).send(site);
    expect(created.status).toBe(201);
    const [rows] = await a.db.sequelize.query(`SELECT name FROM sites WHERE code = 'TWO1'`);
    expect(rows).toEqual([{ name: 'Seen twice' }]);
    await until('the second model has the new site', () => second.ctx.network.model?.document.sites.some((s) => s.code === 'TWO1') ?? false);
    const exported = await request(second.app).get('/api/network/export').set(await headersFor(a, 'viewer'));
    expect(exported.status).toBe(200);
    expect(exported.body.sites.find((s: { code: string }) => s.code === 'TWO1')).toMatchObject({ name: 'Seen twice', role: 'relay' });
  });

  it('refuses in one a session ended in the other', async () => {
    const a = first();
    await until('the second instance hears changes to people', () => second.ctx.userChanges!.listening);
    const h = await headersFor(a, 'operator');
    expect((await request(second.app).get('/api/sites').set(h)).status).toBe(200);
    const out = await request(a.app).post('/api/auth/logout').set(a.auth('operator'));
    expect(out.status).toBe(204);
    const [rows] = await a.db.sequelize.query(`SELECT token_version FROM users WHERE email = 'operator@test.example'`);
    expect(rows).toEqual([{ token_version: 1 }]);
    await until('the ended session is refused by the other instance', async () => (await request(second.app).get('/api/sites').set(h)).status === 401);
  });
});

/**
 * The per-process cache of user rows (server/auth/userRowCache.ts): a request
 * skips the row read while changes to users are heard, and a change made
 * outside this process's model (here raw SQL, as another server process or a
 * database console would) still takes effect as soon as its notification
 * arrives; a change through the model takes effect on the very next request.
 */
import request from 'supertest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { User } from '@/server/db/models/user';
import { useTestApp } from '../helpers/testApp';
import { smallNetwork } from '../fixtures/small-network';

const getT = useTestApp({ network: smallNetwork });
afterEach(() => vi.restoreAllMocks());

async function until(what: string, check: () => Promise<boolean> | boolean, ms = 5000) {
  const t0 = Date.now();
  while (!(await check())) {
    if (Date.now() - t0 > ms) throw new Error(`not within ${ms} ms: ${what}`);
    await new Promise((r) => setTimeout(r, 20));
  }
}

describe('user rows cached per process', () => {
  it('reads the row once while listening, and sees a change made by another process on its notification', async () => {
    const t = getT();
    await until('the listener for changes to people is up', () => t.ctx.userChanges!.listening);
    const h = t.auth('engineer');
    const reads = vi.spyOn(User, 'findByPk');
    expect((await request(t.app).get('/api/sites').set(h)).status).toBe(200);
    expect((await request(t.app).get('/api/sites').set(h)).status).toBe(200);
    expect((await request(t.app).get('/api/sites').set(h)).status).toBe(200);
    // at most the first request reads (the import before the test may have cached the row already)
    expect(reads.mock.calls.length).toBeLessThanOrEqual(1);

    // raw SQL runs no model hook: only the trigger's NOTIFY tells this process
    await t.db.sequelize.query(`UPDATE users SET disabled = true WHERE email = 'engineer@test.example'`);
    await until('the disabled account is refused', async () => (await request(t.app).get('/api/sites').set(h)).status === 401);
    const [rows] = await t.db.sequelize.query(`SELECT disabled FROM users WHERE email = 'engineer@test.example'`);
    expect(rows).toEqual([{ disabled: true }]);
  });

  it('takes a role change through the model on the very next request', async () => {
    const t = getT();
    await until('the listener for changes to people is up', () => t.ctx.userChanges!.listening);
    const h = t.auth('engineer');
    const site = { code: 'CACHE1', name: 'Cache test site', role: 'relay', lat: 51, lon: -1 };
    expect((await request(t.app).get('/api/sites').set(h)).status).toBe(200);
    await User.update({ role: 'viewer' }, { where: { email: 'engineer@test.example' } });
    const refused = await request(t.app).post('/api/sites').set(h).send(site);
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe('forbidden');
    const [rows] = await t.db.sequelize.query(`SELECT count(*)::int AS n FROM sites WHERE code = 'CACHE1'`);
    expect(rows).toEqual([{ n: 0 }]);
  });

  it('forgets a row read between a change and its commit once the change commits', async () => {
    const t = getT();
    await until('the listener for changes to people is up', () => t.ctx.userChanges!.listening);
    // withhold the notification, so that only this process's own forgetting can refuse the next request
    const listener = t.ctx.userChanges as unknown as { cache: object };
    const cache = listener.cache;
    listener.cache = { forget: () => undefined, forgetAll: () => undefined };
    try {
      const h = t.auth('viewer');
      const user = await User.findOne({ where: { email: 'viewer@test.example' } });
      await t.db.sequelize.transaction(async (transaction) => {
        await user!.update({ disabled: true }, { transaction });
        // not committed yet: the request still reads (and may keep) the enabled row
        expect((await request(t.app).get('/api/sites').set(h)).status).toBe(200);
      });
      const after = await request(t.app).get('/api/sites').set(h);
      expect(after.status).toBe(401);
      expect(after.body.error.code).toBe('unauthenticated');
      const [rows] = await t.db.sequelize.query(`SELECT disabled FROM users WHERE email = 'viewer@test.example'`);
      expect(rows).toEqual([{ disabled: true }]);
    } finally {
      listener.cache = cache;
    }
  });

  it('reads the row on every request while the listener is down', async () => {
    const t = getT();
    vi.spyOn(t.ctx.userChanges!, 'listening', 'get').mockReturnValue(false);
    const reads = vi.spyOn(User, 'findByPk');
    const h = t.auth('viewer');
    for (let i = 0; i < 3; i++) expect((await request(t.app).get('/api/sites').set(h)).status).toBe(200);
    expect(reads).toHaveBeenCalledTimes(3);
  });

  it('refuses a signed-out token on the next request (sign-out bumps the version without model hooks)', async () => {
    const t = getT();
    await until('the listener for changes to people is up', () => t.ctx.userChanges!.listening);
    const h = t.auth('operator');
    expect((await request(t.app).get('/api/sites').set(h)).status).toBe(200);
    const out = await request(t.app).post('/api/auth/logout').set(h);
    expect(out.status).toBeLessThan(300);
    const after = await request(t.app).get('/api/sites').set(h);
    expect(after.status).toBe(401);
    const [rows] = await t.db.sequelize.query(`SELECT token_version FROM users WHERE email = 'operator@test.example'`);
    expect(rows).toEqual([{ token_version: 1 }]);
  });
});

/**
 * Demo accounts: created with DEMO=1 and never reset over a changed
 * password; disabled (sessions ended) with DEMO=0; the server listens on
 * 127.0.0.1 only while DEMO=1.
 */
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { useTestApp, emailFor } from '../helpers/testApp';
import { User } from '@/server/db/models/user';
import { checkPassword } from '@/server/auth/passwords';
import { applyDemoAccounts, DEMO_USERS, listenHost, type DemoUser } from '@/server/services/demoAccounts';
import { startServer } from '@/server/server';
import { loadConfig } from '@/server/config';
import { defineUser } from '@/server/db/models/user';
import { defineInventory } from '@/server/db/models/inventory';
import { defineAudit } from '@/server/db/models/audit';

const getT = useTestApp();

const DEMO: DemoUser[] = [
  { email: 'demo-admin@test.example', name: 'Demo admin', role: 'admin', password: 'demo-admin-river-1' },
  { email: 'demo-viewer@test.example', name: 'Demo viewer', role: 'viewer', password: 'demo-viewer-river-1' },
];
const row = (email: string) => User.findOne({ where: { email } });

describe('demo accounts', () => {
  it('creates the missing ones with DEMO=1 and leaves a changed password and role alone on the next start', async () => {
    const first = await applyDemoAccounts(true, DEMO);
    expect(first.created).toEqual(DEMO.map((u) => u.email));
    expect(await checkPassword('demo-viewer-river-1', (await row('demo-viewer@test.example'))!.passwordHash)).toBe(true);

    // the viewer changes the password through the app; an admin promotes them
    const t = getT();
    const login = await request(t.app).post('/api/auth/login').send({ email: 'demo-viewer@test.example', password: 'demo-viewer-river-1' });
    const changed = await request(t.app)
      .post('/api/auth/password')
      .set('Authorization', `Bearer ${login.body.token}`)
      .send({ currentPassword: 'demo-viewer-river-1', newPassword: 'my-private-river-pw' });
    expect(changed.status).toBe(200);
    await User.update({ role: 'operator' }, { where: { email: 'demo-viewer@test.example' } });

    const second = await applyDemoAccounts(true, DEMO);
    expect(second).toEqual({ created: [], kept: DEMO.map((u) => u.email), enabled: [], disabled: [] });
    const after = (await row('demo-viewer@test.example'))!;
    expect(await checkPassword('my-private-river-pw', after.passwordHash)).toBe(true);
    expect(await checkPassword('demo-viewer-river-1', after.passwordHash)).toBe(false);
    expect(after.role).toBe('operator');
  });

  it('with DEMO=0 disables any left over, ends their sessions, and touches no other account', async () => {
    const t = getT();
    await applyDemoAccounts(true, DEMO);
    const login = await request(t.app).post('/api/auth/login').send({ email: 'demo-admin@test.example', password: 'demo-admin-river-1' });
    expect(login.status).toBe(200);
    const off = await applyDemoAccounts(false, DEMO);
    expect(off.disabled).toEqual(DEMO.map((u) => u.email));
    for (const u of DEMO) expect((await row(u.email))!.disabled).toBe(true);
    expect((await request(t.app).get('/api/auth/me').set('Authorization', `Bearer ${login.body.token}`)).status).toBe(401);
    expect((await request(t.app).post('/api/auth/login').send({ email: 'demo-admin@test.example', password: 'demo-admin-river-1' })).status).toBe(401);
    expect((await row(emailFor('admin')))!.disabled).toBe(false);
    // a second DEMO=0 start has nothing more to do; DEMO=1 opens them again
    expect((await applyDemoAccounts(false, DEMO)).disabled).toEqual([]);
    expect((await applyDemoAccounts(true, DEMO)).enabled).toEqual(DEMO.map((u) => u.email));
  });

  it('with DEMO=0 creates no demo account', async () => {
    const r = await applyDemoAccounts(false, DEMO);
    expect(r).toEqual({ created: [], kept: [], enabled: [], disabled: [] });
    expect(await User.count({ where: { email: DEMO.map((u) => u.email) } })).toBe(0);
  });

  it('listens on 127.0.0.1 only with DEMO=1, on every address with DEMO=0, and seeds or disables the shipped list', async () => {
    expect(listenHost(true)).toBe('127.0.0.1');
    expect(listenHost(false)).toBe('0.0.0.0');
    const url = process.env.TEST_DATABASE_URL!;
    for (const demo of ['1', '0'] as const) {
      const running = await startServer(url, loadConfig({ ...process.env, PORT: '0', DEMO: demo, WEB_DIR: '/nonexistent' }));
      try {
        const address = running.server.address();
        expect(typeof address === 'object' && address ? address.address : null).toBe(demo === '1' ? '127.0.0.1' : '0.0.0.0');
        const shipped = await User.findAll({ where: { email: DEMO_USERS.map((u) => u.email) } });
        expect(shipped).toHaveLength(DEMO_USERS.length);
        expect(shipped.every((u) => u.disabled === (demo === '0'))).toBe(true);
      } finally {
        await running.close();
        // startServer bound the models to its own (now closed) connection pool: bind them back
        const sequelize = getT().db.sequelize;
        defineUser(sequelize);
        defineInventory(sequelize);
        defineAudit(sequelize);
      }
    }
  });
});

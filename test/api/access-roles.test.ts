/**
 * Access follows the user's row: roles and disables take effect on the next
 * request, nobody changes their own role, the last active admin stays, and
 * the sign-in look-up compares e-mails literally.
 */
import request from 'supertest';
import { beforeEach, describe, expect, it } from 'vitest';
import { useTestApp, TEST_PASSWORD, emailFor } from '../helpers/testApp';
import { User } from '@/server/db/models/user';
import { ensureUser, updateUser } from '@/server/services/users';
import { signToken } from '@/server/auth/tokens';

const getT = useTestApp();

describe('roles follow the user row, not the token', () => {
  it('a demoted admin\'s old token can no longer list users, create admins or restore its own role', async () => {
    const t = getT();
    const oldAdmin = t.auth('admin');
    const adminId = (await User.findOne({ where: { email: emailFor('admin') } }))!.id;
    // a second admin demotes the first
    const second = await User.create({ email: 'second-admin@test.example', name: 'Second', role: 'admin', passwordHash: 'x' });
    const login = await request(t.app).post('/api/auth/login').send({ email: emailFor('admin'), password: TEST_PASSWORD });
    expect(login.status).toBe(200);
    await User.update({ role: 'viewer' }, { where: { id: adminId } });

    const list = await request(t.app).get('/api/users').set(oldAdmin);
    expect(list.status).toBe(403);
    const create = await request(t.app).post('/api/users').set(oldAdmin).send({ email: 'sneaky@test.example', role: 'admin', password: 'a-long-unusual-password' });
    expect(create.status).toBe(403);
    const restore = await request(t.app).patch(`/api/users/${adminId}`).set(oldAdmin).send({ role: 'admin' });
    expect(restore.status).toBe(403);
    const viaLoginToken = await request(t.app).get('/api/users').set('Authorization', `Bearer ${login.body.token}`);
    expect(viaLoginToken.status).toBe(403);

    expect(await User.count({ where: { email: 'sneaky@test.example' } })).toBe(0);
    expect((await User.findByPk(adminId))!.role).toBe('viewer');
    expect((await User.findByPk(second.id))!.role).toBe('admin');
    // what it may still do as a viewer, it does with the row's role
    const me = await request(t.app).get('/api/auth/me').set(oldAdmin);
    expect(me.status).toBe(200);
    expect(me.body.user.role).toBe('viewer');
  });

  it('a promotion takes effect on the next request with the old token', async () => {
    const t = getT();
    const h = t.auth('viewer');
    expect((await request(t.app).get('/api/users').set(h)).status).toBe(403);
    await User.update({ role: 'admin' }, { where: { email: emailFor('viewer') } });
    expect((await request(t.app).get('/api/users').set(h)).status).toBe(200);
  });

  it('a disable through the API ends the person\'s access on the next request', async () => {
    const t = getT();
    const h = t.auth('engineer');
    expect((await request(t.app).get('/api/auth/me').set(h)).status).toBe(200);
    const id = (await User.findOne({ where: { email: emailFor('engineer') } }))!.id;
    const r = await request(t.app).patch(`/api/users/${id}`).set(t.auth('admin')).send({ disabled: true });
    expect(r.status).toBe(200);
    expect((await request(t.app).get('/api/auth/me').set(h)).status).toBe(401);
  });
});

describe('the admin role is guarded', () => {
  let adminIdSync: number | undefined;
  const adminId = async () => (adminIdSync = (await User.findOne({ where: { email: emailFor('admin') } }))!.id);
  beforeEach(async () => {
    await adminId();
  });

  it('nobody changes their own role, even with another admin present (409, plain sentence)', async () => {
    const t = getT();
    await User.create({ email: 'other-admin@test.example', name: 'Other', role: 'admin', passwordHash: 'x' });
    const r = await request(t.app).patch(`/api/users/${await adminId()}`).set(t.auth('admin')).send({ role: 'engineer' });
    expect(r.status).toBe(409);
    expect(r.body.error).toMatchObject({ code: 'own-role' });
    expect(r.body.error.message).toMatch(/cannot change your own role/);
    expect((await User.findByPk(await adminId()))!.role).toBe('admin');
  });

  it('the last active admin cannot be demoted or disabled (409, plain sentence, row unchanged)', async () => {
    const t = getT();
    // a disabled admin does not count; the acting person here is not an admin row (the service's own rule)
    await User.create({ email: 'disabled-admin@test.example', name: 'Gone', role: 'admin', passwordHash: 'x', disabled: true });
    const engineerId = (await User.findOne({ where: { email: emailFor('engineer') } }))!.id;
    for (const change of [{ role: 'viewer' as const }, { disabled: true }]) {
      const err = await t.db.sequelize.transaction((tx) => updateUser(adminIdSync!, change, engineerId, tx)).catch((e) => e);
      expect(err).toMatchObject({ status: 409, code: 'last-admin' });
      expect(err.message).toMatch(/last active admin/);
    }
    expect((await User.findByPk(adminIdSync!))!.toPublic()).toMatchObject({ role: 'admin', disabled: false });
  });

  it('two admins demoting each other at once leave exactly one admin (one 200, one 409)', async () => {
    const t = getT();
    const other = await User.create({ email: 'other-admin@test.example', name: 'Other', role: 'admin', passwordHash: 'x' });
    const otherToken = { Authorization: `Bearer ${signToken({ sub: String(other.id), email: other.email, role: 'admin' }, t.config.JWT_SECRET, '5m')}` };
    const [a, b] = await Promise.all([
      request(t.app).patch(`/api/users/${other.id}`).set(t.auth('admin')).send({ role: 'viewer' }),
      request(t.app).patch(`/api/users/${adminIdSync}`).set(otherToken).send({ role: 'viewer' }),
    ]);
    const statuses = [a.status, b.status].sort();
    // the second may also be refused as 403 when its row was demoted before its request was checked
    expect(statuses[0]).toBe(200);
    expect([403, 409]).toContain(statuses[1]);
    expect(await User.count({ where: { role: 'admin', disabled: false } })).toBe(1);
  });
});

describe('sign-in looks the e-mail up literally', () => {
  it('refuses % and _ as wildcards with the admin password', async () => {
    const t = getT();
    for (const email of ['%', '%@test.example', 'admin@test%', 'a_min@test.example', '_dmin@test.example', '%admin%']) {
      const r = await request(t.app).post('/api/auth/login').send({ email, password: TEST_PASSWORD });
      expect(r.status, email).toBe(401);
      expect(r.body.token).toBeUndefined();
      t.ctx.resetLoginLimits?.();
    }
  });

  it('takes the e-mail in any case and with spaces around it', async () => {
    const t = getT();
    const r = await request(t.app).post('/api/auth/login').send({ email: '  AdMiN@Test.EXAMPLE ', password: TEST_PASSWORD });
    expect(r.status).toBe(200);
    expect(r.body.user.email).toBe(emailFor('admin'));
  });

  it('finds an address that really holds % or _ only when typed exactly', async () => {
    const t = getT();
    await User.create({ email: 'odd_100%@test.example', name: 'Odd', role: 'viewer', passwordHash: (await User.findOne({ where: { email: emailFor('viewer') } }))!.passwordHash });
    expect((await request(t.app).post('/api/auth/login').send({ email: 'ODD_100%@test.example', password: TEST_PASSWORD })).status).toBe(200);
    expect((await request(t.app).post('/api/auth/login').send({ email: 'oddX100%@test.example', password: TEST_PASSWORD })).status).toBe(401);
  });

  it('answers a NUL byte in the e-mail with 400 naming the field, not 500', async () => {
    const t = getT();
    const r = await request(t.app).post('/api/auth/login').send({ email: 'admin@test.example\u0000', password: TEST_PASSWORD });
    expect(r.status).toBe(400);
    expect(r.body.error.message).toMatch(/email.*NUL/);
  });

  it('ADMIN_EMAIL at start matches literally: a pattern does not take over another account', async () => {
    const before = await User.findOne({ where: { email: emailFor('engineer') } });
    await ensureUser('%', 'start-admin-password-1', 'admin', 'Administrator');
    await ensureUser('ENGINEER@TEST.EXAMPLE ', 'start-admin-password-2', 'admin');
    const after = await User.findOne({ where: { email: emailFor('engineer') } });
    // the mixed-case address is the engineer's own account, so that one is (deliberately) made admin
    expect(after!.role).toBe('admin');
    expect(after!.id).toBe(before!.id);
    // '%' made a new account of its own and touched no one else
    expect(await User.count({ where: { email: '%' } })).toBe(1);
    expect((await User.findOne({ where: { email: emailFor('viewer') } }))!.role).toBe('viewer');
    expect(await User.count()).toBe(5);
  });
});

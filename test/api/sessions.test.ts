/**
 * Sessions end when they should: sign-out and password changes bump the
 * person's token version, so every older token is refused; an admin-set
 * temporary password must be changed before anything else; the password rule
 * refuses common and over-long passwords.
 */
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { useTestApp, TEST_PASSWORD, emailFor } from '../helpers/testApp';
import { User } from '@/server/db/models/user';
import { checkPassword } from '@/server/auth/passwords';

const getT = useTestApp();
const bearer = (token: string) => ({ Authorization: `Bearer ${token}` });

async function signIn(email: string, password = TEST_PASSWORD) {
  const r = await request(getT().app).post('/api/auth/login').send({ email, password });
  expect(r.status).toBe(200);
  return r.body as { token: string; user: { id: number; mustChangePassword: boolean } };
}

describe('sign-out', () => {
  it('ends every session of that person, and only theirs', async () => {
    const t = getT();
    const phone = await signIn(emailFor('operator'));
    const desk = await signIn(emailFor('operator'));
    const other = await signIn(emailFor('viewer'));
    const out = await request(t.app).post('/api/auth/logout').set(bearer(phone.token));
    expect(out.status).toBe(204);
    expect((await request(t.app).get('/api/auth/me').set(bearer(phone.token))).status).toBe(401);
    const deskAfter = await request(t.app).get('/api/auth/me').set(bearer(desk.token));
    expect(deskAfter.status).toBe(401);
    expect(deskAfter.body.error.message).toMatch(/session has ended/);
    expect((await request(t.app).get('/api/auth/me').set(bearer(other.token))).status).toBe(200);
    expect((await User.findOne({ where: { email: emailFor('operator') } }))!.tokenVersion).toBe(1);
    // signing in again works
    const again = await signIn(emailFor('operator'));
    expect((await request(t.app).get('/api/auth/me').set(bearer(again.token))).status).toBe(200);
  });
});

describe('changing one\'s own password', () => {
  const change = (token: string, currentPassword: string, newPassword: string) =>
    request(getT().app).post('/api/auth/password').set(bearer(token)).send({ currentPassword, newPassword });

  it('needs the current password, ends the older sessions and hands back a working token', async () => {
    const t = getT();
    const a = await signIn(emailFor('engineer'));
    const b = await signIn(emailFor('engineer'));
    const wrong = await change(a.token, 'not-my-password', 'a-fresh-river-password');
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.details).toEqual([{ field: 'currentPassword', message: 'The current password is not right.' }]);
    const ok = await change(a.token, TEST_PASSWORD, 'a-fresh-river-password');
    expect(ok.status).toBe(200);
    expect((await request(t.app).get('/api/auth/me').set(bearer(a.token))).status).toBe(401);
    expect((await request(t.app).get('/api/auth/me').set(bearer(b.token))).status).toBe(401);
    expect((await request(t.app).get('/api/auth/me').set(bearer(ok.body.token))).status).toBe(200);
    const row = (await User.findOne({ where: { email: emailFor('engineer') } }))!;
    expect(await checkPassword('a-fresh-river-password', row.passwordHash)).toBe(true);
    expect(row.tokenVersion).toBe(1);
    expect((await request(t.app).post('/api/auth/login').send({ email: emailFor('engineer'), password: TEST_PASSWORD })).status).toBe(401);
  });

  it('refuses a common password and one over 72 bytes, naming why, and keeps the old one', async () => {
    const s = await signIn(emailFor('viewer'));
    const common = await change(s.token, TEST_PASSWORD, 'QwertyUiop');
    expect(common.status).toBe(400);
    expect(common.body.error.message).toMatch(/most used passwords/);
    // 37 characters but 74 bytes in UTF-8
    const long = await change(s.token, TEST_PASSWORD, 'é'.repeat(37));
    expect(long.status).toBe(400);
    expect(long.body.error.message).toMatch(/at most 72 bytes/);
    const exactly72 = await change(s.token, TEST_PASSWORD, 'é'.repeat(36));
    expect(exactly72.status).toBe(200);
    expect(await checkPassword('é'.repeat(36), (await User.findOne({ where: { email: emailFor('viewer') } }))!.passwordHash)).toBe(true);
  });

  it('applies the same rule to invitations', async () => {
    const t = getT();
    const r = await request(t.app).post('/api/users').set(t.auth('admin')).send({ email: 'new@test.example', role: 'viewer', password: '1234567890' });
    expect(r.status).toBe(400);
    expect(r.body.error.message).toMatch(/most used/);
    expect(await User.count({ where: { email: 'new@test.example' } })).toBe(0);
  });
});

describe('a temporary password set by an admin', () => {
  it('ends the person\'s sessions and must be changed before anything else', async () => {
    const t = getT();
    const before = await signIn(emailFor('operator'));
    const id = before.user.id;
    const set = await request(t.app).put(`/api/users/${id}/password`).set(t.auth('admin')).send({ password: 'temporary-river-42' });
    expect(set.status).toBe(200);
    expect(set.body.user).toMatchObject({ mustChangePassword: true });
    expect(set.body.user).not.toHaveProperty('passwordHash');
    expect((await request(t.app).get('/api/auth/me').set(bearer(before.token))).status).toBe(401);

    const temp = await signIn(emailFor('operator'), 'temporary-river-42');
    expect(temp.user.mustChangePassword).toBe(true);
    for (const [method, path] of [['get', '/api/auth/me'], ['get', '/api/sites'], ['post', '/api/analysis/reach']] as const) {
      const r = await request(t.app)[method](path).set(bearer(temp.token)).send({});
      expect(r.status, path).toBe(403);
      expect(r.body.error.code).toBe('password-change-required');
    }
    const changed = await request(t.app).post('/api/auth/password').set(bearer(temp.token)).send({ currentPassword: 'temporary-river-42', newPassword: 'my-own-river-password' });
    expect(changed.status).toBe(200);
    expect(changed.body.user.mustChangePassword).toBe(false);
    expect((await request(t.app).get('/api/sites').set(bearer(changed.body.token))).status).toBe(200);
    expect((await User.findByPk(id))!.mustChangePassword).toBe(false);
  });

  it('lets a person with a temporary password sign out', async () => {
    const t = getT();
    const id = (await User.findOne({ where: { email: emailFor('viewer') } }))!.id;
    await request(t.app).put(`/api/users/${id}/password`).set(t.auth('admin')).send({ password: 'temporary-river-43' });
    const temp = await signIn(emailFor('viewer'), 'temporary-river-43');
    expect((await request(t.app).post('/api/auth/logout').set(bearer(temp.token))).status).toBe(204);
  });

  it('is for admins only and follows the password rule', async () => {
    const t = getT();
    const id = (await User.findOne({ where: { email: emailFor('viewer') } }))!.id;
    expect((await request(t.app).put(`/api/users/${id}/password`).set(t.auth('engineer')).send({ password: 'temporary-river-44' })).status).toBe(403);
    const common = await request(t.app).put(`/api/users/${id}/password`).set(t.auth('admin')).send({ password: 'qwertyuiop' });
    expect(common.status).toBe(400);
    expect((await User.findByPk(id))!.mustChangePassword).toBe(false);
    expect((await request(t.app).put('/api/users/999999/password').set(t.auth('admin')).send({ password: 'temporary-river-45' })).status).toBe(404);
  });
});

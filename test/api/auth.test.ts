import request from 'supertest';
import jwt from 'jsonwebtoken';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { makeTestApp, TEST_PASSWORD, emailFor, type TestApp } from '../helpers/testApp';
import { User } from '@/server/db/models/user';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => t?.close());
beforeEach(async () => t.reset());

describe('POST /api/auth/login', () => {
  it('signs in with the right password and the token opens /api/auth/me', async () => {
    const res = await request(t.app).post('/api/auth/login').send({ email: emailFor('engineer'), password: TEST_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ email: emailFor('engineer'), role: 'engineer' });
    const me = await request(t.app).get('/api/auth/me').set('Authorization', `Bearer ${res.body.token}`);
    expect(me.status).toBe(200);
    expect(me.body.user.role).toBe('engineer');
  });

  it('answers an unknown user and a wrong password the same way, without saying which', async () => {
    const wrong = await request(t.app).post('/api/auth/login').send({ email: emailFor('viewer'), password: 'not-the-password' });
    const unknown = await request(t.app).post('/api/auth/login').send({ email: 'nobody@test.example', password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
    expect(wrong.body.error.message).not.toMatch(/password is wrong|no such user|unknown user/i);
  });

  it('stores passwords as bcrypt hashes with cost >= 10', async () => {
    const u = await User.findOne({ where: { email: emailFor('admin') } });
    const m = /^\$2[aby]\$(\d\d)\$/.exec(u!.passwordHash);
    expect(m).not.toBeNull();
    expect(Number(m![1])).toBeGreaterThanOrEqual(10);
  });

  it('gives 429 to the tenth quick failed sign-in', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 10; i++) {
      const r = await request(t.app).post('/api/auth/login').send({ email: emailFor('viewer'), password: `wrong-${i}` });
      statuses.push(r.status);
    }
    expect(statuses.slice(0, 9)).toEqual(Array(9).fill(401));
    expect(statuses[9]).toBe(429);
  });

  it('refuses a disabled account', async () => {
    await User.update({ disabled: true }, { where: { email: emailFor('operator') } });
    const r = await request(t.app).post('/api/auth/login').send({ email: emailFor('operator'), password: TEST_PASSWORD });
    expect(r.status).toBe(401);
  });

  it('answers 400 naming the field for a malformed body, and 400 for malformed JSON', async () => {
    const r = await request(t.app).post('/api/auth/login').send({ email: emailFor('viewer') });
    expect(r.status).toBe(400);
    expect(r.body.error.message).toMatch(/password/);
    const bad = await request(t.app).post('/api/auth/login').set('Content-Type', 'application/json').send('{"email":');
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('malformed-json');
  });
});

describe('tokens', () => {
  it('rejects a forged token (wrong secret) with 401', async () => {
    const forged = jwt.sign({ email: emailFor('admin'), role: 'admin' }, 'some-other-secret-of-enough-length', { subject: '1', issuer: 'headwater' });
    const r = await request(t.app).get('/api/auth/me').set('Authorization', `Bearer ${forged}`);
    expect(r.status).toBe(401);
  });

  it('rejects an expired token with 401', async () => {
    const expired = jwt.sign({ email: emailFor('admin'), role: 'admin', exp: Math.floor(Date.now() / 1000) - 60 }, t.config.JWT_SECRET, { subject: '1', issuer: 'headwater' });
    const r = await request(t.app).get('/api/auth/me').set('Authorization', `Bearer ${expired}`);
    expect(r.status).toBe(401);
  });

  it('rejects a token whose account was disabled since', async () => {
    const h = t.auth('engineer');
    await User.update({ disabled: true }, { where: { email: emailFor('engineer') } });
    const r = await request(t.app).get('/api/auth/me').set(h);
    expect(r.status).toBe(401);
  });
});

describe('people (admin)', () => {
  it('lets an admin invite a user, change the role and disable them', async () => {
    const created = await request(t.app).post('/api/users').set(t.auth('admin')).send({ email: 'new@test.example', name: 'New Person', role: 'viewer', password: 'a-long-password' });
    expect(created.status).toBe(201);
    expect(created.body.user).not.toHaveProperty('passwordHash');
    const id = created.body.user.id;
    const promoted = await request(t.app).patch(`/api/users/${id}`).set(t.auth('admin')).send({ role: 'operator' });
    expect(promoted.body.user.role).toBe('operator');
    const disabled = await request(t.app).patch(`/api/users/${id}`).set(t.auth('admin')).send({ disabled: true });
    expect(disabled.body.user.disabled).toBe(true);
    const list = await request(t.app).get('/api/users').set(t.auth('admin'));
    expect(list.body.users.find((u: { email: string }) => u.email === 'new@test.example')).toMatchObject({ role: 'operator', disabled: true });
    const login = await request(t.app).post('/api/auth/login').send({ email: 'new@test.example', password: 'a-long-password' });
    expect(login.status).toBe(401);
  });

  it('refuses a duplicate e-mail with 409 and a short password with 400', async () => {
    const dup = await request(t.app).post('/api/users').set(t.auth('admin')).send({ email: emailFor('viewer'), role: 'viewer', password: 'a-long-password' });
    expect(dup.status).toBe(409);
    const short = await request(t.app).post('/api/users').set(t.auth('admin')).send({ email: 'x@test.example', role: 'viewer', password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.message).toMatch(/password/);
  });

  it('forbids a viewer from the admin routes (403)', async () => {
    const r = await request(t.app).get('/api/users').set(t.auth('viewer'));
    expect(r.status).toBe(403);
  });
});

describe('GET /api/health', () => {
  it('answers ok with the database up and the network version', async () => {
    const r = await request(t.app).get('/api/health');
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({ ok: true, db: 'up' });
    expect(typeof r.body.networkVersion).toBe('number');
  });
});

describe('web app fallback', () => {
  it('answers a deep link with 503 and a clear sentence when the web app is not built (never a 500)', async () => {
    const r = await request(t.app).get('/reach?fail=site:X');
    expect(r.status).toBe(503);
    expect(r.text).toContain('npm run web:build');
  });
});

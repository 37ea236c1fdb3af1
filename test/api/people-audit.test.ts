/**
 * Changes to people and every sign-in are in the audit log: who, when, what,
 * to whom; never a password or a hash. Shown through GET /api/audit with the
 * kind filter `people`.
 */
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { useTestApp, TEST_PASSWORD, emailFor } from '../helpers/testApp';
import { User } from '@/server/db/models/user';

const getT = useTestApp();

interface Row {
  user_email: string | null;
  user_id: number | null;
  action: string;
  entity_kind: string;
  entity_code: string | null;
  before: unknown;
  after: unknown;
  at: Date;
  network_version: number | null;
}

async function auditRows(): Promise<Row[]> {
  const [rows] = await getT().db.sequelize.query('SELECT * FROM audit_log ORDER BY id');
  return rows as Row[];
}

describe('audit of people', () => {
  it('records invitation, role change, disable, enable and temporary password with who, when and to whom', async () => {
    const t = getT();
    const admin = t.auth('admin');
    const started = Date.now() - 1000;
    const invited = await request(t.app).post('/api/users').set(admin).send({ email: 'new@test.example', name: 'New', role: 'viewer', password: 'invite-river-password' });
    const id = invited.body.user.id;
    await request(t.app).patch(`/api/users/${id}`).set(admin).send({ role: 'operator' });
    await request(t.app).patch(`/api/users/${id}`).set(admin).send({ disabled: true });
    await request(t.app).patch(`/api/users/${id}`).set(admin).send({ disabled: false, name: 'Renamed' });
    await request(t.app).put(`/api/users/${id}/password`).set(admin).send({ password: 'temporary-river-77' });
    const rows = await auditRows();
    expect(rows.map((r) => r.action)).toEqual(['invite', 'role-change', 'disable', 'enable', 'password-set']);
    for (const r of rows) {
      expect(r).toMatchObject({ entity_kind: 'people', entity_code: 'new@test.example', user_email: emailFor('admin'), network_version: null });
      expect(new Date(r.at).getTime()).toBeGreaterThan(started);
    }
    expect(rows[0].after).toEqual({ name: 'New', role: 'viewer' });
    expect(rows[1]).toMatchObject({ before: { role: 'viewer' }, after: { role: 'operator' } });
    expect(rows[2]).toMatchObject({ before: { disabled: false }, after: { disabled: true } });
    const text = JSON.stringify(rows);
    expect(text).not.toMatch(/invite-river-password|temporary-river-77|\$2[aby]\$/);
  });

  it('records sign-ins, failed ones with the e-mail tried but never the password, own password changes and sign-outs', async () => {
    const t = getT();
    const ok = await request(t.app).post('/api/auth/login').send({ email: emailFor('engineer'), password: TEST_PASSWORD });
    await request(t.app).post('/api/auth/login').send({ email: emailFor('engineer'), password: 'guess-number-one' });
    await request(t.app).post('/api/auth/login').send({ email: 'Nobody@Test.example', password: 'guess-number-two' });
    await User.update({ disabled: true }, { where: { email: emailFor('viewer') } });
    await request(t.app).post('/api/auth/login').send({ email: emailFor('viewer'), password: TEST_PASSWORD });
    const bearer = { Authorization: `Bearer ${ok.body.token}` };
    const changed = await request(t.app).post('/api/auth/password').set(bearer).send({ currentPassword: TEST_PASSWORD, newPassword: 'own-new-river-password' });
    await request(t.app).post('/api/auth/logout').set({ Authorization: `Bearer ${changed.body.token}` });
    const rows = await auditRows();
    expect(rows.map((r) => [r.action, r.entity_code, r.user_email])).toEqual([
      ['sign-in', emailFor('engineer'), emailFor('engineer')],
      ['sign-in-failed', emailFor('engineer'), null],
      ['sign-in-failed', 'Nobody@Test.example', null],
      ['sign-in-failed', emailFor('viewer'), null],
      ['password-change', emailFor('engineer'), emailFor('engineer')],
      ['sign-out', emailFor('engineer'), emailFor('engineer')],
    ]);
    expect(rows.slice(1, 4).map((r) => r.after)).toEqual([{ reason: 'wrong password' }, { reason: 'no such account' }, { reason: 'account disabled' }]);
    expect(JSON.stringify(rows)).not.toMatch(/guess-number|own-new-river-password|\$2[aby]\$/);
    expect(JSON.stringify(rows)).not.toContain(TEST_PASSWORD);
  });

  it('leaves no record of a refused change', async () => {
    const t = getT();
    const adminId = (await User.findOne({ where: { email: emailFor('admin') } }))!.id;
    const r = await request(t.app).patch(`/api/users/${adminId}`).set(t.auth('admin')).send({ role: 'viewer' });
    expect(r.status).toBe(409);
    expect(await auditRows()).toEqual([]);
  });

  it('lists people events for admins with the kind and action filters', async () => {
    const t = getT();
    await request(t.app).post('/api/auth/login').send({ email: emailFor('operator'), password: 'a-wrong-guess' });
    await request(t.app).post('/api/auth/login').send({ email: emailFor('operator'), password: TEST_PASSWORD });
    const all = await request(t.app).get('/api/audit?kind=people').set(t.auth('admin'));
    expect(all.status).toBe(200);
    expect(all.body.total).toBe(2);
    const failed = await request(t.app).get('/api/audit?kind=people&action=sign-in-failed').set(t.auth('admin'));
    expect(failed.body.items).toHaveLength(1);
    expect(failed.body.items[0]).toMatchObject({ action: 'sign-in-failed', entityKind: 'people', entityCode: emailFor('operator'), userEmail: null, networkVersion: null });
    expect((await request(t.app).get('/api/audit?kind=people').set(t.auth('engineer'))).status).toBe(403);
  });
});

import { describe, expect, it } from 'vitest';
import { ApiError } from '@/src/api/client';
import { checkInvitation, invitationErrorsFromServer } from './invitation';

const good = { email: ' new.person@example.test ', name: ' New Person ', role: 'operator', password: 'ten-chars!' };

describe('checkInvitation', () => {
  it('accepts a complete invitation and trims email and name', () => {
    expect(checkInvitation(good)).toEqual({
      ok: true,
      invitation: { email: 'new.person@example.test', name: 'New Person', role: 'operator', password: 'ten-chars!' },
    });
  });

  it('allows an empty name, as the server does', () => {
    expect(checkInvitation({ ...good, name: '' }).ok).toBe(true);
  });

  it('names each wrong field', () => {
    const r = checkInvitation({ email: 'nobody', name: 'x'.repeat(201), role: null, password: 'short' });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors.email).toMatch(/does not look like an email/);
    expect(r.errors.name).toMatch(/at most 200/);
    expect(r.errors.role).toBe('Pick a role: admin, engineer, operator or viewer.');
    expect(r.errors.password).toMatch(/at least 10 characters/);
  });

  it('asks for the email when it is blank, and refuses an unknown role', () => {
    const r = checkInvitation({ ...good, email: '   ', role: 'owner' });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors.email).toBe('Enter an email address.');
    expect(r.errors.role).toBe('Pick a role: admin, engineer, operator or viewer.');
  });

  it('takes a 10-character password and refuses 9 (the server minimum)', () => {
    expect(checkInvitation({ ...good, password: 'a'.repeat(10) }).ok).toBe(true);
    expect(checkInvitation({ ...good, password: 'a'.repeat(9) }).ok).toBe(false);
  });
});

describe('invitationErrorsFromServer', () => {
  it('puts field details beside their fields', () => {
    const e = new ApiError(400, 'bad-request', 'body: password: too short', [
      { field: 'password', message: 'password must be at least 10 characters' },
      { field: 'unknownField', message: 'ignored' },
    ]);
    expect(invitationErrorsFromServer(e)).toEqual({ password: 'password must be at least 10 characters' });
  });

  it('puts an address already in use beside the email', () => {
    expect(invitationErrorsFromServer(new ApiError(409, 'conflict', 'a user with e-mail a@b.test already exists'))).toEqual({
      email: 'a user with e-mail a@b.test already exists',
    });
  });

  it('puts anything else above the form', () => {
    expect(invitationErrorsFromServer(new ApiError(403, 'forbidden', 'admins only'))).toEqual({ form: 'admins only' });
    expect(invitationErrorsFromServer(new TypeError('x')).form).toMatch(/could not be sent/);
  });
});

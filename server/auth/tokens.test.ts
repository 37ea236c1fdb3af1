/**
 * Token checks (tokens.ts): a checked token is remembered until it expires,
 * only for the secret it was checked with, and an oversized one is checked
 * afresh every time rather than kept.
 */
import jwt from 'jsonwebtoken';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { signToken, verifyToken } from './tokens';

const SECRET = 'a-test-secret-of-some-length-0123456789';
afterEach(() => {
  vi.useRealTimers();
  vi.restoreAllMocks();
});

describe('verifyToken', () => {
  it('checks a signature once, and never for another secret', () => {
    const token = signToken({ sub: '7', email: 'once@test.example', role: 'engineer', tv: 2 }, SECRET, '10m');
    const verify = vi.spyOn(jwt, 'verify');
    expect(verifyToken(token, SECRET)).toEqual({ sub: '7', email: 'once@test.example', role: 'engineer', tv: 2 });
    expect(verifyToken(token, SECRET)?.sub).toBe('7');
    expect(verify).toHaveBeenCalledTimes(1);
    expect(verifyToken(token, `${SECRET}-other`)).toBeNull();
    expect(verifyToken(`${token.slice(0, -2)}xx`, SECRET)).toBeNull();
  });

  it('refuses a remembered token once it has expired', () => {
    vi.useFakeTimers({ now: new Date('2026-06-01T12:00:00Z') });
    const token = signToken({ sub: '8', email: 'expiring@test.example', role: 'viewer' }, SECRET, '60s');
    expect(verifyToken(token, SECRET)?.sub).toBe('8');
    vi.setSystemTime(new Date('2026-06-01T12:01:00Z'));
    expect(verifyToken(token, SECRET)).toBeNull();
    expect(verifyToken(token, SECRET)).toBeNull();
  });

  it('does not keep an oversized token (a validly signed one with a huge claim)', () => {
    const token = signToken({ sub: '9', email: `${'x'.repeat(5_000)}@test.example`, role: 'viewer' }, SECRET, '10m');
    const verify = vi.spyOn(jwt, 'verify');
    expect(verifyToken(token, SECRET)?.sub).toBe('9');
    expect(verifyToken(token, SECRET)?.sub).toBe('9');
    expect(verify).toHaveBeenCalledTimes(2);
  });
});

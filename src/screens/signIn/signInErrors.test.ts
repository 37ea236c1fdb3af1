import { describe, expect, it } from 'vitest';
import { ApiError } from '@/src/api/client';
import { checkSignInFields, NOT_RECOGNISED, signInFailureMessage, TOO_MANY } from './signInErrors';

describe('signInFailureMessage', () => {
  it('says the same thing for a wrong email and a wrong password', () => {
    const unknownEmail = new ApiError(401, 'bad-credentials', 'no such user');
    const wrongPassword = new ApiError(401, 'bad-credentials', 'password mismatch');
    expect(signInFailureMessage(unknownEmail)).toBe(NOT_RECOGNISED);
    expect(signInFailureMessage(wrongPassword)).toBe(NOT_RECOGNISED);
    expect(NOT_RECOGNISED).toMatch(/email or password not recognised/i);
  });

  it('never passes the server message of a 400 through', () => {
    expect(signInFailureMessage(new ApiError(400, 'validation', 'email: unknown account'))).toBe(NOT_RECOGNISED);
  });

  it('asks the person to wait when rate-limited', () => {
    expect(signInFailureMessage(new ApiError(429, 'rate-limited', 'slow down'))).toBe(TOO_MANY);
  });

  it('says when the server cannot be reached or fails', () => {
    expect(signInFailureMessage(new ApiError(0, 'network', 'Could not reach the Headwater server.'))).toBe('Could not reach the Headwater server.');
    expect(signInFailureMessage(new ApiError(503, 'http-503', 'x'))).toMatch(/could not sign you in just now/);
    expect(signInFailureMessage(new Error('boom'))).toMatch(/did not work/);
  });
});

describe('checkSignInFields', () => {
  it('asks for both fields when empty', () => {
    expect(checkSignInFields('  ', '')).toEqual({ email: 'Enter your email address.', password: 'Enter your password.' });
  });
  it('flags an address without @ and accepts a plausible one', () => {
    expect(checkSignInFields('ana.example.test', 'pw').email).toMatch(/does not look like an email/);
    expect(checkSignInFields(' ana@example.test ', 'pw')).toEqual({});
  });
});

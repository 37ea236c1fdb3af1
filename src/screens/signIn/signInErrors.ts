/**
 * What the sign-in form says. A refused sign-in never says whether the email
 * or the password was wrong (OWASP Authentication Cheat Sheet, "Authentication
 * and Error Messages": respond with a generic message either way).
 */
import { isApiError } from '@/src/api/client';

export const NOT_RECOGNISED = 'Email or password not recognised.';
export const TOO_MANY = 'Too many sign-in attempts. Wait a few minutes, then try again.';

export function signInFailureMessage(error: unknown): string {
  if (isApiError(error)) {
    // 400 as well as 401: a validation answer could otherwise reveal which field the server disliked.
    if (error.status === 401 || error.status === 400) return NOT_RECOGNISED;
    if (error.status === 429) return TOO_MANY;
    if (error.status === 0) return error.message;
    if (error.status >= 500) return 'The server could not sign you in just now. Try again in a moment.';
  }
  return 'Sign-in did not work. Try again.';
}

export interface SignInFieldErrors {
  email?: string;
  password?: string;
}

/** Checks only that something plausible was typed; the server decides the rest. */
export function checkSignInFields(email: string, password: string): SignInFieldErrors {
  const errors: SignInFieldErrors = {};
  const e = email.trim();
  if (e === '') errors.email = 'Enter your email address.';
  else if (!/^[^\s@]+@[^\s@]+$/.test(e)) errors.email = 'That does not look like an email address.';
  if (password === '') errors.password = 'Enter your password.';
  return errors;
}

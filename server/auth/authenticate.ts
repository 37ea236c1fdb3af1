/**
 * Who is asking, from the user's row rather than the token: the token proves
 * who signed in and under which token version; the row (read per request, or
 * from this process's cache while it hears every change to users: see
 * userRowCache.ts) says the role, whether the account is disabled, whether that token
 * version is still current and whether a temporary password must be changed.
 * A role change, a disable or a sign-out therefore takes effect on the next
 * request.
 */
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { Role } from '@/shared/api';
import { ApiError } from '../http/errors';
import { isDatabaseUnavailableError } from '../db/unavailable';
import { verifyToken } from './tokens';
import { UserRowCache, type UserRow } from './userRowCache';

export interface AuthInfo {
  userId: number;
  /** the user id as the token's subject (a string), kept for older callers */
  sub: string;
  email: string;
  role: Role;
  tokenVersion: number;
  mustChangePassword: boolean;
}

declare module 'express-serve-static-core' {
  interface Request {
    auth?: AuthInfo;
  }
}

export type LoadUserRow = (userId: number) => Promise<UserRow | null>;

const unauthenticated = (message: string) => new ApiError(401, 'unauthenticated', message);

/** A refused request's body is never read; close the connection rather than drain it. */
function refuse(req: Request, res: Response, next: NextFunction, e: ApiError) {
  if (!req.complete) res.set('Connection', 'close');
  next(e);
}

/** Reads the bearer token and the user's row; 401 when either says no, 503 when the row cannot be read. */
export function authenticate(secret: string, loadUserRow: LoadUserRow, cache = new UserRowCache()): RequestHandler {
  return async (req, res, next) => {
    const m = /^Bearer\s+(.+)$/i.exec(req.get('authorization') ?? '');
    if (!m) return refuse(req, res, next, unauthenticated('sign in first: no bearer token was sent'));
    const claims = verifyToken(m[1].trim(), secret);
    const userId = Number(claims?.sub);
    if (!claims || !Number.isSafeInteger(userId) || userId < 1) {
      return refuse(req, res, next, unauthenticated('the session token is not valid or has expired; sign in again'));
    }

    // the row PostgreSQL holds now: from the cache while changes to users are heard, else read
    let row: UserRow | null = cache.current(userId);
    if (!row) {
      const ticket = cache.ticket();
      try {
        row = await loadUserRow(userId);
        if (row) cache.put(row, ticket);
        else cache.forget(userId);
      } catch (e) {
        if (!isDatabaseUnavailableError(e)) return next(e);
        row = cache.fresh(userId);
        if (!row) {
          const down = new ApiError(503, 'database-unavailable', 'the database cannot be reached, so this session cannot be checked; try again in a minute');
          return refuse(req, res, next, down);
        }
      }
    }
    if (!row || row.disabled) return refuse(req, res, next, unauthenticated('this account is disabled or no longer exists'));
    if (row.tokenVersion !== claims.tv) return refuse(req, res, next, unauthenticated('this session has ended (signed out, or the password changed); sign in again'));

    req.auth = {
      userId,
      sub: String(userId),
      email: row.email,
      role: row.role,
      tokenVersion: row.tokenVersion,
      mustChangePassword: row.mustChangePassword,
    };
    next();
  };
}

/** 403 unless the row's role is one of these. Runs after authenticate. */
export function requireRole(...roles: Role[]): RequestHandler {
  return (req, res, next) => {
    if (!req.auth) return next(unauthenticated('sign in first'));
    if (!roles.includes(req.auth.role)) return refuse(req, res, next, new ApiError(403, 'forbidden', `this needs one of the roles: ${roles.join(', ')}`));
    next();
  };
}

/** 403 while a temporary password has not been changed; the change and sign-out routes skip this. */
export const requireCurrentPassword: RequestHandler = (req, res, next) => {
  if (req.auth?.mustChangePassword) {
    return refuse(req, res, next, new ApiError(403, 'password-change-required', 'this account has a temporary password: choose a new one first'));
  }
  next();
};

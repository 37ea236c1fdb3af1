/**
 * Every API route is declared here with the roles it allows, so the check
 * always runs on the server and the role-matrix test can walk the list.
 */
import type { RequestHandler, Router } from 'express';
import type { Role } from '@/shared/api';
import { ApiError } from './errors';
import { inputGuard } from './inputGuard';
import { verifyToken, type TokenClaims } from '../auth/tokens';

export type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';
export interface RouteSpec {
  method: Method;
  path: string;
  roles: readonly Role[] | 'public';
}

declare module 'express-serve-static-core' {
  interface Request {
    auth?: TokenClaims & { userId: number };
  }
}

/** Reads the bearer token; 401 when it is missing, forged or expired. */
export function authenticate(secret: string, isActive: (userId: number) => Promise<boolean>): RequestHandler {
  return async (req, _res, next) => {
    const header = req.get('authorization') ?? '';
    const m = /^Bearer\s+(.+)$/i.exec(header);
    if (!m) return next(new ApiError(401, 'unauthenticated', 'sign in first: no bearer token was sent'));
    const claims = verifyToken(m[1].trim(), secret);
    if (!claims) return next(new ApiError(401, 'unauthenticated', 'the session token is not valid or has expired; sign in again'));
    const userId = Number(claims.sub);
    try {
      if (!(await isActive(userId))) return next(new ApiError(401, 'unauthenticated', 'this account is disabled or no longer exists'));
    } catch (e) {
      return next(e);
    }
    req.auth = { ...claims, userId };
    next();
  };
}

export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.auth) return next(new ApiError(401, 'unauthenticated', 'sign in first'));
    if (!roles.includes(req.auth.role)) {
      return next(new ApiError(403, 'forbidden', `this needs one of the roles: ${roles.join(', ')}`));
    }
    next();
  };
}

/** Wrap an async handler so a rejection reaches the error handler. */
export const handle =
  (fn: RequestHandler): RequestHandler =>
  (req, res, next) => {
    Promise.resolve(fn(req, res, next)).catch(next);
  };

export class RouteTable {
  readonly specs: RouteSpec[] = [];
  constructor(
    private readonly router: Router,
    private readonly auth: RequestHandler,
    private readonly prefix = '/api',
  ) {}

  add(method: Method, path: string, roles: readonly Role[] | 'public', ...handlers: RequestHandler[]) {
    this.specs.push({ method, path: this.prefix + path, roles });
    const guards = roles === 'public' ? [] : [this.auth, requireRole(...roles)];
    // inputGuard after the body is parsed and before any handler (server/http/inputGuard.ts)
    this.router[method](path, ...guards, inputGuard, ...handlers.map(handle));
  }
}

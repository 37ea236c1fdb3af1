/**
 * Every API route is declared here with the roles it allows, so the check
 * always runs on the server and the role-matrix test can walk the list.
 *
 * Order per route: authenticate -> requireRole -> (temporary password
 * changed?) -> body parser -> handlers. A body is parsed only once the token
 * and the role have been checked, so an anonymous 100 MB body, or a small gzip
 * that inflates to one, is refused with 401 without being read.
 */
import express, { type RequestHandler, type Router } from 'express';
import type { Role } from '@/shared/api';
import { requireCurrentPassword, requireRole } from '../auth/authenticate';

export { authenticate, requireRole } from '../auth/authenticate';
import { inputGuard } from './inputGuard';
import { jsonInTurns } from './jsonInTurns';

export type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';
/** The JSON body limit: small for most routes, large for whole network documents. Multipart bodies are left to the route (multer). */
export type BodySize = 'small' | 'large';

export interface RouteSpec {
  method: Method;
  path: string;
  roles: readonly Role[] | 'public';
  body: BodySize;
  /** open while a temporary password is still to be changed (password change, sign-out) */
  whilePasswordChangeDue?: boolean;
}

export interface RouteOptions {
  roles: readonly Role[] | 'public';
  body?: BodySize;
  whilePasswordChangeDue?: boolean;
}

export interface BodyLimits {
  /** protected routes */
  small: string;
  /** protected routes that take a whole network */
  large: string;
  /** public routes (sign-in): anyone may send these */
  public: string;
}

/** Wrap an async handler so a rejection reaches the error handler. */
export const handle =
  (fn: RequestHandler): RequestHandler =>
  (req, res, next) => {
    Promise.resolve(fn(req, res, next)).catch(next);
  };

export class RouteTable {
  readonly specs: RouteSpec[] = [];
  private readonly parsers: Record<BodySize | 'public', RequestHandler>;

  constructor(
    private readonly router: Router,
    private readonly auth: RequestHandler,
    limits: BodyLimits = { small: '2mb', large: '160mb', public: '16kb' },
    private readonly prefix = '/api',
  ) {
    // body-parser counts the limit on the inflated bytes as they stream, so a gzip bomb stops at the limit.
    const json = (limit: string) => express.json({ limit, inflate: true });
    // A large body (a whole network) is parsed in turns so other requests are answered meanwhile (jsonInTurns.ts).
    this.parsers = { small: json(limits.small), large: jsonInTurns(limits.large), public: json(limits.public) };
  }

  /** `roles` is the role list (or 'public'), or options with the roles, the body size and the password-change exemption. */
  add(method: Method, path: string, roles: readonly Role[] | 'public' | RouteOptions, ...handlers: RequestHandler[]) {
    const opts: RouteOptions = roles === 'public' || Array.isArray(roles) ? { roles: roles as readonly Role[] | 'public' } : (roles as RouteOptions);
    const body = opts.body ?? 'small';
    this.specs.push({ method, path: this.prefix + path, roles: opts.roles, body, ...(opts.whilePasswordChangeDue ? { whilePasswordChangeDue: true } : {}) });
    const guards =
      opts.roles === 'public'
        ? [this.parsers.public]
        : [this.auth, requireRole(...opts.roles), ...(opts.whilePasswordChangeDue ? [] : [requireCurrentPassword]), this.parsers[body]];
    // inputGuard after the body is parsed and before any handler (server/http/inputGuard.ts)
    this.router[method](path, ...guards, inputGuard, ...handlers.map(handle));
  }
}

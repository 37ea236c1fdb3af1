/**
 * When PostgreSQL cannot serve a request (it is down or restarting, or a lock
 * or time limit ran out), the answer is a clear 503 or 409 the client can act
 * on, never a 500 and never a hang. The message never carries SQL text.
 * SQLSTATE codes: PostgreSQL documentation, Appendix A "PostgreSQL Error Codes".
 */
import { isDatabaseUnavailableError } from '../db/unavailable';

interface PgLike {
  code?: unknown;
  message?: unknown;
}

/** An answer for the error handler; `retryAfterS` goes out as the Retry-After header. */
export interface DatabaseTrouble {
  status: 409 | 503;
  code: 'database-unavailable' | 'network-busy' | 'database-busy';
  message: string;
  retryAfterS: number;
}

const databaseUnavailable = (): DatabaseTrouble => ({
  status: 503,
  code: 'database-unavailable',
  message: 'the database is not reachable right now; nothing was changed. Try again in a few seconds.',
  retryAfterS: 5,
});

const networkBusy = (): DatabaseTrouble => ({
  status: 409,
  code: 'network-busy',
  message: 'another change (an import or an edit) is being written to the network; nothing was changed. Try again in a moment.',
  retryAfterS: 2,
});

const databaseBusy = (): DatabaseTrouble => ({
  status: 503,
  code: 'database-busy',
  message: 'the database took too long to answer; nothing was changed. Try again in a moment.',
  retryAfterS: 2,
});

function pgErrorOf(err: unknown): PgLike | undefined {
  if (err === null || typeof err !== 'object') return undefined;
  const e = err as { parent?: PgLike; original?: PgLike } & PgLike;
  return e.parent ?? e.original ?? e;
}

/** The answer for a database that cannot serve the request; undefined for any other error. */
export function databaseTrouble(err: unknown): DatabaseTrouble | undefined {
  const pg = pgErrorOf(err);
  const code = typeof pg?.code === 'string' ? pg.code : '';
  // 55P03 lock_not_available (lock_timeout), 40P01 deadlock, 40001 serialization failure
  if (code === '55P03' || code === '40P01' || code === '40001') return networkBusy();
  // 57014 query_canceled (statement_timeout)
  if (code === '57014') return databaseBusy();
  // 53300 too many connections; the rest (refused, dropped, shutting down) is one test shared with authentication
  if (code === '53300' || isDatabaseUnavailableError(err)) return databaseUnavailable();
  return undefined;
}

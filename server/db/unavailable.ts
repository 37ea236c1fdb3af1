/**
 * Is this error "the database cannot be reached" (as opposed to a bad query)?
 * Sequelize wraps connection failures in ConnectionError and its subclasses;
 * a connection that drops mid-query surfaces as a DatabaseError around a pg
 * or socket error, so the causes are checked too.
 */
import { ConnectionError } from 'sequelize';

// SQLSTATE class 08 (connection exception), 57P01-57P03 (shutdown, crash, starting up).
const PG_CODES = /^(08...|57P0[123])$/;
const SOCKET_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'EHOSTUNREACH', 'ENOTFOUND', 'EAI_AGAIN', 'ENETUNREACH']);
const PG_MESSAGES = /Connection terminated|connection .*(closed|ended)|Client has encountered a connection error|timeout exceeded when trying to connect/i;

export function isDatabaseUnavailableError(err: unknown): boolean {
  for (let e = err as { code?: unknown; message?: unknown; original?: unknown; parent?: unknown; cause?: unknown } | undefined, depth = 0; e && depth < 5; depth++) {
    if (e instanceof ConnectionError) return true;
    if (typeof e.code === 'string' && (PG_CODES.test(e.code) || SOCKET_CODES.has(e.code))) return true;
    if (typeof e.message === 'string' && PG_MESSAGES.test(e.message)) return true;
    e = (e.original ?? e.parent ?? e.cause) as typeof e;
  }
  return false;
}

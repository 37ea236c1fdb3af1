/**
 * GET /api/health: is this process fit to serve? Not when PostgreSQL is
 * unreachable, not while the network model is missing or behind the
 * database's version (stale: a lost notification, a failed rebuild), and not
 * while the change listener is reconnecting. `reason` says why in words;
 * the answer is 200 when ok, 503 otherwise.
 */
import type { AppContext } from '../context';

/** How long health waits for PostgreSQL before calling it down. */
export const HEALTH_DB_TIMEOUT_MS = 2500;

export interface Health {
  ok: boolean;
  db: 'up' | 'down';
  /** the model's version (what analysis answers from) */
  networkVersion: number | null;
  /** the database's version; null when it could not be read */
  databaseVersion: number | null;
  model: 'current' | 'catching-up' | 'stale' | 'loading';
  listener: 'listening' | 'reconnecting' | 'closed';
  reason?: string;
}

async function readDatabaseVersion(ctx: AppContext): Promise<number | null> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<null>((resolve) => {
    timer = setTimeout(() => resolve(null), HEALTH_DB_TIMEOUT_MS) as unknown as NodeJS.Timeout;
  });
  try {
    return await Promise.race([ctx.network.databaseVersion().catch(() => null), timeout]);
  } finally {
    clearTimeout(timer);
  }
}

export async function checkHealth(ctx: AppContext): Promise<Health> {
  const databaseVersion = await readDatabaseVersion(ctx);
  const status = ctx.network.status();
  const db = databaseVersion === null ? 'down' : 'up';
  const networkVersion = status.modelVersion;
  let model: Health['model'];
  if (networkVersion === null) model = 'loading';
  else if (databaseVersion === null || networkVersion >= databaseVersion) model = 'current';
  // a rebuild under way that has not failed is the normal moment after a change
  else if (status.rebuilding && !status.rebuildFailure) model = 'catching-up';
  else model = 'stale';

  const reasons: string[] = [];
  if (db === 'down') reasons.push('the database is not reachable; analysis answers from the last loaded network, changes are refused');
  if (model === 'loading') reasons.push('the network model is still loading');
  if (model === 'stale') {
    const why = status.rebuildFailure ? `the last rebuild failed (${status.rebuildFailure.message}); retrying` : 'a change was missed; catching up';
    reasons.push(`the network model is at version ${networkVersion}, the database at ${databaseVersion}: ${why}`);
  }
  if (db === 'up' && status.listener !== 'listening') reasons.push('the change listener is reconnecting');

  const ok = reasons.length === 0;
  return { ok, db, networkVersion, databaseVersion, model, listener: status.listener, ...(ok ? {} : { reason: reasons.join('; ') }) };
}

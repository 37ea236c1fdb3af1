/**
 * A replace-import made from an older network version than the stored one
 * would undo whatever was changed since. The changes are counted from the
 * audit log: every entry recorded at a network version above the document's
 * baseVersion, a single create, update or delete counting one, an import
 * counting the records it created, updated and deleted (its entry's counts).
 * A stale replace needs undoNewer=true; without it the import is refused
 * with 409 (a dry run reports the count instead).
 */
import type { Sequelize, Transaction } from 'sequelize';
import type { StaleBase } from '@/shared/schemas/import';
import { ApiError } from '../../http/errors';
import { countOf } from '@/shared/format';

export async function changesSince(sequelize: Sequelize, baseVersion: number, transaction?: Transaction): Promise<number> {
  const [rows] = await sequelize.query(
    `SELECT COALESCE(SUM(CASE WHEN action = 'import' THEN (
        SELECT COALESCE(SUM(COALESCE((v->>'created')::int, 0) + COALESCE((v->>'updated')::int, 0) + COALESCE((v->>'deleted')::int, 0)), 0)
        FROM jsonb_each(CASE WHEN jsonb_typeof(after->'counts') = 'object' THEN after->'counts' ELSE '{}'::jsonb END) AS e(k, v)
      ) ELSE 1 END), 0)::int AS n
     FROM audit_log WHERE network_version > $1 AND action IN ('create', 'update', 'delete', 'import')`,
    { bind: [baseVersion], transaction },
  );
  return (rows as { n: number }[])[0].n;
}

/** The document's baseVersion, when it states a usable one. */
export function baseVersionOf(raw: unknown): number | undefined {
  const v = raw !== null && typeof raw === 'object' ? (raw as { baseVersion?: unknown }).baseVersion : undefined;
  return typeof v === 'number' && Number.isSafeInteger(v) && v >= 0 ? v : undefined;
}

/** How stale the base of a replace is, or undefined when it is not (or states no version). */
export async function staleBase(sequelize: Sequelize, raw: unknown, currentVersion: number, transaction?: Transaction): Promise<StaleBase | undefined> {
  const baseVersion = baseVersionOf(raw);
  if (baseVersion === undefined || baseVersion >= currentVersion) return undefined;
  return { baseVersion, currentVersion, changesSince: await changesSince(sequelize, baseVersion, transaction) };
}

export function staleRefusal(stale: StaleBase): ApiError {
  const n = stale.changesSince;
  return new ApiError(
    409,
    'stale-base',
    `this file was made from network version ${stale.baseVersion}, and the network is now at version ${stale.currentVersion} with ${countOf(n, 'change')} since; ` +
      `replacing the network with it would undo ${n === 1 ? 'that change' : 'those changes'}. Export again and make your changes there, or send undoNewer=true to replace anyway`,
    stale,
  );
}

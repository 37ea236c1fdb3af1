/** What the planned-work and incident services share: who acts, errors, element checks, time windows. */
import type { Transaction } from 'sequelize';
import type { Role } from '@/shared/api';
import type { Element } from '@/shared/schemas/analysis';
import { ApiError } from '../http/errors';
import type { AppContext } from '../context';
import type { ServedNetwork } from '../services/servedNetwork';
import { recordAudit, type AuditEntry } from '../services/audit';
import { currentModel } from '../routes/checks';
import { canonicalElements } from './reach';

export interface OpsActor {
  userId?: number;
  email?: string;
  role?: Role;
}

export const model = (ctx: AppContext): ServedNetwork => currentModel(ctx);

/** Canonical elements, all known to the current network; otherwise a 422 naming the unknown ones. */
export function knownElements(m: ServedNetwork, elements: readonly Element[], field = 'elements'): Element[] {
  const canonical = canonicalElements(elements);
  const unknown = canonical.filter((e) => !m.engine.hasElement(e));
  if (unknown.length > 0) {
    throw new ApiError(
      422,
      'unknown-elements',
      `${field}: the network (version ${m.networkVersion}) has no ${unknown.map((e) => `${e.kind} ${e.code}`).join(', ')}; pick elements that exist`,
      { unknown },
    );
  }
  return canonical;
}

export const iso = (d: Date | null | undefined) => (d ? d.toISOString() : null);

export async function audit(ctx: AppContext, t: Transaction, actor: OpsActor, networkVersion: number, entry: AuditEntry) {
  await recordAudit(ctx.db.sequelize, t, { userId: actor.userId, email: actor.email }, networkVersion, [entry]);
}

export const staleVersion = (what: string, sent: number, current: number) =>
  new ApiError(409, 'stale-version', `${what} has changed since you read it (you sent version ${sent}, it is now ${current}); reload it and try again`, {
    currentVersion: current,
  });

/** Short stable codes from a sequence: W-0001 ... W-9999, W-10000 ... */
export async function nextCode(ctx: AppContext, t: Transaction, sequence: 'planned_work_codes' | 'incident_codes', prefix: string) {
  const [rows] = await ctx.db.sequelize.query(`SELECT nextval('${sequence}')::int AS n`, { transaction: t });
  return `${prefix}-${String((rows as { n: number }[])[0].n).padStart(4, '0')}`;
}

/**
 * One record's change history, from the audit log (server/services/audit.ts):
 * newest first, paged, each row reduced to the fields that changed.
 */
import type { Sequelize } from 'sequelize';
import type { HistoryAnswer } from '@/shared/schemas/editing';
import type { EntityKind } from '@/shared/schemas/network';
import { listAudit } from '../audit';

type Snapshot = Record<string, unknown> | null | undefined;
/** Bookkeeping, not something a person changed. */
const SKIPPED = new Set(['version', 'updatedAt']);

export function fieldChanges(before: Snapshot, after: Snapshot): HistoryAnswer['items'][number]['changes'] {
  const fields = new Set([...Object.keys(before ?? {}), ...Object.keys(after ?? {})]);
  const out: HistoryAnswer['items'][number]['changes'] = [];
  for (const field of fields) {
    if (SKIPPED.has(field)) continue;
    const b = before?.[field];
    const a = after?.[field];
    if (JSON.stringify(b) === JSON.stringify(a)) continue;
    out.push({ field, ...(b === undefined ? {} : { before: b }), ...(a === undefined ? {} : { after: a }) });
  }
  return out;
}

export async function recordHistory(sequelize: Sequelize, kind: EntityKind, code: string, q: { page: number; pageSize: number }): Promise<HistoryAnswer> {
  const page = await listAudit(sequelize, { kind, code, page: q.page, pageSize: q.pageSize });
  return {
    ...page,
    items: page.items.map((r) => ({
      id: r.id,
      at: r.at,
      userEmail: r.userEmail,
      action: r.action,
      networkVersion: r.networkVersion,
      changes: fieldChanges(r.before as Snapshot, r.after as Snapshot),
    })),
  };
}

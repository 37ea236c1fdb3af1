/**
 * What an import will do, worked out before anything is written: per kind,
 * the entities to create, to update and to leave alone (compared in their
 * canonical form, so a list of groups in another order is not a change), and
 * under `replace` the codes to delete. A dry run answers from this plan alone.
 */
import { ENTITY_KINDS, type EntityKind, type NetworkDocument } from '@/shared/schemas/network';
import type { KindCounts } from '@/shared/schemas/import';
import { canonical, sameEntity, type Fields } from '../inventory/shape';
import { yieldToEventLoop } from '../inventory/tables';

export interface KindPlan {
  create: Fields[];
  update: Fields[];
  unchanged: number;
  remove: string[];
}

export interface ImportPlan {
  kinds: Record<EntityKind, KindPlan>;
  /**
   * Stored carriages that hold the (site, service) place a created or moved
   * carriage is about to take, and are themselves moving away or being
   * deleted. The unique (site, service) constraint is checked row by row, so
   * they step aside first (importer.ts).
   */
  park: string[];
  changed: boolean;
}

const YIELD_EVERY = 10_000;

/** Compares entity by entity without copying the unchanged ones; yields now and then, as it runs inside a request. */
export async function planImport(stored: NetworkDocument, document: NetworkDocument, replace: boolean): Promise<ImportPlan> {
  const kinds = {} as Record<EntityKind, KindPlan>;
  let changed = false;
  let steps = 0;
  for (const kind of ENTITY_KINDS) {
    const before = new Map<string, Fields>();
    for (const e of stored[kind] as unknown as Fields[]) before.set(e.code as string, e);
    const plan: KindPlan = { create: [], update: [], unchanged: 0, remove: [] };
    const seen = new Set<string>();
    for (const e of document[kind] as unknown as Fields[]) {
      const code = e.code as string;
      seen.add(code);
      const old = before.get(code);
      if (!old) plan.create.push(canonical(kind, e));
      else if (!sameEntity(kind, old, e)) plan.update.push(canonical(kind, e));
      else plan.unchanged += 1;
      if (++steps % YIELD_EVERY === 0) await yieldToEventLoop();
    }
    if (replace) for (const code of before.keys()) if (!seen.has(code)) plan.remove.push(code);
    if (plan.create.length || plan.update.length || plan.remove.length) changed = true;
    kinds[kind] = plan;
  }
  return { kinds, park: carriagesToPark(stored, kinds.carriages), changed };
}

function carriagesToPark(stored: NetworkDocument, carriages: KindPlan): string[] {
  const holder = new Map<string, string>();
  for (const c of stored.carriages) holder.set(`${c.site}\u0000${c.service}`, c.code);
  const park = new Set<string>();
  for (const c of [...carriages.create, ...carriages.update]) {
    const current = holder.get(`${c.site as string}\u0000${c.service as string}`);
    if (current !== undefined && current !== c.code) park.add(current);
  }
  return [...park];
}

export function countsOf(plan: ImportPlan, received: Record<EntityKind, number>): Record<EntityKind, KindCounts> {
  const counts = {} as Record<EntityKind, KindCounts>;
  for (const kind of ENTITY_KINDS) {
    const k = plan.kinds[kind];
    counts[kind] = { received: received[kind], created: k.create.length, updated: k.update.length, unchanged: k.unchanged, deleted: k.remove.length };
  }
  return counts;
}

export function emptyCounts(received: Record<EntityKind, number>): Record<EntityKind, KindCounts> {
  const counts = {} as Record<EntityKind, KindCounts>;
  for (const kind of ENTITY_KINDS) counts[kind] = { received: received[kind], created: 0, updated: 0, unchanged: 0, deleted: 0 };
  return counts;
}

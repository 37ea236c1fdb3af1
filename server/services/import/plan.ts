/**
 * What an import will do, worked out before anything is written: per kind,
 * the entities to create, to update and to leave alone (compared in their
 * canonical form, so a list of groups in another order is not a change), and
 * under `replace` the codes to delete. A dry run answers from this plan alone.
 */
import { ENTITY_KINDS, type EntityKind, type NetworkDocument } from '@/shared/schemas/network';
import type { KindCounts } from '@/shared/schemas/import';
import { canonical, sameEntity, type Fields } from '../inventory/shape';
import { Turns, nextTurn } from '../../interchange/turns';

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

/** Compares entity by entity without copying the unchanged ones; gives the event loop a turn when one is due (turns.ts), as it runs inside a request. */
export async function planImport(stored: NetworkDocument, document: NetworkDocument, replace: boolean): Promise<ImportPlan> {
  const kinds = {} as Record<EntityKind, KindPlan>;
  let changed = false;
  const turns = new Turns();
  for (const kind of ENTITY_KINDS) {
    const before = new Map<string, Fields>();
    for (const e of stored[kind] as unknown as Fields[]) {
      before.set(e.code as string, e);
      if (turns.due()) await nextTurn();
    }
    const plan: KindPlan = { create: [], update: [], unchanged: 0, remove: [] };
    // only a replace asks which stored codes the document left out
    const seen = replace ? new Set<string>() : null;
    for (const e of document[kind] as unknown as Fields[]) {
      const code = e.code as string;
      seen?.add(code);
      const old = before.get(code);
      if (!old) plan.create.push(canonical(kind, e));
      else if (!sameEntity(kind, old, e)) plan.update.push(canonical(kind, e));
      else plan.unchanged += 1;
      if (turns.due()) await nextTurn();
    }
    if (seen) {
      for (const code of before.keys()) {
        if (!seen.has(code)) plan.remove.push(code);
        if (turns.due()) await nextTurn();
      }
    }
    if (plan.create.length || plan.update.length || plan.remove.length) changed = true;
    kinds[kind] = plan;
  }
  return { kinds, park: await carriagesToPark(stored, kinds.carriages, turns), changed };
}

async function carriagesToPark(stored: NetworkDocument, carriages: KindPlan, turns: Turns): Promise<string[]> {
  if (stored.carriages.length === 0) return [];
  const holder = new Map<string, string>();
  for (const c of stored.carriages) {
    holder.set(`${c.site}\u0000${c.service}`, c.code);
    if (turns.due()) await nextTurn();
  }
  const park = new Set<string>();
  for (const list of [carriages.create, carriages.update]) {
    for (const c of list) {
      const current = holder.get(`${c.site as string}\u0000${c.service as string}`);
      if (current !== undefined && current !== c.code) park.add(current);
      if (turns.due()) await nextTurn();
    }
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

/**
 * A network document after an edit: the named entities replaced, added or
 * removed, everything else shared with the document before (a new array per
 * kind that changed, the same entity objects). Entities stay in code order
 * (plain code-point order, as networkLoader.ts reads them), so the patched
 * document equals what a full read of the database gives.
 */
import type { EntityKind, NetworkDocument } from '@/shared/schemas/network';
import type { CodesByKind, EntitiesByKind } from './networkLoader';

type Coded = { code: string };

/** `items` (in code order) with the `codes` taken out and `now` (the current state of those codes) put in place. */
export function patchList<T extends Coded>(items: readonly T[], codes: readonly string[], now: readonly T[]): T[] {
  const gone = new Set(codes);
  for (const e of now) gone.add(e.code);
  const out = items.filter((e) => !gone.has(e.code));
  for (const e of [...now].sort((a, b) => (a.code < b.code ? -1 : a.code > b.code ? 1 : 0))) {
    let lo = 0;
    let hi = out.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (out[mid].code < e.code) lo = mid + 1;
      else hi = mid;
    }
    out.splice(lo, 0, e);
  }
  return out;
}

const KINDS: readonly EntityKind[] = ['sites', 'services', 'groups', 'carriages', 'feeds'];

/** The document with the entities of `codes` set to `entities` (a code absent from `entities` was deleted). */
export function patchDocument(doc: NetworkDocument, codes: CodesByKind, entities: EntitiesByKind): NetworkDocument {
  const out = { ...doc };
  for (const kind of KINDS) {
    const named = codes[kind];
    if (!named || named.length === 0) continue;
    (out as Record<EntityKind, Coded[]>)[kind] = patchList(doc[kind] as Coded[], named, (entities[kind] ?? []) as Coded[]);
  }
  return out;
}

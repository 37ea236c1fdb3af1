/**
 * A network document after an edit: the named entities replaced, added or
 * removed, everything else shared with the document before (a new array per
 * kind that changed, the same entity objects). Entities stay in code order
 * (plain code-point order, as networkLoader.ts reads them), so the patched
 * document equals what a full read of the database gives.
 */
import type { EntityKind, NetworkDocument } from '@/shared/schemas/network';
import { patchList } from '../engine/codeOrder';
import type { CodesByKind, EntitiesByKind } from './networkLoader';

type Coded = { code: string };

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

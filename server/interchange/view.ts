/**
 * A code-indexed view of the network an import would produce: the stored
 * network (when given, for upserts) overlaid by the document's entities.
 * Cross-entity rules and warnings read this view, so one pass with maps
 * answers every reference (no quadratic scans at 400k entities).
 */
import { CODE_PATTERN, ENTITY_KINDS, type EntityKind, type NetworkDocument } from '@/shared/schemas/network';
import { Turns } from './turns';

export interface Entry {
  /** position in the document's array, or -1 for an entity of the stored network */
  index: number;
  raw: Record<string, unknown>;
  // Scratch fields the warning pass fills in, so that it needs no maps of its own.
  /** carriages: dense position in the warning pass's graph */
  slot?: number;
  /** sites: how many carriages the site has */
  carriages?: number;
  /** sites: whether a reserve feed comes into one of its carriages */
  hasReserve?: boolean;
}

export interface NetworkView {
  /** the document's entities that are objects, in document order */
  doc: Record<EntityKind, Entry[]>;
  /** code -> entry: the document's first entity with the code, else the stored one */
  byCode: Record<EntityKind, Map<string, Entry>>;
  /** kinds whose list could not be read at all: references into them are not checked */
  unreadable: Set<EntityKind>;
}

/**
 * A generator that pauses (yields `progress` unchanged) when its turn is due:
 * a national network and its stored counterpart are a million map entries.
 */
export function* buildView(
  lists: Partial<Record<EntityKind, unknown[]>>,
  unreadable: Set<EntityKind>,
  context: NetworkDocument | undefined,
  turns: Turns,
  progress = 0,
): Generator<number, NetworkView> {
  const doc = {} as Record<EntityKind, Entry[]>;
  const byCode = {} as Record<EntityKind, Map<string, Entry>>;
  for (const kind of ENTITY_KINDS) {
    const entries: Entry[] = [];
    const map = new Map<string, Entry>();
    for (const stored of context?.[kind] ?? []) {
      map.set(stored.code, { index: -1, raw: stored as unknown as Record<string, unknown> });
      if (turns.due()) yield progress;
    }
    const list = lists[kind] ?? [];
    for (let index = 0; index < list.length; index++) {
      const item = list[index];
      if (item === null || typeof item !== 'object' || Array.isArray(item)) continue;
      if (turns.due()) yield progress;
      const entry: Entry = { index, raw: item as Record<string, unknown> };
      entries.push(entry);
      const code = refAt(entry.raw, 'code');
      if (code === undefined) continue;
      // The document's first entity with a code wins over a stored one and over its own duplicates.
      const held = map.get(code);
      if (held === undefined || held.index < 0) map.set(code, entry);
    }
    doc[kind] = entries;
    byCode[kind] = map;
  }
  return { doc, byCode, unreadable };
}

// A module-level copy: an imported binding may be read through a getter on every use.
const CODE = CODE_PATTERN;

/** A field read as a code, if it is one (a malformed value is reported by the schema check). */
export function refAt(raw: Record<string, unknown>, key: string): string | undefined {
  const value = raw[key];
  return typeof value === 'string' && CODE.test(value) ? value : undefined;
}

/** Visits the codes of a list field with their positions; items that are not codes are skipped. */
export function forEachRef(raw: Record<string, unknown>, key: string, visit: (position: number, code: string) => void): void {
  const value = raw[key];
  if (!Array.isArray(value)) return;
  for (let i = 0; i < value.length; i++) {
    const item = value[i];
    if (typeof item === 'string' && CODE.test(item)) visit(i, item);
  }
}

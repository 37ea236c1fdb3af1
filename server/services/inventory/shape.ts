/**
 * The one shape an entity has everywhere outside the database: the network
 * document's fields (docs/format.md), codes instead of
 * ids, absent rather than null, group lists as sets (sorted by code), via
 * lists in path order. Import diffs, API answers and audit snapshots all use
 * it, so "unchanged" means the same thing in each of them.
 */
import { entitySchemas, type EntityKind } from '@/shared/schemas/network';

export type Fields = Record<string, unknown>;

export const NOUN: Record<EntityKind, string> = {
  sites: 'site',
  services: 'service',
  groups: 'group',
  carriages: 'carriage',
  feeds: 'feed',
};

/** The document fields of each kind, in the order docs/format.md lists them. */
export const FIELDS: Record<EntityKind, readonly string[]> = {
  sites: Object.keys(entitySchemas.sites.shape),
  services: Object.keys(entitySchemas.services.shape),
  groups: Object.keys(entitySchemas.groups.shape),
  carriages: Object.keys(entitySchemas.carriages.shape),
  feeds: Object.keys(entitySchemas.feeds.shape),
};

/** Fields whose list is a set: order does not matter and repeats mean nothing. */
const SET_FIELDS = new Set(['groups']);

/** The canonical document form of an entity or a database row (extra keys such as id are dropped). */
export function canonical(kind: EntityKind, source: Fields): Fields {
  const out: Fields = {};
  for (const field of FIELDS[kind]) {
    let value = source[field];
    if (value === null || value === undefined) continue;
    if (Array.isArray(value)) {
      if (value.length === 0) continue;
      value = SET_FIELDS.has(field) ? [...new Set(value as string[])].sort() : [...value];
    }
    out[field] = value;
  }
  return out;
}

const absent = (v: unknown) => v === null || v === undefined || (Array.isArray(v) && v.length === 0);

function sameList(x: readonly unknown[], y: readonly unknown[]): boolean {
  if (x.length !== y.length) return false;
  for (let i = 0; i < x.length; i++) if (x[i] !== y[i]) return false;
  return true;
}

function sameSet(x: readonly unknown[], y: readonly unknown[]): boolean {
  if (sameList(x, y)) return true;
  const a = new Set(x);
  const b = new Set(y);
  if (a.size !== b.size) return false;
  for (const v of a) if (!b.has(v)) return false;
  return true;
}

/**
 * Same document content. Either side may be canonical or not (null, undefined
 * and an empty list all mean absent; group lists compare as sets), so an
 * import compares each entity without first copying it.
 */
export function sameEntity(kind: EntityKind, a: Fields, b: Fields): boolean {
  for (const field of FIELDS[kind]) {
    const x = a[field];
    const y = b[field];
    if (x === y || (absent(x) && absent(y))) continue;
    if (Array.isArray(x) && Array.isArray(y) && (SET_FIELDS.has(field) ? sameSet(x, y) : sameList(x, y))) continue;
    return false;
  }
  return true;
}

/** An entity as the API answers it: canonical fields plus the optimistic-lock version and last change. */
export function storedEntity(kind: EntityKind, row: Fields): Fields {
  const updatedAt = row.updatedAt instanceof Date ? row.updatedAt.toISOString() : String(row.updatedAt);
  return { ...canonical(kind, row), version: Number(row.version), updatedAt };
}

/**
 * What a committed network change names, as carried by its notification
 * (NOTIFY network_changed): the new version and the codes it created,
 * changed or deleted, per kind. Other processes read those rows by code and
 * update their model instead of rebuilding it (server/services/networkStore.ts).
 * The payload stays small: past MAX_PAYLOAD characters (a cascade through a
 * large site, an import) only the version goes out and receivers rebuild.
 */
import type { EntityKind } from '@/shared/schemas/network';

/** Codes per entity kind. */
export type CodesByKind = Partial<Record<EntityKind, string[]>>;

export interface NetworkChange {
  version: number;
  /** null: not known (an import, or too many to name); the receiver rebuilds */
  codes: CodesByKind | null;
}

export const MAX_PAYLOAD = 1000;
const KINDS: readonly EntityKind[] = ['sites', 'services', 'groups', 'carriages', 'feeds'];

export function encodeChange(change: NetworkChange): string {
  if (change.codes) {
    const text = JSON.stringify({ v: change.version, c: change.codes });
    if (text.length <= MAX_PAYLOAD) return text;
  }
  return JSON.stringify({ v: change.version });
}

/** The change a payload names; a bare number (the older form) or anything malformed names no codes. */
export function decodeChange(payload: string | undefined): NetworkChange | null {
  if (!payload) return null;
  const bare = Number(payload);
  if (Number.isInteger(bare) && bare > 0) return { version: bare, codes: null };
  try {
    const o = JSON.parse(payload) as { v?: unknown; c?: unknown };
    if (!Number.isInteger(o.v) || (o.v as number) < 1) return null;
    return { version: o.v as number, codes: codesOf(o.c) };
  } catch {
    return null;
  }
}

function codesOf(c: unknown): CodesByKind | null {
  if (!c || typeof c !== 'object' || Array.isArray(c)) return null;
  const out: CodesByKind = {};
  for (const [kind, codes] of Object.entries(c)) {
    if (!KINDS.includes(kind as EntityKind) || !Array.isArray(codes) || !codes.every((x) => typeof x === 'string')) return null;
    out[kind as EntityKind] = codes as string[];
  }
  return out;
}

/** Collects the codes of a write's audit entries; any change it cannot name makes the whole change unnamed. */
export class ChangeCollector {
  private codes: Partial<Record<EntityKind, Set<string>>> = {};
  private unnamed = false;
  add(kind: string, code: string | null | undefined): void {
    if (!KINDS.includes(kind as EntityKind) || !code) {
      this.unnamed = true;
      return;
    }
    (this.codes[kind as EntityKind] ??= new Set()).add(code);
  }
  markUnnamed(): void {
    this.unnamed = true;
  }
  result(): CodesByKind | null {
    if (this.unnamed) return null;
    return Object.fromEntries(Object.entries(this.codes).map(([k, s]) => [k, [...s]])) as CodesByKind;
  }
}

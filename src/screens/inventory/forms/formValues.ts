/**
 * Form values <-> entities. A form holds what the person typed (text, a
 * chosen option, a yes/no); an entity is the document shape
 * (shared/schemas/network.ts). Checking a draft uses the same zod schema the
 * server uses, so a latitude of 95 reads "latitude is between -90 and 90"
 * under the field before anything is sent.
 */
import { entitySchemas, type EntityKind } from '@/shared/schemas/network';
import { FORM_FIELDS, type FieldSpec } from './fields';

export type DraftValue = string | boolean;
export type Draft = Record<string, DraftValue>;
export type FieldErrors = Record<string, string>;
export type Entity = Record<string, unknown>;

/** The field a zod path or a server field name ("groups[1]", "via.0") is about. */
export function rootField(path: string | readonly PropertyKey[]): string {
  const head = typeof path === 'string' ? path : String(path[0] ?? '');
  return head.split(/[.[]/)[0];
}

const blankOf = (f: FieldSpec): DraftValue => (f.type === 'flag' ? false : '');

export function emptyDraft(kind: EntityKind): Draft {
  return Object.fromEntries(FORM_FIELDS[kind].map((f) => [f.name, blankOf(f)]));
}

function textOf(value: unknown, f: FieldSpec): DraftValue {
  if (f.type === 'flag') return value === true;
  if (value === null || value === undefined) return '';
  if (Array.isArray(value)) return value.join('; ');
  return String(value);
}

/** The form's starting values for a stored entity. */
export function draftFromEntity(kind: EntityKind, entity: Entity): Draft {
  return Object.fromEntries(FORM_FIELDS[kind].map((f) => [f.name, textOf(entity[f.name], f)]));
}

/** "A; B, C" -> ["A", "B", "C"] (";" is the CSV list separator, so it is the one the hint names). */
export function splitCodes(text: string, isSet = false): string[] {
  const codes = text.split(/[;,\s]+/).filter(Boolean);
  return isSet ? [...new Set(codes)] : codes;
}

/** Decimal text as a number: "12.5", "-38", "1e3"; "" is absent; anything else is NaN. */
export function parseNumber(text: string): number | undefined {
  const t = text.trim();
  if (t === '') return undefined;
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(t)) return Number.NaN;
  return Number(t);
}

interface Converted {
  entity: Entity;
  /** text that is not a number where a number goes */
  errors: FieldErrors;
}

function convert(kind: EntityKind, draft: Draft): Converted {
  const entity: Entity = {};
  const errors: FieldErrors = {};
  for (const f of FORM_FIELDS[kind]) {
    const raw = draft[f.name];
    if (f.type === 'flag') {
      if (raw === true) entity[f.name] = true;
      continue;
    }
    const text = typeof raw === 'string' ? raw : '';
    if (f.type === 'number' || f.type === 'int') {
      const n = parseNumber(text);
      if (n === undefined) continue;
      if (Number.isNaN(n)) errors[f.name] = `${f.label.toLowerCase()} must be a number`;
      else entity[f.name] = n;
      continue;
    }
    if (f.type === 'codes') {
      const codes = splitCodes(text, f.isSet);
      if (codes.length) entity[f.name] = codes;
      continue;
    }
    // Outer spaces are never meant: a pasted code or name often carries them.
    const value = text.trim();
    if (value !== '') entity[f.name] = value;
  }
  return { entity, errors };
}

export type CheckedDraft = { ok: true; entity: Entity } | { ok: false; errors: FieldErrors };

/** The entity a draft describes, checked with the shared schema; errors keyed by field, the first per field. */
export function checkDraft(kind: EntityKind, draft: Draft): CheckedDraft {
  const { entity, errors } = convert(kind, draft);
  const parsed = entitySchemas[kind].safeParse(entity);
  if (parsed.success && Object.keys(errors).length === 0) return { ok: true, entity: parsed.data as Entity };
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const field = rootField(issue.path);
      errors[field || 'form'] ??= issue.message;
    }
  }
  return { ok: false, errors };
}

function same(a: unknown, b: unknown, isSet: boolean): boolean {
  const blank = (v: unknown) => v === undefined || v === null || v === false || (Array.isArray(v) && v.length === 0);
  if (blank(a) || blank(b)) return blank(a) && blank(b);
  if (Array.isArray(a) && Array.isArray(b)) {
    if (a.length !== b.length) return false;
    if (isSet) {
      const sa = new Set(a);
      return b.every((x) => sa.has(x));
    }
    return a.every((x, i) => x === b[i]);
  }
  return a === b;
}

/**
 * The PATCH body's fields (without the version) that turn `original` into
 * `next`: changed fields with their new value, cleared ones as null (the
 * server reads null as "clear"). The code never changes, so it is not sent.
 */
export function changesBetween(kind: EntityKind, original: Entity, next: Entity): Entity {
  const out: Entity = {};
  for (const f of FORM_FIELDS[kind]) {
    if (f.name === 'code') continue;
    const before = original[f.name];
    const after = next[f.name];
    if (same(before, after, !!f.isSet)) continue;
    out[f.name] = after === undefined ? null : after;
  }
  return out;
}

/**
 * The CSV form of the network document (docs/format.md):
 * one file per kind, a header row with the JSON field names, lists separated
 * by ";", an empty cell for an absent field. The columns and their types
 * come from the entities' schemas, so cells are read as the type the JSON
 * field has.
 */
import { decimalPoint } from './csv-dialect';
import { isDecimal } from './decimal';
import type { z } from 'zod';
import { entitySchemas, ENTITY_KINDS, type EntityKind } from '@/shared/schemas/network';

export type ColumnType = 'string' | 'number' | 'boolean' | 'list';

type FieldDef = { type: string; in?: z.ZodType; innerType?: z.ZodType };

/** The JSON type a field's schema takes, under its optional, nullable and transform wrappers. */
function columnType(field: z.ZodType): ColumnType {
  const def = field._zod.def as FieldDef;
  if (def.type === 'pipe' && def.in) return columnType(def.in);
  if ((def.type === 'optional' || def.type === 'nullable' || def.type === 'default') && def.innerType) return columnType(def.innerType);
  if (def.type === 'number') return 'number';
  if (def.type === 'boolean') return 'boolean';
  if (def.type === 'array') return 'list';
  return 'string';
}

const fieldsOf = (kind: EntityKind) => Object.entries(entitySchemas[kind].shape as Record<string, z.ZodType>);
const byKind = <T>(of: (kind: EntityKind) => T) => Object.fromEntries(ENTITY_KINDS.map((k) => [k, of(k)])) as Record<EntityKind, T>;

/**
 * Columns in the order of the entity's schema (shared/schemas/network.ts,
 * the order docs/format.md lists the fields); export writes them in this
 * order. Taken from the schema, so a field added there is a column here.
 */
export const CSV_COLUMNS: Record<EntityKind, ReadonlyArray<readonly [string, ColumnType]>> = byKind((kind) => fieldsOf(kind).map(([name, field]) => [name, columnType(field)] as const));

/** Columns a row cannot do without (the schema's required fields): a file lacking one is reported once, by name. */
export const REQUIRED_COLUMNS: Record<EntityKind, readonly string[]> = byKind((kind) => fieldsOf(kind).filter(([, field]) => !field.safeParse(undefined).success).map(([name]) => name));

export const LIST_SEPARATOR = ';';


/**
 * Spreadsheet formula guard. A spreadsheet takes a cell starting with "=",
 * "+", "-", "@", a tab or a carriage return as a formula; so export writes a
 * text cell that starts with one of them, after any number of "'", with one
 * more "'" in front, and import takes exactly one "'" off a cell that starts
 * with one or more "'" and then one of them. Every other cell is left as it
 * is ("'abc" stays "'abc"). So import(export(x)) = x for every text x:
 * export adds the "'" exactly where import removes it. Numbers and true/false
 * are written as such and never guarded ("-12.5" stays a number).
 */
const GUARDED = /^'+[=+\-@\t\r]/;
const NEEDS_GUARD = /^'*[=+\-@\t\r]/;

/** A text cell as export writes it. */
export function guardCell(text: string): string {
  return NEEDS_GUARD.test(text) ? `'${text}` : text;
}

/** A cell as import reads it: the one "'" export added, taken off again. */
export function unguardCell(cell: string): string {
  return GUARDED.test(cell) ? cell.slice(1) : cell;
}

/**
 * One cell as the JSON value it stands for; undefined for an empty cell.
 * A cell that is not of the column's type stays the text it was, so the
 * schema check reports it with its row and field ("must be a number (got
 * "abc")") rather than it becoming NaN.
 */
export function cellValue(cell: string, type: ColumnType, decimalComma = false): unknown {
  if (cell.trim() === '') return undefined;
  const text = unguardCell(cell.trim());
  switch (type) {
    case 'number': {
      // a `;`-separated file may write 12,5 for 12.5 (csv-dialect.ts)
      const number = decimalComma ? decimalPoint(text) : text;
      // a plain decimal number, read in one pass (decimal.ts: no pattern a long cell could make backtrack)
      return isDecimal(number) ? Number(number) : cell;
    }
    case 'boolean':
      if (/^true$/i.test(text)) return true;
      if (/^false$/i.test(text)) return false;
      return cell;
    case 'list':
      return text.split(LIST_SEPARATOR).map((item) => item.trim()).filter((item) => item !== '');
    default:
      return unguardCell(cell);
  }
}

/** A JSON value as its cell, formula-guarded when it is text: the inverse of cellValue for every valid value. */
export function cellText(value: unknown): string {
  if (value === undefined || value === null) return '';
  if (Array.isArray(value)) return guardCell(value.join(LIST_SEPARATOR));
  if (typeof value === 'string') return guardCell(value);
  return String(value);
}

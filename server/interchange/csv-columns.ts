/**
 * The CSV form of the network document (docs/format.md):
 * one file per kind, a header row with the JSON field names, lists separated
 * by ";", an empty cell for an absent field. This table says which column
 * holds what, so cells are read as the type the JSON field has.
 */
import { decimalPoint } from './csv-dialect';
import { isDecimal } from './decimal';
import type { EntityKind } from '@/shared/schemas/network';

export type ColumnType = 'string' | 'number' | 'boolean' | 'list';

/** Columns in the order docs/format.md lists the fields; export writes them in this order. */
export const CSV_COLUMNS: Record<EntityKind, ReadonlyArray<readonly [string, ColumnType]>> = {
  sites: [
    ['code', 'string'], ['name', 'string'], ['role', 'string'], ['lat', 'number'], ['lon', 'number'],
    ['groundHeightM', 'number'], ['mastHeightM', 'number'], ['households', 'number'], ['groups', 'list'],
  ],
  services: [['code', 'string'], ['name', 'string'], ['kind', 'string']],
  groups: [['code', 'string'], ['name', 'string'], ['note', 'string']],
  carriages: [
    ['code', 'string'], ['site', 'string'], ['service', 'string'], ['frequencyMHz', 'number'], ['channel', 'string'],
    ['erpW', 'number'], ['polarisation', 'string'], ['antennaHeightM', 'number'], ['onChannelRepeater', 'boolean'],
  ],
  feeds: [
    ['code', 'string'], ['from', 'string'], ['to', 'string'], ['medium', 'string'], ['role', 'string'],
    ['via', 'list'], ['groups', 'list'], ['rxFrequencyMHz', 'number'], ['rxChannel', 'string'],
    ['rxAntenna', 'string'], ['bearingDeg', 'number'],
  ],
};

/** Columns a row cannot do without: a file lacking one is reported once, by name. */
export const REQUIRED_COLUMNS: Record<EntityKind, readonly string[]> = {
  sites: ['code', 'name', 'role', 'lat', 'lon'],
  services: ['code', 'name', 'kind'],
  groups: ['code', 'name'],
  carriages: ['code', 'site', 'service'],
  feeds: ['code', 'from', 'to', 'medium', 'role'],
};

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

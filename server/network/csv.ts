/**
 * The network document as CSV files (docs/format.md):
 * reading sites.csv, services.csv, groups.csv, carriages.csv and feeds.csv
 * (alone or in a zip) into a raw document with the data row of every entity
 * kept for the report, and writing a document back out as the same files.
 * Parsing and quoting are csv-parse and csv-stringify; zips are jszip.
 *
 * A row number is the record's position among the file's data records
 * (1-based, header excluded), counting malformed records too; blank lines
 * are not records.
 */
import { parse } from 'csv-parse/sync';
import { stringify } from 'csv-stringify/sync';
import JSZip from 'jszip';
import type { ImportIssue } from '@/shared/schemas/import';
import { ENTITY_KINDS, NETWORK_FORMAT, type EntityKind, type NetworkDocument } from '@/shared/schemas/network';
import { CSV_COLUMNS, REQUIRED_COLUMNS, cellText, cellValue, type ColumnType } from './csv-columns';
import type { RowsOf } from './issues';

export const CSV_FILE_NAMES: Record<EntityKind, string> = {
  sites: 'sites.csv',
  services: 'services.csv',
  groups: 'groups.csv',
  carriages: 'carriages.csv',
  feeds: 'feeds.csv',
};

export interface CsvFile {
  name: string;
  text: string;
}

export interface CsvRead {
  /** the raw document: pass it with rowsOf to validateDocument */
  raw: { format: string } & Partial<Record<EntityKind, Record<string, unknown>[]>>;
  rowsOf: RowsOf;
  /** problems with the files themselves (names, headers, CSV syntax) */
  errors: ImportIssue[];
}

/** The kind a file name stands for ("Sites.CSV" and "export/sites.csv" both mean sites), or undefined. */
export function kindOfFile(name: string): EntityKind | undefined {
  const base = name.split(/[\\/]/).pop()?.toLowerCase() ?? '';
  return ENTITY_KINDS.find((kind) => CSV_FILE_NAMES[kind] === base);
}

export function readCsvFiles(files: readonly CsvFile[]): CsvRead {
  const raw: CsvRead['raw'] = { format: NETWORK_FORMAT };
  const rowsOf: RowsOf = {};
  const errors: ImportIssue[] = [];
  const seen = new Map<EntityKind, string>();
  for (const file of files) {
    const kind = kindOfFile(file.name);
    if (kind === undefined) {
      errors.push({
        kind: 'document', file: file.name, rule: 'unknown-file',
        message: `file "${file.name}" is not part of a network: the files are ${Object.values(CSV_FILE_NAMES).join(', ')}`,
      });
      continue;
    }
    const earlier = seen.get(kind);
    if (earlier !== undefined) {
      errors.push({ kind, file: file.name, rule: 'duplicate-file', message: `file "${file.name}" holds ${kind} again, after "${earlier}": upload one ${CSV_FILE_NAMES[kind]}` });
      continue;
    }
    seen.set(kind, file.name);
    const read = readKindFile(kind, file, errors);
    raw[kind] = read.entities;
    rowsOf[kind] = { file: file.name, rows: read.rows };
  }
  return { raw, rowsOf, errors };
}

function readKindFile(kind: EntityKind, file: CsvFile, errors: ImportIssue[]): { entities: Record<string, unknown>[]; rows: number[] } {
  let records: string[][];
  // Each skipped record's position among all records (header = 0); err.records counts only the good ones before it.
  const skipped: number[] = [];
  try {
    records = parse(file.text, {
      bom: true,
      skip_empty_lines: true,
      skip_records_with_error: true,
      on_skip: (err) => {
        const row = Number(err?.records ?? 0) + skipped.length;
        skipped.push(row);
        errors.push({ kind, file: file.name, row, rule: 'csv-syntax', message: `${file.name} row ${row}: ${err?.message ?? 'the row cannot be read'}` });
        return undefined;
      },
    }) as string[][];
  } catch (err) {
    errors.push({ kind, file: file.name, rule: 'csv-syntax', message: `${file.name} cannot be read as CSV: ${(err as Error).message}` });
    return { entities: [], rows: [] };
  }
  if (records.length === 0 || skipped[0] === 0) {
    errors.push({ kind, file: file.name, rule: 'missing-header', message: `${file.name} has no header row: the first row names the columns (${CSV_COLUMNS[kind].map(([c]) => c).join(', ')})` });
    return { entities: [], rows: [] };
  }
  const columns = headerColumns(kind, file.name, records[0], errors);
  const entities: Record<string, unknown>[] = [];
  const rows: number[] = [];
  let skipsBefore = 0;
  for (let j = 1; j < records.length; j++) {
    while (skipsBefore < skipped.length && skipped[skipsBefore] <= j + skipsBefore) skipsBefore++;
    const cells = records[j];
    const entity: Record<string, unknown> = {};
    for (let i = 0; i < columns.length; i++) {
      const column = columns[i];
      if (column === undefined) continue;
      const value = cellValue(cells[i] ?? '', column.type);
      if (value !== undefined) entity[column.name] = value;
    }
    entities.push(entity);
    rows.push(j + skipsBefore);
  }
  return { entities, rows };
}

/** Maps header cells to known columns; unknown, repeated and missing required columns are errors. */
function headerColumns(kind: EntityKind, fileName: string, cells: string[], errors: ImportIssue[]): Array<{ name: string; type: ColumnType } | undefined> {
  const types = new Map(CSV_COLUMNS[kind]);
  const known = CSV_COLUMNS[kind].map(([c]) => c).join(', ');
  const used = new Set<string>();
  const columns = cells.map((cell) => {
    const name = cell.trim();
    const type = types.get(name);
    if (type === undefined) {
      errors.push({ kind, file: fileName, field: name, rule: 'unknown-column', message: `${fileName}: unknown column "${name}" (the columns are ${known})` });
      return undefined;
    }
    if (used.has(name)) {
      errors.push({ kind, file: fileName, field: name, rule: 'duplicate-column', message: `${fileName}: column "${name}" appears twice` });
      return undefined;
    }
    used.add(name);
    return { name, type };
  });
  for (const name of REQUIRED_COLUMNS[kind]) {
    if (!used.has(name)) {
      errors.push({ kind, file: fileName, field: name, rule: 'missing-column', message: `${fileName}: column "${name}" is missing; every row needs it` });
    }
  }
  return columns;
}

/** A 20,000-site network is about 30 MB of CSV; leave room, refuse the absurd. */
export const MAX_UNZIPPED_BYTES = 300_000_000;

/** Entries of a zip as CSV files; folders and the resource-fork copies some archivers add are left out. */
export async function unzipCsvFiles(data: Uint8Array, maxBytes = MAX_UNZIPPED_BYTES): Promise<{ files: CsvFile[]; errors: ImportIssue[] }> {
  let zip: JSZip;
  try {
    zip = await JSZip.loadAsync(data);
  } catch (err) {
    return { files: [], errors: [{ kind: 'document', rule: 'bad-zip', message: `the upload is not a readable zip: ${(err as Error).message}` }] };
  }
  // Refuse a zip that would unpack to far more than any network document (a "zip bomb"),
  // by the sizes its central directory declares, before inflating anything.
  const declared = Object.values(zip.files).reduce((n, e) => n + ((e as unknown as { _data?: { uncompressedSize?: number } })._data?.uncompressedSize ?? 0), 0);
  if (declared > maxBytes) {
    return { files: [], errors: [{ kind: 'document', rule: 'zip-too-large', message: `the zip would unpack to ${(declared / 1e6).toFixed(1)} MB; the limit is ${maxBytes / 1e6} MB` }] };
  }
  const files: CsvFile[] = [];
  let unpacked = 0;
  for (const entry of Object.values(zip.files)) {
    const base = entry.name.split('/').pop() ?? '';
    // macOS archivers add "__MACOSX/" and "._name" copies holding file metadata, not data.
    if (entry.dir || entry.name.startsWith('__MACOSX/') || base.startsWith('._')) continue;
    const text = await entry.async('string');
    unpacked += text.length;
    if (unpacked > maxBytes) {
      return { files: [], errors: [{ kind: 'document', rule: 'zip-too-large', message: `the zip unpacks to more than ${maxBytes / 1e6} MB` }] };
    }
    files.push({ name: entry.name, text });
  }
  if (files.length === 0) {
    return { files, errors: [{ kind: 'document', rule: 'empty-zip', message: `the zip holds no files: put ${Object.values(CSV_FILE_NAMES).join(', ')} in it` }] };
  }
  return { files, errors: [] };
}

/** The document as CSV texts, file name -> text; every file has every column so the header is stable. */
export function documentToCsv(doc: NetworkDocument): Record<string, string> {
  const out: Record<string, string> = {};
  for (const kind of ENTITY_KINDS) {
    const columns = CSV_COLUMNS[kind].map(([name]) => name);
    const rows = (doc[kind] as unknown as Record<string, unknown>[]).map((entity) => columns.map((c) => cellText(entity[c])));
    out[CSV_FILE_NAMES[kind]] = stringify([columns, ...rows], { record_delimiter: 'unix' });
  }
  return out;
}

/** The document as a zip of the five CSV files. */
export async function documentToZip(doc: NetworkDocument): Promise<Buffer> {
  const zip = new JSZip();
  for (const [name, text] of Object.entries(documentToCsv(doc))) zip.file(name, text);
  return zip.generateAsync({ type: 'nodebuffer', compression: 'DEFLATE' });
}

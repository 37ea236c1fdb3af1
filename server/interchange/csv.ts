/**
 * The network document as CSV files (docs/format.md, "CSV"): sites.csv, services.csv,
 * groups.csv, carriages.csv and feeds.csv, read into a raw document with the
 * data row of every entity kept for the report (csv-read.ts does the
 * reading, streamed for uploads), and a document written back out as the
 * same files. Quoting is csv-stringify; the export zip is jszip.
 */
import { parse } from 'csv-parse/sync';
import { stringify } from 'csv-stringify/sync';
import JSZip from 'jszip';
import type { ImportIssue } from '@/shared/schemas/import';
import { ENTITY_KINDS, NETWORK_FORMAT, type EntityKind, type NetworkDocument } from '@/shared/schemas/network';
import { CSV_COLUMNS, cellText } from './csv-columns';
import { detectDialect } from './csv-dialect';
import { CsvKindReader, csvOptions, StopReading, type IssueCollector } from './csv-read';
import { clip } from '@/shared/clip';
import { IssueList, type RowsOf } from './issues';

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
  raw: { format: string; baseVersion?: unknown } & Partial<Record<EntityKind, Record<string, unknown>[]>>;
  rowsOf: RowsOf;
  /** problems with the files themselves (names, headers, CSV syntax) */
  errors: ImportIssue[];
}

/** The kind a file name stands for ("Sites.CSV" and "export/sites.csv" both mean sites), or undefined. */
export function kindOfFile(name: string): EntityKind | undefined {
  const base = name.split(/[\\/]/).pop()?.toLowerCase() ?? '';
  return ENTITY_KINDS.find((kind) => CSV_FILE_NAMES[kind] === base);
}

/**
 * The manifest of a CSV bundle: one header row and one data row,
 * `format,baseVersion` / `network/1,12`, saying which network version the
 * files were exported at (README "Versions"). Optional.
 */
export const MANIFEST_FILE = 'manifest.csv';
export const MAX_MANIFEST_BYTES = 4096;
export const isManifest = (name: string) => (name.split(/[\\/]/).pop() ?? '').toLowerCase() === MANIFEST_FILE;

export function manifestCsv(baseVersion: number): string {
  return stringify([['format', 'baseVersion'], [NETWORK_FORMAT, String(baseVersion)]], { record_delimiter: 'unix' });
}

/** The manifest's baseVersion as the document field (a number, or the text for the validator to refuse); issues for a broken manifest. */
export function readManifest(name: string, text: string, issues: IssueCollector): unknown {
  let records: string[][];
  try {
    records = parse(text, { bom: true, skip_empty_lines: true, max_record_size: MAX_MANIFEST_BYTES }) as string[][];
  } catch {
    records = [];
  }
  const column = records[0]?.map((c) => c.trim()).indexOf('baseVersion') ?? -1;
  if (records.length !== 2 || column < 0) {
    issues.push({ kind: 'document', file: name, field: 'baseVersion', rule: 'bad-manifest', message: `${name} is a header row "format,baseVersion" and one row of values, e.g. "${NETWORK_FORMAT},12"` });
    return undefined;
  }
  const cell = (records[1][column] ?? '').trim();
  return /^\d{1,15}$/.test(cell) ? Number(cell) : clip(cell);
}

/** Checks a file name against the kinds already read; returns its kind when it is to be read. */
export function claimFile(name: string, seen: Map<EntityKind, string>, issues: IssueCollector): EntityKind | undefined {
  const kind = kindOfFile(name);
  if (kind === undefined) {
    issues.push({
      kind: 'document', file: name, rule: 'unknown-file',
      message: `file "${name}" is not part of a network: the files are ${Object.values(CSV_FILE_NAMES).join(', ')}`,
    });
    return undefined;
  }
  const earlier = seen.get(kind);
  if (earlier !== undefined) {
    issues.push({ kind, file: name, rule: 'duplicate-file', message: `file "${name}" holds ${kind} again, after "${earlier}": upload one ${CSV_FILE_NAMES[kind]}` });
    return undefined;
  }
  seen.set(kind, name);
  return kind;
}

/** CSV texts already in memory (tests, benchmarks): read with the same reader as the streamed upload. */
export function readCsvFiles(files: readonly CsvFile[]): CsvRead {
  const raw: CsvRead['raw'] = { format: NETWORK_FORMAT };
  const rowsOf: RowsOf = {};
  const issues = new IssueList();
  const seen = new Map<EntityKind, string>();
  for (const file of files) {
    if (isManifest(file.name)) {
      raw.baseVersion = readManifest(file.name, file.text, issues);
      continue;
    }
    const kind = claimFile(file.name, seen, issues);
    if (kind === undefined) continue;
    const reader = new CsvKindReader(kind, file.name, issues);
    reader.dialect = detectDialect(file.text.slice(0, file.text.indexOf('\n') + 1 || undefined));
    try {
      parse(file.text, {
        ...csvOptions(undefined, reader.dialect),
        on_skip: (err) => {
          reader.skip(err);
          return undefined;
        },
        // each record goes to the reader as it is read, in order with the skipped ones; none is kept here
        on_record: (record: string[]) => {
          reader.record(record);
          return null;
        },
      });
    } catch (err) {
      if (!(err instanceof StopReading)) reader.fail(err as Error);
    }
    const read = reader.finish();
    raw[kind] = read.entities;
    rowsOf[kind] = { file: file.name, rows: read.rows };
  }
  return { raw, rowsOf, errors: issues.list };
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

/** The document as a zip of the five CSV files, and the manifest when the version is given. */
export async function documentToZip(doc: NetworkDocument, baseVersion?: number): Promise<Buffer> {
  const zip = new JSZip();
  for (const [name, text] of Object.entries(documentToCsv(doc))) zip.file(name, text);
  if (baseVersion !== undefined) zip.file(MANIFEST_FILE, manifestCsv(baseVersion));
  return zip.generateAsync({ type: 'nodebuffer', compression: 'DEFLATE' });
}

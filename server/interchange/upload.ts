/**
 * Uploaded files -> a network document (docs/format.md): one JSON document, or CSV
 * files, each alone or in zips, read together as one document. The kind of
 * upload is told by the file name, else by the zip signature. CSV files are
 * streamed record by record (csv-read.ts), zip entries inflated as streams
 * (zip.ts), and every byte and row counts against one budget per request
 * (limits.ts): passing it throws UploadLimitError, which the route answers
 * with 413.
 */
import { Readable } from 'node:stream';
import type { ImportIssue } from '@/shared/schemas/import';
import { clip } from '@/shared/clip';
import { NETWORK_FORMAT, type EntityKind } from '@/shared/schemas/network';
import { claimFile, isManifest, MAX_MANIFEST_BYTES, readCsvFiles, readManifest, type CsvFile, type CsvRead } from './csv';
import { CsvKindReader, readCsvStream } from './csv-read';
import { IssueList, type RowsOf } from './issues';
import { UploadBudget, UploadLimitError, type UploadLimits } from './limits';
import { validateDocument, type ValidateOptions, type ValidationResult } from './validate';
import { BadZipError, zipEntries } from './zip';

// Every zip (local file header) starts with "PK\x03\x04" (PKWARE APPNOTE.TXT, section 4.3.7).
const ZIP_SIGNATURE = [0x50, 0x4b, 0x03, 0x04];

/** One uploaded file, read and validated (file-level errors first). */
export async function readNetworkUpload(name: string, data: Uint8Array, opts: Omit<ValidateOptions, 'rowsOf'> & { limits?: UploadLimits } = {}): Promise<ValidationResult> {
  const read = await readUploads([{ name, data }], opts.limits);
  if (read.raw === undefined) return failed(read.sourceErrors);
  const result = validateDocument(read.raw, { ...opts, rowsOf: read.rowsOf });
  const errors = [...read.sourceErrors, ...result.errors];
  return { document: errors.length === 0 ? result.document : null, errors, warnings: result.warnings };
}

/** Reads CSV files and validates what they hold; file-level errors come first. */
export function validateCsvFiles(files: readonly CsvFile[], opts: Omit<ValidateOptions, 'rowsOf'> = {}): ValidationResult {
  const read = readCsvFiles(files);
  const result = validateDocument(read.raw, { ...opts, rowsOf: read.rowsOf });
  const errors = [...read.errors, ...result.errors];
  return { document: errors.length === 0 ? result.document : null, errors, warnings: result.warnings };
}

function failed(errors: ImportIssue[]): ValidationResult {
  return { document: null, errors, warnings: [] };
}

export interface UploadedFile {
  name: string;
  data: Uint8Array;
}

export interface UploadRead {
  raw: unknown;
  rowsOf?: RowsOf;
  sourceErrors: ImportIssue[];
  /** file-level issues found beyond those kept, counted only */
  moreSourceErrors?: number;
}

const isZip = (f: UploadedFile) => /\.zip$/i.test(f.name) || ZIP_SIGNATURE.every((byte, i) => f.data[i] === byte);
const isJson = (f: UploadedFile) => /\.json$/i.test(f.name);
const isCsv = (f: UploadedFile) => /\.csv$/i.test(f.name);

const documentIssue = (rule: string, message: string, file?: string): ImportIssue => ({ kind: 'document', rule, message, ...(file ? { file } : {}) });

const asBuffer = (data: Uint8Array) => (Buffer.isBuffer(data) ? data : Buffer.from(data.buffer, data.byteOffset, data.byteLength));

function readJson(file: UploadedFile, budget: UploadBudget): UploadRead {
  budget.addBytes(file.data.byteLength);
  let text = asBuffer(file.data).toString('utf8');
  // Some editors save UTF-8 with a byte order mark, which JSON.parse refuses.
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  try {
    return { raw: JSON.parse(text), sourceErrors: [] };
  } catch (err) {
    return { raw: undefined, sourceErrors: [documentIssue('invalid-json', `${file.name} is not valid JSON: ${clip((err as Error).message, 120)}`, file.name)] };
  }
}

/** Reads every file of one request into one raw document; throws UploadLimitError past the budget. */
export async function readUploads(uploaded: readonly UploadedFile[], limits?: UploadLimits): Promise<UploadRead> {
  const budget = new UploadBudget(limits);
  const files = uploaded.map((f) => ({ ...f, name: clip(f.name, 120) }));
  const json = files.filter(isJson);
  if (json.length > 0) {
    if (files.length > 1) {
      const names = clip(files.map((f) => f.name).join(', '), 200);
      return { raw: undefined, sourceErrors: [documentIssue('mixed-upload', `upload one network document (.json) on its own, or CSV files; got ${names}`)] };
    }
    return readJson(json[0], budget);
  }

  const raw: CsvRead['raw'] = { format: NETWORK_FORMAT };
  const rowsOf: RowsOf = {};
  const issues = new IssueList();
  const seen = new Map<EntityKind, string>();
  const readOne = async (name: string, open: () => Promise<Readable>) => {
    if (isManifest(name)) {
      raw.baseVersion = readManifest(name, await smallText(await open(), budget), issues);
      return;
    }
    const kind = claimFile(name, seen, issues);
    if (kind === undefined) return;
    const read = await readCsvStream(await open(), new CsvKindReader(kind, name, issues, budget.limits.maxRecordChars), budget);
    raw[kind] = read.entities;
    rowsOf[kind] = { file: name, rows: read.rows };
  };

  for (const file of files) {
    if (isZip(file)) {
      const zipIssues = await readZip(file, budget, readOne);
      for (const issue of zipIssues) issues.push(issue);
    } else if (isCsv(file)) {
      await readOne(file.name, async () => Readable.from([asBuffer(file.data)]));
    } else {
      issues.push(documentIssue('unknown-file', `"${file.name}" is neither a network document (.json), a zip of CSV files (.zip) nor a CSV file (.csv)`, file.name));
    }
  }
  return { raw, rowsOf, sourceErrors: issues.list, ...(issues.more > 0 ? { moreSourceErrors: issues.more } : {}) };
}

/** The CSV files of one zip, streamed in turn; a zip that cannot be read is a report issue, a budget overrun is thrown. */
async function readZip(file: UploadedFile, budget: UploadBudget, readOne: (name: string, open: () => Promise<Readable>) => Promise<void>): Promise<ImportIssue[]> {
  let opened: Awaited<ReturnType<typeof zipEntries>>;
  try {
    opened = await zipEntries(file.data, budget);
  } catch (err) {
    if (err instanceof BadZipError) return [documentIssue('bad-zip', err.message, file.name)];
    throw err;
  }
  try {
    if (opened.entries.length === 0) {
      return [documentIssue('empty-zip', `the zip holds no files: put sites.csv, services.csv, groups.csv, carriages.csv, feeds.csv in it`, file.name)];
    }
    for (const entry of opened.entries) {
      try {
        await readOne(entry.name, entry.open);
      } catch (err) {
        if (err instanceof UploadLimitError) throw err;
        // yauzl found the entry's real size, checksum or data not as the directory says
        const message = err instanceof BadZipError ? err.message : `${entry.name} cannot be read from the zip: ${clip((err as Error).message, 120)}`;
        return [documentIssue('bad-zip', message, file.name)];
      }
    }
    return [];
  } finally {
    opened.close();
  }
}

/** A manifest's text: a few bytes; more is not a manifest (the reader then reports it). */
async function smallText(source: Readable, budget: UploadBudget): Promise<string> {
  const chunks: Buffer[] = [];
  let size = 0;
  for await (const chunk of source as AsyncIterable<Buffer>) {
    budget.addBytes(chunk.length);
    size += chunk.length;
    if (size > MAX_MANIFEST_BYTES) {
      source.destroy();
      return '';
    }
    chunks.push(chunk);
  }
  return Buffer.concat(chunks).toString('utf8');
}

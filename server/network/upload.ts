/**
 * Uploaded files -> a network document (docs/format.md):
 * one JSON document, or CSV files, each alone or in zips, read together as
 * one document. The kind of upload is told by the file name, else by the zip
 * signature.
 */
import type { ImportIssue } from '@/shared/schemas/import';
import { readCsvFiles, unzipCsvFiles, type CsvFile } from './csv';
import { validateDocument, type ValidateOptions, type ValidationResult } from './validate';
import type { RowsOf } from './issues';

// Every zip (local file header) starts with "PK\x03\x04" (PKWARE APPNOTE.TXT, section 4.3.7).
const ZIP_SIGNATURE = [0x50, 0x4b, 0x03, 0x04];


/** One uploaded file, read and validated (file-level errors first). */
export async function readNetworkUpload(name: string, data: Uint8Array, opts: Omit<ValidateOptions, 'rowsOf'> = {}): Promise<ValidationResult> {
  const read = await readUploads([{ name, data }]);
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
}

const isZip = (f: UploadedFile) => /\.zip$/i.test(f.name) || ZIP_SIGNATURE.every((byte, i) => f.data[i] === byte);
const isJson = (f: UploadedFile) => /\.json$/i.test(f.name);
const isCsv = (f: UploadedFile) => /\.csv$/i.test(f.name);

const documentIssue = (rule: string, message: string, file?: string): ImportIssue => ({ kind: 'document', rule, message, ...(file ? { file } : {}) });

export async function readUploads(files: readonly UploadedFile[]): Promise<UploadRead> {
  const json = files.filter(isJson);
  if (json.length > 0) {
    if (files.length > 1) {
      const names = files.map((f) => f.name).join(', ');
      return { raw: undefined, sourceErrors: [documentIssue('mixed-upload', `upload one network document (.json) on its own, or CSV files; got ${names}`)] };
    }
    try {
      // Some editors save UTF-8 with a byte order mark, which JSON.parse refuses.
      return { raw: JSON.parse(Buffer.from(json[0].data).toString('utf8').replace(/^\uFEFF/, '')), sourceErrors: [] };
    } catch (err) {
      return { raw: undefined, sourceErrors: [documentIssue('invalid-json', `${json[0].name} is not valid JSON: ${(err as Error).message}`, json[0].name)] };
    }
  }

  const csv: CsvFile[] = [];
  const sourceErrors: ImportIssue[] = [];
  for (const file of files) {
    if (isZip(file)) {
      const unzipped = await unzipCsvFiles(file.data);
      csv.push(...unzipped.files);
      sourceErrors.push(...unzipped.errors.map((e) => ({ ...e, file: e.file ?? file.name })));
    } else if (isCsv(file)) {
      csv.push({ name: file.name, text: Buffer.from(file.data).toString('utf8') });
    } else {
      sourceErrors.push(documentIssue('unknown-file', `"${file.name}" is neither a network document (.json), a zip of CSV files (.zip) nor a CSV file (.csv)`, file.name));
    }
  }
  const read = readCsvFiles(csv);
  return { raw: read.raw, rowsOf: read.rowsOf, sourceErrors: [...sourceErrors, ...read.errors] };
}

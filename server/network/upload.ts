/**
 * One uploaded file -> a validated network document: a JSON document, a zip
 * of the CSV files, or one CSV file alone (handbook interchange.md section 1).
 * The kind of upload is told by the file name, else by the zip signature.
 */
import type { ImportIssue } from '@/shared/schemas/import';
import { readCsvFiles, unzipCsvFiles, type CsvFile } from './csv';
import { validateDocument, type ValidateOptions, type ValidationResult } from './validate';

// Every zip (local file header) starts with "PK\x03\x04" (PKWARE APPNOTE.TXT, section 4.3.7).
const ZIP_SIGNATURE = [0x50, 0x4b, 0x03, 0x04];

function isZip(name: string, data: Uint8Array): boolean {
  return /\.zip$/i.test(name) || ZIP_SIGNATURE.every((byte, i) => data[i] === byte);
}

export async function readNetworkUpload(name: string, data: Uint8Array, opts: Omit<ValidateOptions, 'rowsOf'> = {}): Promise<ValidationResult> {
  if (/\.json$/i.test(name)) {
    let raw: unknown;
    try {
      // Some editors save UTF-8 with a byte order mark, which JSON.parse refuses.
      raw = JSON.parse(Buffer.from(data).toString('utf8').replace(/^\uFEFF/, ''));
    } catch (err) {
      return failed([{ kind: 'document', file: name, rule: 'invalid-json', message: `${name} is not valid JSON: ${(err as Error).message}` }]);
    }
    return validateDocument(raw, opts);
  }
  let files: CsvFile[];
  if (isZip(name, data)) {
    const unzipped = await unzipCsvFiles(data);
    if (unzipped.errors.length > 0) return failed(unzipped.errors);
    files = unzipped.files;
  } else if (/\.csv$/i.test(name)) {
    files = [{ name, text: Buffer.from(data).toString('utf8') }];
  } else {
    return failed([{ kind: 'document', file: name, rule: 'unknown-file', message: `"${name}" is neither a network document (.json), a zip of CSV files (.zip) nor one CSV file (.csv)` }]);
  }
  return validateCsvFiles(files, opts);
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

/**
 * Reading one CSV file of a kind (sites.csv, ...) record by record, so that a
 * file is never held whole: csv-parse's stream API feeds each record to a
 * CsvKindReader, which keeps only the entities built so far. The same reader
 * serves the in-memory path (csv.ts readCsvFiles), so both read alike.
 *
 * A row number is the one a spreadsheet shows: the header is row 1, the
 * first data record row 2, malformed records counted too; blank lines are
 * not records.
 */
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { setImmediate as nextTurn } from 'node:timers/promises';
import { parse, type Options } from 'csv-parse';
import type { ImportIssue } from '@/shared/schemas/import';
import { clip } from '@/shared/clip';
import type { EntityKind } from '@/shared/schemas/network';
import { CSV_COLUMNS, REQUIRED_COLUMNS, cellValue, type ColumnType } from './csv-columns';
import { DEFAULT_DIALECT, detectDialect, notUtf8Message, NotUtf8Error, Utf8Check, type CsvDialect } from './csv-dialect';
import { UPLOAD_LIMITS, type UploadBudget } from './limits';
import { formatCount } from '@/shared/format';

export interface KindRead {
  entities: Record<string, unknown>[];
  rows: number[];
}

/** Collects file-level issues, keeping a bounded number and counting the rest (issues.ts KEEP_ISSUES). */
export interface IssueCollector {
  push(issue: ImportIssue): void;
}

export const csvOptions = (maxRecordChars = UPLOAD_LIMITS.maxRecordChars, dialect: CsvDialect = DEFAULT_DIALECT): Options<string[]> => ({
  bom: true,
  delimiter: dialect.delimiter,
  skip_empty_lines: true,
  skip_records_with_error: true,
  max_record_size: maxRecordChars,
});

type Column = { name: string; type: ColumnType } | undefined;

/** Thrown out of the parser to stop reading a file whose problem is already reported. */
export class StopReading extends Error {}

/** A row wider than any row of a network: its row (the header is row 1) and what is wrong with it. */
export class RowTooWide extends Error {
  constructor(
    readonly row: number,
    readonly what: string,
  ) {
    super(`row ${row} ${what}`);
  }
}

/**
 * Separators one record may hold outside quotes: a row of the widest kind
 * has ten, and a spreadsheet may add empty columns up to the last one it
 * formatted (a few hundred at most; common practice, not a measured bound).
 */
export const MAX_RECORD_SEPARATORS = 4096;

const QUOTE = 0x22;
const LF = 0x0a;
const CR = 0x0d;

// Where SeparatorCheck stands in a record; QUOTE_IN_QUOTED is a quote inside a quoted cell (its end, or the first of a doubled quote).
const FIELD_START = 0;
const BARE = 1;
const QUOTED = 2;
const QUOTE_IN_QUOTED = 3;

/**
 * csv-parse bounds a record by the characters of its cells, not by how many
 * cells it has, and builds every cell before on_record sees them: a record
 * of a million bare separators is a million empty cells and seconds of
 * work, even when quoted line breaks split it into short lines. So the
 * separators of each record are counted outside quotes (RFC 4180 quoting)
 * before the parser sees its bytes; a record past MAX_RECORD_SEPARATORS
 * ends the file (throws RowTooWide). A quote inside a bare cell, or text
 * after a closing quote, is taken as text (the parser refuses such a record
 * anyway), so the count errs high. The row is the record's, blank lines
 * left out, as the parser numbers it.
 */
export class SeparatorCheck {
  private at = FIELD_START;
  private separators = 0;
  private blank = true;
  private row = 1;

  constructor(private readonly separator: number) {}

  push(chunk: Uint8Array): void {
    for (let i = 0; i < chunk.length; i++) {
      const b = chunk[i];
      if (this.at === QUOTED) {
        if (b === QUOTE) this.at = QUOTE_IN_QUOTED;
        continue;
      }
      if (b === QUOTE && this.at !== BARE) {
        this.at = QUOTED;
        this.blank = false;
      } else if (b === LF || b === CR) {
        if (!this.blank) this.row++;
        this.separators = 0;
        this.blank = true;
        this.at = FIELD_START;
      } else if (b === this.separator) {
        this.blank = false;
        this.at = FIELD_START;
        if (++this.separators > MAX_RECORD_SEPARATORS) {
          throw new RowTooWide(this.row, `holds more than ${formatCount(MAX_RECORD_SEPARATORS)} separators; a row of a network has a few dozen at most`);
        }
      } else {
        this.blank = false;
        this.at = BARE;
      }
    }
  }
}

/** Bytes handed to the parser in one turn of the event loop. */
const PIECE_BYTES = 64 * 1024;

/**
 * The source in pieces of at most PIECE_BYTES, with a turn of the event loop
 * after each: a plain CSV upload arrives as one buffer of up to the upload
 * limit, which csv-parse would otherwise parse in one go.
 */
async function* inPieces(source: AsyncIterable<Buffer>): AsyncGenerator<Buffer> {
  for await (const chunk of source) {
    for (let at = 0; at < chunk.length; at += PIECE_BYTES) {
      yield chunk.subarray(at, at + PIECE_BYTES);
      await nextTurn();
    }
  }
}

export class CsvKindReader {
  private position = 0;
  private columns: Column[] | undefined;
  private headerBroken = false;
  private stopped = false;
  private readonly out: KindRead = { entities: [], rows: [] };
  /** how the file writes its cells (csv-dialect.ts); told before the first record */
  dialect: CsvDialect = DEFAULT_DIALECT;

  constructor(
    readonly kind: EntityKind,
    readonly file: string,
    private readonly issues: IssueCollector,
    private readonly maxRecordChars = UPLOAD_LIMITS.maxRecordChars,
  ) {}

  record(cells: string[]): void {
    const position = this.position++;
    if (position === 0) {
      this.columns = headerColumns(this.kind, this.file, cells, this.issues);
      return;
    }
    if (this.headerBroken || this.stopped || !this.columns) return;
    const entity: Record<string, unknown> = {};
    const columns = this.columns;
    for (let i = 0; i < columns.length; i++) {
      const column = columns[i];
      if (column === undefined) continue;
      const value = cellValue(cells[i] ?? '', column.type, this.dialect.decimalComma);
      if (value !== undefined) entity[column.name] = value;
    }
    this.out.entities.push(entity);
    // The header is the spreadsheet's row 1, so record n (1-based after it) is row n + 1.
    this.out.rows.push(position + 1);
  }

  /**
   * A record csv-parse could not read; it still takes its row number. A
   * record over the size limit ends the file (throws StopReading): the
   * parser would otherwise report the rest of it again every few hundred
   * kilobytes.
   */
  skip(err: Error | undefined): void {
    const position = this.position++;
    const row = position + 1;
    if (position === 0) this.headerBroken = true;
    if ((err as { code?: string } | undefined)?.code === 'CSV_MAX_RECORD_SIZE') {
      this.tooWide(new RowTooWide(row, `is longer than any row of a network can be (the limit is ${formatCount(this.maxRecordChars)} characters)`));
      throw new StopReading();
    }
    this.issues.push({ kind: this.kind, file: this.file, row, rule: 'csv-syntax', message: `${this.file} row ${row}: ${clip(err?.message ?? 'the row cannot be read', 200)}` });
  }

  /** A row no network has (SeparatorCheck, or csv-parse's size limit): said once; the file is not read further. */
  tooWide(err: RowTooWide): void {
    this.issues.push({ kind: this.kind, file: this.file, row: err.row, rule: 'csv-syntax', message: `${this.file} row ${err.row} ${err.what}; the file was not read further` });
    this.stopped = true;
  }

  /** A file that is not UTF-8: said once, with the row of its first bad byte; nothing of it is read. */
  notUtf8(err: NotUtf8Error): void {
    this.issues.push({ kind: this.kind, file: this.file, rule: 'not-utf8', message: notUtf8Message(this.file, err) });
    this.stopped = true;
  }

  /** A file that cannot be read at all (it stops here). */
  fail(err: Error): void {
    this.issues.push({ kind: this.kind, file: this.file, rule: 'csv-syntax', message: `${this.file} cannot be read as CSV: ${clip(err.message, 200)}` });
    this.stopped = true;
  }

  finish(): KindRead {
    if (this.stopped) return { entities: [], rows: [] };
    if (this.position === 0 || this.headerBroken || !this.columns) {
      this.issues.push({
        kind: this.kind, file: this.file, rule: 'missing-header',
        message: `${this.file} has no header row: the first row names the columns (${CSV_COLUMNS[this.kind].map(([c]) => c).join(', ')})`,
      });
      return { entities: [], rows: [] };
    }
    return this.out;
  }
}

/**
 * Streams one file through csv-parse into a CsvKindReader, counting its
 * bytes and records against the request's budget (an UploadLimitError from
 * the budget stops the stream and is thrown) and checking it is UTF-8. The
 * first line is read before the parser starts, to tell the separator.
 */
export async function readCsvStream(source: Readable, reader: CsvKindReader, budget: UploadBudget): Promise<KindRead> {
  const utf8 = new Utf8Check();
  const checked = (async function* () {
    for await (const chunk of inPieces(source as AsyncIterable<Buffer>)) {
      budget.addBytes(chunk.length);
      utf8.push(chunk);
      yield chunk;
    }
    utf8.end();
  })();
  try {
    // The header row: until the first line end (or as long as one row may be).
    const head: Buffer[] = [];
    let headBytes = 0;
    for (;;) {
      const next = await checked.next();
      if (next.done) break;
      head.push(next.value);
      headBytes += next.value.length;
      if (next.value.includes(0x0a) || headBytes > budget.limits.maxRecordChars) break;
    }
    const headBuffer = Buffer.concat(head);
    const firstLine = headBuffer.subarray(0, headBuffer.indexOf(0x0a) + 1 || undefined);
    // UTF-16 text without a byte order mark passes the UTF-8 check: its ASCII is every other byte a NUL.
    if (firstLine.includes(0)) throw new NotUtf8Error(0, 1, true);
    reader.dialect = detectDialect(firstLine.toString('utf8'));
    const separators = new SeparatorCheck(reader.dialect.delimiter.charCodeAt(0));
    const rest = (async function* () {
      for (const chunk of head) {
        separators.push(chunk);
        yield chunk;
      }
      for await (const chunk of checked) {
        separators.push(chunk);
        yield chunk;
      }
    })();
    // Records go to the reader from inside the parser (on_record), in order with the skipped
    // ones (on_skip); nothing is passed downstream, so nothing queues up between them.
    const parser = parse({
      ...csvOptions(budget.limits.maxRecordChars, reader.dialect),
      on_skip: (err) => {
        reader.skip(err);
        return undefined;
      },
      on_record: (record: string[]) => {
        budget.addRecord();
        reader.record(record);
        return null;
      },
    });
    const drain = async function* (records: AsyncIterable<unknown>) {
      for await (const _ of records) yield* [];
    };
    await pipeline(Readable.from(rest, { objectMode: false }), parser, drain);
  } catch (err) {
    if (err instanceof StopReading) return reader.finish();
    if (err instanceof RowTooWide) {
      reader.tooWide(err);
      return reader.finish();
    }
    if (err instanceof NotUtf8Error) {
      reader.notUtf8(err);
      return reader.finish();
    }
    const code = (err as { code?: unknown }).code;
    if (typeof code !== 'string' || !code.startsWith('CSV_')) throw err;
    reader.fail(err as Error);
  }
  return reader.finish();
}

/** Maps header cells to known columns; unknown, repeated and missing required columns are errors. */
function headerColumns(kind: EntityKind, fileName: string, cells: string[], issues: IssueCollector): Column[] {
  const types = new Map(CSV_COLUMNS[kind]);
  const known = CSV_COLUMNS[kind].map(([c]) => c).join(', ');
  const used = new Set<string>();
  const columns = cells.map((cell) => {
    const name = cell.trim();
    const type = types.get(name);
    if (type === undefined) {
      const quoted = clip(name);
      issues.push({ kind, file: fileName, field: quoted, rule: 'unknown-column', message: `${fileName}: unknown column "${quoted}" (the columns are ${known})` });
      return undefined;
    }
    if (used.has(name)) {
      issues.push({ kind, file: fileName, field: name, rule: 'duplicate-column', message: `${fileName}: column "${name}" appears twice` });
      return undefined;
    }
    used.add(name);
    return { name, type };
  });
  for (const name of REQUIRED_COLUMNS[kind]) {
    if (!used.has(name)) {
      issues.push({ kind, file: fileName, field: name, rule: 'missing-column', message: `${fileName}: column "${name}" is missing; every row needs it` });
    }
  }
  return columns;
}

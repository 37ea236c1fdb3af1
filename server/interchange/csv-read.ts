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
      this.issues.push({
        kind: this.kind, file: this.file, row, rule: 'csv-syntax',
        message: `${this.file} row ${row} is longer than any row of a network can be (the limit is ${formatCount(this.maxRecordChars)} characters); the file was not read further`,
      });
      this.stopped = true;
      throw new StopReading();
    }
    this.issues.push({ kind: this.kind, file: this.file, row, rule: 'csv-syntax', message: `${this.file} row ${row}: ${clip(err?.message ?? 'the row cannot be read', 200)}` });
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
    for await (const chunk of source as AsyncIterable<Buffer>) {
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
    const headText = Buffer.concat(head).toString('utf8');
    reader.dialect = detectDialect(headText.slice(0, headText.indexOf('\n') + 1 || undefined));
    const rest = (async function* () {
      yield* head;
      yield* checked;
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

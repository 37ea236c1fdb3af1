/**
 * CSV as spreadsheets save it. The separator is told from the header row:
 * a comma, a semicolon or a tab, whichever the header uses most outside
 * quotes (a spreadsheet set to a locale whose decimal mark is a comma writes
 * `;` between cells and `12,5` for twelve and a half, so a `;` file also
 * reads `12,5` in a number column as 12.5). A file must be UTF-8: the first
 * byte that is not is reported with the file's row it sits in (the header
 * is row 1), rather than read as replacement characters.
 */
import { isUtf8 } from 'node:buffer';

export interface CsvDialect {
  delimiter: ',' | ';' | '\t';
  /** number cells may use a comma as the decimal mark */
  decimalComma: boolean;
}

export const DEFAULT_DIALECT: CsvDialect = { delimiter: ',', decimalComma: false };

/** The dialect of a file from its first line (BOM and line end may still be on it). */
export function detectDialect(firstLine: string): CsvDialect {
  const counts = { ',': 0, ';': 0, '\t': 0 };
  let quoted = false;
  for (const ch of firstLine) {
    if (ch === '"') quoted = !quoted;
    else if (ch === '\n') break;
    else if (!quoted && (ch === ',' || ch === ';' || ch === '\t')) counts[ch]++;
  }
  if (counts['\t'] > 0 && counts['\t'] >= counts[','] && counts['\t'] >= counts[';']) return { delimiter: '\t', decimalComma: false };
  if (counts[';'] > counts[',']) return { delimiter: ';', decimalComma: true };
  return DEFAULT_DIALECT;
}

const DECIMAL_COMMA = /^[+-]?\d+,\d+$/;

/** A number cell written with a decimal comma ("12,5") in the form the number reader takes ("12.5"); others as they are. */
export const decimalPoint = (text: string): string => (DECIMAL_COMMA.test(text) ? text.replace(',', '.') : text);

/** The file is not UTF-8: where the first byte that breaks it sits. */
export class NotUtf8Error extends Error {
  constructor(
    readonly byte: number,
    /** the row of the file, the header being row 1 */
    readonly row: number,
    /** the file is UTF-16 (its byte order mark says so, or its header holds NUL bytes) */
    readonly utf16 = false,
  ) {
    super(`byte 0x${byte.toString(16).toUpperCase().padStart(2, '0')} in row ${row} is not UTF-8`);
  }
}

/** A UTF-16 byte order mark (FF FE or FE FF) at the start of a file. */
const isUtf16Mark = (b: Uint8Array) => b.length >= 2 && ((b[0] === 0xff && b[1] === 0xfe) || (b[0] === 0xfe && b[1] === 0xff));

export function notUtf8Message(file: string, err: NotUtf8Error): string {
  if (err.utf16) {
    return `${file} is UTF-16 text, not UTF-8 (a spreadsheet's "Unicode text" is saved so). Save it again as CSV with the UTF-8 encoding and upload it again`;
  }
  const hex = `0x${err.byte.toString(16).toUpperCase().padStart(2, '0')}`;
  return `${file} is not UTF-8 text: row ${err.row.toLocaleString('en')} (the header is row 1) holds the byte ${hex}, which UTF-8 does not allow there; ` +
    'the file was probably saved in an older encoding. Save it again as CSV with the UTF-8 encoding and upload it again';
}

/** Offset of the first byte that breaks UTF-8 (RFC 3629 section 4: no overlongs, no surrogates, nothing past U+10FFFF), or -1. */
export function firstBadByte(b: Uint8Array): number {
  let i = 0;
  while (i < b.length) {
    const c = b[i];
    if (c < 0x80) {
      i++;
      continue;
    }
    const n = c >= 0xc2 && c <= 0xdf ? 1 : c >= 0xe0 && c <= 0xef ? 2 : c >= 0xf0 && c <= 0xf4 ? 3 : -1;
    if (n < 0 || i + n >= b.length) return i;
    const d = b[i + 1];
    const lo = c === 0xe0 ? 0xa0 : c === 0xf0 ? 0x90 : 0x80;
    const hi = c === 0xed ? 0x9f : c === 0xf4 ? 0x8f : 0xbf;
    if (d < lo || d > hi) return i;
    for (let k = 2; k <= n; k++) if ((b[i + k] & 0xc0) !== 0x80) return i;
    i += n + 1;
  }
  return -1;
}

/** Length of a trailing sequence that may still be completed by the next chunk (0 to 3 bytes). */
function openTail(b: Uint8Array): number {
  for (let back = 1; back <= Math.min(3, b.length); back++) {
    const c = b[b.length - back];
    if ((c & 0xc0) === 0x80) continue;
    const need = c >= 0xc2 && c <= 0xdf ? 2 : c >= 0xe0 && c <= 0xef ? 3 : c >= 0xf0 && c <= 0xf4 ? 4 : 1;
    return need > back ? back : 0;
  }
  return 0;
}

function countLines(b: Uint8Array, end = b.length): number {
  let n = 0;
  let at = -1;
  while ((at = b.indexOf(0x0a, at + 1)) !== -1 && at < end) n++;
  return n;
}

/** Checks a file chunk by chunk (a sequence may be cut between chunks); throws NotUtf8Error at the first bad byte. */
export class Utf8Check {
  private carry: Uint8Array = new Uint8Array(0);
  private lines = 0;
  private started = false;

  push(chunk: Uint8Array): void {
    if (!this.started) {
      this.started = true;
      if (isUtf16Mark(chunk)) throw new NotUtf8Error(chunk[0], 1, true);
    }
    const buf = this.carry.length > 0 ? Buffer.concat([this.carry, chunk]) : chunk;
    const cut = buf.length - openTail(buf);
    const whole = buf.subarray(0, cut);
    if (!isUtf8(whole)) this.fail(whole);
    this.lines += countLines(whole);
    this.carry = Uint8Array.from(buf.subarray(cut));
  }

  end(): void {
    if (this.carry.length > 0) this.fail(this.carry);
  }

  private fail(b: Uint8Array): never {
    const at = Math.max(0, firstBadByte(b));
    throw new NotUtf8Error(b[at], this.lines + countLines(b, at) + 1);
  }
}

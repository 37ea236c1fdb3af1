/**
 * The exposure ranking as a CSV file a manager can open in a spreadsheet.
 * Quoting follows RFC 4180 (fields with a comma, quote or line break are
 * quoted, quotes doubled, CRLF line ends). Free-text names that start like a
 * formula get a leading apostrophe, as the OWASP "CSV Injection" page
 * advises, so a spreadsheet shows them rather than running them; codes
 * cannot start that way except with "-", which a spreadsheet reads as text
 * or a number, never a formula call.
 */
import type { Element } from '@/shared/schemas/analysis';

export interface ExposureCsvRow {
  rank: number;
  element: Element;
  /** A site's or group's name when known. */
  name?: string;
  households: number;
  carriages: number;
}

export const EXPOSURE_CSV_HEADER = ['rank', 'kind', 'code', 'name', 'households_off_air', 'carriages_off_air'] as const;

export function csvField(value: string | number): string {
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw new RangeError(`csvField: ${String(value)} is not a finite number`);
    return String(value);
  }
  return /[",\r\n]/.test(value) ? `"${value.replace(/"/g, '""')}"` : value;
}

/** Guards free text against being read as a formula (OWASP, CSV Injection). */
export function textCell(value: string): string {
  return /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
}

export function exposureCsv(rows: readonly ExposureCsvRow[]): string {
  const lines = [EXPOSURE_CSV_HEADER.join(',')];
  for (const r of rows) {
    lines.push([r.rank, r.element.kind, r.element.code, textCell(r.name ?? ''), r.households, r.carriages].map(csvField).join(','));
  }
  return `${lines.join('\r\n')}\r\n`;
}

/** A file name that sorts by date: headwater-exposure-v12-2026-03-04.csv */
export function exposureFileName(networkVersion: number, when: Date): string {
  return `headwater-exposure-v${networkVersion}-${when.toISOString().slice(0, 10)}.csv`;
}

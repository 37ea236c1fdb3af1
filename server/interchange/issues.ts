/**
 * Building import issues (docs/format.md, "Import rules"):
 * every issue names its kind, where it sits (JSON index, or CSV file and row),
 * the entity code, the field, a stable rule name and a sentence a person can
 * act on.
 */
import { MAX_REPORTED_ISSUES, type ImportIssue } from '@/shared/schemas/import';
import { clip } from '@/shared/clip';
import { CODE_PATTERN, type EntityKind } from '@/shared/schemas/network';

/** Where each array element came from when the document was read from CSV: rows[i] is element i's data row. */
export type RowsOf = Partial<Record<EntityKind, { file: string; rows: readonly number[] }>>;

export const KIND_NOUN: Record<EntityKind, string> = {
  sites: 'site',
  services: 'service',
  groups: 'group',
  carriages: 'carriage',
  feeds: 'feed',
};

const KIND_ORDER: Record<ImportIssue['kind'], number> = { document: 0, sites: 1, services: 2, groups: 3, carriages: 4, feeds: 5 };

/** A value quoted for a message: short (shared/clip.ts), and never "[object Object]". */
export function shown(value: unknown): string {
  if (typeof value === 'number') return Number.isNaN(value) ? 'NaN' : String(value);
  if (value === undefined) return 'nothing';
  // cut a long string before quoting it: JSON.stringify of a 200 MB cell would copy it whole
  if (typeof value === 'string') return JSON.stringify(clip(value, SHOWN_LENGTH));
  let text: string;
  try {
    text = JSON.stringify(value) ?? String(value);
  } catch {
    text = String(value);
  }
  return clip(text, SHOWN_LENGTH);
}

const SHOWN_LENGTH = 60;

/** The entity's code when it has a usable one, for messages and the issue's `code`. */
export function codeOf(entity: unknown): string | undefined {
  if (entity === null || typeof entity !== 'object') return undefined;
  const code = (entity as { code?: unknown }).code;
  return typeof code === 'string' && CODE_PATTERN.test(code) ? code : undefined;
}

/**
 * How many issues of each severity a sink keeps; beyond it they are only
 * counted, so a file with a million bad rows costs no memory for its report.
 * Ten times what a report lists, so the sorted list is still mostly in order.
 */
export const KEEP_ISSUES = 10 * MAX_REPORTED_ISSUES;

/** Collects errors and warnings with their locations; sorts them by kind, then position. */
export class IssueSink {
  readonly errors: ImportIssue[] = [];
  readonly warnings: ImportIssue[] = [];
  /** issues found beyond KEEP_ISSUES, counted only */
  moreErrors = 0;
  moreWarnings = 0;

  constructor(private readonly rowsOf?: RowsOf) {}

  /** "site S12", or "site in row 4 of sites.csv" / "site at index 3" when it has no usable code. */
  subject(kind: EntityKind, index: number, code: string | undefined): string {
    if (code !== undefined) return `${KIND_NOUN[kind]} ${code}`;
    return `${KIND_NOUN[kind]} ${this.where(kind, index)}`;
  }

  /** "in row 4 of sites.csv" or "at index 3". */
  where(kind: EntityKind, index: number): string {
    const source = this.rowsOf?.[kind];
    if (source) return `in row ${source.rows[index] ?? index + 1} of ${source.file}`;
    return `at index ${index}`;
  }

  error(kind: EntityKind, index: number, code: string | undefined, field: string | undefined, rule: string, detail: string): void {
    if (this.errors.length >= KEEP_ISSUES) this.moreErrors++;
    else this.errors.push(this.build(kind, index, code, field, rule, detail));
  }

  warn(kind: EntityKind, index: number, code: string | undefined, field: string | undefined, rule: string, detail: string): void {
    if (this.warnings.length >= KEEP_ISSUES) this.moreWarnings++;
    else this.warnings.push(this.build(kind, index, code, field, rule, detail));
  }

  /** An issue about the document as a whole (its shape, its top-level keys). */
  documentError(rule: string, message: string, field?: string): void {
    if (this.errors.length >= KEEP_ISSUES) this.moreErrors++;
    else this.errors.push({ kind: 'document', rule, message, ...(field !== undefined ? { field } : {}) });
  }

  /** An issue about a whole kind (e.g. "sites is not a list"). */
  kindError(kind: EntityKind, rule: string, message: string, field?: string): void {
    const source = this.rowsOf?.[kind];
    if (this.errors.length >= KEEP_ISSUES) this.moreErrors++;
    else this.errors.push({ kind, rule, message, ...(source ? { file: source.file } : {}), ...(field !== undefined ? { field } : {}) });
  }

  sorted(): { errors: ImportIssue[]; warnings: ImportIssue[]; moreErrors: number; moreWarnings: number } {
    return { errors: sortIssues(this.errors), warnings: sortIssues(this.warnings), moreErrors: this.moreErrors, moreWarnings: this.moreWarnings };
  }

  private build(kind: EntityKind, index: number, code: string | undefined, field: string | undefined, rule: string, detail: string): ImportIssue {
    const source = this.rowsOf?.[kind];
    const issue: ImportIssue = { kind, rule, message: `${this.subject(kind, index, code)}: ${detail}` };
    if (source) {
      issue.file = source.file;
      issue.row = source.rows[index] ?? index + 1;
    } else {
      issue.index = index;
    }
    if (code !== undefined) issue.code = code;
    if (field !== undefined) issue.field = source ? columnOf(field) : field;
    return issue;
  }
}

/** In CSV a list is one column: "groups[1]" is reported as the column "groups". */
function columnOf(field: string): string {
  const cut = field.search(/[[.]/);
  return cut === -1 ? field : field.slice(0, cut);
}

function sortIssues(issues: ImportIssue[]): ImportIssue[] {
  const position = (i: ImportIssue) => i.row ?? i.index ?? -1;
  // Array.prototype.sort is stable, so issues at one position keep the order the rules found them in.
  return issues.sort((a, b) => KIND_ORDER[a.kind] - KIND_ORDER[b.kind] || position(a) - position(b));
}

/** A list of issues cut to what a report shows, with the count of the rest. */
export function capIssues(issues: readonly ImportIssue[], alsoUnlisted = 0, max = MAX_REPORTED_ISSUES): { shown: ImportIssue[]; more: number } {
  const shown = issues.length > max ? issues.slice(0, max) : [...issues];
  return { shown, more: issues.length - shown.length + alsoUnlisted };
}

/** File-level issues of one upload, kept up to KEEP_ISSUES and counted beyond. */
export class IssueList {
  readonly list: ImportIssue[] = [];
  more = 0;

  push(issue: ImportIssue): void {
    if (this.list.length >= KEEP_ISSUES) this.more++;
    else this.list.push(issue);
  }
}

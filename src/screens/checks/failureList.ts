/**
 * The network's failing checks as the Checks screen shows them: filters kept in the URL
 * (`/checks?severity=error&check=field-strength,horizon`) so a filtered list can be shared,
 * the filter itself, and the count summary.
 */
import { CHECK_NAMES, CHECK_SEVERITIES, type CheckFailure, type CheckName, type CheckSeverity } from '@/shared/schemas/checks';
import { CHECK_SHORT } from './checkWords';
import { formatFigure, formatMargin } from '@/shared/format';

export interface FailureFilter {
  /** The lowest severity listed: 'warning' lists errors and warnings, 'error' only errors. */
  severity: CheckSeverity;
  /** Kinds of check shown; empty means every kind. */
  checks: CheckName[];
}

export const DEFAULT_FILTER: FailureFilter = { severity: 'warning', checks: [] };

type Param = string | string[] | undefined;
const first = (p: Param) => (Array.isArray(p) ? p[0] : p);

/** Reads the filter from route parameters; unknown values are ignored rather than failing the screen. */
export function readFilter(params: { severity?: Param; check?: Param }): FailureFilter {
  const s = first(params.severity);
  const severity = (CHECK_SEVERITIES as readonly string[]).includes(s ?? '') ? (s as CheckSeverity) : DEFAULT_FILTER.severity;
  const raw = (Array.isArray(params.check) ? params.check.join(',') : params.check ?? '').split(',').map((x) => x.trim());
  // Kept in the fixed CHECK_NAMES order, without repeats, so equal filters give equal URLs.
  const checks = CHECK_NAMES.filter((n) => raw.includes(n));
  return { severity, checks };
}

/** Route parameters for a filter; defaults are left out so the plain URL stays plain. */
export function filterParams(filter: FailureFilter): { severity?: string; check?: string } {
  return {
    severity: filter.severity === DEFAULT_FILTER.severity ? undefined : filter.severity,
    check: filter.checks.length ? CHECK_NAMES.filter((n) => filter.checks.includes(n)).join(',') : undefined,
  };
}

export function toggleCheck(filter: FailureFilter, name: CheckName): FailureFilter {
  const on = filter.checks.includes(name);
  const checks = CHECK_NAMES.filter((n) => (n === name ? !on : filter.checks.includes(n)));
  return { ...filter, checks };
}

/** Keeps the server's worst-first order. */
export function applyFilter(failures: readonly CheckFailure[], filter: FailureFilter): CheckFailure[] {
  return failures.filter((f) => (filter.severity === 'error' ? f.severity === 'error' : true) && (filter.checks.length === 0 || filter.checks.includes(f.check.name)));
}

export interface FailureCounts {
  total: number;
  errors: number;
  warnings: number;
  feeds: number;
  /** Failures per kind of check, in CHECK_NAMES order, kinds with none left out. */
  byCheck: { name: CheckName; count: number }[];
}

export function countFailures(failures: readonly CheckFailure[]): FailureCounts {
  const byName = new Map<CheckName, number>();
  let errors = 0;
  for (const f of failures) {
    if (f.severity === 'error') errors += 1;
    byName.set(f.check.name, (byName.get(f.check.name) ?? 0) + 1);
  }
  return {
    total: failures.length,
    errors,
    warnings: failures.length - errors,
    feeds: new Set(failures.map((f) => f.feed)).size,
    byCheck: CHECK_NAMES.filter((n) => byName.has(n)).map((name) => ({ name, count: byName.get(name)! })),
  };
}

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/** "12 failing checks on 9 feeds: 10 errors, 2 warnings". */
export function summaryWords(counts: FailureCounts): string {
  if (counts.total === 0) return 'No failing checks';
  return `${plural(counts.total, 'failing check')} on ${plural(counts.feeds, 'feed')}: ${plural(counts.errors, 'error')}, ${plural(counts.warnings, 'warning')}`;
}

/** "Field strength: 3, Radio horizon: 1" for the screen reader text of the chips. */
export function chipLabel(name: CheckName, count: number): string {
  return `${CHECK_SHORT[name]} (${count})`;
}

/** "48.2 dBµV/m against 56.0 dBµV/m", or the value alone when there is no limit. */
export function valueAgainstLimit(f: CheckFailure): string {
  const { value, limit, unit } = f.check;
  const v = value === null ? 'no value' : formatFigure(value, unit);
  return limit === undefined || limit === null ? v : `${v} against ${formatFigure(limit, unit)}`;
}

/** The margin's unit is the check's unit (shared/schemas/checks.ts); channel-clash has none. */
export function marginWords(f: CheckFailure): string {
  return f.margin === undefined ? 'no margin (a yes-or-no check)' : formatMargin(f.margin, f.check.unit);
}

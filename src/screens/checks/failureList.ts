/**
 * The network's failing checks as the Checks screen shows them: filters kept in the URL
 * (`/checks?severity=error&check=field-strength,horizon`) so a filtered list can be shared,
 * the filter itself, the chips and the count summary (the counts come from the server).
 */
import { CHECK_NAMES, CHECK_SEVERITIES, type CheckFailure, type CheckName, type CheckSeverity, type FailureCounts } from '@/shared/schemas/checks';
import { CHECK_SHORT } from './checkWords';
import { countOf, formatCount, formatFigure, formatMargin } from '@/shared/format';

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

/** "12 failing checks on 9 feeds: 10 errors, 2 warnings" (counts from the server: the whole filtered list). */
export function summaryWords(counts: FailureCounts): string {
  if (counts.total === 0) return 'No failing checks';
  return `${countOf(counts.total, 'failing check')} on ${countOf(counts.feeds, 'feed')}: ${countOf(counts.errors, 'error')}, ${countOf(counts.warnings, 'warning')}`;
}

/**
 * The filter chips: every kind that fails at the severity shown, with its
 * count, plus any kind already chosen (at 0), so it can be turned off.
 */
export function chipCounts(kinds: readonly { name: CheckName; count: number }[], chosen: readonly CheckName[]): { name: CheckName; count: number }[] {
  const named = new Map(kinds.map((k) => [k.name, k.count]));
  return CHECK_NAMES.filter((n) => named.has(n) || chosen.includes(n)).map((name) => ({ name, count: named.get(name) ?? 0 }));
}

/** "Field strength: 3, Radio horizon: 1" for the screen reader text of the chips. */
export function chipLabel(name: CheckName, count: number): string {
  return `${CHECK_SHORT[name]} (${formatCount(count)})`;
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

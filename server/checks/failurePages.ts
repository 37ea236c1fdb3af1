/**
 * The failing-checks list as `GET /api/checks` serves it: the network's whole
 * list (worst first) filtered by severity and kind of check, counted for the
 * screen's summary and filter chips, and cut into pages, so a phone never
 * receives 17,000 failures to count them itself.
 */
import { CHECK_NAMES, type CheckFailure, type CheckName, type CheckSeverity, type FailureCounts } from '@/shared/schemas/checks';

export interface FailureFilter {
  /** the lowest severity listed: 'warning' lists errors and warnings, 'error' errors only */
  severity: CheckSeverity;
  /** kinds of check listed; empty or absent: every kind */
  checks?: readonly CheckName[];
}

/** Keeps the list's (worst-first) order. */
export function filterFailures(all: readonly CheckFailure[], filter: FailureFilter): readonly CheckFailure[] {
  const kinds = filter.checks?.length ? new Set(filter.checks) : null;
  if (filter.severity === 'warning' && !kinds) return all;
  return all.filter((f) => (filter.severity === 'warning' || f.severity === 'error') && (!kinds || kinds.has(f.check.name)));
}

export function countFailures(failures: readonly CheckFailure[]): FailureCounts {
  const byName = new Map<CheckName, number>();
  const feeds = new Set<string>();
  let errors = 0;
  for (const f of failures) {
    if (f.severity === 'error') errors += 1;
    byName.set(f.check.name, (byName.get(f.check.name) ?? 0) + 1);
    feeds.add(f.feed);
  }
  return {
    total: failures.length,
    errors,
    warnings: failures.length - errors,
    feeds: feeds.size,
    byCheck: CHECK_NAMES.filter((n) => byName.has(n)).map((name) => ({ name, count: byName.get(name)! })),
  };
}

export interface FilteredFailures {
  rows: readonly CheckFailure[];
  counts: FailureCounts;
  /** per kind at the filter's severity, ignoring its kinds: the chips */
  kinds: FailureCounts['byCheck'];
}

/** Filters seen per list kept at once: a screen switches between a handful; anything more is recomputed (one pass). */
const KEEP = 16;

/**
 * Filter and counts of one list, kept per filter so that paging through a
 * filtered list counts it once. `all` must not change (a new network has a
 * new list and so a new memo).
 */
export function failureMemo(all: readonly CheckFailure[]) {
  const seen = new Map<string, FilteredFailures>();
  return (filter: FailureFilter): FilteredFailures => {
    const checks = CHECK_NAMES.filter((n) => filter.checks?.includes(n));
    const key = `${filter.severity}|${checks.join(',')}`;
    let hit = seen.get(key);
    if (!hit) {
      const rows = filterFailures(all, { severity: filter.severity, checks });
      const bySeverity = checks.length ? countFailures(filterFailures(all, { severity: filter.severity })) : countFailures(rows);
      hit = { rows, counts: checks.length ? countFailures(rows) : bySeverity, kinds: bySeverity.byCheck };
      if (seen.size >= KEEP) seen.clear();
      seen.set(key, hit);
    }
    return hit;
  };
}

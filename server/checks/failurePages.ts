/**
 * The failing-checks list as `GET /api/checks` serves it: the network's whole
 * list (worst first) filtered by severity and kind of check, counted for the
 * screen's summary and filter chips, and cut into pages, so a phone never
 * receives 17,000 failures to count them itself.
 */
import { CHECK_NAMES, type CheckFailure, type CheckName, type CheckSeverity, type FailureCounts, type FailureSort } from '@/shared/schemas/checks';

export interface FailureFilter {
  /** the lowest severity listed: 'warning' lists errors and warnings, 'error' errors only */
  severity: CheckSeverity;
  /** kinds of check listed; empty or absent: every kind */
  checks?: readonly CheckName[];
  /** the order (default worst first, the list's own) */
  sort?: FailureSort;
  direction?: 'asc' | 'desc';
}

/** Codes compare as text with the numbers in them in numeric order ("F2" before "F10"), the same whatever the server's locale. */
const collator = new Intl.Collator('en', { numeric: true, sensitivity: 'base' });
const checkRank = new Map(CHECK_NAMES.map((n, i) => [n, i]));

/** Each order's comparison, ascending; margin has its own (blanks last either way). */
const ASCENDING: Record<Exclude<FailureSort, 'worst' | 'margin'>, (a: CheckFailure, b: CheckFailure) => number> = {
  severity: (a, b) => Number(a.severity !== 'error') - Number(b.severity !== 'error'),
  feed: (a, b) => collator.compare(a.feed, b.feed),
  route: (a, b) => collator.compare(a.from, b.from) || collator.compare(a.to, b.to),
  check: (a, b) => checkRank.get(a.check.name)! - checkRank.get(b.check.name)!,
};

/**
 * The rows in the order asked for: a stable sort of the worst-first list, so
 * rows that tie keep their worst-first order and every page of a sorted list
 * is the same whichever page is asked first.
 */
export function sortFailures(rows: readonly CheckFailure[], sort: FailureSort = 'worst', direction: 'asc' | 'desc' = 'asc'): readonly CheckFailure[] {
  if (sort === 'worst') return direction === 'asc' ? rows : [...rows].reverse();
  const sign = direction === 'asc' ? 1 : -1;
  if (sort === 'margin') {
    return [...rows].sort((a, b) => {
      if (a.margin === undefined || b.margin === undefined) return Number(a.margin === undefined) - Number(b.margin === undefined);
      return sign * (a.margin - b.margin);
    });
  }
  const compare = ASCENDING[sort];
  return [...rows].sort((a, b) => sign * compare(a, b));
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
    const sort = filter.sort ?? 'worst';
    const direction = filter.direction ?? 'asc';
    if (sort === 'worst' && direction === 'asc') return hit;
    // Sorted the first time a page of this order is asked for; the counts are the filter's, whatever the order.
    const orderKey = `${key}|${sort}|${direction}`;
    let sorted = seen.get(orderKey);
    if (!sorted) {
      sorted = { ...hit, rows: sortFailures(hit.rows, sort, direction) };
      if (seen.size >= KEEP) seen.clear();
      seen.set(orderKey, sorted);
    }
    return sorted;
  };
}

/**
 * Feed engineering screening (docs/checks.md): one feed's checks
 * (GET /api/feeds/:code/checks) and every failing check in the network (GET /api/checks),
 * plus the small site search the calculator uses to pick two ends of a path.
 */
import { api } from '@/shared/api';
import type { CheckName, CheckSeverity, FailureSort } from '@/shared/schemas/checks';
import { checksListAnswerSchema, feedChecksAnswerSchema, sitePositionsPageSchema, type ChecksListReply } from '../schemas';
import { useApiPages } from '../useApiPages';
import { useApiQuery } from '../useApiQuery';

/** Sites offered per search; enough to pick from on a phone without scrolling far. */
export const SITE_SEARCH_PAGE = 8;

export const checksKeys = {
  feed: (code: string) => api.feedChecks(code),
  /** The filtered list without its page; `checks` in CHECK_NAMES order (failureList.ts keeps it so), so equal filters share a cache entry. */
  filtered: (severity: CheckSeverity, checks: readonly CheckName[], order?: FailureOrder) => {
    const sorted = order && !(order.sort === 'worst' && order.direction === 'asc') ? `sort=${order.sort}&direction=${order.direction}` : '';
    const q = [severity === 'warning' ? '' : `severity=${severity}`, checks.length ? `check=${checks.join(',')}` : '', sorted].filter(Boolean).join('&');
    return `${api.checks()}${q ? `?${q}` : ''}`;
  },
  sites: (q: string) => `${api.list('sites')}?q=${encodeURIComponent(q)}&pageSize=${SITE_SEARCH_PAGE}`,
};

/** The order of the failing-checks list: a column and a direction (the server sorts, so every page follows it). */
export interface FailureOrder {
  sort: FailureSort;
  direction: 'asc' | 'desc';
}

/** One feed's checks; `code` null waits (e.g. while a route parameter is missing). */
export function useFeedChecks(code: string | null) {
  return useApiQuery(code ? checksKeys.feed(code) : null, feedChecksAnswerSchema, 'network');
}

/** Failures per page: a phone shows three or four cards at once, so one page covers a long fling. */
export const FAILURE_PAGE = 100;

const failuresOf = (a: ChecksListReply) => a.failures;

/**
 * The failing checks for one filter, page after page as the list scrolls; the
 * first page carries the counts of the whole filtered list and of each kind.
 */
export function useCheckFailurePages(severity: CheckSeverity, checks: readonly CheckName[], order?: FailureOrder) {
  return useApiPages(checksKeys.filtered(severity, checks, order), checksListAnswerSchema, failuresOf, FAILURE_PAGE, 'network');
}

/** Sites whose code or name holds `q`; an empty search asks nothing. */
export function useSitePositions(q: string) {
  const text = q.trim();
  return useApiQuery(text ? checksKeys.sites(text) : null, sitePositionsPageSchema, 'network');
}

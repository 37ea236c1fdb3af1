/**
 * Feed engineering screening (docs/checks.md): one feed's checks
 * (GET /api/feeds/:code/checks) and every failing check in the network (GET /api/checks),
 * plus the small site search the calculator uses to pick two ends of a path.
 */
import { api } from '@/shared/api';
import type { CheckSeverity } from '@/shared/schemas/checks';
import { checksListAnswerSchema, feedChecksAnswerSchema, sitePositionsPageSchema } from '../schemas';
import { useApiQuery } from '../useApiQuery';

/** Sites offered per search; enough to pick from on a phone without scrolling far. */
export const SITE_SEARCH_PAGE = 8;

export const checksKeys = {
  feed: (code: string) => api.feedChecks(code),
  /** The server lists failures at or above `severity` (default warning: all of them). */
  list: (severity?: CheckSeverity) => api.checks(severity),
  sites: (q: string) => `${api.list('sites')}?q=${encodeURIComponent(q)}&pageSize=${SITE_SEARCH_PAGE}`,
};

/** One feed's checks; `code` null waits (e.g. while a route parameter is missing). */
export function useFeedChecks(code: string | null) {
  return useApiQuery(code ? checksKeys.feed(code) : null, feedChecksAnswerSchema, 'network');
}

/** Every failing check, worst first, as the server orders them. */
export function useCheckFailures(severity?: CheckSeverity) {
  return useApiQuery(checksKeys.list(severity), checksListAnswerSchema, 'network');
}

/** Sites whose code or name holds `q`; an empty search asks nothing. */
export function useSitePositions(q: string) {
  const text = q.trim();
  return useApiQuery(text ? checksKeys.sites(text) : null, sitePositionsPageSchema, 'network');
}

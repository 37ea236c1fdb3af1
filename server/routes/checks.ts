/** Feed engineering screening over the in-memory network (docs/checks.md). */
import { can } from '@/shared/api';
import { checksQuerySchema, type ChecksListAnswer, type FeedChecksAnswer } from '@/shared/schemas/checks';
import { checksForFeed, CheckInputError, networkCheckFailuresInTurns } from '../checks/networkChecks';
import { failureMemo } from '../checks/failurePages';
import { pageRows } from '@/shared/schemas/paging';
import { ApiError, notFound, parseOr400 } from '../http/errors';
import type { RouteTable } from '../http/routes';
import type { AppContext } from '../context';
import type { ServedNetwork } from '../services/servedNetwork';
import { checksCsv, csvFileName } from '../services/analysisCsv';

export function currentModel(ctx: AppContext): ServedNetwork {
  const m = ctx.network.model;
  if (!m) throw new ApiError(503, 'starting', 'the network is still loading; try again in a moment');
  return m;
}

/**
 * Screening results only change with the network, so each model keeps its
 * own: one feed's checks (also read by every chain hop) and the whole list,
 * computed once at the lowest severity and filtered for the higher one.
 */
const cache = new WeakMap<ServedNetwork, { feeds: Map<string, FeedChecksAnswer>; failures?: Promise<ChecksListAnswer>; filtered?: ReturnType<typeof failureMemo> }>();
function cacheOf(m: ServedNetwork) {
  let c = cache.get(m);
  if (!c) cache.set(m, (c = { feeds: new Map() }));
  return c;
}

/** One feed's checks from the model's cache; throws CheckInputError naming an unknown code. */
export function cachedFeedChecks(m: ServedNetwork, code: string): FeedChecksAnswer {
  const c = cacheOf(m);
  let answer = c.feeds.get(code);
  if (!answer) c.feeds.set(code, (answer = checksForFeed(m, code)));
  return answer;
}

export function registerCheckRoutes(routes: RouteTable, ctx: AppContext) {
  routes.add('get', '/feeds/:code/checks', can.read, async (req, res) => {
    const m = currentModel(ctx);
    try {
      res.json({ networkVersion: m.networkVersion, ...cachedFeedChecks(m, String(req.params.code)) });
    } catch (e) {
      if (e instanceof CheckInputError) throw notFound(e.message, { code: e.code });
      throw e;
    }
  });

  // Paged with ?limit&offset; every answer counts the whole filtered list (for the summary) and each kind at the severity asked (for the chips). CSV is the whole filtered list.
  routes.add('get', '/checks', can.read, async (req, res) => {
    const { severity = 'warning', check, sort, direction, format, ...page } = parseOr400(checksQuerySchema, req.query, 'query');
    const m = currentModel(ctx);
    const c = cacheOf(m);
    // computed in turns, once per network version, shared by the requests that arrive meanwhile
    if (!c.failures) {
      const made = networkCheckFailuresInTurns(m.document, { severity: 'warning', networkVersion: m.networkVersion, index: m });
      c.failures = made;
      made.catch(() => {
        if (c.failures === made) c.failures = undefined;
      });
    }
    const all = await c.failures;
    c.filtered ??= failureMemo(all.failures);
    const wanted = c.filtered({ severity, checks: check, sort, direction });
    if (format === 'csv') {
      res.type('text/csv').attachment(csvFileName('failing-checks', m.networkVersion)).send(await checksCsv({ ...all, failures: [...wanted.rows] }));
      return;
    }
    const { rows, total, offset } = pageRows(wanted.rows, page);
    res.json({ networkVersion: all.networkVersion, failures: rows, total, offset, counts: wanted.counts, kinds: wanted.kinds, unfiltered: all.failures.length });
  });
}

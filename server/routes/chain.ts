/**
 * GET /api/carriages/:code/chain (docs/api.md): the chain tree upstream or
 * downstream, whole as it always was, or folded (server/services/chainFolds.ts):
 * `view=levels` answers the count at each level (and the whole tree only when
 * small); `level=K` or `under=CODE` with `limit` and `offset` a page of the
 * carriages at one level or hanging directly from one carriage.
 */
import { can } from '@/shared/api';
import { chainQuerySchema, type ChainPageAnswer } from '@/shared/schemas/analysis';
import { pageRows } from '@/shared/schemas/paging';
import { notFound, parseOr400 } from '../http/errors';
import type { RouteTable } from '../http/routes';
import type { AppContext } from '../context';
import type { ServedNetwork } from '../services/servedNetwork';
import { UnknownCarriageError } from '../engine/engine';
import { foldChain, levelsAnswer, type FoldedChain } from '../services/chainFolds';
import { cachedFeedChecks, currentModel } from './checks';

/** Trees kept per network: a few carriages opened in turn, each paged through. */
const KEEP = 8;
const folded = new WeakMap<ServedNetwork, Map<string, FoldedChain>>();

function foldedChain(m: ServedNetwork, code: string, direction: 'up' | 'down'): FoldedChain {
  let trees = folded.get(m);
  if (!trees) folded.set(m, (trees = new Map()));
  const key = `${direction} ${code}`;
  let f = trees.get(key);
  if (!f) {
    f = foldChain(m.engine.chain(code, direction, { warningsFor: (feed) => cachedFeedChecks(m, feed).warnings }));
    if (trees.size >= KEEP) trees.delete(trees.keys().next().value!);
    trees.set(key, f);
  }
  return f;
}

export function registerChainRoutes(routes: RouteTable, ctx: AppContext) {
  routes.add('get', '/carriages/:code/chain', can.analyse, async (req, res) => {
    const { direction, view, level, under, ...page } = parseOr400(chainQuerySchema, req.query, 'query');
    const m = currentModel(ctx);
    const code = String(req.params.code);
    try {
      if (view === undefined && level === undefined && under === undefined) {
        res.json(m.engine.chain(code, direction, { warningsFor: (feed) => cachedFeedChecks(m, feed).warnings }));
        return;
      }
      const f = foldedChain(m, code, direction);
      if (view === 'levels') {
        res.json(levelsAnswer(f));
        return;
      }
      let rows;
      if (under !== undefined) {
        if (!f.carriages.has(under)) throw notFound(`carriage ${under} is not in the ${direction === 'up' ? 'upstream' : 'downstream'} chain of ${code}`, { kind: 'carriage', code: under });
        rows = f.childrenOf.get(under) ?? [];
      } else {
        rows = f.byLevel[level!] ?? [];
      }
      const paged = pageRows(rows, page);
      const answer: ChainPageAnswer = { networkVersion: f.answer.networkVersion, direction, ...(under !== undefined ? { under } : { level }), rows: paged.rows, total: paged.total, offset: paged.offset };
      res.json(answer);
    } catch (e) {
      if (e instanceof UnknownCarriageError) throw notFound(`carriage ${e.carriage} does not exist`, { kind: 'carriage', code: e.carriage });
      throw e;
    }
  });
}

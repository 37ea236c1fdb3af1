/** Feed engineering screening over the in-memory network (interchange.md section 2). */
import { can } from '@/shared/api';
import { checksQuerySchema, type ChecksListAnswer } from '@/shared/schemas/checks';
import { checksForFeed, CheckInputError, networkCheckFailures } from '../checks/networkChecks';
import { ApiError, notFound, parseOr400 } from '../http/errors';
import type { RouteTable } from '../http/routes';
import type { AppContext } from '../context';
import type { NetworkModel } from '../services/networkModel';

export function currentModel(ctx: AppContext): NetworkModel {
  const m = ctx.network.model;
  if (!m) throw new ApiError(503, 'starting', 'the network is still loading; try again in a moment');
  return m;
}

// The whole-network list is the same until the network changes: keep one per model.
const listCache = new WeakMap<NetworkModel, Map<string, ChecksListAnswer>>();

export function registerCheckRoutes(routes: RouteTable, ctx: AppContext) {
  routes.add('get', '/feeds/:code/checks', can.read, async (req, res) => {
    const m = currentModel(ctx);
    const code = String(req.params.code);
    if (!m.feeds.has(code)) throw notFound(`feed ${code} does not exist`, { kind: 'feed', code });
    try {
      res.json({ networkVersion: m.networkVersion, ...checksForFeed(m, code) });
    } catch (e) {
      if (e instanceof CheckInputError) throw notFound(e.message, { code: e.code });
      throw e;
    }
  });

  routes.add('get', '/checks', can.read, async (req, res) => {
    const { severity = 'warning' } = parseOr400(checksQuerySchema, req.query, 'query');
    const m = currentModel(ctx);
    let perModel = listCache.get(m);
    if (!perModel) listCache.set(m, (perModel = new Map()));
    let answer = perModel.get(severity);
    if (!answer) {
      answer = networkCheckFailures(m.document, { severity, networkVersion: m.networkVersion });
      perModel.set(severity, answer);
    }
    res.json(answer);
  });
}

/** The analysis API over the in-memory graphs (docs/api.md). */
import { z } from 'zod';
import { can } from '@/shared/api';
import { reachRequestSchema } from '@/shared/schemas/analysis';
import { badRequest, notFound, parseOr400 } from '../http/errors';
import type { RouteTable } from '../http/routes';
import type { AppContext } from '../context';
import { UnknownCarriageError, UnknownElementsError } from '../engine/engine';
import { cachedFeedChecks, currentModel } from './checks';

export const chainQuery = z.object({ direction: z.enum(['up', 'down'], { error: 'direction is up or down' }).default('up') });
export const exposureQuery = z.object({
  limit: z.coerce.number({ error: 'limit must be a number' }).int('limit is a whole number').min(1, 'limit is at least 1').max(100_000).optional(),
});

export function registerAnalysisRoutes(routes: RouteTable, ctx: AppContext) {
  routes.add('post', '/analysis/reach', can.analyse, async (req, res) => {
    if (req.body === undefined || req.body === null || typeof req.body !== 'object' || Array.isArray(req.body)) {
      throw badRequest('body: send { "failed": [{ "kind": "site"|"feed"|"group", "code": "..." }] }');
    }
    const { failed } = parseOr400(reachRequestSchema, req.body);
    const m = currentModel(ctx);
    try {
      res.json(m.engine.reach(failed));
    } catch (e) {
      if (e instanceof UnknownElementsError) throw notFound(e.message, { unknown: e.elements });
      throw e;
    }
  });

  routes.add('get', '/analysis/spof', can.analyse, async (_req, res) => {
    res.json(currentModel(ctx).engine.spof());
  });

  routes.add('get', '/analysis/exposure', can.analyse, async (req, res) => {
    const { limit } = parseOr400(exposureQuery, req.query, 'query');
    res.json(currentModel(ctx).engine.exposure(limit));
  });

  routes.add('get', '/analysis/diversity', can.analyse, async (_req, res) => {
    res.json(currentModel(ctx).engine.diversity());
  });

  routes.add('get', '/analysis/unfed', can.analyse, async (_req, res) => {
    res.json(currentModel(ctx).engine.unfed());
  });

  routes.add('get', '/carriages/:code/chain', can.analyse, async (req, res) => {
    const { direction } = parseOr400(chainQuery, req.query, 'query');
    const m = currentModel(ctx);
    const warningsFor = (feedCode: string) => cachedFeedChecks(m, feedCode).warnings;
    try {
      res.json(m.engine.chain(String(req.params.code), direction, { warningsFor }));
    } catch (e) {
      if (e instanceof UnknownCarriageError) throw notFound(`carriage ${e.carriage} does not exist`, { kind: 'carriage', code: e.carriage });
      throw e;
    }
  });
}

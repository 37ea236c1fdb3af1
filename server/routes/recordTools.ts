/**
 * What a record's page asks besides the record (paths relative to /api):
 *
 *   GET /<kind>/:code/impact        what deleting it would take off air (services/inventory/impact.ts),
 *                                   from the engine's fault reach -> DeleteImpact
 *   GET /<kind>/:code/history       its own audit rows, newest first, ?page ?pageSize (1-100, default 20);
 *                                   engineers and admins -> HistoryAnswer
 *   GET /carriages/:code/sources    carriages of the same service that could feed it, nearest first, with
 *                                   distance (km) and bearing (degrees) from its site, ?q ?limit (1-100,
 *                                   default 20) -> SourcesAnswer
 *
 * Schemas in shared/schemas/editing.ts.
 */
import { can } from '@/shared/api';
import { historyQuerySchema, sourcesQuerySchema } from '@/shared/schemas/editing';
import { ENTITY_KINDS } from '@/shared/schemas/network';
import { notFound, parseOr400 } from '../http/errors';
import type { RouteTable } from '../http/routes';
import type { AppContext } from '../context';
import { recordHistory } from '../services/inventory/history';
import { deleteImpact } from '../services/inventory/impact';
import { MODELS } from '../services/inventory/records';
import { NOUN } from '../services/inventory/shape';
import { sourceCarriages } from '../services/inventory/sources';
import { currentModel } from './checks';

export function registerRecordToolRoutes(routes: RouteTable, ctx: AppContext) {
  const sequelize = ctx.db.sequelize;
  for (const kind of ENTITY_KINDS) {
    routes.add('get', `/${kind}/:code/impact`, can.read, async (req, res) => {
      res.json(deleteImpact(currentModel(ctx), kind, String(req.params.code)));
    });

    routes.add('get', `/${kind}/:code/history`, can.editNetwork, async (req, res) => {
      const q = parseOr400(historyQuerySchema, req.query, 'query');
      const code = String(req.params.code);
      const answer = await recordHistory(sequelize, kind, code, q);
      // A deleted record keeps its history; a code never used has none and is not found.
      if (answer.total === 0 && !(await MODELS[kind].findOne({ where: { code }, attributes: ['id'] }))) throw notFound(`no ${NOUN[kind]} with code ${code}`, { code });
      res.json(answer);
    });
  }

  routes.add('get', '/carriages/:code/sources', can.read, async (req, res) => {
    res.json(sourceCarriages(currentModel(ctx), String(req.params.code), parseOr400(sourcesQuerySchema, req.query, 'query')));
  });
}

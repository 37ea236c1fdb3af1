/**
 * Planned works, incidents and availability (server/operations/README.md).
 * Thin handlers: parse with the shared zod schemas, call the service.
 */
import type { Request } from 'express';
import { can } from '@/shared/api';
import {
  availabilityQuerySchema,
  incidentCreateSchema,
  incidentPatchSchema,
  incidentUpdateSchema,
  workApproveSchema,
  workCreateSchema,
  workPatchSchema,
  worksQuerySchema,
  workTransitionSchema,
} from '@/shared/schemas/operations';
import { objectBody, parseOr400 } from '../http/errors';
import type { RouteTable } from '../http/routes';
import type { AppContext } from '../context';
import type { OpsActor } from '../operations/common';
import { approveWork, createWork, deleteWork, getWork, listWorks, patchWork, transitionWork } from '../operations/works';
import { addIncidentUpdate, getIncident, listIncidents, openIncident, patchIncident } from '../operations/incidents';
import { availability, availabilityCsv } from '../operations/availability';

const actorOf = (req: Request): OpsActor => ({ userId: req.auth?.userId, email: req.auth?.email, role: req.auth?.role });
const code = (req: Request) => String(req.params.code);
const body = (req: Request): unknown => objectBody(req.body);

export function registerOperationsRoutes(routes: RouteTable, ctx: AppContext) {
  routes.add('get', '/works', can.read, async (req, res) => {
    res.json(await listWorks(ctx, parseOr400(worksQuerySchema, req.query, 'query')));
  });
  routes.add('post', '/works', can.operate, async (req, res) => {
    res.status(201).json(await createWork(ctx, actorOf(req), parseOr400(workCreateSchema, body(req))));
  });
  routes.add('get', '/works/:code', can.read, async (req, res) => {
    res.json(await getWork(ctx, code(req)));
  });
  routes.add('patch', '/works/:code', can.operate, async (req, res) => {
    res.json(await patchWork(ctx, actorOf(req), code(req), parseOr400(workPatchSchema, body(req))));
  });
  routes.add('delete', '/works/:code', can.operate, async (req, res) => {
    res.json(await deleteWork(ctx, actorOf(req), code(req)));
  });
  routes.add('post', '/works/:code/approve', can.approveWork, async (req, res) => {
    const { version } = parseOr400(workApproveSchema, body(req));
    res.json(await approveWork(ctx, actorOf(req), code(req), version));
  });
  routes.add('post', '/works/:code/transition', can.operate, async (req, res) => {
    const { to, version } = parseOr400(workTransitionSchema, body(req));
    res.json(await transitionWork(ctx, actorOf(req), code(req), to, version));
  });

  routes.add('get', '/incidents', can.read, async (req, res) => {
    res.json(await listIncidents(ctx, req.query.open === 'true'));
  });
  routes.add('post', '/incidents', can.operate, async (req, res) => {
    res.status(201).json(await openIncident(ctx, actorOf(req), parseOr400(incidentCreateSchema, body(req))));
  });
  routes.add('get', '/incidents/:code', can.read, async (req, res) => {
    res.json(await getIncident(ctx, code(req)));
  });
  routes.add('patch', '/incidents/:code', can.operate, async (req, res) => {
    res.json(await patchIncident(ctx, actorOf(req), code(req), parseOr400(incidentPatchSchema, body(req))));
  });
  routes.add('post', '/incidents/:code/updates', can.operate, async (req, res) => {
    res.status(201).json(await addIncidentUpdate(ctx, actorOf(req), code(req), parseOr400(incidentUpdateSchema, body(req))));
  });

  routes.add('get', '/reports/availability', can.read, async (req, res) => {
    const q = parseOr400(availabilityQuerySchema, req.query, 'query');
    if (q.format === 'csv') {
      res.type('text/csv').attachment(`availability-${q.from.slice(0, 10)}-${q.to.slice(0, 10)}.csv`).send(await availabilityCsv(ctx, q));
      return;
    }
    res.json(await availability(ctx, q));
  });
}

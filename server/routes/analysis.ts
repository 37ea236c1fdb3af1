/** The analysis API over the in-memory graphs (docs/api.md). */
import type { Request, Response } from 'express';
import { z } from 'zod';
import { can } from '@/shared/api';
import {
  carriageSearchQuerySchema,
  exposureQuerySchema,
  listFormatQuerySchema,
  pairsQuerySchema,
  planRequestSchema,
  proposalsQuerySchema,
  reachCarriagesQuerySchema,
  reachQuerySchema,
  reachRequestSchema,
  spofQuerySchema,
  type Element,
  type PairsRunning,
  type ProposalsRunning,
  type SiteInfo,
} from '@/shared/schemas/analysis';
import { pageQuerySchema, pageRows } from '@/shared/schemas/paging';
import { ApiError, conflict, notFound, objectBody, parseOr400 } from '../http/errors';
import { actorOf, settled } from './inventory';
import { createEntities } from '../services/inventory/write';
import { findPlan, forgetPlan, makePlan, pairsState, proposalsState } from '../services/planner';
import type { RouteTable } from '../http/routes';
import type { AppContext } from '../context';
import type { ServedNetwork } from '../services/servedNetwork';
import { UnknownCarriageError, UnknownElementsError } from '../engine/engine';
import { currentModel } from './checks';
import { registerChainRoutes } from './chain';
import { csvFileName, diversityCsv, elementName, exposureCsv, exposureGroupsCsv, unfedCsv } from '../services/analysisCsv';
import { carriageIndexReady, searchCarriages } from '../services/carriageSearch';
import { turnPacer } from '../interchange/turns';
import { prepared, preparedFor } from '../services/prepared';
import { sendJsonInTurns } from '../services/stringifyInTurns';
import { briefReach, reachCarriagesPage, reachSitesPage } from '../services/reachLists';

/** A sandbox's exposure takes a limit and the element kinds; the files and the names are the stored network's only, so asking for them is refused rather than ignored. */
const sandboxExposureQuery = z.strictObject(exposureQuerySchema.pick({ limit: true, kinds: true }).shape);

export const exposureQuery = exposureQuerySchema.extend({
  /** with=names: the name of each listed element (services/analysisCsv.ts elementName: a carriage as "site name, service name", a feed as "from → to"). */
  with: z.enum(['names'], { error: 'with is names (or left out)' }).optional(),
});


function siteInfoOf(m: ServedNetwork, sites: readonly { site: string }[]): Record<string, SiteInfo> {
  const out: Record<string, SiteInfo> = {};
  for (const { site } of sites) {
    const s = m.sites.get(site);
    if (s) out[site] = { name: s.name, households: s.households ?? 0 };
  }
  return out;
}

/** "kind:code" -> a name a person reads, for the elements listed (so a screen need not load the whole network). */
function namesOf(m: ServedNetwork, elements: readonly Element[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (const e of elements) {
    const name = elementName(m, e);
    if (name) out[`${e.kind}:${e.code}`] = name;
  }
  return out;
}

export function registerAnalysisRoutes(routes: RouteTable, ctx: AppContext) {
  const failedOf = (req: Request) => parseOr400(reachRequestSchema, objectBody(req.body, '{ "failed": [{ "kind": "site"|"carriage"|"feed"|"group", "code": "..." }] }')).failed;
  /** An answer about a failure set; unknown elements are a 404 naming them. */
  const aboutFailure = <T>(answer: () => T): T => {
    try {
      return answer();
    } catch (e) {
      if (e instanceof UnknownElementsError) throw notFound(e.message, { unknown: e.elements });
      throw e;
    }
  };

  routes.add('post', '/analysis/reach', can.analyse, async (req, res) => {
    const failed = failedOf(req);
    const { with: extra, first } = parseOr400(reachQuerySchema, req.query, 'query');
    const m = currentModel(ctx);
    // ?first=N: the counts and the first rows of each long list (server/services/reachLists.ts), the rest paged below.
    if (first !== undefined) {
      res.json(aboutFailure(() => briefReach(m, failed, first)));
      return;
    }
    const answer = aboutFailure(() => m.engine.reach(failed));
    // ?with=sites: the name and households of each site in the answer, so a phone need not load the whole network to label them.
    res.json(extra === 'sites' ? { ...answer, siteInfo: siteInfoOf(m, answer.sites) } : answer);
  });

  routes.add('post', '/analysis/reach/sites', can.analyse, async (req, res) => {
    const failed = failedOf(req);
    const page = parseOr400(pageQuerySchema, req.query, 'query');
    const m = currentModel(ctx);
    res.json(aboutFailure(() => reachSitesPage(m, failed, page)));
  });

  routes.add('post', '/analysis/reach/carriages', can.analyse, async (req, res) => {
    const failed = failedOf(req);
    const { state, ...page } = parseOr400(reachCarriagesQuerySchema, req.query, 'query');
    const m = currentModel(ctx);
    res.json(aboutFailure(() => reachCarriagesPage(m, failed, state, page)));
  });

  routes.add('get', '/analysis/spof', can.analyse, async (req, res) => {
    const { kinds } = parseOr400(spofQuerySchema, req.query, 'query');
    const m = currentModel(ctx);
    await preparedFor(m.engine, 'spof', kinds);
    await sendJsonInTurns(res, m.engine.spof(kinds), m.networkVersion);
  });

  // format=csv: the same ranking as a file, one line per element, elements with the same loss sharing a rank.
  routes.add('get', '/analysis/exposure', can.analyse, async (req, res) => {
    const { limit, kinds, format, with: extra } = parseOr400(exposureQuery, req.query, 'query');
    const m = currentModel(ctx);
    // the first rows alone are quick; the whole ranking is made in slices
    if (limit === undefined) await preparedFor(m.engine, 'exposure', kinds);
    else await prepared(m.engine, 'resilience');
    const answer = m.engine.exposure(limit, kinds);
    if (format === 'csv') {
      res.type('text/csv').attachment(csvFileName('exposure', m.networkVersion)).send(await exposureCsv(m, answer));
      return;
    }
    await sendJsonInTurns(res, extra === 'names' ? { ...answer, names: namesOf(m, answer.elements.map((r) => r.element)) } : answer, m.networkVersion);
  });

  // Elements that take off exactly the same carriages in one row (a site and the feeds that only serve it).
  routes.add('get', '/analysis/exposure-groups', can.analyse, async (req, res) => {
    const { limit, kinds, format } = parseOr400(exposureQuery, req.query, 'query');
    const m = currentModel(ctx);
    await preparedFor(m.engine, 'groups', kinds);
    const answer = m.engine.exposureGroups(limit, kinds);
    if (format === 'csv') res.type('text/csv').attachment(csvFileName('exposure-grouped', m.networkVersion)).send(await exposureGroupsCsv(m, answer));
    else await sendJsonInTurns(res, answer, m.networkVersion);
  });

  // Long lists at 20,000 sites: ?limit&offset pick a page; the whole list without them (docs/api.md). CSV is always the whole list.
  const carriageList = <A extends { carriages: unknown[] }>(path: string, file: string, answerOf: (m: ServedNetwork) => A, csvOf: (m: ServedNetwork, a: A) => Promise<string>, need?: 'diversity') =>
    routes.add('get', path, can.analyse, async (req, res) => {
      const { format, ...page } = parseOr400(pageQuerySchema.extend(listFormatQuerySchema.shape), req.query, 'query');
      const m = currentModel(ctx);
      if (need) await prepared(m.engine, need);
      const answer = answerOf(m);
      if (format === 'csv') {
        res.type('text/csv').attachment(csvFileName(file, m.networkVersion)).send(await csvOf(m, answer));
        return;
      }
      const { rows, total, offset } = pageRows(answer.carriages, page);
      await sendJsonInTurns(res, { ...answer, carriages: rows, total, offset }, m.networkVersion);
    });
  carriageList('/analysis/diversity', 'diversity-gaps', (m) => m.engine.diversity(), diversityCsv, 'diversity');
  carriageList('/analysis/unfed', 'unfed-carriages', (m) => m.engine.unfed(), unfedCsv);

  // Carriages to mark failed, by code or by site and service together (server/services/carriageSearch.ts).
  routes.add('get', '/analysis/carriage-search', can.analyse, async (req, res) => {
    const { q, pageSize } = parseOr400(carriageSearchQuerySchema, req.query, 'query');
    const m = currentModel(ctx);
    await carriageIndexReady(m, turnPacer());
    res.json({ networkVersion: m.networkVersion, ...searchCarriages(m, q, pageSize) });
  });

  /** 202 with the progress of a background job (critical pairs, the proposals ranking). */
  const running = (res: Response, networkVersion: number, state: { done: number; total: number }) => {
    const progress = { done: state.done, total: state.total, percent: state.total === 0 ? 0 : Math.floor((100 * state.done) / state.total) };
    const body: PairsRunning | ProposalsRunning = { state: 'running', networkVersion, progress };
    res.status(202).json(body);
  };

  // One carriage's proposals at once; over the network the ranking runs in the background like the pairs (below).
  routes.add('get', '/analysis/proposals', can.analyse, async (req, res) => {
    const { carriage, limit } = parseOr400(proposalsQuerySchema, req.query, 'query');
    const { engine } = currentModel(ctx);
    await prepared(engine, 'diversity');
    if (carriage === undefined) {
      const state = proposalsState(engine, limit ?? 100);
      if (state.state === 'failed') throw new ApiError(500, 'proposals-failed', 'the proposals could not be ranked; the server log has the cause');
      if (state.state === 'running') running(res, engine.networkVersion, state);
      else res.json({ state: 'done', ...state.answer });
      return;
    }
    try {
      res.json(engine.proposals({ carriage, limit: limit ?? 100 }));
    } catch (e) {
      if (e instanceof UnknownCarriageError) throw notFound(`carriage ${e.carriage} does not exist`, { kind: 'carriage', code: e.carriage });
      throw e;
    }
  });

  // Critical pairs run in the background: 202 with progress until done, then the answer (kept per network version).
  routes.add('get', '/analysis/pairs', can.analyse, async (req, res) => {
    const { limit, kinds, sample } = parseOr400(pairsQuerySchema, req.query, 'query');
    const { engine } = currentModel(ctx);
    const state = pairsState(engine, kinds);
    if (state.state === 'failed') throw new ApiError(500, 'pairs-failed', 'the critical pairs could not be computed; the server log has the cause');
    if (state.state === 'running') {
      running(res, engine.networkVersion, state);
      return;
    }
    const answer = engine.pairsAnswer(state.rows, limit);
    if (sample !== undefined) answer.pairs = answer.pairs.map((p) => ({ ...p, jointLost: p.jointLost.slice(0, sample), jointLostCount: p.jointLost.length }));
    res.json({ state: 'done', ...answer });
  });

  routes.add('post', '/analysis/plans', can.analyse, async (req, res) => {
    const { budget } = parseOr400(planRequestSchema, objectBody(req.body, '{ "budget": N } (new feeds, 1-10)'));
    const stored = await makePlan(currentModel(ctx), budget);
    res.status(201).json(stored.answer);
  });

  const planOr404 = (id: string) => {
    const p = findPlan(id);
    if (!p) throw notFound(`plan ${id} does not exist or has expired; make the plan again`, { plan: id });
    return p;
  };

  routes.add('get', '/analysis/plans/:id', can.analyse, async (req, res) => {
    res.json(planOr404(String(req.params.id)).answer);
  });

  // The sandbox: the same answers as above, from the network with the plan's feeds added (nothing stored).
  routes.add('get', '/analysis/plans/:id/:answer', can.analyse, async (req, res) => {
    const p = planOr404(String(req.params.id));
    const sandbox = p.plan.sandbox;
    const answer = String(req.params.answer);
    if (answer === 'exposure') {
      const { limit, kinds } = parseOr400(sandboxExposureQuery, req.query, 'query');
      res.json({ sandbox: p.id, ...sandbox.exposure(limit, kinds) });
    }
    else if (answer === 'diversity') res.json({ sandbox: p.id, ...sandbox.diversity() });
    else if (answer === 'unfed') res.json({ sandbox: p.id, ...sandbox.unfed() });
    else throw notFound(`a sandbox answers exposure, diversity and unfed, not ${answer}`);
  });

  // "Create for real": the plan's feeds through the inventory's own create (rules, audit) in one transaction.
  routes.add('post', '/analysis/plans/:id/apply', can.editNetwork, async (req, res) => {
    const p = planOr404(String(req.params.id));
    const m = currentModel(ctx);
    if (m.networkVersion !== p.networkVersion) {
      const gone = p.plan.feeds.flatMap((f) => [f.from, f.to]).filter((c) => !m.carriages.has(c));
      const what = gone.length > 0 ? `; carriage${gone.length > 1 ? 's' : ''} ${[...new Set(gone)].join(', ')} no longer exist${gone.length > 1 ? '' : 's'}` : '';
      throw conflict(`the network changed since this plan was made (version ${p.networkVersion}, now ${m.networkVersion})${what}; make the plan again`, { plan: p.id, gone });
    }
    if (p.plan.feeds.length === 0) throw conflict('this plan has no feeds to create');
    const out = await settled(ctx, await createEntities(ctx.db.sequelize, p.plan.feeds.map((f) => ({ kind: 'feeds' as const, body: f })), actorOf(req)));
    forgetPlan(p.id);
    res.setHeader('X-Network-Version', String(out.networkVersion));
    res.status(201).json({ networkVersion: out.networkVersion, created: out.result.map((f) => f.code) });
  });

  registerChainRoutes(routes, ctx);
}

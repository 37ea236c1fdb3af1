/**
 * Planned works: drafting, the approval path, reach at the current network
 * version and clashes with other works and open incidents. Every change runs
 * in one transaction with its audit row and its events.
 */
import { Op, type Transaction } from 'sequelize';
import {
  LIVE_WORK_STATES,
  MAX_WINDOW_DAYS,
  WORK_STATE_LABELS,
  type WorkAnswer,
  type WorkCreate,
  type WorkPatch,
  type WorkState,
} from '@/shared/schemas/operations';
import { PlannedWork } from '../db/models/operations';
import { ApiError, badRequest, notFound } from '../http/errors';
import type { AppContext } from '../context';
import type { ServedNetwork } from '../services/servedNetwork';
import { countOf } from '@/shared/format';
import type { OperationsEvent } from './events';
import { audit, knownElements, model, nextCode, staleVersion, type OpsActor } from './common';
import { allClashes } from './clashes';
import { reachCacheFor } from './reach';
import { firmWorkClashes, liveClashes, spellEvent, spellsOverlapping, workSpell } from './spells';

const DAY = 86_400_000;

/** Which state may follow which; approving has its own route and rules. */
export const NEXT_STATES: Record<WorkState, readonly WorkState[]> = {
  draft: ['requested', 'cancelled'],
  requested: ['draft', 'approved', 'cancelled'],
  approved: ['in-progress', 'cancelled'],
  'in-progress': ['done'],
  done: [],
  cancelled: [],
};

export function checkWindow(start: Date, end: Date) {
  if (!(end.getTime() > start.getTime())) throw new ApiError(422, 'bad-window', `end (${end.toISOString()}) must be after start (${start.toISOString()})`);
  if (end.getTime() - start.getTime() > MAX_WINDOW_DAYS * DAY) {
    throw new ApiError(422, 'bad-window', `the window is longer than ${MAX_WINDOW_DAYS} days; split the work into shorter windows`);
  }
}

const shown = (w: PlannedWork) => ({
  code: w.code,
  title: w.title,
  elements: w.elements,
  start: w.startAt.toISOString(),
  end: w.endAt.toISOString(),
  notes: w.notes,
  state: w.state,
  requestedBy: w.requestedByEmail,
  approvedBy: w.approvedByEmail,
  version: w.version,
});

function answer(m: ServedNetwork, w: PlannedWork, clashes: WorkAnswer['clashes']): WorkAnswer {
  const r = reachCacheFor(m).of(w.elements);
  return {
    ...shown(w),
    stateLabel: WORK_STATE_LABELS[w.state],
    updatedAt: w.updatedAt.toISOString(),
    networkVersion: m.networkVersion,
    missing: r.missing,
    reach: r.reach,
    clashes,
  };
}

const clashesOf = async (m: ServedNetwork, w: PlannedWork, t?: Transaction) => (LIVE_WORK_STATES.includes(w.state) ? liveClashes(m, workSpell(w), t) : []);

const event = (m: ServedNetwork, w: PlannedWork, kind: OperationsEvent['kind'], summary: string, extra: Partial<OperationsEvent> = {}) =>
  spellEvent(
    { code: w.code, title: w.title, start: w.startAt, end: w.endAt },
    kind,
    `${kind}:${w.code}:${w.version}`,
    { networkVersion: m.networkVersion, reach: reachCacheFor(m).of(w.elements).reach },
    summary,
    extra,
  );

async function locked(t: Transaction, code: string, version?: number): Promise<PlannedWork> {
  const w = await PlannedWork.findOne({ where: { code }, transaction: t, lock: t.LOCK.UPDATE });
  if (!w) throw notFound(`planned work ${code} does not exist`, { code });
  if (version !== undefined && version !== w.version) throw staleVersion(`planned work ${code}`, version, w.version);
  return w;
}

export async function listWorks(ctx: AppContext, q: { from?: string; to?: string; state?: WorkState[] }) {
  const m = model(ctx);
  const from = q.from ? new Date(q.from) : undefined;
  const to = q.to ? new Date(q.to) : undefined;
  if (from && to && !(to > from)) throw badRequest('query: to must be after from');
  const where: Record<string | symbol, unknown> = {};
  if (q.state?.length) where.state = q.state;
  if (to) where.startAt = { [Op.lt]: to };
  if (from) where.endAt = { [Op.gt]: from };
  const works = await PlannedWork.findAll({ where, order: [['startAt', 'ASC'], ['code', 'ASC']], limit: 2000 });
  // Clashes also with live works outside the listed states or range that overlap a listed one.
  const live = works.filter((w) => LIVE_WORK_STATES.includes(w.state));
  let clashes = new Map<string, WorkAnswer['clashes']>();
  if (live.length > 0) {
    const lo = new Date(Math.min(...live.map((w) => w.startAt.getTime())));
    const hi = new Date(Math.max(...live.map((w) => w.endAt.getTime())));
    const spells = await spellsOverlapping(lo, hi);
    clashes = allClashes(reachCacheFor(m), spells);
  }
  return { networkVersion: m.networkVersion, items: works.map((w) => answer(m, w, clashes.get(w.code) ?? [])) };
}

export async function getWork(ctx: AppContext, code: string): Promise<WorkAnswer> {
  const m = model(ctx);
  const w = await PlannedWork.findOne({ where: { code } });
  if (!w) throw notFound(`planned work ${code} does not exist`, { code });
  return answer(m, w, await clashesOf(m, w));
}

export async function createWork(ctx: AppContext, actor: OpsActor, body: WorkCreate): Promise<WorkAnswer> {
  const m = model(ctx);
  const elements = knownElements(m, body.elements);
  const start = new Date(body.start);
  const end = new Date(body.end);
  checkWindow(start, end);
  return ctx.db.sequelize.transaction(async (t) => {
    const w = await PlannedWork.create(
      {
        code: await nextCode(ctx, t, 'planned_work_codes', 'W'),
        title: body.title,
        elements,
        startAt: start,
        endAt: end,
        notes: body.notes ?? '',
        state: body.submit ? 'requested' : 'draft',
        requestedBy: actor.userId ?? null,
        requestedByEmail: actor.email ?? null,
      },
      { transaction: t },
    );
    await audit(ctx, t, actor, m.networkVersion, { action: 'create', entityKind: 'works', entityCode: w.code, after: shown(w) });
    return answer(m, w, await clashesOf(m, w, t));
  });
}

export async function patchWork(ctx: AppContext, actor: OpsActor, code: string, body: WorkPatch): Promise<WorkAnswer> {
  const m = model(ctx);
  const elements = body.elements ? knownElements(m, body.elements) : undefined;
  return ctx.db.sequelize.transaction(async (t) => {
    const w = await locked(t, code, body.version);
    const before = shown(w);
    const plan = elements !== undefined || body.start !== undefined || body.end !== undefined;
    if (w.state === 'done' || w.state === 'cancelled') {
      throw new ApiError(409, 'state-refused', `planned work ${code} is ${WORK_STATE_LABELS[w.state].toLowerCase()} and can no longer be changed; draft a new one`);
    }
    if (w.state === 'in-progress' && (elements !== undefined || body.start !== undefined)) {
      throw new ApiError(409, 'state-refused', `planned work ${code} is under way: only its title, notes and end can change`);
    }
    const start = body.start ? new Date(body.start) : w.startAt;
    const end = body.end ? new Date(body.end) : w.endAt;
    checkWindow(start, end);
    w.set({ title: body.title ?? w.title, notes: body.notes ?? w.notes, startAt: start, endAt: end, elements: elements ?? w.elements });
    // A changed plan needs a fresh approval: the approval was for the old window and elements.
    if (plan && w.state === 'approved') w.set({ state: 'requested', approvedBy: null, approvedByEmail: null });
    w.version += 1;
    await w.save({ transaction: t });
    await audit(ctx, t, actor, m.networkVersion, { action: 'update', entityKind: 'works', entityCode: code, before, after: shown(w) });
    return answer(m, w, await clashesOf(m, w, t));
  });
}

export async function deleteWork(ctx: AppContext, actor: OpsActor, code: string) {
  const m = model(ctx);
  await ctx.db.sequelize.transaction(async (t) => {
    const w = await locked(t, code);
    if (w.state !== 'draft') {
      throw new ApiError(409, 'state-refused', `planned work ${code} is ${WORK_STATE_LABELS[w.state].toLowerCase()}: only a drafted work can be deleted; cancel it instead`);
    }
    await audit(ctx, t, actor, m.networkVersion, { action: 'delete', entityKind: 'works', entityCode: code, before: shown(w) });
    await w.destroy({ transaction: t });
  });
  return { deleted: code, networkVersion: m.networkVersion };
}

function refuse(w: PlannedWork, to: WorkState): never {
  const from = WORK_STATE_LABELS[w.state].toLowerCase();
  const next = NEXT_STATES[w.state];
  const hint = next.length ? `from ${from} it can go to: ${next.map((s) => WORK_STATE_LABELS[s].toLowerCase()).join(', ')}` : 'it cannot change any more; draft a new work';
  throw new ApiError(409, 'state-refused', `planned work ${w.code} is ${from} and cannot become ${WORK_STATE_LABELS[to].toLowerCase()}: ${hint}`, {
    state: w.state,
    allowed: next,
  });
}

export async function transitionWork(ctx: AppContext, actor: OpsActor, code: string, to: WorkState, version: number): Promise<WorkAnswer> {
  if (to === 'approved') return approveWork(ctx, actor, code, version);
  const m = model(ctx);
  return ctx.db.sequelize.transaction(async (t) => {
    const w = await locked(t, code, version);
    if (!NEXT_STATES[w.state].includes(to)) refuse(w, to);
    const before = shown(w);
    w.state = to;
    if (to === 'draft') w.set({ approvedBy: null, approvedByEmail: null });
    w.version += 1;
    await w.save({ transaction: t });
    await audit(ctx, t, actor, m.networkVersion, { action: 'update', entityKind: 'works', entityCode: code, before, after: shown(w) });
    if (to === 'in-progress') await ctx.events?.emit(t, event(m, w, 'work-started', `${w.code} "${w.title}" is under way`));
    if (to === 'cancelled') await ctx.events?.emit(t, event(m, w, 'work-cancelled', `${w.code} "${w.title}" was cancelled`));
    return answer(m, w, await clashesOf(m, w, t));
  });
}

export async function approveWork(ctx: AppContext, actor: OpsActor, code: string, version: number): Promise<WorkAnswer> {
  const m = model(ctx);
  if (actor.role !== 'admin' && actor.role !== 'engineer') throw new ApiError(403, 'forbidden', 'approving planned work needs the engineer or admin role');
  return ctx.db.sequelize.transaction(async (t) => {
    const w = await locked(t, code, version);
    if (w.state !== 'requested') {
      if (w.state === 'draft') throw new ApiError(409, 'state-refused', `planned work ${code} is still drafted: submit it for approval first`);
      refuse(w, 'approved');
    }
    if (w.requestedBy !== null && w.requestedBy === actor.userId && actor.role !== 'admin') {
      throw new ApiError(403, 'own-request', `you requested ${code}: another engineer (or an admin) must approve it`);
    }
    const before = shown(w);
    w.set({ state: 'approved', approvedBy: actor.userId ?? null, approvedByEmail: actor.email ?? null });
    w.version += 1;
    await w.save({ transaction: t });
    await audit(ctx, t, actor, m.networkVersion, { action: 'update', entityKind: 'works', entityCode: code, before, after: shown(w) });
    await ctx.events?.emit(t, event(m, w, 'work-approved', `${w.code} "${w.title}" was approved`));
    const clashes = await clashesOf(m, w, t);
    for (const c of firmWorkClashes(clashes)) {
      await ctx.events?.emit(
        t,
        event(m, w, 'work-clash', `${w.code} and ${c.work} together put ${countOf(c.jointLost.length, 'carriage')} off air that neither does alone`, {
          key: `work-clash:${w.code}:${c.work}:${w.version}`,
          other: c.work,
          start: c.overlap.start,
          end: c.overlap.end,
        }),
      );
    }
    return answer(m, w, clashes);
  });
}

/**
 * Incidents: what did fail, step by step. Each step stores the failed set
 * and its reach computed once, at that moment, with the network version
 * (frozen: later network edits never change a recorded step). A step lasts
 * until the next one; the closing step has nothing failed. Closing works out
 * minutes off air per carriage and household-minutes.
 */
import type { Transaction } from 'sequelize';
import { elementKey, type Element } from '@/shared/schemas/analysis';
import type { Clash, FrozenReach, IncidentAnswer, IncidentUpdate } from '@/shared/schemas/operations';
import { Incident, IncidentStep } from '../db/models/operations';
import { ApiError, badRequest, notFound } from '../http/errors';
import type { AppContext } from '../context';
import type { ServedNetwork } from '../services/servedNetwork';
import { countOf, formatCount } from '@/shared/format';
import type { OperationsEvent } from './events';
import { audit, iso, knownElements, model, nextCode, staleVersion, type OpsActor } from './common';
import { canonicalElements, reachCacheFor } from './reach';
import { firmWorkClashes, incidentSpell, liveClashes, spellEvent } from './spells';

/** How far ahead of the server's clock a time may be (clocks on phones drift). */
const SKEW_MS = 5 * 60_000;
const MINUTE = 60_000;

export interface StepTimes {
  at: Date;
  reach: Pick<FrozenReach, 'lost' | 'households'>;
}

/**
 * Minutes off air per carriage and household-minutes: each step lasts from
 * its time to the next step's (the last open step to `until`).
 */
export function outageFigures(steps: readonly StepTimes[], until: Date) {
  const carriageMinutes: Record<string, number> = {};
  let householdMinutes = 0;
  steps.forEach((s, i) => {
    const next = i + 1 < steps.length ? steps[i + 1].at : until;
    const minutes = Math.max(0, next.getTime() - s.at.getTime()) / MINUTE;
    if (minutes === 0) return;
    householdMinutes += s.reach.households.lost * minutes;
    for (const c of s.reach.lost) carriageMinutes[c] = (carriageMinutes[c] ?? 0) + minutes;
  });
  for (const c of Object.keys(carriageMinutes)) carriageMinutes[c] = Math.round(carriageMinutes[c] * 100) / 100;
  return { carriageMinutes, householdMinutes: Math.round(householdMinutes) };
}

const stepAnswer = (s: IncidentStep) => ({
  at: s.at.toISOString(),
  note: s.note,
  added: s.added,
  restored: s.restored,
  elements: s.elements,
  networkVersion: s.networkVersion,
  reach: s.reach,
  by: s.byEmail,
});

const shown = (i: Incident) => ({
  code: i.code,
  title: i.title,
  elements: i.elements,
  startedAt: i.startedAt.toISOString(),
  endedAt: iso(i.endedAt),
  householdMinutes: i.householdMinutes,
  version: i.version,
});

async function stepsOf(i: Incident, t?: Transaction) {
  return IncidentStep.findAll({ where: { incidentId: i.id }, order: [['idx', 'ASC']], transaction: t });
}

const clashesOf = async (m: ServedNetwork, i: Incident, t?: Transaction): Promise<Clash[]> => (i.endedAt ? [] : liveClashes(m, incidentSpell(i), t));

function answer(m: ServedNetwork, i: Incident, steps: IncidentStep[], clashes: Clash[]): IncidentAnswer {
  return {
    ...shown(i),
    open: i.endedAt === null,
    openedBy: i.openedByEmail,
    carriageMinutes: i.carriageMinutes ?? null,
    householdMinutes: i.householdMinutes === null ? null : Number(i.householdMinutes),
    networkVersion: m.networkVersion,
    steps: steps.map(stepAnswer),
    clashes,
  };
}

const event = (i: Incident, kind: OperationsEvent['kind'], key: string, reach: FrozenReach, networkVersion: number, summary: string, extra: Partial<OperationsEvent> = {}) =>
  spellEvent({ code: i.code, title: i.title, start: i.startedAt, end: i.endedAt }, kind, key, { networkVersion, reach }, summary, extra);

/** One work-clash event for each clash with an approved or under-way work that did not exist before. */
async function emitNewClashes(ctx: AppContext, t: Transaction, i: Incident, before: Clash[], after: Clash[], stepIdx: number, reach: FrozenReach, version: number) {
  const had = new Set(before.map((c) => c.work));
  for (const c of firmWorkClashes(after)) {
    if (had.has(c.work)) continue;
    await ctx.events?.emit(
      t,
      event(i, 'work-clash', `work-clash:${i.code}:${c.work}:${stepIdx}`, reach, version, `${i.code} and planned work ${c.work} together put ${countOf(c.jointLost.length, 'carriage')} off air that neither does alone`, {
        other: c.work,
      }),
    );
  }
}

function notFuture(d: Date, what: string) {
  if (d.getTime() > Date.now() + SKEW_MS) throw new ApiError(422, 'bad-time', `${what} (${d.toISOString()}) is in the future; record what has happened`);
}

export async function listIncidents(ctx: AppContext, openOnly: boolean) {
  const m = model(ctx);
  const rows = await Incident.findAll({ where: openOnly ? { endedAt: null } : {}, order: [['startedAt', 'DESC']], limit: 500 });
  return { networkVersion: m.networkVersion, items: rows.map((i) => ({ ...shown(i), open: i.endedAt === null, openedBy: i.openedByEmail })) };
}

export async function getIncident(ctx: AppContext, code: string): Promise<IncidentAnswer> {
  const m = model(ctx);
  const i = await Incident.findOne({ where: { code } });
  if (!i) throw notFound(`incident ${code} does not exist`, { code });
  return answer(m, i, await stepsOf(i), await clashesOf(m, i));
}

export async function openIncident(ctx: AppContext, actor: OpsActor, body: { title: string; elements: Element[]; startedAt?: string; note?: string }) {
  const m = model(ctx);
  const elements = knownElements(m, body.elements);
  const startedAt = body.startedAt ? new Date(body.startedAt) : new Date();
  notFuture(startedAt, 'startedAt');
  const reach = reachCacheFor(m).frozen(elements);
  return ctx.db.sequelize.transaction(async (t) => {
    const i = await Incident.create(
      { code: await nextCode(ctx, t, 'incident_codes', 'I'), title: body.title, elements, startedAt, openedBy: actor.userId ?? null, openedByEmail: actor.email ?? null },
      { transaction: t },
    );
    const step = await IncidentStep.create(
      { incidentId: i.id, idx: 0, at: startedAt, note: body.note ?? '', added: elements, elements, networkVersion: m.networkVersion, reach, byUserId: actor.userId ?? null, byEmail: actor.email ?? null },
      { transaction: t },
    );
    await audit(ctx, t, actor, m.networkVersion, { action: 'create', entityKind: 'incidents', entityCode: i.code, after: shown(i) });
    await ctx.events?.emit(t, event(i, 'incident-opened', `incident-opened:${i.code}:0`, reach, m.networkVersion, `${i.code} "${i.title}" opened: ${countOf(reach.lost.length, 'carriage')} off air`));
    const clashes = await clashesOf(m, i, t);
    await emitNewClashes(ctx, t, i, [], clashes, 0, reach, m.networkVersion);
    return answer(m, i, [step], clashes);
  });
}

async function locked(t: Transaction, code: string, version: number) {
  const i = await Incident.findOne({ where: { code }, transaction: t, lock: t.LOCK.UPDATE });
  if (!i) throw notFound(`incident ${code} does not exist`, { code });
  if (version !== i.version) throw staleVersion(`incident ${code}`, version, i.version);
  return i;
}

async function closeFigures(i: Incident, steps: IncidentStep[]) {
  if (!i.endedAt) return;
  const f = outageFigures(steps.slice(0, -1), i.endedAt);
  i.set({ carriageMinutes: f.carriageMinutes, householdMinutes: f.householdMinutes });
}

export async function patchIncident(ctx: AppContext, actor: OpsActor, code: string, body: { version: number; title?: string; startedAt?: string }) {
  const m = model(ctx);
  return ctx.db.sequelize.transaction(async (t) => {
    const i = await locked(t, code, body.version);
    const before = shown(i);
    const steps = await stepsOf(i, t);
    if (body.title !== undefined) i.title = body.title;
    if (body.startedAt !== undefined) {
      const startedAt = new Date(body.startedAt);
      notFuture(startedAt, 'startedAt');
      if (steps.length > 1 && startedAt > steps[1].at) {
        throw new ApiError(422, 'bad-time', `startedAt must be before the first update (${steps[1].at.toISOString()})`);
      }
      i.startedAt = startedAt;
      steps[0].at = startedAt;
      await steps[0].save({ transaction: t });
      await closeFigures(i, steps);
    }
    i.version += 1;
    await i.save({ transaction: t });
    await audit(ctx, t, actor, m.networkVersion, { action: 'update', entityKind: 'incidents', entityCode: code, before, after: shown(i) });
    return answer(m, i, steps, await clashesOf(m, i, t));
  });
}

export async function addIncidentUpdate(ctx: AppContext, actor: OpsActor, code: string, body: IncidentUpdate): Promise<IncidentAnswer> {
  const m = model(ctx);
  const add = body.add?.length ? knownElements(m, body.add, 'add') : [];
  const restore = canonicalElements(body.restore ?? []);
  if (!add.length && !restore.length && !body.close && !body.note?.trim()) {
    throw badRequest('body: send a note, elements to add or restore, or close: true');
  }
  const at = body.at ? new Date(body.at) : new Date();
  notFuture(at, 'at');
  const cache = reachCacheFor(m);
  return ctx.db.sequelize.transaction(async (t) => {
    const i = await locked(t, code, body.version);
    if (i.endedAt) throw new ApiError(409, 'incident-closed', `incident ${code} was closed at ${i.endedAt.toISOString()}; open a new incident`);
    const steps = await stepsOf(i, t);
    const last = steps[steps.length - 1];
    if (at < last.at) throw new ApiError(422, 'bad-time', `at (${at.toISOString()}) is before the last step (${last.at.toISOString()}); updates are recorded in order`);
    const failed = new Set(i.elements.map(elementKey));
    const notFailed = restore.filter((e) => !failed.has(elementKey(e)));
    if (notFailed.length) {
      throw new ApiError(422, 'not-failed', `restore: ${notFailed.map((e) => `${e.kind} ${e.code}`).join(', ')} is not failed in ${code}`, { notFailed });
    }
    const restoring = new Set(restore.map(elementKey));
    const elements = canonicalElements([...i.elements.filter((e) => !restoring.has(elementKey(e))), ...add]);
    const closing = body.close === true || elements.length === 0;
    const changed = closing || add.some((e) => !failed.has(elementKey(e))) || restore.length > 0;
    // A note alone keeps the reach it follows; a change of what failed is computed now, once.
    const reach = closing ? cache.frozen([]) : changed ? cache.frozen(elements) : last.reach;
    const networkVersion = closing || changed ? m.networkVersion : last.networkVersion;
    const before = shown(i);
    const clashesBefore = await clashesOf(m, i, t);
    const step = await IncidentStep.create(
      {
        incidentId: i.id,
        idx: last.idx + 1,
        at,
        note: body.note ?? '',
        added: add,
        restored: closing ? i.elements.filter((e) => !add.some((a) => elementKey(a) === elementKey(e))) : restore,
        elements: closing ? [] : elements,
        networkVersion,
        reach,
        byUserId: actor.userId ?? null,
        byEmail: actor.email ?? null,
      },
      { transaction: t },
    );
    steps.push(step);
    if (!closing) i.elements = elements;
    if (closing) {
      i.endedAt = at;
      await closeFigures(i, steps);
    }
    i.version += 1;
    await i.save({ transaction: t });
    await audit(ctx, t, actor, m.networkVersion, { action: 'update', entityKind: 'incidents', entityCode: code, before, after: shown(i) });
    if (closing) {
      await ctx.events?.emit(t, event(i, 'incident-closed', `incident-closed:${i.code}`, reach, networkVersion, `${i.code} "${i.title}" closed; ${formatCount(Number(i.householdMinutes))} household-minutes off air`));
    } else if (changed) {
      await ctx.events?.emit(t, event(i, 'incident-updated', `incident-updated:${i.code}:${step.idx}`, reach, networkVersion, `${i.code} "${i.title}" updated: ${countOf(reach.lost.length, 'carriage')} off air`));
    }
    const clashes = await clashesOf(m, i, t);
    if (changed && !closing) await emitNewClashes(ctx, t, i, clashesBefore, clashes, step.idx, reach, networkVersion);
    return answer(m, i, steps, clashes);
  });
}

/**
 * What planned works and incidents share as periods on the calendar: their
 * spells (window and failed set), the live spells overlapping a window, the
 * clashes of one spell with them, and the event shape both emit.
 */
import { Op, type Transaction } from 'sequelize';
import { FIRM_WORK_STATES, LIVE_WORK_STATES, type Clash, type OperationsReach, type WorkState } from '@/shared/schemas/operations';
import { Incident, PlannedWork } from '../db/models/operations';
import type { ServedNetwork } from '../services/servedNetwork';
import type { OperationsEvent } from './events';
import { clashesWith, type Spell } from './clashes';
import { iso } from './common';
import { eventReach, reachCacheFor } from './reach';

export const workSpell = (w: PlannedWork): Spell => ({
  code: w.code,
  kind: 'work',
  state: w.state,
  start: w.startAt.getTime(),
  end: w.endAt.getTime(),
  elements: w.elements,
});
export const incidentSpell = (i: Incident): Spell => ({
  code: i.code,
  kind: 'incident',
  state: 'open',
  start: i.startedAt.getTime(),
  end: i.endedAt ? i.endedAt.getTime() : Infinity,
  elements: i.elements,
});

/** Live works and open incidents whose windows overlap [start, end) (end null: open-ended). */
export async function spellsOverlapping(start: Date, end: Date | null, t?: Transaction): Promise<Spell[]> {
  const works = await PlannedWork.findAll({
    where: { state: LIVE_WORK_STATES as WorkState[], endAt: { [Op.gt]: start }, ...(end ? { startAt: { [Op.lt]: end } } : {}) },
    transaction: t,
  });
  const incidents = await Incident.findAll({ where: { endedAt: null, ...(end ? { startedAt: { [Op.lt]: end } } : {}) }, transaction: t });
  return [...works.map(workSpell), ...incidents.map(incidentSpell)];
}

/** The clashes of one live spell with every live work and open incident overlapping it. */
export async function liveClashes(m: ServedNetwork, spell: Spell, t?: Transaction): Promise<Clash[]> {
  const others = await spellsOverlapping(new Date(spell.start), Number.isFinite(spell.end) ? new Date(spell.end) : null, t);
  return clashesWith(reachCacheFor(m), spell, others);
}

/** Clashes with a work that is going ahead (approved or under way): the ones people are told of. */
export const firmWorkClashes = (clashes: readonly Clash[]) => clashes.filter((c) => c.with === 'work' && FIRM_WORK_STATES.includes(c.otherState as WorkState));

/** An event about a work or an incident; `extra` overrides (a clash names the other and its overlap). */
export function spellEvent(
  what: { code: string; title: string; start: Date; end: Date | null },
  kind: OperationsEvent['kind'],
  key: string,
  at: { networkVersion: number; reach: OperationsReach },
  summary: string,
  extra: Partial<OperationsEvent> = {},
): OperationsEvent {
  return {
    kind,
    code: what.code,
    title: what.title,
    key,
    start: what.start.toISOString(),
    end: iso(what.end),
    networkVersion: at.networkVersion,
    reach: eventReach(at.reach),
    summary,
    ...extra,
  };
}

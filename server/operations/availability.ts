/**
 * Availability over a period: per carriage and per site, the share of the
 * period on air (1 - minutes off air / minutes in period) from the frozen
 * reach of recorded incident steps; planned works that were carried out
 * (under way or finished) are counted separately as planned outage, from
 * their reach at the current network version. Overlapping outages of one
 * carriage count once (intervals are merged).
 */
import { Op } from 'sequelize';
import { stringify } from 'csv-stringify/sync';
import type { AvailabilityAnswer, AvailabilityRow } from '@/shared/schemas/operations';
import { Incident, IncidentStep, PlannedWork } from '../db/models/operations';
import { badRequest } from '../http/errors';
import type { AppContext } from '../context';
import { model } from './common';
import { reachCacheFor } from './reach';

const MINUTE = 60_000;
const MAX_PERIOD_DAYS = 800;

type Interval = [number, number];
class Intervals {
  private readonly map = new Map<string, Interval[]>();
  add(key: string, a: number, b: number) {
    if (b <= a) return;
    let l = this.map.get(key);
    if (!l) this.map.set(key, (l = []));
    l.push([a, b]);
  }
  keys() {
    return this.map.keys();
  }
  /** Minutes covered, overlapping intervals counted once. */
  minutes(key: string): number {
    const l = [...(this.map.get(key) ?? [])].sort((x, y) => x[0] - y[0]);
    let total = 0;
    let cur: Interval | null = null;
    for (const iv of l) {
      if (cur && iv[0] <= cur[1]) cur[1] = Math.max(cur[1], iv[1]);
      else {
        if (cur) total += cur[1] - cur[0];
        cur = [iv[0], iv[1]];
      }
    }
    if (cur) total += cur[1] - cur[0];
    return total / MINUTE;
  }
}

const round2 = (x: number) => Math.round(x * 100) / 100;

export async function availability(ctx: AppContext, q: { from: string; to: string; service?: string }): Promise<AvailabilityAnswer> {
  const m = model(ctx);
  const from = new Date(q.from).getTime();
  const to = new Date(q.to).getTime();
  if (!(to > from)) throw badRequest('query: to must be after from');
  if (to - from > MAX_PERIOD_DAYS * 86_400_000) throw badRequest(`query: the period is at most ${MAX_PERIOD_DAYS} days`);
  const service = q.service?.trim() || undefined;
  const openUntil = Math.min(to, Date.now());
  const clip = (a: number, b: number): Interval => [Math.max(a, from), Math.min(b, to)];

  const off = { carriage: new Intervals(), site: new Intervals() };
  const planned = { carriage: new Intervals(), site: new Intervals() };
  const placeOf = new Map<string, { site: string; service: string }>();

  const incidents = await Incident.findAll({
    where: { startedAt: { [Op.lt]: new Date(to) }, [Op.or]: [{ endedAt: null }, { endedAt: { [Op.gt]: new Date(from) } }] },
  });
  const steps = incidents.length
    ? await IncidentStep.findAll({ where: { incidentId: incidents.map((i) => i.id) }, order: [['incidentId', 'ASC'], ['idx', 'ASC']] })
    : [];
  const stepsBy = new Map<number, IncidentStep[]>();
  for (const s of steps) {
    const list = stepsBy.get(s.incidentId);
    if (list) list.push(s);
    else stepsBy.set(s.incidentId, [s]);
  }
  for (const inc of incidents) {
    const list = stepsBy.get(inc.id) ?? [];
    const until = inc.endedAt ? inc.endedAt.getTime() : openUntil;
    list.forEach((s, k) => {
      const [a, b] = clip(s.at.getTime(), k + 1 < list.length ? list[k + 1].at.getTime() : until);
      for (const p of s.reach.places ?? []) {
        if (service && p.service !== service) continue;
        placeOf.set(p.carriage, { site: p.site, service: p.service });
        off.carriage.add(p.carriage, a, b);
        off.site.add(p.site, a, b);
      }
    });
  }

  const works = await PlannedWork.findAll({
    where: { state: ['in-progress', 'done'], startAt: { [Op.lt]: new Date(to) }, endAt: { [Op.gt]: new Date(from) } },
  });
  const cache = reachCacheFor(m);
  for (const w of works) {
    const end = w.state === 'in-progress' ? Math.min(w.endAt.getTime(), openUntil) : w.endAt.getTime();
    const [a, b] = clip(w.startAt.getTime(), end);
    for (const c of cache.of(w.elements).reach.lost) {
      const carriage = m.carriages.get(c)!;
      if (service && carriage.service !== service) continue;
      placeOf.set(c, { site: carriage.site, service: carriage.service });
      planned.carriage.add(c, a, b);
      planned.site.add(carriage.site, a, b);
    }
  }

  const minutesInPeriod = (to - from) / MINUTE;
  const row = (code: string, site: string, svc: string | null, level: 'carriage' | 'site'): AvailabilityRow => {
    const minutesOffAir = off[level].minutes(code);
    return {
      code,
      site,
      service: svc,
      minutesOffAir: round2(minutesOffAir),
      minutesPlanned: round2(planned[level].minutes(code)),
      availability: 1 - minutesOffAir / minutesInPeriod,
    };
  };
  const worstFirst = (a: AvailabilityRow, b: AvailabilityRow) =>
    a.availability - b.availability || b.minutesPlanned - a.minutesPlanned || (a.code < b.code ? -1 : a.code > b.code ? 1 : 0);
  const carriages = [...placeOf.entries()].map(([c, p]) => row(c, p.site, p.service, 'carriage')).sort(worstFirst);
  const siteCodes = new Set([...off.site.keys(), ...planned.site.keys()]);
  const sites = [...siteCodes].map((s) => row(s, s, null, 'site')).sort(worstFirst);

  const counts = new Map<string, number>();
  for (const c of m.document.carriages) counts.set(c.service, (counts.get(c.service) ?? 0) + 1);
  const services = [...counts.keys()]
    .filter((s) => !service || s === service)
    .sort()
    .map((s) => {
      const mine = carriages.filter((r) => r.service === s);
      const minutesOffAir = mine.reduce((t, r) => t + r.minutesOffAir, 0);
      const n = counts.get(s)!;
      return {
        service: s,
        carriages: n,
        minutesOffAir: round2(minutesOffAir),
        minutesPlanned: round2(mine.reduce((t, r) => t + r.minutesPlanned, 0)),
        availability: 1 - minutesOffAir / (n * minutesInPeriod),
      };
    });
  return { networkVersion: m.networkVersion, from: new Date(from).toISOString(), to: new Date(to).toISOString(), minutesInPeriod, service: service ?? null, carriages, sites, services };
}

/** A text cell a spreadsheet would read as a formula gets a leading apostrophe (common practice against CSV injection). */
export const guardCell = (v: string) => (/^[=+\-@\t\r]/.test(v) ? `'${v}` : v);

export async function availabilityCsv(ctx: AppContext, q: { from: string; to: string; service?: string }): Promise<string> {
  const a = await availability(ctx, q);
  const pct = (x: number) => (x * 100).toFixed(4);
  const rows: (string | number)[][] = [['level', 'code', 'site', 'service', 'minutes_off_air', 'minutes_planned', 'availability_percent']];
  for (const r of a.carriages) rows.push(['carriage', guardCell(r.code), guardCell(r.site), guardCell(r.service ?? ''), r.minutesOffAir, r.minutesPlanned, pct(r.availability)]);
  for (const r of a.sites) rows.push(['site', guardCell(r.code), guardCell(r.site), '', r.minutesOffAir, r.minutesPlanned, pct(r.availability)]);
  for (const s of a.services) rows.push(['service', guardCell(s.service), '', guardCell(s.service), s.minutesOffAir, s.minutesPlanned, pct(s.availability)]);
  return stringify(rows);
}

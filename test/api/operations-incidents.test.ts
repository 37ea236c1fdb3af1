/**
 * Incidents and availability over HTTP on the hand-worked network of
 * test/helpers/ops-network.ts: frozen reach per step, household-minutes worked
 * out by hand, bad input, events, and the availability report with its CSV.
 */
import request from 'supertest';
import { parse } from 'csv-parse/sync';
import { describe, expect, it } from 'vitest';
import type { Role } from '@/shared/api';
import type { OperationsEvent } from '@/server/operations/events';
import { Incident, IncidentStep } from '@/server/db/models/operations';
import { guardCell } from '@/server/operations/availability';
import { opsNetwork } from '../helpers/ops-network';
import { useTestApp } from '../helpers/testApp';

const app = useTestApp({ network: opsNetwork });
const feed = (code: string) => ({ kind: 'feed' as const, code });
const site = (code: string) => ({ kind: 'site' as const, code });
const post = (role: Role, path: string, body: object) => request(app().app).post(`/api${path}`).set(app().auth(role)).send(body);
const get = (path: string, role: Role = 'viewer') => request(app().app).get(`/api${path}`).set(app().auth(role));

/**
 * The worked example, on 2026-11-02 (UTC):
 *   10:00 open, site RA failed: RA.TV, RA.FM and RB.TV (fed from RA.TV) off air;
 *         households 200 (RA) + 50 (RB) = 250
 *   10:20 feeds FL and FS added: MA.TV off air too; households 1,000 + 200 + 50 = 1,250
 *   10:50 feed FS restored: MA.TV back on its line feed... no: FL is still down,
 *         so MA.TV is back through the satellite reserve; households 250 again
 *   11:30 closed
 * Household-minutes = 20 min x 250 + 30 min x 1,250 + 40 min x 250
 *                   = 5,000 + 37,500 + 10,000 = 52,500
 * Minutes off air: RA.TV, RA.FM, RB.TV 20 + 30 + 40 = 90 each; MA.TV 30.
 */
async function workedExample() {
  const opened = await post('operator', '/incidents', { title: 'Mains failure at RA', elements: [site('RA')], startedAt: '2026-11-02T11:00:00+01:00', note: 'no mains' });
  expect(opened.status).toBe(201);
  const add = await post('operator', '/incidents/I-0001/updates', { version: 1, at: '2026-11-02T10:20:00Z', add: [feed('FL'), feed('FS')], note: 'line and dish too' });
  expect(add.status).toBe(201);
  const restore = await post('engineer', '/incidents/I-0001/updates', { version: 2, at: '2026-11-02T10:50:00Z', restore: [feed('FS')] });
  expect(restore.status).toBe(201);
  const closed = await post('operator', '/incidents/I-0001/updates', { version: 3, at: '2026-11-02T11:30:00Z', close: true, note: 'all back' });
  expect(closed.status).toBe(201);
  return { opened, add, restore, closed };
}

describe('incidents', () => {
  it('freezes the reach of each step and works out household-minutes as by hand', async () => {
    const events: OperationsEvent[] = [];
    const off = app().ctx.events!.subscribe(async (_t, e) => void events.push(e));
    const { opened, closed } = await workedExample().finally(off);
    expect(opened.body).toMatchObject({ code: 'I-0001', startedAt: '2026-11-02T10:00:00.000Z', endedAt: null, open: true, householdMinutes: null });
    expect(opened.body.steps[0].reach).toMatchObject({ lost: ['RA.FM', 'RA.TV', 'RB.TV'], households: { lost: 250, fallback: 0 } });
    const b = closed.body;
    expect(b).toMatchObject({ open: false, endedAt: '2026-11-02T11:30:00.000Z', householdMinutes: 52_500 });
    expect(b.carriageMinutes).toEqual({ 'RA.FM': 90, 'RA.TV': 90, 'RB.TV': 90, 'MA.TV': 30 });
    expect(b.steps.map((s: { at: string; reach: { households: { lost: number } }; by: string }) => [s.at.slice(11, 16), s.reach.households.lost, s.by])).toEqual([
      ['10:00', 250, 'operator@test.example'],
      ['10:20', 1250, 'operator@test.example'],
      ['10:50', 250, 'engineer@test.example'],
      ['11:30', 0, 'operator@test.example'],
    ]);
    expect(b.steps[2].restored).toEqual([feed('FS')]);
    expect(events.map((e) => e.key)).toEqual(['incident-opened:I-0001:0', 'incident-updated:I-0001:1', 'incident-updated:I-0001:2', 'incident-closed:I-0001']);
    expect(events[1].reach.households.lost).toBe(1250);
    const row = await Incident.findOne({ where: { code: 'I-0001' } });
    expect(Number(row!.householdMinutes)).toBe(52_500);
    expect(await IncidentStep.count()).toBe(4);
  });

  it('never changes a recorded step when the network changes later', async () => {
    await workedExample();
    const versionBefore = (await get('/incidents/I-0001')).body.steps[0].networkVersion;
    const s = await get('/sites/RA', 'engineer');
    const edit = await request(app().app).patch('/api/sites/RA').set(app().auth('engineer')).send({ version: s.body.site.version, households: 9999 });
    expect([edit.status, edit.body.error]).toEqual([200, undefined]);
    const after = (await get('/incidents/I-0001')).body;
    expect(after.networkVersion).toBeGreaterThan(versionBefore);
    expect(after.steps[0]).toMatchObject({ networkVersion: versionBefore, reach: { households: { lost: 250, fallback: 0 } } });
    expect(after.householdMinutes).toBe(52_500);
  });

  it('tells people of a clash with an approved work when an incident opens', async () => {
    await post('operator', '/works', { title: 'Dish work', elements: [feed('FS')], start: '2026-11-01T00:00:00Z', end: '2027-01-01T00:00:00Z', submit: true });
    await post('engineer', '/works/W-0001/approve', { version: 1 });
    const events: OperationsEvent[] = [];
    const off = app().ctx.events!.subscribe(async (_t, e) => void events.push(e));
    let r;
    try {
      r = await post('operator', '/incidents', { title: 'Line down', elements: [feed('FL')] });
    } finally {
      off();
    }
    expect(r.status).toBe(201);
    expect(r.body.clashes).toMatchObject([{ work: 'W-0001', jointLost: ['MA.TV', 'RA.TV', 'RB.TV'], households: 1250 }]);
    expect(events.map((e) => [e.kind, e.key, e.other ?? null])).toEqual([
      ['incident-opened', 'incident-opened:I-0001:0', null],
      ['work-clash', 'work-clash:I-0001:W-0001:0', 'W-0001'],
    ]);
  });

  it('lets a late record move startedAt, and lists incidents for viewers', async () => {
    await post('operator', '/incidents', { title: 'Line down', elements: [feed('FL')] });
    const p = await request(app().app).patch('/api/incidents/I-0001').set(app().auth('operator')).send({ version: 1, startedAt: '2026-11-02T09:00:00Z', title: 'Line down at OA' });
    expect(p.status).toBe(200);
    expect(p.body).toMatchObject({ startedAt: '2026-11-02T09:00:00.000Z', title: 'Line down at OA', version: 2 });
    expect(p.body.steps[0].at).toBe('2026-11-02T09:00:00.000Z');
    const list = await get('/incidents');
    expect(list.status).toBe(200);
    expect(list.body.items.map((i: { code: string; open: boolean }) => [i.code, i.open])).toEqual([['I-0001', true]]);
  });

  it.each([
    ['unknown elements', { elements: [site('NOPE')] }, 422, /has no site NOPE/],
    ['an empty element list', { elements: [] }, 400, /at least one element/],
    ['a start in the future', { startedAt: '2099-01-01T00:00:00Z' }, 422, /in the future/],
    ['a start without a zone', { startedAt: '2026-11-02 10:00' }, 400, /ISO 8601/],
  ])('refuses to open with %s and writes nothing', async (_w, change, status, message) => {
    const r = await post('operator', '/incidents', { title: 'T', elements: [site('RA')], ...change });
    expect(r.status).toBe(status);
    expect(r.body.error.message).toMatch(message);
    expect(await Incident.count()).toBe(0);
    expect(await IncidentStep.count()).toBe(0);
  });

  it('refuses bad updates and writes nothing', async () => {
    await post('operator', '/incidents', { title: 'T', elements: [site('RA')], startedAt: '2026-11-02T10:00:00Z' });
    const cases: [object, number, RegExp][] = [
      [{ version: 1, restore: [feed('FL')] }, 422, /feed FL is not failed in I-0001/],
      [{ version: 1, add: [feed('NOPE')] }, 422, /add: .* has no feed NOPE/],
      [{ version: 7, note: 'x' }, 409, /changed since you read it/],
      [{ version: 1, note: 'x', at: '2026-11-02T09:00:00Z' }, 422, /before the last step/],
      [{ version: 1 }, 400, /send a note/],
      [{ version: 1, add: 'everything' }, 400, /add/],
    ];
    for (const [body, status, message] of cases) {
      const r = await post('operator', '/incidents/I-0001/updates', body);
      expect([r.status, r.body.error?.message], JSON.stringify(body)).toEqual([status, expect.stringMatching(message)]);
    }
    expect(await IncidentStep.count()).toBe(1);
    await post('operator', '/incidents/I-0001/updates', { version: 1, close: true });
    const late = await post('operator', '/incidents/I-0001/updates', { version: 2, note: 'after' });
    expect(late.status).toBe(409);
    expect(late.body.error.message).toMatch(/was closed .* open a new incident/);
    expect((await post('operator', '/incidents/NOPE/updates', { version: 1, note: 'x' })).status).toBe(404);
  });
});

describe('availability', () => {
  it('reports the share on air per carriage, site and service, worst first, with carried-out works apart', async () => {
    await workedExample();
    await post('operator', '/works', { title: 'RB mast work', elements: [site('RB')], start: '2026-11-02T11:00:00Z', end: '2026-11-02T13:00:00Z', submit: true });
    await post('engineer', '/works/W-0001/approve', { version: 1 });
    await post('operator', '/works/W-0001/transition', { to: 'in-progress', version: 2 });
    await post('operator', '/works/W-0001/transition', { to: 'done', version: 3 });
    const r = await get('/reports/availability?from=2026-11-02T10:00:00Z&to=2026-11-02T12:00:00Z');
    expect(r.status).toBe(200);
    const a = r.body;
    expect(a.minutesInPeriod).toBe(120);
    // 90 of 120 minutes off air -> 25 % on air; MA.TV 30 of 120 -> 75 %. RB.TV also 60 planned minutes (11:00-12:00).
    expect(a.carriages.map((c: { code: string; minutesOffAir: number; minutesPlanned: number; availability: number }) => [c.code, c.minutesOffAir, c.minutesPlanned, c.availability])).toEqual([
      ['RB.TV', 90, 60, 0.25],
      ['RA.FM', 90, 0, 0.25],
      ['RA.TV', 90, 0, 0.25],
      ['MA.TV', 30, 0, 0.75],
    ]);
    expect(a.sites.map((s: { code: string; minutesOffAir: number }) => [s.code, s.minutesOffAir])).toEqual([['RB', 90], ['RA', 90], ['MA', 30]]);
    // TV: 5 carriages x 120 min, 90 + 90 + 30 = 210 off -> 1 - 210/600 = 0.65; FM: 2 x 120, 90 off -> 0.625.
    expect(a.services).toEqual([
      { service: 'FM', carriages: 2, minutesOffAir: 90, minutesPlanned: 0, availability: 0.625 },
      { service: 'TV', carriages: 5, minutesOffAir: 210, minutesPlanned: 60, availability: 0.65 },
    ]);
    const fm = (await get('/reports/availability?from=2026-11-02T10:00:00Z&to=2026-11-02T12:00:00Z&service=FM')).body;
    expect(fm.carriages.map((c: { code: string }) => c.code)).toEqual(['RA.FM']);
  });

  it('counts an open incident up to the end of the period, and downloads as CSV', async () => {
    await post('operator', '/incidents', { title: 'T', elements: [site('RB')], startedAt: '2026-11-02T11:00:00Z' });
    const a = (await get('/reports/availability?from=2026-11-02T10:00:00Z&to=2026-11-02T12:00:00Z')).body;
    expect(a.carriages).toEqual([{ code: 'RB.TV', site: 'RB', service: 'TV', minutesOffAir: 60, minutesPlanned: 0, availability: 0.5 }]);
    const csv = await get('/reports/availability?from=2026-11-02T10:00:00Z&to=2026-11-02T12:00:00Z&format=csv');
    expect(csv.status).toBe(200);
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    expect(csv.headers['content-disposition']).toMatch(/attachment; filename="?availability-2026-11-02-2026-11-02.csv/);
    const rows = parse(csv.text) as string[][];
    expect(rows[0]).toEqual(['level', 'code', 'site', 'service', 'minutes_off_air', 'minutes_planned', 'availability_percent']);
    expect(rows[1]).toEqual(['carriage', 'RB.TV', 'RB', 'TV', '60', '0', '50.0000']);
    expect(rows).toContainEqual(['service', 'TV', '', 'TV', '60', '0', '90.0000']);
  });

  it('guards text cells a spreadsheet would run', () => {
    expect(['=SUM(A1)', '+1', '-2', '@x', 'RB.TV'].map(guardCell)).toEqual(["'=SUM(A1)", "'+1", "'-2", "'@x", 'RB.TV']);
  });

  it('refuses a bad period', async () => {
    expect((await get('/reports/availability?from=2026-11-02T12:00:00Z&to=2026-11-02T10:00:00Z')).status).toBe(400);
    expect((await get('/reports/availability?from=yesterday&to=2026-11-02T10:00:00Z')).status).toBe(400);
    expect((await get('/reports/availability?to=2026-11-02T10:00:00Z')).status).toBe(400);
    expect((await get('/reports/availability?from=2020-01-01T00:00:00Z&to=2026-11-02T10:00:00Z')).status).toBe(400);
  });
});

/**
 * Hostile input against the planned-work, incident and availability routes:
 * huge text, thousands of elements, times far in the past or future or
 * malformed, wrong shapes in the query string. Each gets a 4xx naming what is
 * wrong, never a 500, and nothing is half-written (rows and audit counted).
 */
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import type { Role } from '@/shared/api';
import { Incident, IncidentStep, PlannedWork } from '@/server/db/models/operations';
import { opsNetwork } from '../helpers/ops-network';
import { useTestApp } from '../helpers/testApp';

const app = useTestApp({ network: opsNetwork });
const site = (code: string) => ({ kind: 'site' as const, code });
const send = (method: 'post' | 'patch', path: string, body: unknown, role: Role = 'engineer') =>
  request(app().app)[method](`/api${path}`).set(app().auth(role)).send(body as object);
const get = (path: string) => request(app().app).get(`/api${path}`).set(app().auth('viewer'));
const auditCount = async () => Number(((await app().db.sequelize.query(`SELECT count(*)::int AS n FROM audit_log`))[0] as { n: number }[])[0].n);
const work = { title: 'Aerial inspection', elements: [site('RB')], start: '2027-03-01T08:00:00Z', end: '2027-03-01T12:00:00Z' };

/** What is stored, to compare before and after a refused request. */
const stored = async () => ({
  works: (await PlannedWork.findAll({ order: [['code', 'ASC']] })).map((w) => [w.code, w.title, w.notes, w.version, w.startAt.toISOString()]),
  incidents: (await Incident.findAll({ order: [['code', 'ASC']] })).map((i) => [i.code, i.title, i.version, i.elements.length]),
  steps: await IncidentStep.count(),
  audit: await auditCount(),
});

describe('planned works refuse hostile bodies', () => {
  it.each([
    ['a title of a megabyte', { title: 'x'.repeat(1024 * 1024) }, [400, 413]],
    ['a title of 201 characters', { title: 'x'.repeat(201) }, [400]],
    ['notes of 5,001 characters', { notes: 'n'.repeat(5001) }, [400]],
    ['5,000 elements', { elements: Array.from({ length: 5000 }, (_, i) => site(`S${i}`)) }, [400, 413]],
    ['an element code of 10,000 characters', { elements: [site('S'.repeat(10_000))] }, [400]],
    ['an element that is a string', { elements: ['RB'] }, [400]],
    ['elements as an object', { elements: { kind: 'site', code: 'RB' } }, [400]],
    ['a title that is an array', { title: ['a', 'b'] }, [400]],
    ['a five-digit year', { start: '+275760-09-13T00:00:00Z' }, [400]],
    ['a day that does not exist', { start: '2027-02-30T08:00:00Z' }, [400]],
    ['an hour that does not exist', { start: '2027-03-01T25:00:00Z' }, [400]],
    ['an offset beyond a day', { start: '2027-03-01T08:00:00+25:00' }, [400]],
    ['a time as epoch milliseconds', { start: 1_800_000_000_000 }, [400]],
    ['a window across ten thousand years', { start: '0001-01-01T00:00:00Z', end: '9999-12-31T23:59:59Z' }, [422]],
    ['a window ending before it starts', { start: '9999-12-31T23:00:00Z', end: '0001-01-01T00:00:00Z' }, [422]],
    ['a prototype key', JSON.parse('{"__proto__": {"admin": true}}'), [400]],
  ])('POST /works with %s: 4xx, nothing written', async (_what, change, statuses) => {
    const before = await stored();
    const r = await send('post', '/works', { ...work, ...change });
    expect(statuses).toContain(r.status);
    expect(r.body.error.message).toEqual(expect.any(String));
    expect(await stored()).toEqual({ ...before, works: [] });
  });

  it('keeps a work far in the past or future exactly as sent (the database holds any of these years)', async () => {
    const old = await send('post', '/works', { ...work, start: '0001-01-01T00:00:00Z', end: '0001-01-01T04:00:00Z' });
    expect(old.status).toBe(201);
    const late = await send('post', '/works', { ...work, start: '9999-12-31T20:00:00Z', end: '9999-12-31T23:59:59.999Z' });
    expect(late.status).toBe(201);
    const rows = await PlannedWork.findAll({ order: [['code', 'ASC']] });
    expect(rows.map((w) => [w.startAt.toISOString(), w.endAt.toISOString()])).toEqual([
      ['0001-01-01T00:00:00.000Z', '0001-01-01T04:00:00.000Z'],
      ['9999-12-31T20:00:00.000Z', '9999-12-31T23:59:59.999Z'],
    ]);
    const list = await get('/works?from=0001-01-01T00:00:00Z&to=9999-12-31T23:59:59Z');
    expect(list.status).toBe(200);
    expect(list.body.items.map((w: { code: string }) => w.code)).toEqual([old.body.code, late.body.code]);
  });

  it('refuses a hostile edit of an existing work and leaves it as it was', async () => {
    expect((await send('post', '/works', work)).status).toBe(201);
    const before = await stored();
    const bodies: unknown[] = [
      { version: 1, title: 'y'.repeat(300_000) },
      { version: 1, notes: 'n'.repeat(5001) },
      { version: 1, elements: Array.from({ length: 501 }, (_, i) => site(`S${i}`)) },
      { version: 1, elements: [site('RB'), site('NOPE')] },
      { version: 1, end: '2027-02-01T00:00:00Z' },
      { version: 1, start: '2027-03-01T08:00:00' },
      { version: 1e300, title: 'z' },
      { version: '1', title: 'z' },
      { version: 1, title: 'z', extra: { deep: [[[[1]]]] } },
      [{ version: 1, title: 'z' }],
    ];
    for (const b of bodies) {
      const r = await send('patch', '/works/W-0001', b);
      expect([400, 409, 413, 422], JSON.stringify(b).slice(0, 80)).toContain(r.status);
    }
    expect(await stored()).toEqual(before);
    const transition = await send('post', '/works/W-0001/transition', { to: 'constructor', version: 1 });
    expect(transition.status).toBe(400);
    const badCode = await get('/works/W-0001%00');
    expect(badCode.status).toBe(400);
    expect(await stored()).toEqual(before);
  });

  it('refuses malformed list queries', async () => {
    for (const q of ['from=yesterday', 'from=2027-01-01T00:00:00Z&from=2027-02-01T00:00:00Z', 'state=draft,paused', 'to[$gt]=1', 'colour=red']) {
      const r = await get(`/works?${q}`);
      expect(r.status, q).toBe(400);
      expect(r.body.error.message, q).toEqual(expect.any(String));
    }
  });
});

describe('incidents refuse hostile bodies', () => {
  it('refuses huge, malformed and future times on open, and writes nothing', async () => {
    const open = { title: 'Mains failure', elements: [site('RA')] };
    const before = await stored();
    const cases: [object, number[]][] = [
      [{ ...open, title: 't'.repeat(100_000) }, [400, 413]],
      [{ ...open, note: 'n'.repeat(5001) }, [400]],
      [{ ...open, elements: Array.from({ length: 3000 }, (_, i) => site(`S${i}`)) }, [400, 413]],
      [{ ...open, startedAt: '9999-01-01T00:00:00Z' }, [422]],
      [{ ...open, startedAt: new Date(Date.now() + 3_600_000).toISOString() }, [422]],
      [{ ...open, startedAt: '2026-13-01T00:00:00Z' }, [400]],
      [{ ...open, startedAt: 'now' }, [400]],
    ];
    for (const [b, statuses] of cases) {
      const r = await send('post', '/incidents', b, 'operator');
      expect(statuses, JSON.stringify(b).slice(0, 80)).toContain(r.status);
    }
    expect(await stored()).toEqual({ ...before, incidents: [], steps: 0 });
  });

  it('refuses hostile updates to an open incident and leaves its steps as they were', async () => {
    expect((await send('post', '/incidents', { title: 'T', elements: [site('RA')], startedAt: '2026-11-02T10:00:00Z' }, 'operator')).status).toBe(201);
    const before = await stored();
    const many = Array.from({ length: 2000 }, (_, i) => site(`S${i}`));
    const bodies: object[] = [
      { version: 1, add: many },
      { version: 1, restore: many },
      { version: 1, note: 'n'.repeat(5001) },
      { version: 1, note: 'x', at: '9999-01-01T00:00:00Z' },
      { version: 1, note: 'x', at: '2026-11-02T10:00:00+99:00' },
      { version: 1, close: 'yes' },
      { version: 1, add: [{ kind: 'site', code: 'RB', extra: 1 }] },
    ];
    for (const b of bodies) {
      const r = await send('post', '/incidents/I-0001/updates', b, 'operator');
      expect([400, 413, 422], JSON.stringify(b).slice(0, 80)).toContain(r.status);
    }
    const patch = await send('patch', '/incidents/I-0001', { version: 1, startedAt: '9999-01-01T00:00:00Z' }, 'operator');
    expect(patch.status).toBe(422);
    expect(await stored()).toEqual(before);
  });

  it('works out household-minutes for an incident recorded as started in year 1 without overflowing', async () => {
    const opened = await send('post', '/incidents', { title: 'Very late record', elements: [site('RA')], startedAt: '0001-01-01T00:00:00Z' }, 'operator');
    expect(opened.status).toBe(201);
    const closed = await send('post', '/incidents/I-0001/updates', { version: 1, at: '0002-01-01T00:00:00Z', close: true }, 'operator');
    expect(closed.status).toBe(201);
    // 365 days x 1,440 minutes x 250 households (RA 200 + RB 50)
    expect(closed.body.householdMinutes).toBe(365 * 1440 * 250);
    const row = await Incident.findOne({ where: { code: 'I-0001' } });
    expect(Number(row!.householdMinutes)).toBe(365 * 1440 * 250);
    const report = await get('/reports/availability?from=0001-01-01T00:00:00Z&to=0002-01-01T00:00:00Z');
    expect(report.status).toBe(200);
    expect(report.body.sites.map((s: { code: string; availability: number }) => [s.code, s.availability])).toEqual([
      ['RA', 0],
      ['RB', 0],
    ]);
  });
});

describe('availability refuses hostile queries', () => {
  it.each([
    ['no period', ''],
    ['a malformed time', 'from=2026-11-01&to=2026-12-01T00:00:00Z'],
    ['a period of ten thousand years', 'from=0001-01-01T00:00:00Z&to=9999-12-31T00:00:00Z'],
    ['from given twice', 'from=2026-11-01T00:00:00Z&from=2026-11-02T00:00:00Z&to=2026-12-01T00:00:00Z'],
    ['a service code of 10,000 characters', `from=2026-11-01T00:00:00Z&to=2026-12-01T00:00:00Z&service=${'S'.repeat(10_000)}`],
    ['an unknown format', 'from=2026-11-01T00:00:00Z&to=2026-12-01T00:00:00Z&format=xlsx'],
  ])('%s: 400 with a message', async (_what, q) => {
    const r = await get(`/reports/availability?${q}`);
    expect(r.status).toBe(400);
    expect(r.body.error.message).toEqual(expect.any(String));
  });
});

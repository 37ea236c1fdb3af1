/**
 * Planned works over HTTP: drafting, bad input, the approval path and its
 * roles, optimistic concurrency, clashes (rule 10) on the hand-worked network
 * of test/helpers/ops-network.ts, the audit trail, and events emitted inside
 * the transaction of the change.
 */
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import type { Role } from '@/shared/api';
import type { OperationsEvent } from '@/server/operations/events';
import { PlannedWork } from '@/server/db/models/operations';
import { opsNetwork } from '../helpers/ops-network';
import { useTestApp } from '../helpers/testApp';

const app = useTestApp({ network: opsNetwork });
const feed = (code: string) => ({ kind: 'feed' as const, code });
const site = (code: string) => ({ kind: 'site' as const, code });

function post(role: Role, path: string, body: object) {
  return request(app().app).post(`/api${path}`).set(app().auth(role)).send(body);
}
const get = (path: string, role: Role = 'viewer') => request(app().app).get(`/api${path}`).set(app().auth(role));
const draft = (role: Role, title: string, elements: object[], start: string, end: string, submit = false) =>
  post(role, '/works', { title, elements, start, end, submit });
const auditRows = async (code: string) =>
  (await app().db.sequelize.query(`SELECT action, user_email, after FROM audit_log WHERE entity_kind = 'works' AND entity_code = $1 ORDER BY id`, { bind: [code] }))[0] as {
    action: string;
    user_email: string;
    after: { state: string } | null;
  }[];

describe('drafting a planned work', () => {
  it('stores it in UTC with a generated code, its reach at the current network version and an audit row', async () => {
    const r = await draft('operator', 'Line card swap', [feed('FL')], '2027-03-01T08:00:00+01:00', '2027-03-01T12:00:00+01:00');
    expect(r.status).toBe(201);
    expect(r.body).toMatchObject({
      code: 'W-0001',
      state: 'draft',
      stateLabel: 'Drafted',
      start: '2027-03-01T07:00:00.000Z',
      end: '2027-03-01T11:00:00.000Z',
      requestedBy: 'operator@test.example',
      version: 1,
      clashes: [],
      reach: { lost: [], fallback: ['MA.TV', 'RA.TV', 'RB.TV'], households: { lost: 0, fallback: 1250 } },
    });
    expect(r.body.networkVersion).toBe(app().ctx.network.model!.networkVersion);
    const row = await PlannedWork.findOne({ where: { code: 'W-0001' } });
    expect(row!.startAt.toISOString()).toBe('2027-03-01T07:00:00.000Z');
    expect(row!.elements).toEqual([feed('FL')]);
    expect(await auditRows('W-0001')).toEqual([expect.objectContaining({ action: 'create', user_email: 'operator@test.example' })]);
    const again = await get('/works/W-0001');
    expect(again.status).toBe(200);
    expect(again.body.reach.households).toEqual({ lost: 0, fallback: 1250 });
  });

  it.each([
    ['unknown codes', { elements: [feed('NOPE-1'), site('RB'), site('NOPE-2')] }, 422, /has no site NOPE-2, feed NOPE-1; pick elements that exist/],
    ['an empty element list', { elements: [] }, 400, /at least one element/],
    ['end not after start', { end: '2027-03-01T08:00:00+01:00' }, 422, /end .* must be after start/],
    ['a window over 90 days', { end: '2027-06-01T08:00:00+01:00' }, 422, /longer than 90 days/],
    ['a time without a zone', { start: '2027-03-01T08:00:00' }, 400, /ISO 8601 with a zone/],
    ['a missing title', { title: '' }, 400, /title/],
    ['an unknown field', { colour: 'red' }, 400, /colour/],
  ])('refuses %s with a message naming it and writes nothing', async (_what, change, status, message) => {
    const body = { title: 'T', elements: [feed('FL')], start: '2027-03-01T08:00:00+01:00', end: '2027-03-01T12:00:00+01:00', ...change };
    const r = await post('engineer', '/works', body);
    expect(r.status).toBe(status);
    expect(r.body.error.message).toMatch(message);
    expect(await PlannedWork.count()).toBe(0);
    expect(await auditRows('W-0001')).toEqual([]);
  });

  it('refuses hostile bodies with a 4xx', async () => {
    expect((await post('engineer', '/works', [] as unknown as object)).status).toBe(400);
    const many = Array.from({ length: 501 }, (_, i) => site(`S${i}`));
    expect((await draft('engineer', 'T', many, '2027-03-01T08:00:00Z', '2027-03-01T09:00:00Z')).status).toBe(400);
    const r = await request(app().app).post('/api/works').set(app().auth('engineer')).set('content-type', 'application/json').send('{"title":');
    expect(r.status).toBe(400);
  });
});

describe('clashes', () => {
  it('names the other work, the overlap, the joint loss and its households on both works, and not for touching windows', async () => {
    await draft('operator', 'Line work', [feed('FL')], '2027-03-01T10:00:00Z', '2027-03-01T14:00:00Z');
    await draft('engineer', 'Dish work', [feed('FS')], '2027-03-01T12:00:00Z', '2027-03-01T16:00:00Z');
    await draft('engineer', 'Dish work again', [feed('FS')], '2027-03-01T14:00:00Z', '2027-03-01T18:00:00Z');
    const clash = { jointLost: ['MA.TV', 'RA.TV', 'RB.TV'], households: 1250, overlap: { start: '2027-03-01T12:00:00.000Z', end: '2027-03-01T14:00:00.000Z' } };
    const a = await get('/works/W-0001');
    expect(a.body.clashes).toEqual([{ work: 'W-0002', with: 'work', otherState: 'draft', ...clash }]);
    expect((await get('/works/W-0002')).body.clashes).toEqual([{ work: 'W-0001', with: 'work', otherState: 'draft', ...clash }]);
    // W-0003 starts exactly when W-0001 ends: touching windows do not overlap.
    expect((await get('/works/W-0003')).body.clashes).toEqual([]);
    const list = await get('/works');
    expect(list.status).toBe(200);
    expect(list.body.items.map((w: { code: string; clashes: { work: string }[] }) => [w.code, w.clashes.map((c) => c.work)])).toEqual([
      ['W-0001', ['W-0002']],
      ['W-0002', ['W-0001']],
      ['W-0003', []],
    ]);
  });

  it('leaves out cancelled works and includes open incidents', async () => {
    await draft('operator', 'Line work', [feed('FL')], '2027-03-01T10:00:00Z', '2027-03-01T14:00:00Z');
    const w2 = await draft('engineer', 'Dish work', [feed('FS')], '2027-03-01T12:00:00Z', '2027-03-01T16:00:00Z');
    expect((await post('engineer', '/works/W-0002/transition', { to: 'cancelled', version: w2.body.version })).status).toBe(200);
    expect((await get('/works/W-0001')).body.clashes).toEqual([]);
    const inc = await post('operator', '/incidents', { title: 'Dish fault', elements: [feed('FS')], startedAt: '2026-01-01T00:00:00Z' });
    expect(inc.status).toBe(201);
    const a = await get('/works/W-0001');
    expect(a.body.clashes).toEqual([
      { work: 'I-0001', with: 'incident', otherState: 'open', jointLost: ['MA.TV', 'RA.TV', 'RB.TV'], households: 1250, overlap: { start: '2027-03-01T10:00:00.000Z', end: '2027-03-01T14:00:00.000Z' } },
    ]);
    expect((await get('/incidents/I-0001')).body.clashes.map((c: { work: string }) => c.work)).toEqual(['W-0001']);
  });
});

describe('approval', () => {
  it('lets an engineer approve an operator\'s request, with events, and refuses their own request', async () => {
    const events: OperationsEvent[] = [];
    const off = app().ctx.events!.subscribe(async (_t, e) => void events.push(e));
    try {
      const first = await draft('engineer', 'Dish work', [feed('FS')], '2027-03-01T12:00:00Z', '2027-03-01T16:00:00Z', true);
      const own = await post('engineer', '/works/W-0001/approve', { version: first.body.version });
      expect(own.status).toBe(403);
      expect(own.body.error.message).toMatch(/you requested W-0001/);
      const byAdmin = await post('admin', '/works/W-0001/approve', { version: first.body.version });
      expect(byAdmin.status).toBe(200);
      expect(byAdmin.body).toMatchObject({ state: 'approved', approvedBy: 'admin@test.example', version: 2 });

      const second = await draft('operator', 'Line work', [feed('FL')], '2027-03-01T10:00:00Z', '2027-03-01T14:00:00Z', true);
      expect(second.body.clashes).toHaveLength(1);
      expect((await post('operator', '/works/W-0002/approve', { version: 1 })).status).toBe(403);
      const ok = await post('engineer', '/works/W-0002/approve', { version: 1 });
      expect(ok.status).toBe(200);
      expect(ok.body.state).toBe('approved');
      expect(events.map((e) => [e.kind, e.code, e.other ?? null, e.key])).toEqual([
        ['work-approved', 'W-0001', null, 'work-approved:W-0001:2'],
        ['work-approved', 'W-0002', null, 'work-approved:W-0002:2'],
        ['work-clash', 'W-0002', 'W-0001', 'work-clash:W-0002:W-0001:2'],
      ]);
      expect(events[2].reach.fallback).toEqual(['MA.TV', 'RA.TV', 'RB.TV']);
      expect((await PlannedWork.findOne({ where: { code: 'W-0002' } }))!.approvedByEmail).toBe('engineer@test.example');
      expect((await auditRows('W-0002')).map((a) => a.after?.state)).toEqual(['requested', 'approved']);
    } finally {
      off();
    }
  });

  it('refuses unknown state changes with a message a person can act on', async () => {
    const w = await draft('operator', 'Line work', [feed('FL')], '2027-03-01T10:00:00Z', '2027-03-01T14:00:00Z');
    const early = await post('engineer', '/works/W-0001/approve', { version: w.body.version });
    expect(early.status).toBe(409);
    expect(early.body.error.message).toMatch(/still drafted: submit it for approval first/);
    const cancelled = await post('operator', '/works/W-0001/transition', { to: 'cancelled', version: 1 });
    expect(cancelled.body.state).toBe('cancelled');
    const r = await post('engineer', '/works/W-0001/approve', { version: 2 });
    expect(r.status).toBe(409);
    expect(r.body.error.message).toMatch(/W-0001 is cancelled and cannot become approved: it cannot change any more; draft a new work/);
    const jump = await post('operator', '/works/W-0001/transition', { to: 'done', version: 2 });
    expect(jump.status).toBe(409);
    expect((await PlannedWork.findOne({ where: { code: 'W-0001' } }))!.state).toBe('cancelled');
    const bad = await post('operator', '/works/W-0001/transition', { to: 'exploded', version: 2 });
    expect(bad.status).toBe(400);
  });

  it('walks a work through to finished, telling people when it starts', async () => {
    const events: string[] = [];
    const off = app().ctx.events!.subscribe(async (_t, e) => void events.push(e.key));
    try {
      await draft('operator', 'Line work', [feed('FL')], '2027-03-01T10:00:00Z', '2027-03-01T14:00:00Z', true);
      await post('engineer', '/works/W-0001/approve', { version: 1 });
      const started = await post('operator', '/works/W-0001/transition', { to: 'in-progress', version: 2 });
      expect(started.body).toMatchObject({ state: 'in-progress', stateLabel: 'Under way' });
      const done = await post('operator', '/works/W-0001/transition', { to: 'done', version: 3 });
      expect(done.body).toMatchObject({ state: 'done', stateLabel: 'Finished' });
      expect(events).toEqual(['work-approved:W-0001:2', 'work-started:W-0001:3']);
    } finally {
      off();
    }
  });
});

describe('editing and deleting', () => {
  it('answers 409 to a stale version and changes nothing', async () => {
    await draft('operator', 'Line work', [feed('FL')], '2027-03-01T10:00:00Z', '2027-03-01T14:00:00Z');
    const ok = await request(app().app).patch('/api/works/W-0001').set(app().auth('operator')).send({ version: 1, title: 'Line work, card 2' });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ title: 'Line work, card 2', version: 2 });
    const stale = await request(app().app).patch('/api/works/W-0001').set(app().auth('engineer')).send({ version: 1, title: 'Other' });
    expect(stale.status).toBe(409);
    expect(stale.body.error.message).toMatch(/changed since you read it .* reload/);
    const row = await PlannedWork.findOne({ where: { code: 'W-0001' } });
    expect([row!.title, row!.version]).toEqual(['Line work, card 2', 2]);
    const bad = await request(app().app).patch('/api/works/W-0001').set(app().auth('engineer')).send({ version: 2, end: '2027-03-01T09:00:00Z' });
    expect(bad.status).toBe(422);
    expect((await auditRows('W-0001')).map((a) => a.action)).toEqual(['create', 'update']);
  });

  it('sends an approved work back for approval when its plan changes', async () => {
    await draft('operator', 'Line work', [feed('FL')], '2027-03-01T10:00:00Z', '2027-03-01T14:00:00Z', true);
    await post('engineer', '/works/W-0001/approve', { version: 1 });
    const r = await request(app().app).patch('/api/works/W-0001').set(app().auth('operator')).send({ version: 2, end: '2027-03-01T15:00:00Z' });
    expect(r.body).toMatchObject({ state: 'requested', approvedBy: null, end: '2027-03-01T15:00:00.000Z' });
  });

  it('deletes only while drafted', async () => {
    await draft('operator', 'Line work', [feed('FL')], '2027-03-01T10:00:00Z', '2027-03-01T14:00:00Z');
    await draft('operator', 'Dish work', [feed('FS')], '2027-03-01T10:00:00Z', '2027-03-01T14:00:00Z', true);
    const refused = await request(app().app).delete('/api/works/W-0002').set(app().auth('operator'));
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(/only a drafted work can be deleted; cancel it instead/);
    const gone = await request(app().app).delete('/api/works/W-0001').set(app().auth('operator'));
    expect(gone.status).toBe(200);
    expect(await PlannedWork.count()).toBe(1);
    expect((await auditRows('W-0001')).map((a) => a.action)).toEqual(['create', 'delete']);
    expect((await get('/works/W-0001')).status).toBe(404);
  });

  it('filters the list by state and window', async () => {
    await draft('operator', 'Line work', [feed('FL')], '2027-03-01T10:00:00Z', '2027-03-01T14:00:00Z');
    await draft('operator', 'Dish work', [feed('FS')], '2027-04-01T10:00:00Z', '2027-04-01T14:00:00Z', true);
    const codes = async (q: string) => (await get(`/works${q}`)).body.items.map((w: { code: string }) => w.code);
    expect(await codes('?state=requested')).toEqual(['W-0002']);
    expect(await codes('?from=2027-03-15T00:00:00Z')).toEqual(['W-0002']);
    expect(await codes('?to=2027-03-01T10:00:00Z')).toEqual([]);
    expect((await get('/works?state=sideways')).status).toBe(400);
  });
});

describe('events inside the transaction', () => {
  it('rolls the approval back when a sink fails, and a sink sees the row in its transaction', async () => {
    await draft('operator', 'Line work', [feed('FL')], '2027-03-01T10:00:00Z', '2027-03-01T14:00:00Z', true);
    const off = app().ctx.events!.subscribe(async () => {
      throw new Error('the queue is down');
    });
    const r = await post('engineer', '/works/W-0001/approve', { version: 1 });
    off();
    expect(r.status).toBe(500);
    const row = await PlannedWork.findOne({ where: { code: 'W-0001' } });
    expect([row!.state, row!.version]).toEqual(['requested', 1]);
    expect((await auditRows('W-0001')).map((a) => a.after?.state)).toEqual(['requested']);

    const seen: string[] = [];
    const off2 = app().ctx.events!.subscribe(async (t, e) => {
      const inside = await PlannedWork.findOne({ where: { code: e.code }, transaction: t });
      seen.push(`${e.kind}:${inside!.state}`);
    });
    const ok = await post('engineer', '/works/W-0001/approve', { version: 1 });
    off2();
    expect(ok.status).toBe(200);
    expect(seen).toEqual(['work-approved:approved']);
  });
});

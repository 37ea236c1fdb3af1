/**
 * The resilience planner over HTTP on the demo region: diversity gaps
 * (rule 9, revised), proposals, critical pairs (rule 10, checked against the
 * brute force in test/helpers/bruteforce.ts), plans, their sandbox and
 * creating the planned feeds for real; and the bad input a client can send.
 */
import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import type { NetworkDocument } from '@/shared/schemas/network';
import { NetworkEngine } from '@/server/engine/engine';
import { BruteForce } from '../helpers/bruteforce';
import { useTestApp } from '../helpers/testApp';

const demo: NetworkDocument = JSON.parse(fs.readFileSync(path.join(__dirname, '..', 'fixtures', 'demo-network.json'), 'utf8'));
const brute = new BruteForce(demo);
const t = useTestApp({ network: () => demo });
const get = (url: string, role: 'viewer' | 'engineer' = 'viewer') => request(t().app).get(url).set(t().auth(role));

/** Asks again while the server answers 202 with progress (critical pairs, the proposals ranking), checking each progress. */
async function whenDone(url: string) {
  for (let i = 0; i < 2000; i++) {
    const r = await get(url);
    if (r.status !== 202) return r;
    expect(r.body.state).toBe('running');
    expect(r.body.progress.done).toBeLessThanOrEqual(r.body.progress.total);
    await new Promise((resolve) => setTimeout(resolve, 10));
  }
  throw new Error(`${url} never finished`);
}

describe('GET /api/analysis/diversity (rule 9, revised)', () => {
  it('lists avoidable weak points beside the full list, as the rules say', async () => {
    const r = await get('/api/analysis/diversity');
    expect(r.status).toBe(200);
    const expected = brute.diversity();
    expect(expected.length).toBeGreaterThan(0);
    expect(r.body.carriages.map((c: { carriage: string; spof: unknown; avoidable: unknown }) => ({ carriage: c.carriage, spof: c.spof, avoidable: c.avoidable }))).toEqual(expected);
    // Fewer gaps than the earlier reading (every reserve-fed carriage with any single point of failure).
    const earlier = brute.spof().filter((row) => row.spof.length > 0 && demo.feeds.some((f) => f.role === 'reserve' && f.to === row.carriage));
    expect(expected.length).toBeLessThan(earlier.length);
  });
});

describe('GET /api/analysis/proposals', () => {
  it('answers the proposals of a gap carriage, each removing only its avoidable weak points', async () => {
    const gaps = (await get('/api/analysis/diversity')).body.carriages as { carriage: string; avoidable: { kind: string; code: string }[] }[];
    let withProposals = 0;
    for (const gap of gaps) {
      const r = await get(`/api/analysis/proposals?carriage=${encodeURIComponent(gap.carriage)}`);
      expect(r.status).toBe(200);
      for (const p of r.body.proposals) {
        expect(p.carriage).toBe(gap.carriage);
        expect(p.removes.length).toBeGreaterThan(0);
        for (const x of p.removes) expect(gap.avoidable).toContainEqual(x);
        if (p.medium === 'off-air') expect(p.fieldStrengthDbuvm).toBeGreaterThanOrEqual(p.minimumDbuvm);
        else expect([p.fieldStrengthDbuvm, p.minimumDbuvm]).toEqual([null, null]);
      }
      if (r.body.proposals.length > 0) withProposals++;
    }
    expect(withProposals).toBeGreaterThan(0);
  });

  it('ranks the best proposal of each gap carriage over the network, by households protected', async () => {
    const r = await whenDone('/api/analysis/proposals?limit=5');
    expect(r.status).toBe(200);
    expect(r.body.state).toBe('done');
    // the ranking worked out in slices is the one the engine works out in one go
    expect(r.body.proposals).toEqual(NetworkEngine.build(demo, r.body.networkVersion).proposals({ limit: 5 }).proposals);
    expect(r.body.proposals.length).toBeGreaterThan(0);
    expect(r.body.proposals.length).toBeLessThanOrEqual(5);
    const hh = r.body.proposals.map((p: { householdsProtected: number }) => p.householdsProtected);
    expect(hh).toEqual([...hh].sort((a, b) => b - a));
    expect(new Set(r.body.proposals.map((p: { carriage: string }) => p.carriage)).size).toBe(r.body.proposals.length);
  });

  it('an unknown carriage is a 404, a carriage with no gap an empty list, a bad limit a 400', async () => {
    const unknown = await get('/api/analysis/proposals?carriage=NO-SUCH.TV');
    expect(unknown.status).toBe(404);
    expect(unknown.body.error.message).toContain('NO-SUCH.TV');
    const gapCodes = new Set(brute.diversity().map((g) => g.carriage));
    const noGap = demo.carriages.find((c) => !gapCodes.has(c.code))!;
    const empty = await get(`/api/analysis/proposals?carriage=${encodeURIComponent(noGap.code)}`);
    expect(empty.status).toBe(200);
    expect(empty.body.proposals).toEqual([]);
    for (const q of ['limit=0', 'limit=1001', 'limit=abc', 'limit=2.5', 'colour=red', 'carriage=' + 'x'.repeat(200)]) {
      const r = await get(`/api/analysis/proposals?${q}`);
      expect(r.status, q).toBe(400);
      expect(r.body.error.message.length).toBeGreaterThan(5);
    }
  });
});

describe('GET /api/analysis/pairs (rule 10)', () => {
  it('runs in the background, then answers the pairs of sites and groups exactly as the rules say', async () => {
    const r = await whenDone('/api/analysis/pairs?limit=1000&kinds=site,group');
    expect(r.status).toBe(200);
    expect(r.body.state).toBe('done');
    expect(typeof r.body.networkVersion).toBe('number');
    const expected = brute.pairs(['site', 'group']);
    expect(expected.length).toBeGreaterThan(0);
    expect(r.body.pairs).toEqual(expected.slice(0, 1000));
    const top = await get('/api/analysis/pairs?limit=3&kinds=group,site');
    expect(top.status).toBe(200);
    expect(top.body.pairs).toEqual(expected.slice(0, 3));
  });

  it('bad limit and kinds are a 400', async () => {
    for (const q of ['limit=0', 'limit=5000', 'kinds=tower', 'kinds=', 'kinds=site,,group', 'limit=x']) {
      const r = await get(`/api/analysis/pairs?${q}`);
      expect(r.status, q).toBe(400);
    }
  });
});

describe('plans, the sandbox and creating for real', () => {
  it('a plan picks feeds, the sandbox shows fewer gaps, and creating it stores the feeds with an audit entry each', async () => {
    const made = await request(t().app).post('/api/analysis/plans').set(t().auth('viewer')).send({ budget: 2 });
    expect(made.status).toBe(201);
    const plan = made.body;
    expect(plan.picks.length).toBeGreaterThan(0);
    expect(plan.picks.length).toBeLessThanOrEqual(2);
    expect(plan.gaps.after).toBeLessThanOrEqual(plan.gaps.before);
    expect(plan.householdsProtected).toBeGreaterThan(0);
    expect(plan.exposure.before.length).toBeGreaterThan(0);
    expect((await get(`/api/analysis/plans/${plan.id}`)).body).toEqual(plan);
    const sandbox = await get(`/api/analysis/plans/${plan.id}/diversity`);
    expect(sandbox.status).toBe(200);
    expect(sandbox.body.sandbox).toBe(plan.id);
    expect(sandbox.body.carriages.length).toBe(plan.gaps.after);
    // The first pick's weak points are gone from its carriage in the sandbox.
    const first = plan.picks[0];
    const left = sandbox.body.carriages.find((c: { carriage: string }) => c.carriage === first.carriage)?.avoidable ?? [];
    for (const x of first.removes) expect(left).not.toContainEqual(x);
    // Nothing stored yet.
    const [before] = await t().db.sequelize.query(`SELECT count(*)::int AS n FROM feeds`);
    expect((before as { n: number }[])[0].n).toBe(demo.feeds.length);

    const applied = await request(t().app).post(`/api/analysis/plans/${plan.id}/apply`).set(t().auth('engineer')).send({});
    expect(applied.status).toBe(201);
    expect(applied.body.created).toEqual(plan.picks.map((p: { feed: string }) => p.feed));
    const [rows] = await t().db.sequelize.query(
      `SELECT f.code, a.code AS "from", b.code AS "to", f.role, f.medium FROM feeds f JOIN carriages a ON a.id = f.from_carriage_id JOIN carriages b ON b.id = f.to_carriage_id WHERE f.code IN (:codes) ORDER BY f.code`,
      { replacements: { codes: applied.body.created } },
    );
    expect(rows).toEqual(
      plan.picks.map((p: { feed: string; from: string; carriage: string; medium: string }) => ({ code: p.feed, from: p.from, to: p.carriage, role: 'reserve', medium: p.medium })).sort((a: { code: string }, b: { code: string }) => (a.code < b.code ? -1 : 1)),
    );
    const [audit] = await t().db.sequelize.query(`SELECT action, entity_kind AS kind, entity_code AS code, user_email AS email FROM audit_log WHERE entity_code IN (:codes) ORDER BY entity_code`, {
      replacements: { codes: applied.body.created },
    });
    expect(audit).toHaveLength(plan.picks.length);
    for (const a of audit as { action: string; email: string }[]) expect([a.action, a.email]).toEqual(['create', 'engineer@test.example']);
    // The live network now has the gaps the sandbox showed.
    expect((await get('/api/analysis/diversity')).body.carriages.length).toBe(plan.gaps.after);
    // A plan is created once.
    expect((await request(t().app).post(`/api/analysis/plans/${plan.id}/apply`).set(t().auth('engineer')).send({})).status).toBe(404);
  });

  it('a plan made before the network changed is refused with a 409 naming the change, and nothing is written', async () => {
    const plan = (await request(t().app).post('/api/analysis/plans').set(t().auth('engineer')).send({ budget: 1 })).body;
    const source = plan.picks[0].from as string;
    const [versions] = await t().db.sequelize.query(`SELECT version FROM carriages WHERE code = :c`, { replacements: { c: source } });
    const del = await request(t().app)
      .delete(`/api/carriages/${encodeURIComponent(source)}?version=${(versions as { version: number }[])[0].version}&cascade=true`)
      .set(t().auth('engineer'));
    expect(del.status, JSON.stringify(del.body)).toBe(200);
    const r = await request(t().app).post(`/api/analysis/plans/${plan.id}/apply`).set(t().auth('engineer')).send({});
    expect(r.status).toBe(409);
    expect(r.body.error.message).toContain('network changed');
    expect(r.body.error.message).toContain(source);
    const [left] = await t().db.sequelize.query(`SELECT count(*)::int AS n FROM feeds WHERE code = :c`, { replacements: { c: plan.picks[0].feed } });
    expect((left as { n: number }[])[0].n).toBe(0);
  });

  it('bad budgets, an unknown plan and an unknown sandbox answer are 4xx', async () => {
    for (const body of [{}, { budget: 0 }, { budget: 11 }, { budget: 'two' }, { budget: 1.5 }, { budget: 1, extra: true }, []]) {
      const r = await request(t().app).post('/api/analysis/plans').set(t().auth('viewer')).send(body as object);
      expect(r.status, JSON.stringify(body)).toBe(400);
    }
    expect((await get('/api/analysis/plans/nope')).status).toBe(404);
    expect((await request(t().app).post('/api/analysis/plans/nope/apply').set(t().auth('engineer')).send({})).status).toBe(404);
    const plan = (await request(t().app).post('/api/analysis/plans').set(t().auth('viewer')).send({ budget: 1 })).body;
    expect((await get(`/api/analysis/plans/${plan.id}/reach`)).status).toBe(404);
    expect((await get(`/api/analysis/plans/${plan.id}/exposure?limit=0`)).status).toBe(400);
    const exposure = await get(`/api/analysis/plans/${plan.id}/exposure?limit=3`);
    expect(exposure.status).toBe(200);
    expect(exposure.body.elements).toHaveLength(3);
    // the kinds apply in the sandbox as on the stored network; files and names are refused, not ignored
    const groups = await get(`/api/analysis/plans/${plan.id}/exposure?kinds=group`);
    expect(groups.status).toBe(200);
    expect(groups.body.elements.length).toBeGreaterThan(0);
    expect(groups.body.elements.every((e: { element: { kind: string } }) => e.element.kind === 'group')).toBe(true);
    for (const q of ['format=csv', 'with=names']) {
      const refused = await get(`/api/analysis/plans/${plan.id}/exposure?${q}`);
      expect(refused.status, q).toBe(400);
      expect(refused.body.error.message).toContain(q.split('=')[0]);
    }
  });
});

/**
 * The analysis API over HTTP on the demo region, checked against a direct
 * evaluation of rules 1-9 of docs/domain.md (test/helpers/bruteforce.ts), and
 * the garbage a client can send.
 */
import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { NetworkDocument } from '@/shared/schemas/network';
import { BruteForce } from '../helpers/bruteforce';
import { appWithNetwork, type TestApp } from '../helpers/testApp';

const demo: NetworkDocument = JSON.parse(fs.readFileSync(path.join(__dirname, '..', 'fixtures', 'demo-network.json'), 'utf8'));
const brute = new BruteForce(demo);

let t: TestApp;
beforeAll(async () => {
  t = await appWithNetwork(demo);
});
afterAll(async () => t?.close());

const reach = (failed: unknown) => request(t.app).post('/api/analysis/reach').set(t.auth('operator')).send(failed as object);

describe('POST /api/analysis/reach', () => {
  it('agrees with the rules for each origin and main station failing alone', async () => {
    const sites = demo.sites.filter((s) => s.role !== 'relay');
    expect(sites.length).toBeGreaterThan(5);
    for (const s of sites) {
      const failed = [{ kind: 'site' as const, code: s.code }];
      const r = await reach({ failed });
      expect(r.status).toBe(200);
      const { networkVersion, ...answer } = r.body;
      expect(typeof networkVersion).toBe('number');
      expect(answer, `site ${s.code}`).toEqual(brute.reach(failed));
    }
  });

  it('agrees with the rules for every shared-risk group and a mixed failure set', async () => {
    for (const g of demo.groups) {
      const failed = [{ kind: 'group' as const, code: g.code }];
      const { networkVersion: _v, ...answer } = (await reach({ failed })).body;
      expect(answer, `group ${g.code}`).toEqual(brute.reach(failed));
    }
    const mixed = [
      { kind: 'site' as const, code: demo.sites.find((s) => s.role === 'main')!.code },
      { kind: 'feed' as const, code: demo.feeds.find((f) => f.role === 'reserve')!.code },
      { kind: 'group' as const, code: demo.groups[0].code },
    ];
    const { networkVersion: _v, ...answer } = (await reach({ failed: mixed })).body;
    expect(answer).toEqual(brute.reach(mixed));
  });

  it('answers 404 naming unknown codes', async () => {
    const r = await reach({ failed: [{ kind: 'site', code: 'NOPE-1' }, { kind: 'feed', code: 'NOPE-2' }] });
    expect(r.status).toBe(404);
    expect(r.body.error.message).toContain('NOPE-1');
    expect(r.body.error.message).toContain('NOPE-2');
  });

  it('answers 400 for an empty list, a body that is not a list of elements, and a bad kind', async () => {
    for (const body of [{ failed: [] }, { failed: 'site:X' }, [{ kind: 'site', code: 'X' }], {}, { failed: [{ kind: 'tower', code: 'X' }] }, { failed: [{ kind: 'site' }] }]) {
      const r = await reach(body);
      expect(r.status, JSON.stringify(body)).toBe(400);
      expect(r.body.error.message.length).toBeGreaterThan(5);
    }
  });

  it('refuses a million elements with a 4xx, quickly', async () => {
    const failed = Array.from({ length: 1_000_000 }, (_, i) => ({ kind: 'site', code: `S${i}` }));
    const r = await reach({ failed });
    expect(r.status).toBeGreaterThanOrEqual(400);
    expect(r.status).toBeLessThan(500);
  });

  it('answers 400 for malformed JSON', async () => {
    const r = await request(t.app).post('/api/analysis/reach').set(t.auth('operator')).set('Content-Type', 'application/json').send('{"failed": [');
    expect(r.status).toBe(400);
  });
});

describe('GET /api/analysis/*', () => {
  it('lists single points of failure exactly as the rules say', async () => {
    const r = await request(t.app).get('/api/analysis/spof').set(t.auth('viewer'));
    expect(r.status).toBe(200);
    expect(r.body.carriages).toEqual(brute.spof());
  });

  it('lists the unfed carriages, including the demo relay with no feed', async () => {
    const r = await request(t.app).get('/api/analysis/unfed').set(t.auth('viewer'));
    expect(r.body.carriages.map((c: { carriage: string }) => c.carriage)).toEqual(brute.unfed());
    expect(r.body.carriages.length).toBeGreaterThan(0);
  });

  it('ranks exposure by households, as the rules compute it', async () => {
    const r = await request(t.app).get('/api/analysis/exposure?limit=15').set(t.auth('viewer'));
    expect(r.body.elements).toHaveLength(15);
    const expected = brute.exposure();
    for (const row of r.body.elements) {
      const e = expected.find((x) => x.element.kind === row.element.kind && x.element.code === row.element.code)!;
      expect(row.households).toBe(e.households);
      expect(row.carriages).toBe(e.carriages);
    }
    const hh = r.body.elements.map((x: { households: number }) => x.households);
    expect(hh).toEqual([...hh].sort((a, b) => b - a));
    expect((await request(t.app).get('/api/analysis/exposure?limit=abc').set(t.auth('viewer'))).status).toBe(400);
  });

  it('finds the diversity gaps, with the shared elements', async () => {
    const r = await request(t.app).get('/api/analysis/diversity').set(t.auth('viewer'));
    const got = r.body.carriages.map((c: { carriage: string; spof: unknown; avoidable: unknown }) => ({ carriage: c.carriage, spof: c.spof, avoidable: c.avoidable }));
    expect(got).toEqual(brute.diversity());
    expect(got.length).toBeGreaterThan(0);
  });
});

describe('GET /api/carriages/:code/chain', () => {
  const relayFeed = demo.feeds.find((f) => f.medium === 'off-air' && f.role === 'main')!;

  it('walks upstream to an origin, each hop with medium, role and distance', async () => {
    const r = await request(t.app).get(`/api/carriages/${relayFeed.to}/chain?direction=up`).set(t.auth('viewer'));
    expect(r.status).toBe(200);
    expect(r.body.root.carriage).toBe(relayFeed.to);
    const hop = r.body.root.children.find((c: { via: { feed: string } }) => c.via.feed === relayFeed.code);
    expect(hop.carriage).toBe(relayFeed.from);
    expect(hop.via.medium).toBe('off-air');
    expect(hop.via.distanceKm).toBeGreaterThan(0);
    const origins: string[] = [];
    const walk = (n: { origin: boolean; carriage: string; children: unknown[] }) => {
      if (n.origin) origins.push(n.carriage);
      n.children.forEach((c) => walk(c as typeof n));
    };
    walk(r.body.root);
    expect(origins.length).toBeGreaterThan(0);
  });

  it('walks downstream from an origin carriage', async () => {
    const origin = demo.sites.find((s) => s.role === 'origin')!;
    const carriage = demo.carriages.find((c) => c.site === origin.code)!;
    const r = await request(t.app).get(`/api/carriages/${carriage.code}/chain?direction=down`).set(t.auth('viewer'));
    expect(r.status).toBe(200);
    expect(r.body.direction).toBe('down');
    expect(r.body.root.carriage).toBe(carriage.code);
    expect(r.body.root.children.length).toBeGreaterThan(0);
  });

  it('answers 404 for an unknown carriage and 400 for a bad direction', async () => {
    expect((await request(t.app).get('/api/carriages/NO-SUCH/chain?direction=up').set(t.auth('viewer'))).status).toBe(404);
    expect((await request(t.app).get(`/api/carriages/${relayFeed.to}/chain?direction=sideways`).set(t.auth('viewer'))).status).toBe(400);
  });
});

describe('feed checks', () => {
  it('answers all eight checks for a feed, and 404 for an unknown feed', async () => {
    const feed = demo.feeds.find((f) => f.medium === 'off-air')!;
    const r = await request(t.app).get(`/api/feeds/${feed.code}/checks`).set(t.auth('viewer'));
    expect(r.status).toBe(200);
    expect(r.body.checks.map((c: { name: string }) => c.name).sort()).toEqual(
      ['bearing-record', 'channel-clash', 'clearance', 'earth-bulge', 'field-strength', 'free-space-loss', 'fresnel-f1', 'horizon'].sort(),
    );
    expect(r.body.distanceKm).toBeGreaterThan(0);
    expect((await request(t.app).get('/api/feeds/NO-SUCH-FEED/checks').set(t.auth('viewer'))).status).toBe(404);
  });

  it('lists the planted problems of the demo: a channel clash and a wrong recorded bearing', async () => {
    const r = await request(t.app).get('/api/checks').set(t.auth('viewer'));
    const names = new Set(r.body.failures.map((f: { check: { name: string } }) => f.check.name));
    expect(names.has('channel-clash')).toBe(true);
    expect(names.has('bearing-record')).toBe(true);
    const errorsOnly = await request(t.app).get('/api/checks?severity=error').set(t.auth('viewer'));
    expect(errorsOnly.body.failures.length).toBeGreaterThan(0);
    expect(errorsOnly.body.failures.every((f: { severity: string }) => f.severity === 'error')).toBe(true);
    expect((await request(t.app).get('/api/checks?severity=loud').set(t.auth('viewer'))).status).toBe(400);
  });
});

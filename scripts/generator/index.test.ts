import { describe, expect, it } from 'vitest';
import type { NetworkDocument } from '@/shared/schemas/network';
import { bearingDifferenceDeg, geodesicInverse } from '@/shared/rf/geodesy';
import { tryParseChannel } from '@/shared/rf/bands';
import { validateDocument } from '@/server/interchange/validate';
import { generateNetwork, planCounts } from './index';
import { Prng } from './prng';
import { parseArgs } from '../gen';

describe('generateNetwork arguments', () => {
  it.each([0, -1, 1.5, Number.NaN, 1_000_001])('rejects %s sites', (sites) => {
    expect(() => generateNetwork({ sites, seed: 1 })).toThrow(/sites must be a whole number from 1 to 1000000/);
  });

  it('rejects a seed that is not whole', () => {
    expect(() => generateNetwork({ sites: 5, seed: 0.5 })).toThrow(/seed must be a whole number/);
  });
});

describe('Prng (mulberry32)', () => {
  it('gives the same stream for the same seed, another for another seed', () => {
    const a = new Prng(42);
    const b = new Prng(42);
    const c = new Prng(43);
    const first = Array.from({ length: 5 }, () => a.next());
    expect(Array.from({ length: 5 }, () => b.next())).toEqual(first);
    expect(Array.from({ length: 5 }, () => c.next())).not.toEqual(first);
    for (const x of first) expect(x >= 0 && x < 1).toBe(true);
  });

  it('matches the reference mulberry32 output for seed 0 (computed with the published algorithm)', () => {
    // Reference: mulberry32 as published by Tommy Ettinger, written out independently here.
    let s = 0;
    const reference = () => {
      s = (s + 0x6d2b79f5) | 0;
      let t = Math.imul(s ^ (s >>> 15), 1 | s);
      t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
      return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
    };
    const p = new Prng(0);
    for (let i = 0; i < 100; i++) expect(p.next()).toBe(reference());
  });
});

describe('generateNetwork determinism', () => {
  it('gives the same document for the same seed and size', () => {
    expect(JSON.stringify(generateNetwork({ sites: 1500, seed: 7 }))).toBe(JSON.stringify(generateNetwork({ sites: 1500, seed: 7 })));
  });

  it('gives a different document for another seed', () => {
    expect(JSON.stringify(generateNetwork({ sites: 300, seed: 7 }))).not.toBe(JSON.stringify(generateNetwork({ sites: 300, seed: 8 })));
  });
});

describe.each([1, 2, 3, 10, 57, 400, 3000])('a generated network of %i sites', (sites) => {
  const doc = generateNetwork({ sites, seed: sites * 31 + 5 });
  const result = validateDocument(doc);

  it('is valid: no import error', () => {
    expect(result.errors).toEqual([]);
    expect(doc.sites).toHaveLength(sites);
  });

  it('records for every off-air feed the geodesic bearing to the parent (0.1 deg) over 5-60 km', () => {
    const site = new Map(doc.sites.map((s) => [s.code, s]));
    const carriage = new Map(doc.carriages.map((c) => [c.code, c]));
    for (const f of doc.feeds) {
      if (f.medium !== 'off-air') continue;
      const here = site.get(carriage.get(f.to)!.site)!;
      const there = site.get(carriage.get(f.from)!.site)!;
      const path = geodesicInverse(here.lat, here.lon, there.lat, there.lon);
      expect(bearingDifferenceDeg(f.bearingDeg!, path.initialBearingDeg)).toBeLessThan(0.06);
      expect(path.distanceKm).toBeGreaterThan(4.99);
      expect(path.distanceKm).toBeLessThan(60.01);
    }
  });
});

describe('the structure of a generated network (5000 sites)', () => {
  const doc: NetworkDocument = generateNetwork({ sites: 5000, seed: 3 });
  const { warnings } = validateDocument(doc);
  const roles = (role: string) => doc.sites.filter((s) => s.role === role).length;

  it('has a few origins, 3-5 % mains and the rest relays', () => {
    expect(roles('origin')).toBe(planCounts(5000).origins);
    expect(roles('origin')).toBeGreaterThanOrEqual(3);
    expect(roles('main') / doc.sites.length).toBeGreaterThanOrEqual(0.03);
    expect(roles('main') / doc.sites.length).toBeLessThanOrEqual(0.05);
  });

  it('carries 10-14 services of every kind in use, each on a plausible channel', () => {
    expect(doc.services.length).toBeGreaterThanOrEqual(10);
    expect(doc.services.length).toBeLessThanOrEqual(14);
    const kind = new Map(doc.services.map((s) => [s.code, s.kind]));
    expect(new Set(kind.values())).toEqual(new Set(['dtt', 'fm', 'dab']));
    for (const c of doc.carriages) {
      if (c.frequencyMHz === undefined) continue;
      const k = kind.get(c.service)!;
      const channel = tryParseChannel(c.channel ?? String(c.frequencyMHz), k);
      expect(channel, `${c.code} ${c.channel} ${c.frequencyMHz}`).not.toBeNull();
      expect(Math.abs(channel!.centreMHz - c.frequencyMHz)).toBeLessThan(1e-9);
    }
  });

  it('uses all four media, main and reserve roles, via-sites and every kind of shared-risk group', () => {
    expect(new Set(doc.feeds.map((f) => f.medium))).toEqual(new Set(['off-air', 'satellite', 'line', 'microwave']));
    expect(new Set(doc.feeds.map((f) => f.role))).toEqual(new Set(['main', 'reserve']));
    expect(doc.feeds.some((f) => (f.via?.length ?? 0) > 0)).toBe(true);
    const prefixes = new Set(doc.groups.map((g) => g.code.split('-')[0]));
    expect(prefixes).toEqual(new Set(['SAT', 'TEL', 'PWR']));
    expect(doc.sites.some((s) => s.groups?.length)).toBe(true);
  });

  it('has relays several hops deep', () => {
    const parentOf = new Map<string, string>();
    const siteOf = new Map(doc.carriages.map((c) => [c.code, c.site]));
    for (const f of doc.feeds) if (f.medium === 'off-air' && f.role === 'main') parentOf.set(siteOf.get(f.to)!, siteOf.get(f.from)!);
    let deepest = 0;
    for (const s of doc.sites) {
      let depth = 0;
      for (let at = s.code; parentOf.has(at) && depth < 50; at = parentOf.get(at)!) depth++;
      deepest = Math.max(deepest, depth);
    }
    expect(deepest).toBeGreaterThanOrEqual(4);
  });

  it('has a loop with no origin upstream, and an unfed carriage, to find', () => {
    const rules = new Set(warnings.map((w) => w.rule));
    expect(rules.has('loop-without-origin')).toBe(true);
    expect(rules.has('no-feed')).toBe(true);
  });

  it('names no site or service after a broadcaster\'s pattern (numbered programmes, "... House")', () => {
    const echoes = [/radio house/i, /broadcast house/i, /\bprogram(me)? (one|two|three|four|[1-4])\b/i, /\b(one|two|three|four)$/i];
    for (const name of [...doc.sites.map((s) => s.name), ...doc.services.map((s) => s.name)]) {
      for (const pattern of echoes) expect(name, `${name} matches ${String(pattern)}`).not.toMatch(pattern);
    }
  });

  it('has plausible heights, powers and households', () => {
    for (const s of doc.sites) {
      expect(s.groundHeightM).toBeGreaterThanOrEqual(0);
      expect(s.groundHeightM).toBeLessThan(1500);
      if (s.role !== 'origin') expect(s.households).toBeGreaterThan(0);
    }
    for (const c of doc.carriages) if (c.erpW !== undefined) expect(c.erpW).toBeLessThanOrEqual(100000);
  });
});

describe('gen CLI arguments', () => {
  it('reads sites, seed, format and out', () => {
    expect(parseArgs(['--sites', '20000', '--seed', '7'])).toEqual({ sites: 20000, seed: 7, format: 'json', out: undefined });
    expect(parseArgs(['--seed', '-3', '--sites', '5', '--format', 'csv', '--out', 'dir'])).toEqual({ sites: 5, seed: -3, format: 'csv', out: 'dir' });
    expect(parseArgs(['--sites', '5', '--seed', '1', '--faults', '0.05'])).toEqual({ sites: 5, seed: 1, format: 'json', out: undefined, faultShare: 0.05 });
    expect(parseArgs(['--sites', '5', '--seed', '1', '--faults', '0'])).toMatchObject({ faultShare: 0 });
  });

  it.each([
    [[], '--sites and --seed are required'],
    [['--sites', '10'], '--sites and --seed are required'],
    [['--sites', 'ten', '--seed', '1'], '--sites must be a whole number'],
    [['--sites', '0', '--seed', '1'], '--sites must be a whole number'],
    [['--sites', '10', '--seed', '1.5'], '--seed must be a whole number'],
    [['--sites', '10', '--seed', '1', '--format', 'xml'], '--format is json or csv'],
    [['--sites', '10', '--seed', '1', '--format', 'csv'], '--format csv needs --out'],
    [['--sites', '10', '--seed'], '--seed needs a value'],
    [['--nodes', '10'], 'unknown argument "--nodes"'],
    [['--sites', '10', '--seed', '1', '--faults', '1.5'], '--faults must be a share from 0 to 1'],
    [['--sites', '10', '--seed', '1', '--faults', '-0.1'], '--faults must be a share from 0 to 1'],
    [['--sites', '10', '--seed', '1', '--faults', 'some'], '--faults must be a share from 0 to 1'],
  ])('%j -> %s', (argv, message) => {
    expect(parseArgs(argv)).toEqual(expect.stringContaining(message));
  });
});

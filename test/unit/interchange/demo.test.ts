/**
 * The demo network (test/fixtures/demo-network.json): an invented region that
 * passes import, with the data problems it is meant to show and nothing else.
 */
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import type { Feed, NetworkDocument } from '@/shared/schemas/network';
import { bearingDifferenceDeg, geodesicInverse } from '@/shared/rf/geodesy';
import { tryParseChannel } from '@/shared/rf/bands';
import { validateDocument } from '@/server/interchange/validate';
import { demoFixtureText } from '@/scripts/generator/demo';
import * as region from '@/scripts/generator/demo-region';
import * as turf from '@turf/turf';
import type { Feature, MultiPolygon } from 'geojson';
import demoCoast from '@/assets/demo/demo-coast.json';

const FIXTURE = path.resolve(__dirname, '..', '..', 'fixtures', 'demo-network.json');
const text = fs.readFileSync(FIXTURE, 'utf8');
const doc = JSON.parse(text) as NetworkDocument;
const site = new Map(doc.sites.map((s) => [s.code, s]));
const carriage = new Map(doc.carriages.map((c) => [c.code, c]));
const service = new Map(doc.services.map((s) => [s.code, s]));
const ends = (f: Feed) => ({ here: site.get(carriage.get(f.to)!.site)!, there: site.get(carriage.get(f.from)!.site)! });

describe('demo network fixture', () => {
  it('is what scripts/generator/demo.ts writes (regenerate it with npx tsx scripts/generator/demo.ts)', () => {
    expect(text).toBe(demoFixtureText());
  });

  it('imports with no error', () => {
    const result = validateDocument(doc);
    expect(result.errors).toEqual([]);
    expect(result.document).toEqual(doc);
  });

  it('warns about exactly one carriage with no feed, no loop, and relays without reserve', () => {
    const { warnings } = validateDocument(doc);
    expect(warnings.filter((w) => w.rule === 'no-feed').map((w) => w.code)).toEqual([region.UNFED_CARRIAGE]);
    expect(warnings.filter((w) => w.rule === 'loop-without-origin')).toEqual([]);
    const noReserve = warnings.filter((w) => w.rule === 'no-reserve').map((w) => w.code);
    expect(noReserve.length).toBeGreaterThan(30);
    expect(noReserve).not.toContain('R-ABK');
    expect(new Set(warnings.map((w) => w.rule))).toEqual(new Set(['no-feed', 'no-reserve']));
  });

  it('has 3 origins, 6-8 mains, 50-80 relays and 10-14 services of every kind, one of them local', () => {
    const count = (role: string) => doc.sites.filter((s) => s.role === role).length;
    expect(count('origin')).toBe(3);
    expect(count('main')).toBeGreaterThanOrEqual(6);
    expect(count('main')).toBeLessThanOrEqual(8);
    expect(count('relay')).toBeGreaterThanOrEqual(50);
    expect(count('relay')).toBeLessThanOrEqual(80);
    expect(doc.services.length).toBeGreaterThanOrEqual(10);
    expect(doc.services.length).toBeLessThanOrEqual(14);
    expect(new Set(doc.services.map((s) => s.kind))).toEqual(new Set(['dtt', 'fm', 'dab']));
    const sitesPerService = new Map<string, number>();
    for (const c of doc.carriages) sitesPerService.set(c.service, (sitesPerService.get(c.service) ?? 0) + 1);
    expect(Math.min(...sitesPerService.values())).toBeLessThanOrEqual(5);
  });

  it('uses all four media, main and reserve feeds, a microwave path through a hop site, and the three kinds of group', () => {
    expect(new Set(doc.feeds.map((f) => f.medium))).toEqual(new Set(['off-air', 'satellite', 'line', 'microwave']));
    expect(new Set(doc.feeds.map((f) => f.role))).toEqual(new Set(['main', 'reserve']));
    const hop = doc.feeds.find((f) => f.medium === 'microwave' && f.via?.length);
    expect(hop).toBeDefined();
    expect(site.get(hop!.via![0])).toBeDefined();
    const names = doc.groups.map((g) => g.name.toLowerCase()).join(' | ');
    for (const kind of ['satellite transponder', 'telecom route', 'power supply']) expect(names).toContain(kind.split(' ')[0]);
    expect(doc.feeds.some((f) => f.groups?.includes('SAT-TP7'))).toBe(true);
    expect(doc.sites.some((s) => s.groups?.includes('PWR-NORTH'))).toBe(true);
  });

  it('has reserves that are not really diverse: same telecom route, and same parent site', () => {
    const feedsInto = (to: string) => doc.feeds.filter((f) => f.to === to);
    const elva = feedsInto('M-ELVA.MX1');
    expect(elva.map((f) => [f.role, f.medium, f.groups])).toEqual([
      ['main', 'line', ['TEL-WEST']],
      ['reserve', 'line', ['TEL-WEST']],
    ]);
    const abk = feedsInto('R-ABK.MX1');
    expect(abk.map((f) => f.role).sort()).toEqual(['main', 'reserve']);
    expect(new Set(abk.map((f) => carriage.get(f.from)!.site))).toEqual(new Set(['M-CORR']));
  });

  it('spans 5-60 km on every off-air feed, recording the geodesic bearing to the parent except on one feed', () => {
    const wrong: string[] = [];
    for (const f of doc.feeds.filter((x) => x.medium === 'off-air')) {
      const { here, there } = ends(f);
      const path = geodesicInverse(here.lat, here.lon, there.lat, there.lon);
      expect(path.distanceKm, f.code).toBeGreaterThanOrEqual(5);
      expect(path.distanceKm, f.code).toBeLessThanOrEqual(60);
      // 5 deg: the bearing-record screening limit (docs/checks.md).
      if (bearingDifferenceDeg(f.bearingDeg!, path.initialBearingDeg) > 5) wrong.push(f.code);
      else expect(bearingDifferenceDeg(f.bearingDeg!, path.initialBearingDeg), f.code).toBeLessThan(0.06);
    }
    expect(wrong).toEqual([region.WRONG_BEARING_FEED]);
  });

  it('has one declared on-channel repeater and exactly one undeclared channel clash', () => {
    const clashes: string[] = [];
    const onChannel: string[] = [];
    for (const f of doc.feeds.filter((x) => x.medium === 'off-air')) {
      const target = carriage.get(f.to)!;
      const rx = f.rxFrequencyMHz ?? carriage.get(f.from)!.frequencyMHz;
      if (rx === undefined || target.frequencyMHz === undefined || Math.abs(rx - target.frequencyMHz) > 1e-6) continue;
      (target.onChannelRepeater ? onChannel : clashes).push(target.code);
    }
    expect(clashes).toEqual([region.CLASH_CARRIAGE]);
    expect(onChannel.length).toBeGreaterThan(0);
    expect(new Set(onChannel.map((c) => carriage.get(c)!.site))).toEqual(new Set([region.ON_CHANNEL_RELAY]));
  });

  it('puts every carriage on a channel or frequency of its band, with plausible ERP and antenna height', () => {
    for (const c of doc.carriages) {
      const s = site.get(c.site)!;
      if (s.role === 'origin') continue;
      const kind = service.get(c.service)!.kind;
      const channel = tryParseChannel(c.channel ?? String(c.frequencyMHz), kind);
      expect(channel, c.code).not.toBeNull();
      expect(channel!.centreMHz).toBeCloseTo(c.frequencyMHz!, 9);
      expect(c.erpW!).toBeGreaterThan(0);
      expect(c.erpW!).toBeLessThanOrEqual(s.role === 'main' ? 100000 : 2000);
      expect(c.antennaHeightM!).toBeLessThanOrEqual(s.mastHeightM!);
    }
  });

  it('gives every site a ground height and mast, and every main and relay households', () => {
    for (const s of doc.sites) {
      expect(s.groundHeightM, s.code).toBeGreaterThanOrEqual(0);
      expect(s.groundHeightM, s.code).toBeLessThan(1200);
      expect(s.mastHeightM, s.code).toBeGreaterThan(0);
      if (s.role !== 'origin') expect(s.households, s.code).toBeGreaterThan(0);
    }
    expect(new Set(doc.sites.map((s) => s.name)).size).toBe(doc.sites.length);
  });
});

/** Naming patterns of well-known public broadcasters, retired from the demo and generated data. */
const ECHOING_NAMES = [/radio house/i, /broadcast house/i, /\bprogram(me)? (one|two|three|four|[1-4])\b/i, /\b(one|two|three|four)$/i];

describe('demo names', () => {
  it('echo no broadcaster: no "... Radio House", "Broadcast House" or numbered programmes', () => {
    const names = [...doc.sites.map((s) => s.name), ...doc.services.map((s) => s.name)];
    for (const name of names) for (const pattern of ECHOING_NAMES) expect(name, `${name} matches ${String(pattern)}`).not.toMatch(pattern);
  });
});

describe('demo land (assets/demo/demo-coast.json)', () => {
  const land = (demoCoast as unknown as { features: Feature<MultiPolygon>[] }).features[0];
  const coastLines = land.geometry.coordinates.map((polygon) => turf.lineString(polygon[0]));

  it('holds every demo site (turf booleanPointInPolygon), at least 5 km inland', () => {
    for (const s of doc.sites) {
      const at = turf.point([s.lon, s.lat]);
      expect(turf.booleanPointInPolygon(at, land), `${s.code} ${s.name} is over the sea`).toBe(true);
      const inland = Math.min(...coastLines.map((line) => turf.pointToLineDistance(at, line, { units: 'kilometers' })));
      expect(inland, `${s.code} is ${inland.toFixed(1)} km from the coast`).toBeGreaterThanOrEqual(5);
    }
  });
});

/**
 * Rules 1-9 of docs/domain.md on hand-built networks (fixtures.ts); every
 * expected value below was worked out by hand from the rules.
 */
import { describe, expect, it } from 'vitest';
import { NetworkEngine } from '@/server/engine/engine';
import type { Element } from '@/shared/schemas/analysis';
import type { NetworkDocument } from '@/shared/schemas/network';
import { twoPathNetwork, valleyNetwork } from './fixtures';

const site = (code: string): Element => ({ kind: 'site', code });
const feed = (code: string): Element => ({ kind: 'feed', code });
const group = (code: string): Element => ({ kind: 'group', code });
const spofOf = (engine: NetworkEngine, carriage: string) => engine.spof().carriages.find((c) => c.carriage === carriage)?.spof;

describe('valley network', () => {
  const engine = NetworkEngine.build(valleyNetwork(), 3);

  it('rule 8: the loop with no origin upstream and the carriage with no feed are unfed', () => {
    expect(engine.unfed()).toEqual({
      networkVersion: 3,
      carriages: [
        { carriage: 'D.TV', service: 'TV', site: 'D' },
        { carriage: 'L1.TV', service: 'TV', site: 'L1' },
        { carriage: 'L2.TV', service: 'TV', site: 'L2' },
      ],
    });
  });

  it('rule 6: single points of failure of every fed carriage, own site excepted, sorted by kind then code', () => {
    expect(engine.spof()).toEqual({
      networkVersion: 3,
      carriages: [
        { carriage: 'H.TV', spof: [site('O1'), feed('F06')] },
        { carriage: 'M.FM', spof: [site('O1'), feed('F10'), group('PWR'), group('SAT')] },
        // O1 alone leaves the satellite reserve; H alone only cuts the microwave hop.
        { carriage: 'M.TV', spof: [group('PWR')] },
        { carriage: 'O1.FM', spof: [] },
        { carriage: 'O1.TV', spof: [] },
        { carriage: 'O2.TV', spof: [] },
        { carriage: 'R1.FM', spof: [site('M'), site('O1'), feed('F10'), feed('F11'), group('PWR'), group('SAT')] },
        { carriage: 'R1.TV', spof: [site('M'), feed('F03'), group('PWR')] },
        // R1 alone leaves the reserve from M.
        { carriage: 'R2.TV', spof: [site('M'), group('PWR')] },
        { carriage: 'R3.TV', spof: [site('M'), site('R2'), feed('F07'), group('PWR')] },
      ],
    });
  });

  it('rule 9 (revised): carriages whose reserve leaves an avoidable single point of failure', () => {
    // TV has two origins and neither PWR nor M holds both, so every weak point is avoidable.
    expect(engine.diversity().carriages).toEqual([
      { carriage: 'M.TV', service: 'TV', site: 'M', spof: [group('PWR')], avoidable: [group('PWR')] },
      { carriage: 'R2.TV', service: 'TV', site: 'R2', spof: [site('M'), group('PWR')], avoidable: [site('M'), group('PWR')] },
    ]);
  });

  it('rules 4, 5, 7: an origin fails; what depends on the reserve is on fallback', () => {
    expect(engine.reach([site('O1')])).toEqual({
      networkVersion: 3,
      lost: ['H.TV', 'M.FM', 'O1.FM', 'O1.TV', 'R1.FM'],
      // M.TV keeps programme only through reserve F02, and everything below it with it.
      fallback: ['M.TV', 'R1.TV', 'R2.TV', 'R3.TV'],
      // lost: H 0 + M 1000 + O1 0 + R1 100; fallback: R2 50 + R3 20 (M and R1 also lost a service).
      households: { lost: 1100, fallback: 70 },
      byService: [
        { service: 'FM', lost: 3, fallback: 0 },
        { service: 'TV', lost: 2, fallback: 4 },
      ],
      sites: [
        { site: 'H', lost: ['TV'], fallback: [] },
        { site: 'M', lost: ['FM'], fallback: ['TV'] },
        { site: 'O1', lost: ['FM', 'TV'], fallback: [] },
        { site: 'R1', lost: ['FM'], fallback: ['TV'] },
        { site: 'R2', lost: [], fallback: ['TV'] },
        { site: 'R3', lost: [], fallback: ['TV'] },
      ],
    });
  });

  it('rule 2: a via-site that also carries the service takes down its own carriage and the hop', () => {
    const r = engine.reach([site('H')]);
    expect(r.lost).toEqual(['H.TV']);
    expect(r.fallback).toEqual(['M.TV', 'R1.TV', 'R2.TV', 'R3.TV']);
    expect(r.households).toEqual({ lost: 0, fallback: 1170 });
  });

  it('rule 4: two feeds of one service fail together (main of R1, reserve of R2)', () => {
    const r = engine.reach([feed('F03'), feed('F05')]);
    expect(r.lost).toEqual(['R1.TV', 'R2.TV', 'R3.TV']);
    expect(r.fallback).toEqual([]);
    expect(r.households).toEqual({ lost: 170, fallback: 0 });
    expect(r.byService).toEqual([{ service: 'TV', lost: 3, fallback: 0 }]);
  });

  it('rule 1: a group on sites downs every site in it', () => {
    const r = engine.reach([group('PWR')]);
    expect(r.lost).toEqual(['M.FM', 'M.TV', 'R1.FM', 'R1.TV', 'R2.TV', 'R3.TV']);
    expect(r.households.lost).toBe(1170);
  });

  it('rule 4: failing an unfed carriage\'s site loses nothing', () => {
    const r = engine.reach([site('L1'), site('D')]);
    expect(r.lost).toEqual([]);
    expect(r.households).toEqual({ lost: 0, fallback: 0 });
    expect(r.sites).toEqual([]);
  });

  it('rule 7: exposure of every element, highest first, ties by kind then code', () => {
    const rows = engine.exposure().elements.map((r) => [r.element.kind, r.element.code, r.households, r.carriages]);
    expect(rows).toEqual([
      ['site', 'M', 1170, 6],
      ['group', 'PWR', 1170, 6],
      ['site', 'O1', 1100, 5],
      ['feed', 'F10', 1100, 2],
      ['group', 'SAT', 1100, 2],
      ['site', 'R1', 100, 2],
      ['feed', 'F03', 100, 1],
      ['feed', 'F11', 100, 1],
      ['site', 'R2', 70, 2],
      ['site', 'R3', 20, 1],
      ['feed', 'F07', 20, 1],
      ['site', 'D', 0, 0],
      ['site', 'H', 0, 1],
      ['site', 'L1', 0, 0],
      ['site', 'L2', 0, 0],
      ['site', 'O2', 0, 1],
      ['feed', 'F01', 0, 0],
      ['feed', 'F02', 0, 0],
      ['feed', 'F04', 0, 0],
      ['feed', 'F05', 0, 0],
      ['feed', 'F06', 0, 1],
      ['feed', 'F08', 0, 0],
      ['feed', 'F09', 0, 0],
    ]);
    expect(engine.exposure(2).elements.map((r) => r.element)).toEqual([site('M'), group('PWR')]);
  });
});

describe('a relay with a main and a reserve feed', () => {
  const build = (shape: Parameters<typeof twoPathNetwork>[0]) => NetworkEngine.build(twoPathNetwork(shape), 1);

  it('reserve from the same parent: the parent site is a single point of failure and a diversity gap (P2 is another origin)', () => {
    const engine = build('same-parent');
    expect(spofOf(engine, 'X.TV')).toEqual([site('P1')]);
    expect(engine.diversity().carriages).toEqual([{ carriage: 'X.TV', service: 'TV', site: 'X', spof: [site('P1')], avoidable: [site('P1')] }]);
    const r = engine.reach([feed('A')]);
    expect(r.lost).toEqual([]);
    expect(r.fallback).toEqual(['X.TV']);
    expect(r.households).toEqual({ lost: 0, fallback: 300 });
  });

  it('both paths through one hop site: the hop site owns two nodes and is still caught, and is avoidable', () => {
    const engine = build('shared-hop');
    expect(spofOf(engine, 'X.TV')).toEqual([site('HOP')]);
    expect(engine.diversity().carriages.map((c) => c.avoidable)).toEqual([[site('HOP')]]);
    expect(engine.reach([site('HOP')]).lost).toEqual(['X.TV']);
    expect(engine.exposure(1).elements[0]).toEqual({ element: site('HOP'), households: 300, carriages: 1 });
  });

  it('both feeds in one group: a group weak point that another feed avoids', () => {
    const engine = build('shared-feed-group');
    expect(spofOf(engine, 'X.TV')).toEqual([group('G')]);
    expect(engine.diversity().carriages).toEqual([{ carriage: 'X.TV', service: 'TV', site: 'X', spof: [group('G')], avoidable: [group('G')] }]);
  });

  it('both parents in one site group: the group downs both origins, so it is unavoidable and no gap', () => {
    const engine = build('shared-site-group');
    expect(spofOf(engine, 'X.TV')).toEqual([group('G')]);
    expect(engine.diversity().carriages).toEqual([]);
    expect(spofOf(engine, 'P1.TV')).toEqual([group('G')]);
    expect(engine.reach([group('G')]).lost).toEqual(['P1.TV', 'P2.TV', 'X.TV']);
  });

  it('diverse paths: no single point of failure, no diversity gap, the reserve takes over', () => {
    const engine = build('diverse');
    expect(spofOf(engine, 'X.TV')).toEqual([]);
    expect(engine.diversity().carriages).toEqual([]);
    const r = engine.reach([site('P1')]);
    expect(r.lost).toEqual(['P1.TV']);
    expect(r.fallback).toEqual(['X.TV']);
    expect(r.households).toEqual({ lost: 0, fallback: 300 });
  });
});

describe('rule 5 when the main feed comes from an unfed loop', () => {
  const doc: NetworkDocument = {
    format: 'network/1',
    sites: [
      { code: 'O', name: 'Origin', role: 'origin', lat: 0, lon: 0, households: 0 },
      { code: 'L1', name: 'Loop one', role: 'relay', lat: 0, lon: 0.1, households: 1 },
      { code: 'L2', name: 'Loop two', role: 'relay', lat: 0, lon: 0.2, households: 2 },
      { code: 'X', name: 'Relay', role: 'relay', lat: 0, lon: 0.3, households: 40 },
    ],
    services: [{ code: 'TV', name: 'Television', kind: 'dtt' }],
    groups: [],
    carriages: ['O', 'L1', 'L2', 'X'].map((s) => ({ code: `${s}.TV`, site: s, service: 'TV' })),
    feeds: [
      { code: 'a', from: 'L1.TV', to: 'L2.TV', medium: 'off-air', role: 'main' },
      { code: 'b', from: 'L2.TV', to: 'L1.TV', medium: 'off-air', role: 'main' },
      { code: 'c', from: 'L1.TV', to: 'X.TV', medium: 'off-air', role: 'main' },
      { code: 'd', from: 'O.TV', to: 'X.TV', medium: 'line', role: 'reserve' },
    ],
  };
  const engine = NetworkEngine.build(doc, 1);

  it('the relay lives on its reserve with nothing failed, so it is on fallback under any failure it survives', () => {
    expect(engine.unfed().carriages.map((c) => c.carriage)).toEqual(['L1.TV', 'L2.TV']);
    const r = engine.reach([site('L2')]);
    expect(r.lost).toEqual([]);
    expect(r.fallback).toEqual(['X.TV']);
    expect(r.households).toEqual({ lost: 0, fallback: 40 });
    expect(engine.reach([feed('d')]).lost).toEqual(['X.TV']);
    expect(spofOf(engine, 'X.TV')).toEqual([site('O'), feed('d')]);
  });
});

describe('rule 9 (revised) with a single-origin service', () => {
  // One origin O feeds relay A; relay X has a main from A and a reserve from O.
  const doc: NetworkDocument = {
    format: 'network/1',
    sites: [
      { code: 'O', name: 'Origin', role: 'origin', lat: 0, lon: 0, households: 0, groups: ['PWR'] },
      { code: 'A', name: 'Relay A', role: 'relay', lat: 0, lon: 0.1, households: 10, groups: ['PWR'] },
      { code: 'X', name: 'Relay X', role: 'relay', lat: 0, lon: 0.2, households: 40 },
    ],
    services: [{ code: 'TV', name: 'Television', kind: 'dtt' }],
    groups: [{ code: 'PWR', name: 'Power' }, { code: 'RT', name: 'Route' }],
    carriages: ['O', 'A', 'X'].map((s) => ({ code: `${s}.TV`, site: s, service: 'TV' })),
    feeds: [
      { code: 'a', from: 'O.TV', to: 'A.TV', medium: 'line', role: 'main' },
      { code: 'b', from: 'A.TV', to: 'X.TV', medium: 'off-air', role: 'main', groups: ['RT'] },
      { code: 'c', from: 'O.TV', to: 'X.TV', medium: 'line', role: 'reserve', groups: ['RT'] },
    ],
  };
  const engine = NetworkEngine.build(doc, 1);

  it('the only origin and the group holding it are unavoidable; the shared route group is avoidable', () => {
    expect(spofOf(engine, 'X.TV')).toEqual([site('O'), group('PWR'), group('RT')]);
    expect(engine.diversity().carriages).toEqual([{ carriage: 'X.TV', service: 'TV', site: 'X', spof: [site('O'), group('PWR'), group('RT')], avoidable: [group('RT')] }]);
  });

  it('a carriage whose only weak point is the single origin has no gap', () => {
    const without = NetworkEngine.build({ ...doc, feeds: doc.feeds.map((f) => ({ ...f, groups: [] })) }, 1);
    expect(spofOf(without, 'X.TV')).toEqual([site('O'), group('PWR')]);
    expect(without.diversity().carriages).toEqual([]);
  });
});

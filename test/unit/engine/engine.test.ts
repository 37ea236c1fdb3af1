import { describe, expect, it } from 'vitest';
import { NetworkEngine, UnknownElementsError } from '@/server/engine/engine';
import { NetworkModelError } from '@/server/engine/model';
import { carriageKey, feedKey, hopKey, ROOT_KEY } from '@/server/engine/graphs';
import type { Element } from '@/shared/schemas/analysis';
import { nationalNetwork, prng } from '@/test/helpers/random-network';
import { BruteForce } from '@/test/helpers/bruteforce';
import { baselineExposure, walkFloor } from '@/test/helpers/engine-yardsticks';
import { twoPathNetwork, valleyNetwork } from './fixtures';

describe('NetworkEngine: bad input', () => {
  const engine = NetworkEngine.build(valleyNetwork(), 1);

  it('reach with unknown elements throws UnknownElementsError listing every unknown one once', () => {
    const failed: Element[] = [
      { kind: 'site', code: 'M' },
      { kind: 'site', code: 'NOWHERE' },
      { kind: 'feed', code: 'M' },
      { kind: 'site', code: 'NOWHERE' },
    ];
    let caught: unknown;
    try {
      engine.reach(failed);
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(UnknownElementsError);
    expect((caught as UnknownElementsError).elements).toEqual([
      { kind: 'site', code: 'NOWHERE' },
      { kind: 'feed', code: 'M' },
    ]);
    expect((caught as Error).message).toBe('unknown elements: site NOWHERE, feed M');
  });

  it('rejects a bad version, a bad limit and a document that is not one', () => {
    expect(() => NetworkEngine.build(valleyNetwork(), -1)).toThrow(/networkVersion must be a whole number/);
    expect(() => engine.exposure(0)).toThrow(/limit must be a whole number >= 1/);
    expect(() => NetworkEngine.build({} as never, 1)).toThrow(/validated network document/);
  });

  it('names what is wrong in a document that is not referentially valid', () => {
    const doc = valleyNetwork();
    doc.feeds[0].via = ['ATLANTIS'];
    expect(() => NetworkEngine.build(doc, 1)).toThrow(NetworkModelError);
    expect(() => NetworkEngine.build(doc, 1)).toThrow('feed F01: site ATLANTIS does not exist');
    const mixed = valleyNetwork();
    mixed.feeds[0].to = 'M.FM';
    expect(() => NetworkEngine.build(mixed, 1)).toThrow('feed F01: carriages O1.TV and M.FM carry different services');
    const twice = valleyNetwork();
    twice.sites.push({ ...twice.sites[0] });
    expect(() => NetworkEngine.build(twice, 1)).toThrow('site O1: the code is used twice');
  });
});

describe('NetworkEngine: lookups and the graphology model', () => {
  it('answers on an empty network and on a site with no carriage', () => {
    const empty = NetworkEngine.build({ format: 'network/1', sites: [], services: [], groups: [], carriages: [], feeds: [] }, 0);
    expect(empty.spof().carriages).toEqual([]);
    expect(empty.exposure().elements).toEqual([]);
    expect(empty.counts.nodes).toBe(0);
    const bare = NetworkEngine.build(
      { format: 'network/1', sites: [{ code: 'A', name: 'Bare hill', role: 'relay', lat: 0, lon: 0 }], services: [], groups: [], carriages: [], feeds: [] },
      0,
    );
    expect(bare.reach([{ kind: 'site', code: 'A' }])).toEqual({ networkVersion: 0, lost: [], fallback: [], households: { lost: 0, fallback: 0 }, byService: [], sites: [] });
    expect(bare.exposure().elements).toEqual([{ element: { kind: 'site', code: 'A' }, households: 0, carriages: 0 }]);
  });

  it('trims codes and keeps their case', () => {
    const doc = twoPathNetwork('diverse');
    doc.sites[0].code = ' P1 ';
    doc.carriages[0].site = 'P1  ';
    const engine = NetworkEngine.build(doc, 1);
    expect(engine.hasElement({ kind: 'site', code: 'P1' })).toBe(true);
    expect(engine.hasElement({ kind: 'site', code: ' P1' })).toBe(true);
    expect(engine.hasElement({ kind: 'site', code: 'p1' })).toBe(false);
    expect(engine.hasCarriage('X.TV')).toBe(true);
    expect(engine.reach([{ kind: 'site', code: 'P1 ' }]).lost).toEqual(['P1.TV']);
  });

  it('keeps one graphology graph per service with carriage, feed and hop nodes', () => {
    const engine = NetworkEngine.build(valleyNetwork(), 1);
    const tv = engine.serviceGraph('TV')!;
    expect(engine.serviceGraph('RADIO')).toBeUndefined();
    expect(tv.outNeighbors(ROOT_KEY).sort()).toEqual([carriageKey('O1.TV'), carriageKey('O2.TV')]);
    // O1 -> hop(F01, site H) -> F01 -> M, and O2 -> hop(F02, group SAT) -> F02 -> M
    expect(tv.outNeighbors(hopKey('F01', { kind: 'site', code: 'H' }))).toEqual([feedKey('F01')]);
    expect(tv.inNeighbors(hopKey('F02', { kind: 'group', code: 'SAT' }))).toEqual([carriageKey('O2.TV')]);
    expect(tv.inNeighbors(carriageKey('M.TV')).sort()).toEqual([feedKey('F01'), feedKey('F02')]);
    expect(tv.getNodeAttributes(feedKey('F02'))).toEqual({ kind: 'feed', feed: 'F02', role: 'reserve' });
    // 10 TV carriages + 9 TV feeds + 2 hops + root; 3 FM carriages + 2 FM feeds + 1 hop + root
    expect(engine.counts).toEqual({ sites: 10, services: 2, groups: 2, carriages: 13, feeds: 11, nodes: 22 + 7, edges: 2 + 9 * 2 + 2 + 1 + 2 * 2 + 1, unfed: 3 });
  });
});

describe('NetworkEngine: the yardsticks agree with the engine', () => {
  const doc = nationalNetwork({ sites: 1500, seed: 11, services: 5 });
  const engine = NetworkEngine.build(doc, 1);
  const elements = engine.elements();
  const rnd = prng(99);
  const sample = Array.from({ length: 150 }, () => elements[Math.floor(rnd() * elements.length)]);

  it('baselineExposure (remove and walk) gives the precomputed exposure of each element', () => {
    const byKey = new Map(engine.exposure(undefined, ['site', 'carriage', 'feed', 'group']).elements.map((r) => [`${r.element.kind}:${r.element.code}`, r]));
    const baseline = baselineExposure(engine, sample);
    expect(baseline.map((r) => byKey.get(`${r.element.kind}:${r.element.code}`))).toEqual(baseline);
    expect(baseline.some((r) => r.households > 0)).toBe(true);
  });

  it('walkFloor (plain walk) loses as many carriages as reach, on random failure sets', () => {
    let withLosses = 0;
    for (let t = 0; t < 40; t++) {
      const failed = Array.from({ length: 1 + (t % 5) }, () => elements[Math.floor(rnd() * elements.length)]);
      const lost = engine.reach(failed).lost.length;
      expect(walkFloor(engine, failed)).toBe(lost);
      if (lost > 0) withLosses++;
    }
    // the comparison means something only if failures did take carriages off air
    expect(withLosses).toBeGreaterThan(5);
  });

  it('the generated national network agrees with the brute force for a few failures', () => {
    const brute = new BruteForce(doc);
    for (const failed of sample.slice(0, 5).map((e) => [e])) {
      const { networkVersion: _v, ...answer } = engine.reach(failed);
      expect(answer).toEqual(brute.reach(failed));
    }
    expect(engine.unfed().carriages.map((c) => c.carriage)).toEqual(brute.unfed());
  });
});

/**
 * The network-wide answers worked out in slices (NetworkEngine.prepare, and
 * the server's `prepared`, which yields between slices) are the answers
 * worked out at once: the slicing is only about when the work runs.
 */
import { describe, expect, it } from 'vitest';
import { NetworkEngine } from '@/server/engine/engine';
import { prepared, preparedFor } from '@/server/services/prepared';
import { generateNetwork } from '@/scripts/generator';
import { smallRandomNetwork } from '@/test/helpers/random-network';
import { countTurns } from '@/test/helpers/turnCounter';

const answers = (e: NetworkEngine) => ({ spof: e.spof(), exposure: e.exposure(), groups: e.exposureGroups(50), diversity: e.diversity(), carriageSpof: e.spof(['site', 'feed', 'group', 'carriage']) });

describe('weak points and diversity gaps worked out in slices', () => {
  it('give the answers worked out at once, on random networks, however small the slices', () => {
    for (let seed = 1; seed <= 40; seed++) {
      const doc = smallRandomNetwork({ seed, sites: 10, services: 2, groups: 3, feeds: 18, originChance: 0.25, carriageChance: 0.9 });
      const sliced = NetworkEngine.build(doc, 3);
      // a deadline already past: one piece of work per call
      let calls = 1;
      while (!sliced.prepare('diversity', 0)) calls++;
      expect(sliced.holds('resilience')).toBe(true);
      expect(sliced.holds('diversity')).toBe(true);
      expect(calls).toBeGreaterThan(1);
      expect(answers(sliced)).toEqual(answers(NetworkEngine.build(doc, 3)));
    }
  });

  it('the grouped exposure ranking and the weak points answer worked out in slices are the ones worked out at once, for each set of kinds', () => {
    const kindSets = [undefined, ['site'], ['site', 'feed', 'group', 'carriage']] as const;
    for (let seed = 1; seed <= 25; seed++) {
      const doc = smallRandomNetwork({ seed, sites: 12, services: 2, groups: 3, feeds: 22, originChance: 0.25, carriageChance: 0.9 });
      const sliced = NetworkEngine.build(doc, 3);
      const atOnce = NetworkEngine.build(doc, 3);
      for (const kinds of kindSets) {
        expect(sliced.holdsExposureGroups(kinds)).toBe(false);
        let calls = 1;
        while (!sliced.prepareExposureGroups(kinds, 0)) calls++;
        expect(sliced.holdsExposureGroups(kinds)).toBe(true);
        if (kinds === undefined) expect(calls).toBeGreaterThan(1);
        expect(sliced.exposureGroups(undefined, kinds)).toEqual(atOnce.exposureGroups(undefined, kinds));
        expect(sliced.holdsExposure(kinds)).toBe(false);
        while (!sliced.prepareExposure(kinds, 0));
        expect(sliced.holdsExposure(kinds)).toBe(true);
        expect(sliced.exposure(undefined, kinds)).toEqual(atOnce.exposure(undefined, kinds));
        expect(sliced.holdsSpof(kinds)).toBe(false);
        while (!sliced.prepareSpof(kinds, 0));
        expect(sliced.holdsSpof(kinds)).toBe(true);
        expect(sliced.spof(kinds)).toEqual(atOnce.spof(kinds));
      }
    }
  });

  it("preparedFor('groups') gives the event loop turns while it walks, and its answer agrees", async () => {
    const doc = generateNetwork({ sites: 600, seed: 9 });
    const e = NetworkEngine.build(doc, 1);
    await prepared(e, 'resilience');
    const counter = countTurns();
    const a = preparedFor(e, 'groups', undefined, 0);
    // the same kinds named in another order share the work
    expect(preparedFor(e, 'groups', ['group', 'site', 'feed'], 0)).toBe(a);
    await a;
    const turns = counter.stop();
    expect(turns).toBeGreaterThan(2);
    expect(e.holdsExposureGroups(['site', 'feed', 'group'])).toBe(true);
    expect(e.exposureGroups(20)).toEqual(NetworkEngine.build(doc, 1).exposureGroups(20));
    await preparedFor(e, 'spof', ['site']);
    expect(e.holdsSpof(['site'])).toBe(true);
    expect(e.spof(['site'])).toEqual(NetworkEngine.build(doc, 1).spof(['site']));
  });

  it('the first rows of the exposure ranking, asked for alone, are the first rows of the whole ranking', () => {
    for (let seed = 1; seed <= 20; seed++) {
      const doc = smallRandomNetwork({ seed, sites: 12, services: 2, groups: 3, feeds: 22, originChance: 0.25, carriageChance: 0.9 });
      const e = NetworkEngine.build(doc, 2);
      for (const kinds of [undefined, ['feed'], ['site', 'carriage']] as const) {
        const firsts = [1, 3, 10, 1_000].map((limit) => e.exposure(limit, kinds).elements);
        const whole = NetworkEngine.build(doc, 2).exposure(undefined, kinds).elements;
        expect(firsts).toEqual([1, 3, 10, 1_000].map((limit) => whole.slice(0, limit)));
        // and the same once the whole ranking is held
        expect(e.exposure(undefined, kinds).elements).toEqual(whole);
        expect(e.exposure(3, kinds).elements).toEqual(whole.slice(0, 3));
      }
    }
  });

  it('an answer asked for between slices finishes the work at once and agrees', () => {
    const doc = generateNetwork({ sites: 300, seed: 3 });
    const e = NetworkEngine.build(doc, 1);
    let calls = 0;
    while (calls < 5 && !e.prepare('resilience', 0)) calls++;
    expect(e.holds('resilience')).toBe(false);
    const mid = answers(e);
    expect(e.holds('diversity')).toBe(true);
    expect(mid).toEqual(answers(NetworkEngine.build(doc, 1)));
    expect(e.prepare('diversity', 0)).toBe(true);
  });

  it('prepared() gives the event loop turns while it works, and requests meanwhile share one piece of work', async () => {
    const doc = generateNetwork({ sites: 800, seed: 5 });
    const e = NetworkEngine.build(doc, 1);
    const counter = countTurns();
    // slices of no time at all: one piece of work between turns, however fast the machine
    const a = prepared(e, 'diversity', 0);
    const b = prepared(e, 'diversity');
    expect(b).toBe(a);
    await a;
    const turns = counter.stop();
    expect(e.holds('diversity')).toBe(true);
    expect(turns).toBeGreaterThan(2);
    const fresh = NetworkEngine.build(doc, 1);
    expect(e.diversity()).toEqual(fresh.diversity());
    expect(e.spof()).toEqual(fresh.spof());
    await expect(prepared(e, 'resilience')).resolves.toBeUndefined();
  });
});

/**
 * The network-wide answers worked out in slices (NetworkEngine.prepare, and
 * the server's `prepared`, which yields between slices) are the answers
 * worked out at once: the slicing is only about when the work runs.
 */
import { describe, expect, it } from 'vitest';
import { NetworkEngine } from '@/server/engine/engine';
import { prepared } from '@/server/services/prepared';
import { generateNetwork } from '@/scripts/generator';
import { smallRandomNetwork } from '@/test/helpers/random-network';

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
    let turns = 0;
    let on = true;
    const tick = () => {
      if (!on) return;
      turns++;
      setImmediate(tick);
    };
    setImmediate(tick);
    // slices of no time at all: one piece of work between turns, however fast the machine
    const a = prepared(e, 'diversity', 0);
    const b = prepared(e, 'diversity');
    expect(b).toBe(a);
    await a;
    on = false;
    expect(e.holds('diversity')).toBe(true);
    expect(turns).toBeGreaterThan(2);
    const fresh = NetworkEngine.build(doc, 1);
    expect(e.diversity()).toEqual(fresh.diversity());
    expect(e.spof()).toEqual(fresh.spof());
    await expect(prepared(e, 'resilience')).resolves.toBeUndefined();
  });
});

/**
 * The engine against the brute-force evaluation of rules 1-9 (test/helpers/bruteforce.ts)
 * on random networks with loops, via-sites, groups on feeds and sites, reserve feeds,
 * several origins and unfed carriages.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { NetworkEngine } from '@/server/engine/engine';
import { BruteForce } from '@/test/helpers/bruteforce';
import { smallRandomNetwork, prng } from '@/test/helpers/random-network';
import type { Element } from '@/shared/schemas/analysis';

const networkParams = fc.record({
  seed: fc.integer({ min: 0, max: 0x7fffffff }),
  sites: fc.integer({ min: 1, max: 9 }),
  services: fc.integer({ min: 1, max: 3 }),
  groups: fc.integer({ min: 0, max: 3 }),
  feeds: fc.integer({ min: 0, max: 18 }),
  originChance: fc.constantFrom(0, 0.15, 0.3, 0.6),
  carriageChance: fc.constantFrom(0.5, 0.8, 1),
});

function randomFailures(elements: Element[], seed: number, sets: number): Element[][] {
  const rnd = prng(seed);
  return Array.from({ length: sets }, () => elements.filter(() => rnd() < 0.2));
}

describe('engine agrees with the brute force on random networks', () => {
  it('reach, fallback and households under random failure sets; unfed; spof; exposure; diversity (500 networks)', () => {
    let failureSetsChecked = 0;
    let nonEmptyReach = 0;
    fc.assert(
      fc.property(networkParams, (p) => {
        const doc = smallRandomNetwork(p);
        const engine = NetworkEngine.build(doc, 7);
        const brute = new BruteForce(doc);

        expect(engine.unfed().carriages.map((c) => c.carriage)).toEqual(brute.unfed());
        expect(engine.spof().carriages).toEqual(brute.spof());
        const exposure = engine.exposure().elements;
        expect(exposure).toEqual(brute.exposure());
        expect(engine.diversity().carriages.map(({ carriage, spof, avoidable }) => ({ carriage, spof, avoidable }))).toEqual(brute.diversity());

        const elements = brute.elements();
        for (const failed of [...elements.map((e) => [e]), ...randomFailures(elements, p.seed, 6)]) {
          const { networkVersion, ...answer } = engine.reach(failed);
          expect(networkVersion).toBe(7);
          expect(answer).toEqual(brute.reach(failed));
          failureSetsChecked++;
          if (answer.lost.length > 0) nonEmptyReach++;
        }
      }),
      { numRuns: 500 },
    );
    // The generator must produce networks where failures matter, or the comparison proves little.
    expect(nonEmptyReach).toBeGreaterThan(failureSetsChecked / 10);
  });
});

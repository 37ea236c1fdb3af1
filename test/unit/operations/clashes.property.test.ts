/**
 * Clash detection and incident step reach against the brute-force evaluation
 * of the rules (test/helpers/bruteforce.ts) on random networks, with random
 * windows on a coarse minute grid so that touching, contained and identical
 * windows come up often (and are also forced in every case).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { Element } from '@/shared/schemas/analysis';
import { elementKey } from '@/shared/schemas/analysis';
import { buildServedNetwork } from '@/server/services/servedNetwork';
import { OperationsReachCache } from '@/server/operations/reach';
import { allClashes, clashesWith, type Spell } from '@/server/operations/clashes';
import { outageFigures } from '@/server/operations/incidents';
import { BruteForce } from '@/test/helpers/bruteforce';
import { prng, smallRandomNetwork } from '@/test/helpers/random-network';

const networkParams = fc.record({
  seed: fc.integer({ min: 0, max: 0x7fffffff }),
  sites: fc.integer({ min: 2, max: 8 }),
  services: fc.integer({ min: 1, max: 2 }),
  groups: fc.integer({ min: 0, max: 3 }),
  feeds: fc.integer({ min: 2, max: 16 }),
  originChance: fc.constantFrom(0.15, 0.3),
  carriageChance: fc.constantFrom(0.8, 1),
});
const MIN = 60_000;

/** Rule 10 straight from the brute force: joint loss and its households, or null. */
function bruteJoint(brute: BruteForce, a: Element[], b: Element[]) {
  const ra = brute.reach(a);
  const rb = brute.reach(b);
  const ru = brute.reach([...a, ...b]);
  const alone = new Set([...ra.lost, ...rb.lost]);
  const joint = ru.lost.filter((c) => !alone.has(c));
  if (joint.length === 0) return null;
  const siteOf = new Map(brute.doc.carriages.map((c) => [c.code, c.site]));
  const aloneSites = new Set([...alone].map((c) => siteOf.get(c)));
  const sites = new Set(joint.map((c) => siteOf.get(c)!).filter((s) => !aloneSites.has(s)));
  const households = [...sites].reduce((t, s) => t + (brute.doc.sites.find((x) => x.code === s)!.households ?? 0), 0);
  return { jointLost: joint, households };
}

/** Overlap by walking the grid minute by minute: some minute lies in both half-open windows. */
function bruteOverlap(a: Spell, b: Spell): [number, number] | null {
  let first = -1;
  let last = -1;
  const hi = Math.min(Number.isFinite(a.end) ? a.end : 1e9 * MIN, Number.isFinite(b.end) ? b.end : 1e9 * MIN);
  for (let t = Math.max(a.start, b.start); t < hi && t <= 40 * MIN; t += MIN) {
    if (t >= a.start && t < a.end && t >= b.start && t < b.end) {
      if (first < 0) first = t;
      last = t;
    }
  }
  return first < 0 ? null : [first, last + MIN];
}

function randomSpells(elements: Element[], seed: number): Spell[] {
  const rnd = prng(seed);
  const pickSet = () => {
    const s = elements.filter(() => rnd() < 0.25);
    return s.length ? s : [elements[Math.floor(rnd() * elements.length)]];
  };
  const spells: Spell[] = [];
  for (let i = 0; i < 6; i++) {
    const start = Math.floor(rnd() * 10) * MIN;
    spells.push({ code: `W-${i}`, kind: 'work', state: 'draft', start, end: start + (1 + Math.floor(rnd() * 5)) * MIN, elements: pickSet() });
  }
  const w0 = spells[0];
  // The edge cases, every time: identical, touching on both sides, contained.
  spells.push({ ...w0, code: 'W-same', elements: pickSet() });
  spells.push({ ...w0, code: 'W-after', start: w0.end, end: w0.end + 2 * MIN, elements: pickSet() });
  spells.push({ ...w0, code: 'W-before', start: w0.start - 2 * MIN, end: w0.start, elements: pickSet() });
  if (w0.end - w0.start >= 2 * MIN) spells.push({ ...w0, code: 'W-inside', start: w0.start + MIN, end: w0.end - MIN + 1, elements: pickSet() });
  spells.push({ code: 'I-open', kind: 'incident', state: 'open', start: Math.floor(rnd() * 12) * MIN, end: Infinity, elements: pickSet() });
  spells.push({ code: 'I-other', kind: 'incident', state: 'open', start: 0, end: Infinity, elements: pickSet() });
  return spells;
}

describe('clashes agree with the brute force', () => {
  it('every pair of spells on 150 random networks (identical, touching, contained windows included)', () => {
    let clashesSeen = 0;
    let touchingPairs = 0;
    fc.assert(
      fc.property(networkParams, fc.integer({ min: 0, max: 0x7fffffff }), (p, seed) => {
        const doc = smallRandomNetwork(p);
        const brute = new BruteForce(doc);
        const elements = brute.elements();
        if (elements.length === 0) return;
        const cache = new OperationsReachCache(buildServedNetwork(doc, 3));
        const spells = randomSpells(elements, seed);
        const found = allClashes(cache, spells);
        for (const a of spells) {
          const expected = [];
          for (const b of spells) {
            if (a === b || (a.kind === 'incident' && b.kind === 'incident')) continue;
            if (a.end === b.start || b.end === a.start) touchingPairs++;
            const overlap = bruteOverlap(a, b);
            const joint = overlap ? bruteJoint(brute, a.elements, b.elements) : null;
            if (!joint) continue;
            const start = new Date(Math.max(a.start, b.start)).toISOString();
            const end = Number.isFinite(Math.min(a.end, b.end)) ? new Date(Math.min(a.end, b.end)).toISOString() : null;
            expected.push({ work: b.code, with: b.kind, otherState: b.state, overlap: { start, end }, ...joint });
          }
          const key = (c: { work: string }) => c.work;
          const sortBy = <T extends { work: string }>(l: T[]) => [...l].sort((x, y) => (key(x) < key(y) ? -1 : 1));
          expect(sortBy(found.get(a.code)!), `${a.code} on seed ${p.seed}`).toEqual(sortBy(expected));
          expect(sortBy(clashesWith(cache, a, spells))).toEqual(sortBy(expected));
          clashesSeen += expected.length;
        }
      }),
      { numRuns: 150 },
    );
    // The property must not pass vacuously.
    expect(clashesSeen).toBeGreaterThan(20);
    expect(touchingPairs).toBeGreaterThan(100);
  });
});

describe('incident step reach agrees with the brute force', () => {
  it('each step of random add/restore sequences, and household-minutes summed minute by minute', () => {
    let lostSteps = 0;
    fc.assert(
      fc.property(networkParams, fc.integer({ min: 0, max: 0x7fffffff }), (p, seed) => {
        const doc = smallRandomNetwork(p);
        const brute = new BruteForce(doc);
        const elements = brute.elements();
        if (elements.length === 0) return;
        const rnd = prng(seed);
        const cache = new OperationsReachCache(buildServedNetwork(doc, 5));
        let failed = new Map<string, Element>();
        const steps: { at: Date; reach: ReturnType<OperationsReachCache['frozen']> }[] = [];
        let t = 0;
        for (let k = 0; k < 5; k++) {
          for (const e of elements) if (rnd() < 0.15) failed.set(elementKey(e), e);
          failed = new Map([...failed].filter(() => rnd() > 0.3));
          const reach = cache.frozen([...failed.values()]);
          const { lost, fallback, households } = brute.reach([...failed.values()]);
          expect({ lost: reach.lost, fallback: reach.fallback, households: reach.households }).toEqual({ lost, fallback, households });
          expect(reach.places.map((x) => x.carriage)).toEqual(lost);
          if (lost.length) lostSteps++;
          steps.push({ at: new Date(t * MIN), reach });
          t += 1 + Math.floor(rnd() * 30);
        }
        const until = new Date(t * MIN);
        // Minute by minute: in each minute, the households of the step that covers it.
        let expected = 0;
        for (let m = 0; m < t; m++) {
          const step = [...steps].reverse().find((s) => s.at.getTime() <= m * MIN)!;
          expected += step.reach.households.lost;
        }
        expect(outageFigures(steps, until).householdMinutes).toBe(expected);
      }),
      { numRuns: 150 },
    );
    expect(lostSteps).toBeGreaterThan(50);
  });
});

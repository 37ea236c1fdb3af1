/**
 * The fast proposals (a grid of candidate sources within the horizon and
 * field-strength radii, an early stop for the network ranking) give exactly
 * the answers of the straightforward path (test/helpers/proposals-reference.ts)
 * on random networks with real geometry: heights, e.r.p., frequencies, some
 * missing, some near the antimeridian or a pole where the grid cannot help.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { NetworkEngine } from '@/server/engine/engine';
import { ReferenceProposals } from '@/test/helpers/proposals-reference';
import { prng, smallRandomNetwork } from '@/test/helpers/random-network';
import type { NetworkDocument } from '@/shared/schemas/network';

/** A small random network with positions spread over a few hundred km, heights, powers and frequencies. */
function withRadio(doc: NetworkDocument, seed: number, lat: number, lon: number, spreadDeg: number): NetworkDocument {
  const rnd = prng(seed ^ 0x5bd1e995);
  const kind = (i: number) => (i % 2 === 0 ? 'dtt' : 'fm') as 'dtt' | 'fm';
  const services = doc.services.map((s, i) => ({ ...s, kind: kind(i) }));
  const kindOf = new Map(services.map((s) => [s.code, s.kind]));
  const sites = doc.sites.map((s) => ({
    ...s,
    lat: Math.max(-89.9, Math.min(89.9, lat + (rnd() - 0.5) * spreadDeg)),
    lon: ((lon + (rnd() - 0.5) * spreadDeg * 2 + 540) % 360) - 180,
    ...(rnd() < 0.9 ? { groundHeightM: Math.floor(rnd() * 800) } : {}),
    ...(rnd() < 0.9 ? { mastHeightM: 10 + Math.floor(rnd() * 290) } : {}),
  }));
  const carriages = doc.carriages.map((c) => {
    const fm = kindOf.get(c.service) === 'fm';
    const r = rnd();
    const frequency = r < 0.1 ? {} : fm ? { frequencyMHz: 88 + Math.floor(rnd() * 200) / 10 } : { frequencyMHz: 474 + 8 * Math.floor(rnd() * 28) };
    const erp = rnd() < 0.1 ? {} : { erpW: rnd() < 0.05 ? 0 : Math.round(10 ** (rnd() * 5)) };
    return { ...c, ...frequency, ...erp, ...(rnd() < 0.3 ? { antennaHeightM: 5 + Math.floor(rnd() * 200) } : {}) };
  });
  return { ...doc, services, sites, carriages };
}

describe('fast proposals agree with the straightforward path', () => {
  const params = fc.record({
    seed: fc.integer({ min: 0, max: 0x7fffffff }),
    sites: fc.integer({ min: 2, max: 30 }),
    services: fc.integer({ min: 1, max: 2 }),
    groups: fc.integer({ min: 0, max: 3 }),
    feeds: fc.integer({ min: 2, max: 60 }),
    originChance: fc.constantFrom(0.1, 0.3, 0.6),
    carriageChance: fc.constantFrom(0.8, 1),
    // mid-latitude, near a pole, across the antimeridian
    place: fc.constantFrom([45, 10], [45, 10], [88, 20], [10, 179.5], [-40, -179.8]),
    spreadDeg: fc.constantFrom(0.5, 2, 6),
  });

  it('every carriage\'s proposals and the network ranking at several limits, in one go and in steps (200 networks)', () => {
    let compared = 0;
    let offAir = 0;
    fc.assert(
      fc.property(params, ({ place, spreadDeg, ...p }) => {
        const doc = withRadio(smallRandomNetwork(p), p.seed, place[0], place[1], spreadDeg);
        const reference = new ReferenceProposals(doc);
        const engine = NetworkEngine.build(doc, 1);
        for (const code of reference.gapCarriages()) {
          const expected = reference.forCarriage(code);
          expect(engine.proposals({ carriage: code }).proposals).toEqual(expected);
          compared += expected.length;
          offAir += expected.filter((r) => r.medium === 'off-air').length;
        }
        const ranking = reference.network();
        // Smaller limits first, so the cached prefix grows as the server would grow it.
        for (const limit of [1, 3, 10]) expect(engine.proposals({ limit }).proposals).toEqual(ranking.slice(0, limit));
        expect(engine.proposals({}).proposals).toEqual(ranking);
        expect(NetworkEngine.build(doc, 1).proposals({ limit: 2 }).proposals).toEqual(ranking.slice(0, 2));
        // In steps as the server runs it (a deadline already passed: one carriage per step), the same ranking.
        for (const limit of [2, undefined]) {
          const stepped = NetworkEngine.build(doc, 1);
          const job = stepped.proposalsJob(limit);
          let steps = 1;
          while (!job.step(Number.NEGATIVE_INFINITY)) {
            expect(job.done).toBeLessThan(job.total);
            steps++;
          }
          expect(job.done).toBe(job.total);
          expect(job.result()).toEqual(limit === undefined ? ranking : ranking.slice(0, limit));
          if (reference.gapCarriages().length > 1) expect(steps).toBeGreaterThan(1);
          expect(stepped.holdsProposals(limit)).toBe(true);
          expect(stepped.proposals({ limit }).proposals).toEqual(job.result());
        }
      }),
      { numRuns: 200 },
    );
    // The property is not empty: proposals of both media were compared.
    expect(compared).toBeGreaterThan(200);
    expect(offAir).toBeGreaterThan(50);
  });
});

/**
 * The exposure ranking's packed-key sort (server/engine/resilience.ts) against
 * the plain comparator sort it replaces: households highest first, ties by
 * element id, on random values with many ties and zeros, and past the packing's
 * exact range (where it must fall back rather than lose precision).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { rankByExposure } from '@/server/engine/resilience';

function reference(households: Float64Array): number[] {
  return Array.from(households.keys()).sort((a, b) => households[b] - households[a] || a - b);
}

describe('rankByExposure', () => {
  it('orders as the comparator sort on random households with ties', () => {
    fc.assert(
      fc.property(fc.array(fc.oneof(fc.constant(0), fc.integer({ min: 0, max: 50 }), fc.integer({ min: 0, max: 2_147_483_647 })), { maxLength: 3000 }), (values) => {
        const households = Float64Array.from(values);
        expect(Array.from(rankByExposure(households))).toEqual(reference(households));
      }),
      { numRuns: 200 },
    );
  });

  it('keeps exact order where packed keys would lose precision', () => {
    // 2^50 households with 4 elements needs 2^52+ in the key: beyond what a float holds exactly with the id
    const households = Float64Array.from([2 ** 50, 2 ** 50 + 1, 2 ** 50, 3]);
    expect(Array.from(rankByExposure(households))).toEqual([1, 0, 2, 3]);
    const big = Float64Array.from({ length: 5000 }, (_, i) => (i % 7) * 2 ** 45 + (i % 3));
    expect(Array.from(rankByExposure(big))).toEqual(reference(big));
  });

  it('ranks a national-scale list as the comparator does', () => {
    let seed = 12345;
    const next = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31);
    const households = Float64Array.from({ length: 900_000 }, () => (next() % 4 === 0 ? 0 : next() % 200_000));
    expect(Array.from(rankByExposure(households))).toEqual(reference(households));
  });
});

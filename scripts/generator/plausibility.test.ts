/**
 * Generated networks are plausible: every off-air feed lies within radio
 * horizon and above the planning minimum, and the only failed checks are the
 * deliberate faults (undeclared on-channel relays), in the share asked for.
 * Judged by the feed checks themselves (server/checks).
 */
import { describe, expect, it } from 'vitest';
import type { NetworkDocument } from '@/shared/schemas/network';
import { computeFeedChecks } from '@/server/checks/feedChecks';
import { feedCheckInput, indexNetwork, networkCheckFailures } from '@/server/checks/networkChecks';
import { antennaHeightAsl } from '@/server/checks/checkInputs';
import { generateNetwork } from './index';

/** Off-air main feeds that are not part of a planted loop pair: where a fault may be planted. */
function plantable(doc: NetworkDocument) {
  const siteOf = new Map(doc.carriages.map((c) => [c.code, c.site]));
  const feeds = doc.feeds.filter((f) => f.medium === 'off-air' && f.role === 'main');
  // A loop pair's two relays feed each other: each is the other's source.
  const pairs = new Set(feeds.map((f) => `${siteOf.get(f.from)}>${siteOf.get(f.to)}`));
  return feeds.filter((f) => !pairs.has(`${siteOf.get(f.to)}>${siteOf.get(f.from)}`));
}

describe.each([
  [3000, 11, undefined, 0.02],
  [3000, 12, 0, 0],
  [2000, 13, 0.1, 0.1],
])('a generated network of %i sites (seed %i, faultShare %s)', (sites, seed, faultShare, expected) => {
  const doc = generateNetwork({ sites, seed, faultShare });
  const index = indexNetwork(doc);
  const offAir = doc.feeds.filter((f) => f.medium === 'off-air');

  it('has every off-air feed inside the radio horizon and at or above the planning minimum', () => {
    expect(offAir.length).toBeGreaterThan(sites);
    for (const feed of offAir) {
      const checks = computeFeedChecks(feedCheckInput(index, feed)).checks;
      const horizon = checks.find((c) => c.name === 'horizon')!;
      const field = checks.find((c) => c.name === 'field-strength')!;
      expect(horizon.ok, `${feed.code}: ${horizon.note}`).toBe(true);
      expect(field.ok, `${feed.code}: ${field.note}`).toBe(true);
    }
  });

  it('agrees with the textbook horizon, d <= 4.12 (sqrt h1 + sqrt h2) km for k = 4/3 (common practice)', () => {
    for (const feed of offAir) {
      const input = feedCheckInput(index, feed);
      const h1 = antennaHeightAsl(input.sourceSite, input.source);
      const h2 = antennaHeightAsl(input.targetSite, input.target);
      if (!h1.ok || !h2.ok) throw new Error(`${feed.code}: heights missing`);
      const distance = computeFeedChecks(input).distanceKm;
      expect(distance, feed.code).toBeLessThanOrEqual(4.12 * (Math.sqrt(h1.value) + Math.sqrt(h2.value)) + 0.05);
    }
  });

  it(`fails no check but the planted channel clashes, on ${String(expected * 100)} % of the off-air main feeds`, () => {
    const { failures } = networkCheckFailures(doc);
    expect(new Set(failures.map((f) => f.check.name)).size).toBeLessThanOrEqual(1);
    for (const f of failures) {
      expect(f.check.name, f.feed).toBe('channel-clash');
      const feed = index.feeds.get(f.feed)!;
      expect([feed.medium, feed.role]).toEqual(['off-air', 'main']);
      expect(index.carriages.get(feed.to)!.onChannelRepeater).toBeUndefined();
    }
    const eligible = plantable(doc).length;
    // A quota, not a dice roll: the share is exact to a carriage or two (unfed carriages have no feed to fail).
    expect(Math.abs(failures.length - expected * eligible)).toBeLessThanOrEqual(Math.max(2, 0.002 * eligible));
    if (expected > 0) expect(failures.length).toBeGreaterThan(0);
  });
});

describe('faultShare', () => {
  it.each([-0.1, 1.5, Number.NaN])('refuses %s', (faultShare) => {
    expect(() => generateNetwork({ sites: 10, seed: 1, faultShare })).toThrow(/faultShare must be a number from 0 to 1/);
  });

  it('keeps the generator deterministic', () => {
    expect(JSON.stringify(generateNetwork({ sites: 800, seed: 4, faultShare: 0.05 }))).toBe(JSON.stringify(generateNetwork({ sites: 800, seed: 4, faultShare: 0.05 })));
  });
});

/**
 * Source carriages nearest first (server/services/inventory/sources.ts) solve
 * only the geodesics they need: the answer must be exactly the one solving
 * every geodesic and sorting gives, for any carriage, search and limit.
 */
import { describe, expect, it } from 'vitest';
import { geodesicInverse } from '@/shared/rf/geodesy';
import type { NetworkDocument } from '@/shared/schemas/network';
import { sourceCarriages } from '@/server/services/inventory/sources';
import { buildServedNetwork } from '@/server/services/servedNetwork';
import { nationalNetwork, prng } from '../../helpers/random-network';

function everyGeodesic(doc: NetworkDocument, code: string, text: string, limit: number) {
  const sites = new Map(doc.sites.map((s) => [s.code, s]));
  const target = doc.carriages.find((c) => c.code === code)!;
  const here = sites.get(target.site)!;
  const rows = doc.carriages
    .filter((c) => c.service === target.service && c.code !== code)
    .map((c) => ({ c, site: sites.get(c.site)! }))
    .filter(({ c, site }) => !text || `${c.code} ${site.code} ${site.name}`.toLowerCase().includes(text))
    .map(({ c, site }) => {
      const g = geodesicInverse(here.lat, here.lon, site.lat, site.lon);
      return { carriage: c.code, site: site.code, siteName: site.name, distanceKm: g.distanceKm, bearingDeg: g.initialBearingDeg };
    })
    .sort((a, b) => a.distanceKm - b.distanceKm || a.carriage.localeCompare(b.carriage));
  return { items: rows.slice(0, limit), total: rows.length };
}

/** Sites spread over the whole globe, poles and the antimeridian included, some sharing a position. */
function worldNetwork(seed: number): NetworkDocument {
  const rnd = prng(seed);
  const sites = Array.from({ length: 300 }, (_, i) => ({
    code: `W${i}`,
    name: `World ${i % 7}`,
    role: i === 0 ? ('origin' as const) : ('relay' as const),
    lat: i % 50 === 0 ? 90 : i % 37 === 0 ? -90 : Math.round((rnd() * 180 - 90) * 10) / 10,
    lon: i % 11 === 0 ? 180 : i % 13 === 0 ? -180 : Math.round((rnd() * 360 - 180) * 10) / 10,
  }));
  return {
    sites,
    services: [{ code: 'S', name: 'Service', kind: 'other' }],
    groups: [],
    carriages: sites.map((s) => ({ code: `${s.code}.S`, site: s.code, service: 'S' })),
    feeds: [],
  } as unknown as NetworkDocument;
}

describe('sourceCarriages', () => {
  // Where the straight-line order and the geodesic order differ. From (0, 0): the pole is a
  // meridian quadrant away (10,001.966 km on WGS84) and (0, 89.83) 89.83/90 of a quarter
  // equator (a pi / 2 = 10,018.754 km), 9,999.8 km: nearer. Their chords are
  // sqrt(a^2 + b^2) = 9,004.9 km and 2 a sin(44.915 deg) = 9,006.6 km: the pole first.
  it('solves past the chord order where it differs from the geodesic order', () => {
    const doc = worldNetwork(1);
    doc.sites = [
      { code: 'H', name: 'Here', role: 'origin', lat: 0, lon: 0 },
      { code: 'P', name: 'Pole', role: 'relay', lat: 90, lon: 0 },
      { code: 'E', name: 'Equator', role: 'relay', lat: 0, lon: 89.83 },
    ];
    doc.carriages = doc.sites.map((s) => ({ code: `${s.code}.S`, site: s.code, service: 'S' }));
    const got = sourceCarriages(buildServedNetwork(doc, 1), 'H.S', { limit: 1 });
    expect(got.items.map((i) => i.carriage)).toEqual(['E.S']);
    expect(got.items[0].distanceKm).toBeCloseTo((10018.754 * 89.83) / 90, 2);
    expect(got.total).toBe(2);
  });

  it.each([
    ['a national network', nationalNetwork({ sites: 1500, seed: 7, services: 3 })],
    ['sites over the whole globe', worldNetwork(11)],
  ])('answers what solving every geodesic answers, on %s', (_name, doc) => {
    const m = buildServedNetwork(doc, 1);
    const rnd = prng(3);
    for (let i = 0; i < 25; i++) {
      const code = doc.carriages[Math.floor(rnd() * doc.carriages.length)].code;
      const limit = [1, 2, 8, 20, 100][i % 5];
      const text = ['', '', '1', 'world 3', 'zz'][i % 5];
      const got = sourceCarriages(m, code, { q: text, limit });
      expect(got).toEqual({ networkVersion: 1, carriage: code, site: expect.any(String), service: expect.any(String), ...everyGeodesic(doc, code, text, limit) });
    }
  });
});

/**
 * The carriages a feed into one carriage could come from: the other
 * carriages of its service, nearest first, with the distance and the bearing
 * from the receiving site (where a receive antenna would point), on WGS84
 * with the project's geodesic helper (shared/rf/geodesy.ts, checked against
 * GeographicLib's published test values in geodesy.test.ts). Read from the
 * served in-memory network.
 *
 * The picker asks as someone types, and one geodesic costs tens of
 * microseconds (20,000 took 955 ms on the shared 2-core development machine):
 * a service of 20,000 carriages solved whole held the event loop for about a
 * second per keystroke. So each candidate gets its
 * straight-line (chord) distance, which is never longer than the geodesic,
 * and geodesics are solved only for the `limit` straight-line nearest and
 * for those whose chord is within the farthest of these: the same answer as
 * solving them all, solving little more than `limit`. The sites' Earth-centred
 * positions are kept per network version.
 */
import { chordKm, ecefKm, geodesicInverse } from '@/shared/rf/geodesy';
import type { Site } from '@/shared/schemas/network';
import type { SourcesAnswer } from '@/shared/schemas/editing';
import { notFound } from '../../http/errors';
import type { ServedNetwork } from '../servedNetwork';

type Row = SourcesAnswer['items'][number];
type Place = { carriage: string; site: Site; xyz: [number, number, number] };
const nearestFirst = (a: Row, b: Row) => a.distanceKm - b.distanceKm || a.carriage.localeCompare(b.carriage);

/** Each service's carriages with their site's Earth-centred position, once per network version. */
const placesOf = new WeakMap<ServedNetwork, Map<string, Place[]>>();
function servicePlaces(m: ServedNetwork, service: string): Place[] {
  let byService = placesOf.get(m);
  if (!byService) {
    byService = new Map();
    for (const c of m.document.carriages) {
      const site = m.sites.get(c.site)!;
      let list = byService.get(c.service);
      if (!list) byService.set(c.service, (list = []));
      list.push({ carriage: c.code, site, xyz: ecefKm(site.lat, site.lon) });
    }
    placesOf.set(m, byService);
  }
  return byService.get(service) ?? [];
}

/** The `k` entries with the smallest `chord`, in one pass (k is at most 100). */
function smallest<T extends { chord: number }>(items: readonly T[], k: number): T[] {
  const kept: T[] = [];
  for (const item of items) {
    if (kept.length === k && item.chord >= kept[k - 1].chord) continue;
    let i = kept.length === k ? k - 1 : kept.length;
    while (i > 0 && kept[i - 1].chord > item.chord) {
      kept[i] = kept[i - 1];
      i--;
    }
    kept[i] = item;
  }
  return kept;
}

const solve = (here: Site, place: Place): Row => {
  const g = geodesicInverse(here.lat, here.lon, place.site.lat, place.site.lon);
  return { carriage: place.carriage, site: place.site.code, siteName: place.site.name, distanceKm: g.distanceKm, bearingDeg: g.initialBearingDeg };
};

export function sourceCarriages(m: ServedNetwork, code: string, q: { q?: string; limit: number }): SourcesAnswer {
  const target = m.carriages.get(code);
  if (!target) throw notFound(`no carriage with code ${code}`, { code });
  const here = m.sites.get(target.site)!;
  const hereXyz = ecefKm(here.lat, here.lon);
  const text = q.q?.trim().toLowerCase() ?? '';
  const candidates: { place: Place; chord: number }[] = [];
  for (const place of servicePlaces(m, target.service)) {
    if (place.carriage === code) continue;
    const { site } = place;
    if (text && !`${place.carriage} ${site.code} ${site.name}`.toLowerCase().includes(text)) continue;
    candidates.push({ place, chord: chordKm(hereXyz, place.xyz) });
  }
  // Any `limit` candidates bound the limit-th nearest distance from above; the straight-line
  // nearest give a tight bound. Only a candidate whose chord is within it can be in the answer.
  const first = new Map(smallest(candidates, q.limit).map((c) => [c, solve(here, c.place)]));
  // A micrometre of slack: between points metres apart the chord and the geodesic agree to
  // rounding, and a chord rounded a hair above its geodesic must not drop a tie at the bound.
  const bound = Math.max(0, ...[...first.values()].map((r) => r.distanceKm)) + 1e-9;
  const rows = candidates.filter((c) => c.chord <= bound).map((c) => first.get(c) ?? solve(here, c.place));
  rows.sort(nearestFirst);
  return { networkVersion: m.networkVersion, carriage: code, site: here.code, service: target.service, items: rows.slice(0, q.limit), total: candidates.length };
}

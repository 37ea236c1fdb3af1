/**
 * The carriages a feed into one carriage could come from: the other
 * carriages of its service, nearest first, with the distance and the bearing
 * from the receiving site (where a receive antenna would point), on WGS84
 * with the project's geodesic helper (shared/rf/geodesy.ts, checked against
 * GeographicLib's published test values in geodesy.test.ts). Read from the
 * served in-memory network: a service of 20,000 carriages is one pass.
 */
import { geodesicInverse } from '@/shared/rf/geodesy';
import type { SourcesAnswer } from '@/shared/schemas/editing';
import { notFound } from '../../http/errors';
import type { ServedNetwork } from '../servedNetwork';

export function sourceCarriages(m: ServedNetwork, code: string, q: { q?: string; limit: number }): SourcesAnswer {
  const target = m.carriages.get(code);
  if (!target) throw notFound(`no carriage with code ${code}`, { code });
  const here = m.sites.get(target.site)!;
  const text = q.q?.trim().toLowerCase() ?? '';
  const rows: SourcesAnswer['items'] = [];
  for (const c of m.document.carriages) {
    if (c.service !== target.service || c.code === code) continue;
    const site = m.sites.get(c.site)!;
    if (text && !`${c.code} ${site.code} ${site.name}`.toLowerCase().includes(text)) continue;
    const g = geodesicInverse(here.lat, here.lon, site.lat, site.lon);
    rows.push({ carriage: c.code, site: site.code, siteName: site.name, distanceKm: g.distanceKm, bearingDeg: g.initialBearingDeg });
  }
  rows.sort((a, b) => a.distanceKm - b.distanceKm || a.carriage.localeCompare(b.carriage));
  return { networkVersion: m.networkVersion, carriage: code, site: here.code, service: target.service, items: rows.slice(0, q.limit), total: rows.length };
}

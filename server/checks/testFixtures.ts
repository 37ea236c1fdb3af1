/** Invented test network around a made-up valley; names and positions are fictional. */
import * as geographiclib from 'geographiclib-geodesic';
import type { Carriage, Feed, ServiceKind, Site } from '@/shared/schemas/network';
import type { FeedCheckInput } from './feedChecks';

type Lib = typeof geographiclib;
const lib: Lib = (geographiclib as unknown as { default?: Lib }).default ?? geographiclib;

/**
 * Places a point `km` from (lat, lon) along azimuth `az` with GeographicLib's direct solver,
 * so test geometry does not depend on the inverse solver under test. Returns the point and
 * the azimuth from that point back towards the start, [0, 360).
 */
export function place(lat: number, lon: number, az: number, km: number) {
  const r = lib.Geodesic.WGS84.Direct(lat, lon, az, km * 1000, lib.Geodesic.LATITUDE | lib.Geodesic.LONGITUDE | lib.Geodesic.AZIMUTH);
  const back = (((r.azi2! + 180) % 360) + 360) % 360;
  return { lat: r.lat2!, lon: r.lon2!, backAzimuthDeg: back };
}

export const PARENT_POS = { lat: 51.2, lon: 9.4 };

export function site(code: string, over: Partial<Site> = {}): Site {
  return { code, name: `Site ${code}`, role: 'relay', lat: PARENT_POS.lat, lon: PARENT_POS.lon, groundHeightM: 200, mastHeightM: 50, ...over } as Site;
}

export function carriage(code: string, siteCode: string, over: Partial<Carriage> = {}): Carriage {
  return { code, site: siteCode, service: 'SVC', ...over } as Carriage;
}

export interface Scenario {
  kind?: ServiceKind;
  km?: number;
  az?: number;
  feed?: Partial<Feed>;
  source?: Partial<Carriage>;
  target?: Partial<Carriage>;
  sourceSite?: Partial<Site>;
  targetSite?: Partial<Site>;
}

/** Parent site "Greyfell" (P) feeding relay "Ousel Cross" (R) `km` away along azimuth `az` from P. */
export function scenario(s: Scenario = {}): FeedCheckInput & { expectedBearingDeg: number } {
  const at = place(PARENT_POS.lat, PARENT_POS.lon, s.az ?? 40, s.km ?? 10);
  const sourceSite = site('GREYFELL', { role: 'main', groundHeightM: 300, mastHeightM: 150, ...s.sourceSite });
  const targetSite = site('OUSEL-X', { lat: at.lat, lon: at.lon, groundHeightM: 100, mastHeightM: 30, ...s.targetSite });
  const source = carriage('GF-1', 'GREYFELL', { frequencyMHz: 100, erpW: 1000, ...s.source });
  const target = carriage('OX-1', 'OUSEL-X', { frequencyMHz: 96, erpW: 10, ...s.target });
  const feed = { code: 'F-OX', from: 'GF-1', to: 'OX-1', medium: 'off-air', role: 'main', ...s.feed } as Feed;
  return { feed, source, target, sourceSite, targetSite, serviceKind: s.kind ?? 'fm', expectedBearingDeg: at.backAzimuthDeg };
}

/**
 * Placing sites on the WGS84 ellipsoid for generated networks: a site at a
 * distance and bearing from another (the direct geodesic problem), and the
 * bearing a receiving site points along to its parent. Both are GeographicLib
 * (Karney, "Algorithms for geodesics", J. Geodesy 87, 2013), like
 * shared/rf/geodesy.ts, so recorded bearings agree with the feed checks.
 */
import * as geographiclib from 'geographiclib-geodesic';
import { geodesicInverse, normaliseDeg } from '@/shared/rf/geodesy';

type Lib = typeof geographiclib;
// A UMD bundle: its exports arrive named or under `default`, depending on the loader.
const lib: Lib = (geographiclib as unknown as { default?: Lib }).default ?? geographiclib;
const WGS84 = lib.Geodesic.WGS84;
const DIRECT_MASK = lib.Geodesic.LATITUDE | lib.Geodesic.LONGITUDE | lib.Geodesic.AZIMUTH;

export interface Placed {
  lat: number;
  lon: number;
  /** bearing from the new site back to the one it was placed from, degrees [0, 360) */
  bearingBackDeg: number;
}

/** The point `distanceKm` from (lat, lon) along initial bearing `bearingDeg`. */
export function placeFrom(lat: number, lon: number, bearingDeg: number, distanceKm: number): Placed {
  const r = WGS84.Direct(lat, lon, bearingDeg, distanceKm * 1000, DIRECT_MASK);
  if (r.lat2 === undefined || r.lon2 === undefined || r.azi2 === undefined) throw new Error('geodesic solver returned no position');
  // azi2 is the direction of travel on arrival; the way back starts opposite to it.
  return { lat: r.lat2, lon: wrapLon(r.lon2), bearingBackDeg: normaliseDeg(r.azi2 + 180) };
}

/** Bearing from a receiving site to its parent, degrees [0, 360), and the distance, km. */
export function bearingTo(fromLat: number, fromLon: number, toLat: number, toLon: number): { bearingDeg: number; distanceKm: number } {
  const r = geodesicInverse(fromLat, fromLon, toLat, toLon);
  return { bearingDeg: r.initialBearingDeg, distanceKm: r.distanceKm };
}

export function wrapLon(lon: number): number {
  const w = ((((lon + 180) % 360) + 360) % 360) - 180;
  return w === -180 ? 180 : w;
}

/** Rounds to a fixed number of decimals, as a value a person would record. */
export function round(value: number, decimals: number): number {
  const f = 10 ** decimals;
  return Math.round(value * f) / f;
}

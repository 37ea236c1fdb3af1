/**
 * Ellipsoidal distance and bearings on WGS84 (a = 6378137 m, f = 1/298.257223563),
 * via GeographicLib (Karney, "Algorithms for geodesics", J. Geodesy 87, 2013).
 * A spherical formula misses the published test tolerances (docs/checks.md, "Distance and bearing").
 */
import * as geographiclib from 'geographiclib-geodesic';

type Lib = typeof geographiclib;
// The package is a UMD/CommonJS bundle: depending on the loader (tsx, vitest, Metro) its
// exports arrive either as named exports or wrapped in `default`.
const lib: Lib = (geographiclib as unknown as { default?: Lib }).default ?? geographiclib;
const WGS84 = lib.Geodesic.WGS84;
const MASK = lib.Geodesic.DISTANCE | lib.Geodesic.AZIMUTH;

export interface GeodesicInverse {
  /** Ellipsoidal (geodesic) distance, km. */
  distanceKm: number;
  /** Forward azimuth at point 1 towards point 2, degrees clockwise from true north, [0, 360). */
  initialBearingDeg: number;
  /** Forward azimuth at point 2 (direction of travel on arrival), degrees, [0, 360). */
  finalBearingDeg: number;
}

/** Wraps any angle in degrees into [0, 360). */
export function normaliseDeg(deg: number): number {
  const r = deg % 360;
  const n = r < 0 ? r + 360 : r;
  // -1e-15 % 360 + 360 rounds to exactly 360 in floating point; -0 would print as "-0".
  return n >= 360 || n === 0 ? 0 : n;
}

/** Smallest absolute difference between two bearings, degrees in [0, 180]. */
export function bearingDifferenceDeg(a: number, b: number): number {
  const d = normaliseDeg(a - b);
  return d > 180 ? 360 - d : d;
}

function checkCoordinate(name: string, value: number, isLatitude: boolean): void {
  if (typeof value !== 'number' || !Number.isFinite(value)) throw new RangeError(`${name} must be a finite number (got ${String(value)})`);
  if (isLatitude && Math.abs(value) > 90) throw new RangeError(`${name} must be between -90 and 90 (got ${value})`);
}

/**
 * Inverse geodesic problem on WGS84: distance and bearings from (lat1, lon1) to (lat2, lon2).
 * Longitudes may be outside [-180, 180] (they are reduced, as GeographicLib does).
 */
export function geodesicInverse(lat1: number, lon1: number, lat2: number, lon2: number): GeodesicInverse {
  checkCoordinate('lat1', lat1, true);
  checkCoordinate('lon1', lon1, false);
  checkCoordinate('lat2', lat2, true);
  checkCoordinate('lon2', lon2, false);
  const r = WGS84.Inverse(lat1, lon1, lat2, lon2, MASK);
  if (r.s12 === undefined || r.azi1 === undefined || r.azi2 === undefined) {
    throw new Error('geodesic solver returned no distance or azimuth');
  }
  return {
    distanceKm: r.s12 / 1000,
    initialBearingDeg: normaliseDeg(r.azi1),
    finalBearingDeg: normaliseDeg(r.azi2),
  };
}

/** Raw GeographicLib solution (metres, azimuths in (-180, 180]), for tests against its own suite. */
export function geodesicInverseRaw(lat1: number, lon1: number, lat2: number, lon2: number) {
  return WGS84.Inverse(lat1, lon1, lat2, lon2, lib.Geodesic.ALL);
}

const A_KM = WGS84.a / 1000;
const E2 = WGS84.f * (2 - WGS84.f);

/** Earth-centred, Earth-fixed position of a point on the WGS84 ellipsoid (height 0), km. */
export function ecefKm(lat: number, lon: number): [number, number, number] {
  const phi = (lat * Math.PI) / 180;
  const lambda = (lon * Math.PI) / 180;
  const sinPhi = Math.sin(phi);
  // Prime vertical radius of curvature: the standard geodetic-to-ECEF conversion.
  const n = A_KM / Math.sqrt(1 - E2 * sinPhi * sinPhi);
  return [n * Math.cos(phi) * Math.cos(lambda), n * Math.cos(phi) * Math.sin(lambda), n * (1 - E2) * sinPhi];
}

/**
 * Straight-line distance between two ECEF points, km. A straight line is never
 * longer than any path between the same points, the geodesic included, so this
 * is a cheap lower bound on geodesicInverse's distance (a few multiplications
 * against its iterative solution).
 */
export function chordKm(a: readonly number[], b: readonly number[]): number {
  const dx = a[0] - b[0];
  const dy = a[1] - b[1];
  const dz = a[2] - b[2];
  return Math.sqrt(dx * dx + dy * dy + dz * dz);
}

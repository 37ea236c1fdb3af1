/**
 * The diagram's distance scale: a bar of a round length (1, 2 or 5 times a
 * power of ten, in m or km) that fits the room given, measured at the centre
 * of the view. The diagram is Mercator, whose scale changes with latitude,
 * so the bar is true at the middle of the box and the screen says so.
 */
import { geoDistance, type GeoProjection } from 'd3-geo';
import { formatCount } from '@/shared/format';
import { toWorld, type View } from './viewport';

/** Mean earth radius, km (IUGG R1 = 6371.0088 km); a spherical earth is plenty for a scale bar. */
const EARTH_KM = 6371.0088;
/** Screen px either side of the centre over which the scale is measured. */
const PROBE_PX = 50;

export interface ScaleBar {
  /** Length of the bar on screen, px. */
  px: number;
  /** What it stands for, km. */
  km: number;
  /** "20 km", "500 m", "1,000 km". */
  label: string;
}

/** The largest 1-2-5 step at or below `x` (x > 0). */
export function roundDown125(x: number): number {
  const p = 10 ** Math.floor(Math.log10(x));
  const m = x / p;
  // A hair of slack: 5 / 1e-3 must not fall to 2e-3 through rounding.
  return (m >= 5 - 1e-9 ? 5 : m >= 2 - 1e-9 ? 2 : 1) * p;
}

export function scaleLabel(km: number): string {
  if (km >= 1) return `${formatCount(km)} km`;
  return `${formatCount(km * 1000)} m`;
}

/** km per screen px at the centre of the box, measured east-west; null off the map. */
export function kmPerPx(projection: GeoProjection, view: View, width: number, height: number): number | null {
  const invert = projection.invert;
  if (!invert) return null;
  const cy = height / 2;
  const a = invert(toWorld(view, width / 2 - PROBE_PX, cy));
  const b = invert(toWorld(view, width / 2 + PROBE_PX, cy));
  if (!a || !b || ![...a, ...b].every(Number.isFinite)) return null;
  const km = geoDistance(a, b) * EARTH_KM;
  return km > 0 ? km / (2 * PROBE_PX) : null;
}

/** A round-length bar no longer than `maxPx`, or null when there is no scale to show. */
export function scaleBar(projection: GeoProjection, view: View, width: number, height: number, maxPx = 120): ScaleBar | null {
  const per = kmPerPx(projection, view, width, height);
  if (per === null || !(maxPx > 0)) return null;
  const km = roundDown125(per * maxPx);
  return { km, px: km / per, label: scaleLabel(km) };
}

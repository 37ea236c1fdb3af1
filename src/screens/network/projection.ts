/**
 * Places sites on the diagram: a Mercator projection (d3-geo) fitted to the
 * extent of the sites being drawn, so the network fills the box whatever
 * part of the globe it sits in. Mercator keeps local angles true, so the
 * direction from a relay to its parent reads right on the diagram
 * (Snyder, "Map Projections: A Working Manual", USGS PP 1395, 1987, ch. 7).
 */
import { geoMercator, type GeoProjection } from 'd3-geo';

export interface LonLat {
  code: string;
  lat: number;
  lon: number;
}

export interface FittedProjection {
  /** Box-relative px of a lon/lat pair. */
  project: (lon: number, lat: number) => [number, number];
  /** The same, one axis at a time and without making a pair (Mercator's x follows longitude alone, y latitude). */
  x: (lon: number) => number;
  y: (lat: number) => number;
  projection: GeoProjection;
}

/** Below this span (deg) the extent is widened around its centre, so one site or a cluster still gets a sane scale. */
export const MIN_SPAN_DEG = 0.02;

function checkPlace(p: LonLat) {
  if (!Number.isFinite(p.lat) || p.lat < -90 || p.lat > 90) throw new RangeError(`site ${p.code}: latitude ${String(p.lat)} is not between -90 and 90`);
  if (!Number.isFinite(p.lon) || p.lon < -180 || p.lon > 180) throw new RangeError(`site ${p.code}: longitude ${String(p.lon)} is not between -180 and 180`);
}

/**
 * Fits a Mercator projection so every place lies inside the box
 * [pad, width - pad] x [pad, height - pad]. Returns null when there is
 * nothing to place. Latitudes are clipped at +-85 deg, where Mercator
 * runs away (the usual web-map limit, common practice).
 */
export function fitProjection(places: readonly LonLat[], width: number, height: number, pad = 24): FittedProjection | null {
  if (!(width > 2 * pad) || !(height > 2 * pad)) throw new RangeError(`fitProjection: the box ${width} x ${height} px leaves no room inside a ${pad} px margin`);
  if (places.length === 0) return null;
  let south = Infinity;
  let north = -Infinity;
  let west = Infinity;
  let east = -Infinity;
  for (const p of places) {
    checkPlace(p);
    const lat = Math.max(-85, Math.min(85, p.lat));
    south = Math.min(south, lat);
    north = Math.max(north, lat);
    west = Math.min(west, p.lon);
    east = Math.max(east, p.lon);
  }
  if (north - south < MIN_SPAN_DEG && east - west < MIN_SPAN_DEG) {
    const midLat = (north + south) / 2;
    const midLon = (east + west) / 2;
    south = midLat - MIN_SPAN_DEG / 2;
    north = midLat + MIN_SPAN_DEG / 2;
    west = midLon - MIN_SPAN_DEG / 2;
    east = midLon + MIN_SPAN_DEG / 2;
  }
  // The four corners of the extent stand for all the places: in Mercator the
  // projected box of the corners is the projected box of everything inside.
  const corners = {
    type: 'MultiPoint' as const,
    coordinates: [
      [west, south],
      [west, north],
      [east, south],
      [east, north],
    ],
  };
  const projection = geoMercator()
    .center([(west + east) / 2, (south + north) / 2])
    .fitExtent(
      [
        [pad, pad],
        [width - pad, height - pad],
      ],
      corners,
    );
  // The fitted projection as arithmetic: x = x0 + k.lon, y = y0 - k.ln(tan(pi/4 + lat/2)) (lon and lat in
  // radians; Snyder, eq. 7-1 and 7-2), with the origin and scale d3 fitted. Through d3 each site's pair cost
  // the first frame of a national network some 30 ms; a test holds the two to the same pixels.
  const origin = projection([0, 0]) ?? [NaN, NaN];
  const k = projection.scale();
  const x = (lon: number) => origin[0] + k * (lon * RADIANS);
  const y = (lat: number) => origin[1] - k * Math.log(Math.tan(Math.PI / 4 + (Math.max(-85, Math.min(85, lat)) * RADIANS) / 2));
  return { projection, x, y, project: (lon, lat) => [x(lon), y(lat)] };
}

const RADIANS = Math.PI / 180;

/**
 * A faint outline of land behind the diagram, so a person can orient
 * themselves. Two outlines, and the screen names the one it draws:
 * - the demo region's invented coastline (assets/demo/demo-coast.json),
 *   drawn when every site of the network stands on it: the demo network
 *   lies in open ocean, where no real map has land;
 * - otherwise Natural Earth's 1:110m land polygons (public domain), as
 *   packaged in `world-atlas` (TopoJSON).
 * The choice follows from the data alone (the sites' positions), so the
 * server and the network document carry nothing extra. Each outline becomes
 * one SVG path with the diagram's own projection, clipped to a margin around
 * the diagram box so the path stays small.
 */
import { geoBounds, geoContains, geoPath, type GeoPermissibleObjects, type GeoProjection } from 'd3-geo';
import type { FeatureCollection, MultiPolygon } from 'geojson';
import { feature } from 'topojson-client';
import type { GeometryCollection, Topology } from 'topojson-specification';
import land110 from 'world-atlas/land-110m.json';
import demoCoast from '@/assets/demo/demo-coast.json';

export type LandKind = 'demo' | 'natural-earth';

export const LAND_SOURCE = 'Natural Earth 1:110m land (public domain), from the world-atlas package';
export const DEMO_LAND_SOURCE = 'Invented demo coastline (the demo region is made up: no real place)';

/** What the screen says about the outline it draws. */
export const LAND_CREDIT: Record<LandKind, string> = { demo: DEMO_LAND_SOURCE, 'natural-earth': LAND_SOURCE };

export const DEMO_COAST = demoCoast as unknown as FeatureCollection<MultiPolygon>;
// [[west, south], [east, north]]: a cheap first test before the polygon test.
const DEMO_BOUNDS = geoBounds(DEMO_COAST);

/** Corners of the demo island's bounding box: the diagram fits them too, so the whole island shows. */
export const DEMO_COAST_CORNERS = [
  { code: 'coast-sw', lon: DEMO_BOUNDS[0][0], lat: DEMO_BOUNDS[0][1] },
  { code: 'coast-ne', lon: DEMO_BOUNDS[1][0], lat: DEMO_BOUNDS[1][1] },
] as const;

let naturalEarth: GeoPermissibleObjects | null = null;

/** The land outline as GeoJSON, ready for d3-geo. */
export function landGeometry(kind: LandKind): GeoPermissibleObjects {
  if (kind === 'demo') return DEMO_COAST;
  if (!naturalEarth) {
    const topology = land110 as unknown as Topology;
    naturalEarth = feature(topology, topology.objects.land as GeometryCollection);
  }
  return naturalEarth;
}

/** True when (lon, lat) is on the invented demo land. */
export function onDemoLand(lon: number, lat: number): boolean {
  const [[west, south], [east, north]] = DEMO_BOUNDS;
  if (lon < west || lon > east || lat < south || lat > north) return false;
  return geoContains(DEMO_COAST, [lon, lat]);
}

/** The invented coastline when every site stands on it (the demo network), else Natural Earth. */
export function landKindFor(sites: readonly { lat: number; lon: number }[]): LandKind {
  if (sites.length === 0) return 'natural-earth';
  for (const s of sites) if (!onDemoLand(s.lon, s.lat)) return 'natural-earth';
  return 'demo';
}

export function landPath(land: GeoPermissibleObjects, projection: GeoProjection, width: number, height: number): string {
  const clipped = projection.clipExtent([
    [-width, -height],
    [2 * width, 2 * height],
  ]);
  try {
    return geoPath(clipped)(land) ?? '';
  } finally {
    projection.clipExtent(null);
  }
}

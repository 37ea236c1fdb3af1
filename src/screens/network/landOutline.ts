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
import type { FeatureCollection, Geometry, MultiPolygon, Position } from 'geojson';
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

/** Each polygon of an outline with its box in degrees ([west, south, east, north] of its vertices). */
type BoxedPolygon = { rings: Position[][]; box: [number, number, number, number] };
const boxedCache = new WeakMap<object, BoxedPolygon[] | null>();

/** The outline's polygons with their boxes (once per outline); null for a shape other than polygons. */
function boxedPolygons(land: GeoPermissibleObjects): BoxedPolygon[] | null {
  const known = boxedCache.get(land);
  if (known !== undefined) return known;
  const out: BoxedPolygon[] = [];
  let ok = true;
  const addPolygon = (rings: Position[][]) => {
    let [w, s, e, n] = [Infinity, Infinity, -Infinity, -Infinity];
    for (const ring of rings) {
      for (const [lon, lat] of ring) {
        if (lon < w) w = lon;
        if (lon > e) e = lon;
        if (lat < s) s = lat;
        if (lat > n) n = lat;
      }
    }
    out.push({ rings, box: [w, s, e, n] });
  };
  const addGeometry = (g: Geometry | null) => {
    if (!g) return;
    if (g.type === 'Polygon') addPolygon(g.coordinates);
    else if (g.type === 'MultiPolygon') for (const p of g.coordinates) addPolygon(p);
    else if (g.type === 'GeometryCollection') for (const c of g.geometries) addGeometry(c);
    else ok = false;
  };
  const any = land as { type: string; features?: { geometry: Geometry | null }[]; geometry?: Geometry | null };
  if (any.type === 'FeatureCollection') for (const f of any.features ?? []) addGeometry(f.geometry);
  else if (any.type === 'Feature') addGeometry(any.geometry ?? null);
  else addGeometry(land as Geometry);
  const result = ok ? out : null;
  boxedCache.set(land, result);
  return result;
}

/** Degrees of slack around the view's box when choosing polygons: an edge between two vertices bends a little on the map. */
const NEAR_DEG = 2;

/**
 * Only the polygons whose box comes near the area [west, south, east, north]
 * (degrees): the rest would all be clipped away, and projecting and clipping
 * the whole world's outline for a view of one region cost the first frame of
 * a national network some 50 ms. Null when every polygon is to be kept.
 */
export function landNear(land: GeoPermissibleObjects, west: number, south: number, east: number, north: number): GeoPermissibleObjects | null {
  const polygons = boxedPolygons(land);
  if (!polygons || !(east - west < 300)) return null;
  const kept = polygons.filter(({ box: [w, s, e, n] }) => e >= west - NEAR_DEG && w <= east + NEAR_DEG && n >= south - NEAR_DEG && s <= north + NEAR_DEG);
  return { type: 'MultiPolygon', coordinates: kept.map((p) => p.rings) };
}

export function landPath(land: GeoPermissibleObjects, projection: GeoProjection, width: number, height: number): string {
  const clipped = projection.clipExtent([
    [-width, -height],
    [2 * width, 2 * height],
  ]);
  try {
    // The clip box in degrees (Mercator: a box on the map is a box of longitudes and latitudes).
    const a = projection.invert?.([-width, 2 * height]);
    const b = projection.invert?.([2 * width, -height]);
    const near = a && b && Number.isFinite(a[0] + a[1] + b[0] + b[1]) && a[0] < b[0] ? landNear(land, a[0], a[1], b[0], b[1]) : null;
    return geoPath(clipped)(near ?? land) ?? '';
  } finally {
    projection.clipExtent(null);
  }
}

/**
 * A faint outline of land behind the diagram, so a person can orient
 * themselves: Natural Earth's 1:110m land polygons (public domain), as
 * packaged in `world-atlas` (TopoJSON), turned into one SVG path with the
 * diagram's own projection. Clipped to a margin around the diagram box, so
 * the path stays small.
 */
import { geoPath, type GeoProjection } from 'd3-geo';
import { feature } from 'topojson-client';
import type { GeometryCollection, Topology } from 'topojson-specification';

export const LAND_SOURCE = 'Natural Earth 1:110m land (public domain), from the world-atlas package';

export function landPath(topology: Topology, projection: GeoProjection, width: number, height: number): string {
  const land = feature(topology, topology.objects.land as GeometryCollection);
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

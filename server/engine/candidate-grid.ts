/**
 * Where a new off-air feed could come from: the fed carriages of one service
 * bucketed by their site's position, so proposals (proposals.ts) look only at
 * sources that could be within reach instead of every carriage of the
 * service. A plain grid keyed by cell over latitude and longitude: a query is
 * a handful of map look-ups, cheaper than a general spatial index (such as
 * @turf/turf's) for this one question.
 *
 * Exactness: `near` returns a superset of the carriages whose
 * `distanceLowerBoundKm` to the target is at most the radius, so a source it
 * leaves out could never pass the distance checks that follow.
 */
import type { EngineCore } from './core';

/** Kilometres per degree of latitude, a little under the true ~110.57 so no bound ever exceeds a true distance. */
export const KM_PER_DEGREE_LOW = 110;
/** Cell size, degrees (about 55 km north-south). */
const CELL_DEG = 0.5;

const cosDeg = (deg: number) => Math.cos((deg * Math.PI) / 180);

/** A cheap lower bound on the distance between two sites, km (never above the true distance). */
export function distanceLowerBoundKm(core: EngineCore, a: number, b: number): number {
  const sa = core.model.sites[a];
  const sb = core.model.sites[b];
  const dLat = Math.abs(sa.lat - sb.lat);
  let dLon = Math.abs(sa.lon - sb.lon);
  if (dLon > 180) dLon = 360 - dLon;
  const minCos = Math.min(cosDeg(Math.min(Math.abs(sa.lat), 89.9)), cosDeg(Math.min(Math.abs(sb.lat), 89.9)));
  // Equator-ward of both ends the meridians are furthest apart; the poleward cosine is the safe (small) one.
  return KM_PER_DEGREE_LOW * Math.max(dLat, dLon * Math.max(0, minCos - 0.01));
}

const cellKey = (row: number, col: number) => (row + 400) * 2000 + (col + 1000);

export class CandidateGrid {
  private readonly cells = new Map<number, number[]>();
  /** every bucketed node, for queries that reach too far for the grid to help */
  readonly all: number[] = [];

  /** `nodes`: local node ids of the service's fed carriages. */
  constructor(
    private readonly core: EngineCore,
    private readonly service: number,
    nodes: Iterable<number>,
  ) {
    const svc = core.services[service];
    for (const u of nodes) {
      const site = core.model.sites[core.model.carriageSite[svc.ref[u]]];
      const key = cellKey(Math.floor(site.lat / CELL_DEG), Math.floor(site.lon / CELL_DEG));
      let list = this.cells.get(key);
      if (!list) this.cells.set(key, (list = []));
      list.push(u);
      this.all.push(u);
    }
  }

  /** Nodes that may lie within `radiusKm` of site `siteId` (by `distanceLowerBoundKm`); a superset. */
  near(siteId: number, radiusKm: number): number[] {
    if (radiusKm < 0) return [];
    const { lat, lon } = this.core.model.sites[siteId];
    // A little slack on each side so rounding at a cell edge never drops a node.
    const dLat = (radiusKm / KM_PER_DEGREE_LOW) * (1 + 1e-9) + 1e-9;
    const band = Math.min(90, Math.abs(lat) + dLat);
    const cosBand = cosDeg(band) - 0.01;
    if (cosBand <= 0) return this.all;
    const dLon = (radiusKm / (KM_PER_DEGREE_LOW * cosBand)) * (1 + 1e-9) + 1e-9;
    // A window over the antimeridian: the grid does not wrap, so take everything (rare, still exact).
    if (lon - dLon < -180 || lon + dLon > 180) return this.all;
    const rows = [Math.floor((lat - dLat) / CELL_DEG), Math.floor((lat + dLat) / CELL_DEG)];
    const cols = [Math.floor((lon - dLon) / CELL_DEG), Math.floor((lon + dLon) / CELL_DEG)];
    if ((rows[1] - rows[0] + 1) * (cols[1] - cols[0] + 1) > this.cells.size) return this.all;
    const out: number[] = [];
    for (let r = rows[0]; r <= rows[1]; r++) {
      for (let k = cols[0]; k <= cols[1]; k++) {
        const list = this.cells.get(cellKey(r, k));
        if (list) for (const u of list) out.push(u);
      }
    }
    return out;
  }
}

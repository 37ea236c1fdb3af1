/**
 * Where the sites of a generated network stand and what they carry: a few
 * origins near the middle, main stations on a jittered grid around them,
 * relays in trees under each main (a relay 5-60 km from its parent, up to
 * several hops deep), and a few pairs of relays that will feed each other
 * in a loop. The region is invented and placed over open ocean so that no
 * real place is meant.
 *
 * A relay stands within radio horizon of the site it receives from: the
 * k = 4/3 smooth-earth horizon of the two antennas (shared/rf/propagation.ts,
 * the function the feed checks use), taken from the ground heights and the
 * lowest antenna a carriage there can get (ANTENNA_SHARE.low of the mast).
 * Each site also records how far its farthest off-air receiver is, so its
 * transmitters can be given the power to reach it (./carriages.ts).
 */
import type { Site, SiteRole } from '@/shared/schemas/network';
import { pathHorizonKm } from '@/shared/rf/propagation';
import { SERVICE_SPECS, type Family } from './catalogue';
import { bearingTo, placeFrom, round, wrapLon } from './geo';
import { siteName } from './names';
import type { Prng } from './prng';

export const CENTRE = { lat: -40.5, lon: -24.5 };
const MAIN_SPACING_KM = 45;
const MAX_RELAY_DEPTH = 5;
const KM_PER_DEG_LAT = 111.2;
const MIN_RELAY_KM = 5;
const MAX_RELAY_KM = 60;
/** Off-air paths are kept this far inside the horizon: a margin for rounding and for a planner's caution. */
const HORIZON_USE = 0.9;

/** A carriage's antenna stands at this share of its site's mast (./carriages.ts draws within it). */
export const ANTENNA_SHARE = { low: 0.6, high: 0.95 } as const;

/** The lowest antenna height (m) a carriage on a mast of `mastM` can get: the horizon is planned on it. */
export function lowestAntennaM(mastM: number): number {
  return Math.floor(mastM * ANTENNA_SHARE.low);
}

export interface Counts {
  origins: number;
  mains: number;
  relays: number;
  loopPairs: number;
  unfed: number;
}

/** Site counts for a network of `total` sites (origins + mains + relays + loop relays = total). */
export function planCounts(total: number): Counts {
  const origins = total < 3 ? 1 : Math.min(8, 3 + Math.floor(total / 10000));
  const loopPairs = total >= 50 ? Math.max(1, Math.floor(total / 5000)) : 0;
  const rest = total - origins - 2 * loopPairs;
  const mains = rest > 0 ? Math.max(1, Math.round(rest * 0.04)) : 0;
  return { origins, mains, relays: rest - mains, loopPairs, unfed: total >= 20 ? Math.max(1, Math.floor(total / 5000)) : 0 };
}

export interface SiteDraft {
  site: Site;
  role: SiteRole;
  /** the parent site (relays), else -1 */
  parent: number;
  depth: number;
  /** the main whose tree holds this site (itself for a main), -1 for origins */
  tree: number;
  /** relays: bearing from the relay to its parent, from the placement */
  bearingBackDeg: number;
  /** indices into SERVICE_SPECS, ascending */
  services: number[];
  /** origins: the families of services that enter the network here */
  families: Family[];
  children: number;
  /** Distance (km) to the farthest site that receives from this one off-air (0 when none). */
  reachKm: number;
  gridX: number;
  gridY: number;
}

export interface Layout {
  sites: SiteDraft[];
  origins: number[];
  mains: number[];
  relays: number[];
  loopPairs: Array<[number, number]>;
  gridSide: number;
}

const pad = (n: number, width: number) => String(n).padStart(width, '0');

function originFamilies(i: number, origins: number): Family[] {
  if (origins === 1) return ['tv', 'radio', 'local'];
  if (origins === 2) return i === 0 ? ['tv', 'local'] : ['radio'];
  if (i < 3) return [(['tv', 'radio', 'local'] as const)[i]];
  return [i % 2 === 1 ? 'tv' : 'radio'];
}

/** A made-up terrain: gentle hills, so ground heights vary smoothly with position. */
function terrainM(lat: number, lon: number): number {
  const h = 180 + 160 * Math.sin(lat * 7.3) * Math.cos(lon * 5.1) + 90 * Math.sin(lat * 23 + lon * 17);
  return Math.max(0, h);
}

function offsetFromCentre(dxKm: number, dyKm: number): { lat: number; lon: number } {
  const lat = Math.max(-85, Math.min(85, CENTRE.lat + dyKm / KM_PER_DEG_LAT));
  return { lat, lon: wrapLon(CENTRE.lon + dxKm / (KM_PER_DEG_LAT * Math.cos((lat * Math.PI) / 180))) };
}

function draft(code: string, role: SiteRole, name: string, lat: number, lon: number, extra: Partial<SiteDraft>): SiteDraft {
  return {
    site: { code, name, role, lat: round(lat, 6), lon: round(lon, 6) },
    role, parent: -1, depth: 0, tree: -1, bearingBackDeg: 0, services: [], families: [], children: 0, reachKm: 0, gridX: 0, gridY: 0,
    ...extra,
  };
}

export function layoutSites(prng: Prng, counts: Counts): Layout {
  const sites: SiteDraft[] = [];
  const width = String(Math.max(counts.mains, counts.relays + 2 * counts.loopPairs, 1)).length;
  const origins: number[] = [];
  for (let i = 0; i < counts.origins; i++) {
    const p = offsetFromCentre(prng.between(-25, 25), prng.between(-25, 25));
    const families = originFamilies(i, counts.origins);
    const services = SERVICE_SPECS.flatMap((s, k) => (families.includes(s.family) ? [k] : []));
    origins.push(sites.length);
    sites.push(draft(`O${i + 1}`, 'origin', siteName(prng, 'origin'), p.lat, p.lon, { families, services }));
    const o = sites[sites.length - 1].site;
    o.groundHeightM = Math.round(terrainM(o.lat, o.lon));
    o.mastHeightM = prng.int(20, 60);
  }

  const gridSide = Math.max(1, Math.ceil(Math.sqrt(counts.mains)));
  const mains: number[] = [];
  const localMains = new Set(nearestMains(counts.mains, gridSide, Math.max(1, Math.round(counts.mains * 0.03))));
  for (let i = 0; i < counts.mains; i++) {
    const gridX = i % gridSide;
    const gridY = Math.floor(i / gridSide);
    const half = (gridSide - 1) / 2;
    const p = offsetFromCentre((gridX - half) * MAIN_SPACING_KM + prng.between(-8, 8), (gridY - half) * MAIN_SPACING_KM + prng.between(-8, 8));
    const services = SERVICE_SPECS.flatMap((s, k) => (s.family !== 'local' || localMains.has(i) ? [k] : []));
    const index = sites.length;
    mains.push(index);
    sites.push(draft(`M${pad(i + 1, width)}`, 'main', siteName(prng, 'main'), p.lat, p.lon, { services, tree: index, gridX, gridY }));
    const m = sites[index].site;
    m.groundHeightM = Math.round(terrainM(m.lat, m.lon) + prng.between(200, 500));
    m.mastHeightM = prng.int(150, 320);
    m.households = Math.round(prng.logBetween(20000, 400000) / 100) * 100;
  }

  const relays: number[] = [];
  let relayNumber = 0;
  const base = counts.mains > 0 ? Math.floor(counts.relays / counts.mains) : 0;
  const extra = counts.mains > 0 ? counts.relays % counts.mains : 0;
  for (let m = 0; m < counts.mains; m++) {
    const treeStart = relays.length;
    const size = base + (m < extra ? 1 : 0);
    for (let k = 0; k < size; k++) {
      let parent = mains[m];
      if (k > 0 && prng.chance(0.5)) {
        const candidate = relays[treeStart + prng.int(0, k - 1)];
        if (sites[candidate].depth < MAX_RELAY_DEPTH) parent = candidate;
      }
      relays.push(addRelay(prng, sites, parent, `R${pad(++relayNumber, width)}`, relayServices(prng, sites[parent].services)));
    }
  }

  const loopPairs: Array<[number, number]> = [];
  for (let i = 0; i < counts.loopPairs && counts.mains > 0; i++) {
    const main = prng.pick(mains);
    const first = SERVICE_SPECS.findIndex((s) => s.kind === 'dtt');
    const a = addRelay(prng, sites, main, `R${pad(++relayNumber, width)}`, [first]);
    const b = addRelay(prng, sites, a, `R${pad(++relayNumber, width)}`, [first]);
    // In the loop, a receives from b as well: b must reach back.
    const sa = sites[a].site;
    const sb = sites[b].site;
    sites[b].reachKm = Math.max(sites[b].reachKm, bearingTo(sb.lat, sb.lon, sa.lat, sa.lon).distanceKm);
    relays.push(a, b);
    loopPairs.push([a, b]);
  }
  return { sites, origins, mains, relays, loopPairs, gridSide };
}

function addRelay(prng: Prng, sites: SiteDraft[], parent: number, code: string, services: number[]): number {
  const from = sites[parent];
  const bearing = prng.between(0, 360);
  let km = prng.between(MIN_RELAY_KM, MAX_RELAY_KM);
  const name = siteName(prng, 'relay');
  const lift = prng.between(0, 250);
  const mast = prng.int(15, 60);
  const households = Math.round(prng.logBetween(100, 20000) / (from.depth + 1) / 10) * 10;
  const parentAntennaAsl = (from.site.groundHeightM ?? 0) + lowestAntennaM(from.site.mastHeightM ?? 0);
  // Pull the relay toward its parent until the path is inside the horizon (the ground moves with it).
  let placed = placeFrom(from.site.lat, from.site.lon, bearing, km);
  let ground = Math.round(terrainM(placed.lat, placed.lon) + lift);
  for (let tries = 0; tries < 8; tries++) {
    const limit = HORIZON_USE * pathHorizonKm(parentAntennaAsl, ground + lowestAntennaM(mast));
    if (km <= limit || km <= MIN_RELAY_KM) break;
    km = Math.max(MIN_RELAY_KM, Math.min(km * 0.85, limit));
    placed = placeFrom(from.site.lat, from.site.lon, bearing, km);
    ground = Math.round(terrainM(placed.lat, placed.lon) + lift);
  }
  const index = sites.length;
  const relay = draft(code, 'relay', name, placed.lat, placed.lon, {
    parent, depth: from.depth + 1, tree: from.tree, bearingBackDeg: placed.bearingBackDeg, services,
  });
  relay.site.groundHeightM = ground;
  relay.site.mastHeightM = mast;
  relay.site.households = households;
  from.children++;
  from.reachKm = Math.max(from.reachKm, km);
  sites.push(relay);
  return index;
}

/** What a relay carries: part of what its parent carries (it can only pass on what it receives). */
function relayServices(prng: Prng, parent: readonly number[]): number[] {
  const of = (kind: string) => parent.filter((k) => SERVICE_SPECS[k].kind === kind);
  const tv = of('dtt');
  const fm = of('fm');
  const r = prng.next();
  let chosen: number[];
  if (r < 0.62) chosen = tv.slice(0, prng.int(2, 4));
  else if (r < 0.88) chosen = fm.slice(0, prng.int(2, 4)).concat(fm.filter((k) => SERVICE_SPECS[k].family === 'local'));
  else chosen = tv.slice(0, prng.int(2, 5)).concat(fm, of('dab'));
  if (chosen.length === 0) chosen = parent.slice(0, 3);
  return [...new Set(chosen)].sort((a, b) => a - b);
}

/** The `count` mains nearest the grid centre, where the local studio is. */
function nearestMains(mains: number, side: number, count: number): number[] {
  const half = (side - 1) / 2;
  const distance = (i: number) => Math.hypot((i % side) - half, Math.floor(i / side) - half);
  return Array.from({ length: mains }, (_, i) => i)
    .sort((a, b) => distance(a) - distance(b) || a - b)
    .slice(0, count);
}

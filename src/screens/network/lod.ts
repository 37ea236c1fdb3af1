/**
 * Level of detail for the geographic diagram. Sites are gathered on a square
 * grid in diagram px (zoom 1), one grid per zoom level: level L has cells of
 * CELL_PX / 2^L, so at zoom k = 2^L a cell is CELL_PX on screen. Sites that
 * share a cell are one group (drawn as a circle with their number); a cell
 * with one site is that site. Feed lines are bundled the same way: one line
 * per pair of groups and role, its width growing with the feeds it carries.
 *
 * Each level is built once per network, filter and box size (on first use,
 * then kept), never per frame: a frame only culls the level's typed arrays.
 */
import type { FeedRole, Medium, SiteRole } from '@/shared/schemas/network';
import type { DiagramModel, PlacedDiagram } from './diagramModel';

/** A group's cell on screen at its level's own zoom, px. Our choice: room for a 4-digit count. */
export const CELL_PX = 36;
/** Levels 0..MAX_LEVEL, so the last one serves zoom 2^MAX_LEVEL (viewport.MAX_ZOOM). */
export const MAX_LEVEL = 6;

const ROLE_RANK: Record<SiteRole, number> = { origin: 0, main: 1, relay: 2 };
export const MIXED = 'mixed' as const;

export interface Level {
  level: number;
  /** Cell side in diagram px. */
  cell: number;
  /** Per group: position (the mean of its sites), number of sites, lead site (origin, then main station, then most households). */
  x: Float64Array;
  y: Float64Array;
  count: Int32Array;
  lead: Int32Array;
  /** Per group: how many of its sites are origins and main stations. */
  origins: Int32Array;
  mains: Int32Array;
  /** Per site: its group. */
  groupOf: Int32Array;
  /** Bundled lines between groups: ends (group indices), role, the medium when all share one, and feeds carried. */
  lineA: Int32Array;
  lineB: Int32Array;
  lineRole: FeedRole[];
  lineMedium: (Medium | typeof MIXED)[];
  lineFeeds: Int32Array;
}

export interface LodIndex {
  /** The level for zoom k (the one whose cells are CELL_PX..2*CELL_PX on screen). */
  levelFor(k: number): Level;
  level(l: number): Level;
  /** Levels built so far (for tests and the benchmark). */
  built(): number[];
}

export function levelForZoom(k: number): number {
  if (!(k > 0)) throw new RangeError(`levelForZoom: zoom must be > 0, got ${String(k)}`);
  return Math.max(0, Math.min(MAX_LEVEL, Math.floor(Math.log2(k) + 1e-9)));
}

export function buildLodIndex(model: DiagramModel, placed: PlacedDiagram): LodIndex {
  const cache = new Map<number, Level>();
  const level = (l: number): Level => {
    if (!Number.isInteger(l) || l < 0 || l > MAX_LEVEL) throw new RangeError(`level must be a whole number 0..${MAX_LEVEL}, got ${String(l)}`);
    let built = cache.get(l);
    if (!built) cache.set(l, (built = buildLevel(model, placed, l)));
    return built;
  };
  return { level, levelFor: (k) => level(levelForZoom(k)), built: () => [...cache.keys()].sort((a, b) => a - b) };
}

/** Sites by importance (below zero when a comes first): origins, then main stations, then relays; more households first. It picks a group's lead, and the diagram names sites in this order. */
export function byImportance(model: DiagramModel, a: number, b: number): number {
  const sa = model.sites[a];
  const sb = model.sites[b];
  return ROLE_RANK[sa.role] - ROLE_RANK[sb.role] || (sb.households ?? 0) - (sa.households ?? 0);
}

function better(model: DiagramModel, a: number, b: number): boolean {
  const c = byImportance(model, a, b);
  return c !== 0 ? c < 0 : model.sites[a].code < model.sites[b].code;
}

export function buildLevel(model: DiagramModel, placed: PlacedDiagram, l: number): Level {
  const n = model.sites.length;
  const cell = CELL_PX / 2 ** l;
  const { xs, ys } = placed;
  const groupOf = new Int32Array(n);
  const byCell = new Map<number, number>();
  const sx: number[] = [];
  const sy: number[] = [];
  const count: number[] = [];
  const lead: number[] = [];
  const origins: number[] = [];
  const mains: number[] = [];
  // Cells are keyed as one number: columns and rows stay well inside 2^20 for any box and zoom we allow.
  const COLS = 1 << 21;
  for (let i = 0; i < n; i++) {
    const cx = Math.floor(xs[i] / cell) + (1 << 20);
    const cy = Math.floor(ys[i] / cell) + (1 << 20);
    const key = cy * COLS + cx;
    let g = byCell.get(key);
    if (g === undefined) {
      g = count.length;
      byCell.set(key, g);
      sx.push(0);
      sy.push(0);
      count.push(0);
      lead.push(i);
      origins.push(0);
      mains.push(0);
    } else if (better(model, i, lead[g])) lead[g] = i;
    groupOf[i] = g;
    sx[g] += xs[i];
    sy[g] += ys[i];
    count[g]++;
    const role = model.sites[i].role;
    if (role === 'origin') origins[g]++;
    else if (role === 'main') mains[g]++;
  }
  const groups = count.length;
  const x = new Float64Array(groups);
  const y = new Float64Array(groups);
  for (let g = 0; g < groups; g++) {
    // A lone site stays exactly where it is; a group sits at the mean of its sites.
    x[g] = count[g] === 1 ? xs[lead[g]] : sx[g] / count[g];
    y[g] = count[g] === 1 ? ys[lead[g]] : sy[g] / count[g];
  }

  // Lines: one per unordered pair of groups and role (direction is not drawn).
  // Keyed as one number (pair of groups, then role): text keys cost the first frame tens of ms at 20,000 sites.
  const lines = new Map<number, number>();
  const lineA: number[] = [];
  const lineB: number[] = [];
  const lineRole: FeedRole[] = [];
  const lineMedium: (Medium | typeof MIXED)[] = [];
  const lineFeeds: number[] = [];
  for (const link of model.links) {
    let a = groupOf[link.from];
    let b = groupOf[link.to];
    if (a === b) continue;
    if (a > b) [a, b] = [b, a];
    const key = (a * groups + b) * 2 + (link.role === 'main' ? 0 : 1);
    const at = lines.get(key);
    if (at === undefined) {
      lines.set(key, lineA.length);
      lineA.push(a);
      lineB.push(b);
      lineRole.push(link.role);
      lineMedium.push(link.medium);
      lineFeeds.push(link.feeds);
    } else {
      lineFeeds[at] += link.feeds;
      if (lineMedium[at] !== link.medium) lineMedium[at] = MIXED;
    }
  }
  return {
    level: l,
    cell,
    x,
    y,
    count: Int32Array.from(count),
    lead: Int32Array.from(lead),
    origins: Int32Array.from(origins),
    mains: Int32Array.from(mains),
    groupOf,
    lineA: Int32Array.from(lineA),
    lineB: Int32Array.from(lineB),
    lineRole,
    lineMedium,
    lineFeeds: Int32Array.from(lineFeeds),
  };
}

export interface GroupMarks {
  /** Per group of the level: sites off air and on reserve under the failure set. */
  off: Int32Array;
  reserve: Int32Array;
}

/** Failure marks summed per group: one pass over the marked sites, not over the network. */
export function groupMarks(level: Level, siteIndex: ReadonlyMap<string, number>, statuses: ReadonlyMap<string, 'off-air' | 'on-reserve'>): GroupMarks {
  const off = new Int32Array(level.count.length);
  const reserve = new Int32Array(level.count.length);
  for (const [code, st] of statuses) {
    const i = siteIndex.get(code);
    if (i === undefined) continue;
    const g = level.groupOf[i];
    if (st === 'off-air') off[g]++;
    else reserve[g]++;
  }
  return { off, reserve };
}

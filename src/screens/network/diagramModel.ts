/**
 * What the network diagram draws, built once per network and service filter:
 * sites (those carrying the chosen service, or all), and feed lines merged
 * per site pair, medium and role, so thousands of feeds of many services
 * become one line per visible path. Positions are typed arrays for the
 * culling in ./viewport.ts.
 */
import type { FeedRole, Medium, SiteRole } from '@/shared/schemas/network';
import type { NetworkDrawing } from '@/src/api/schemas';
import type { ReachResult } from '@/src/api/queries/analysis';
import { fitProjection, type LonLat } from './projection';

export interface DiagramSite {
  code: string;
  name: string;
  role: SiteRole;
  lat: number;
  lon: number;
  households: number | null;
  /** Services with a carriage here (within the filter), sorted. */
  services: string[];
  /** Carriage codes here (within the filter), sorted. */
  carriages: string[];
}

export interface DiagramLink {
  from: number;
  to: number;
  medium: Medium;
  role: FeedRole;
  /** Feeds merged into this line. */
  feeds: number;
}

export interface DiagramModel {
  sites: DiagramSite[];
  links: DiagramLink[];
  /** Feeds drawn (merged into links). */
  feedCount: number;
  /** Feeds left out because a carriage they name is not in the document. */
  skippedFeeds: number;
}

export function buildDiagram(doc: NetworkDrawing, service: string | null): DiagramModel {
  const carriageAt = new Map<string, { site: string; service: string }>();
  for (const c of doc.carriages) {
    if (service && c.service !== service) continue;
    carriageAt.set(c.code, { site: c.site, service: c.service });
  }
  const perSite = new Map<string, { services: Set<string>; carriages: string[] }>();
  for (const [code, c] of carriageAt) {
    let entry = perSite.get(c.site);
    if (!entry) perSite.set(c.site, (entry = { services: new Set(), carriages: [] }));
    entry.services.add(c.service);
    entry.carriages.push(code);
  }
  const sites: DiagramSite[] = [];
  const indexOf = new Map<string, number>();
  for (const s of doc.sites) {
    const here = perSite.get(s.code);
    if (service && !here) continue;
    indexOf.set(s.code, sites.length);
    sites.push({
      code: s.code,
      name: s.name,
      role: s.role,
      lat: s.lat,
      lon: s.lon,
      households: s.households ?? null,
      services: here ? [...here.services].sort() : [],
      carriages: here ? [...here.carriages].sort() : [],
    });
  }
  const merged = new Map<string, DiagramLink>();
  let feedCount = 0;
  let skippedFeeds = 0;
  for (const f of doc.feeds) {
    const a = carriageAt.get(f.from);
    const b = carriageAt.get(f.to);
    if (!a || !b) {
      // Outside the service filter is expected; a dangling reference is not.
      if (!service) skippedFeeds++;
      continue;
    }
    const from = indexOf.get(a.site);
    const to = indexOf.get(b.site);
    if (from === undefined || to === undefined) {
      skippedFeeds++;
      continue;
    }
    feedCount++;
    const key = `${from}>${to}|${f.medium}|${f.role}`;
    const link = merged.get(key);
    if (link) link.feeds++;
    else merged.set(key, { from, to, medium: f.medium, role: f.role, feeds: 1 });
  }
  return { sites, links: [...merged.values()], feedCount, skippedFeeds };
}

export interface PlacedDiagram {
  xs: Float64Array;
  ys: Float64Array;
  linkFrom: Int32Array;
  linkTo: Int32Array;
}

/** Diagram px of every site and the end indices of every link, for a box of width x height. */
/** Places the sites; `alsoShow` are further places the fit keeps in the box (the demo island's corners). */
export function placeDiagram(model: DiagramModel, width: number, height: number, pad = 28, alsoShow: readonly LonLat[] = []): PlacedDiagram {
  const fit = fitProjection(alsoShow.length > 0 && model.sites.length > 0 ? [...model.sites, ...alsoShow] : model.sites, width, height, pad);
  const xs = new Float64Array(model.sites.length);
  const ys = new Float64Array(model.sites.length);
  if (fit) {
    model.sites.forEach((s, i) => {
      const [x, y] = fit.project(s.lon, s.lat);
      xs[i] = x;
      ys[i] = y;
    });
  }
  return {
    xs,
    ys,
    linkFrom: Int32Array.from(model.links, (l) => l.from),
    linkTo: Int32Array.from(model.links, (l) => l.to),
  };
}

export type SiteStatus = 'off-air' | 'on-reserve';

/**
 * Sites marked by a reach answer: "off air" where at least one carriage (of
 * the filtered service, when there is one) loses programme, "on reserve"
 * where none does but at least one runs on a reserve feed.
 */
export function siteStatuses(reach: ReachResult | undefined, service: string | null): Map<string, SiteStatus> {
  const out = new Map<string, SiteStatus>();
  if (!reach) return out;
  const keep = (list: readonly string[] | undefined) => (list ?? []).filter((s) => !service || s === service);
  for (const row of reach.sites) {
    if (keep(row.lost).length > 0) out.set(row.site, 'off-air');
    else if (keep(row.fallback).length > 0) out.set(row.site, 'on-reserve');
  }
  return out;
}

const STATUS_RANK: Record<SiteStatus, number> = { 'off-air': 0, 'on-reserve': 1 };

/**
 * The sites on screen in the order a person wants them: off air first, then
 * on reserve, then by households (most first), then by code. Indices past
 * the end of `sites` (left from the view of a previous filter for one render)
 * are skipped.
 */
export function orderSitesInView(sites: readonly DiagramSite[], inView: readonly number[], statuses: Map<string, SiteStatus>): number[] {
  const rank = (i: number) => {
    const st = statuses.get(sites[i].code);
    return st ? STATUS_RANK[st] : 2;
  };
  return inView
    .filter((i) => i >= 0 && i < sites.length)
    // codes compared by code unit, not localeCompare: this runs after every zoom step over up to every site
    .sort((a, b) => rank(a) - rank(b) || (sites[b].households ?? 0) - (sites[a].households ?? 0) || (sites[a].code < sites[b].code ? -1 : sites[a].code > sites[b].code ? 1 : 0));
}

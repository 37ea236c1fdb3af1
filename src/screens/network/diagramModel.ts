/**
 * What the network diagram draws, built once per network and service filter
 * from the server's columns (shared/schemas/drawing.ts):
 * sites (those carrying the chosen service, or all), and feed lines merged
 * per site pair, medium and role, so thousands of feeds of many services
 * become one line per visible path. Positions are typed arrays for the
 * culling in ./viewport.ts.
 */
import { FEED_ROLES, MEDIA, SITE_ROLES, type FeedRole, type Medium, type SiteRole } from '@/shared/schemas/network';
import { carriageCodeOf, type DrawingDocument } from '@/shared/schemas/drawing';
import type { ReachResult } from '@/src/api/queries/analysis';
import { fitProjection, type FittedProjection, type LonLat } from './projection';

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
}

interface SiteLists {
  carriages(site: number): string[];
  services(site: number): string[];
}

/**
 * A site of the model. Its carriages and services are listed when first
 * asked for (the site card): at 20,000 sites making and sorting every
 * site's lists up front cost the first frame about 0.1 s, for lists read a
 * few at a time.
 */
class ModelSite implements DiagramSite {
  private carriageList: string[] | null = null;
  private serviceList: string[] | null = null;
  constructor(
    readonly code: string,
    readonly name: string,
    readonly role: SiteRole,
    readonly lat: number,
    readonly lon: number,
    readonly households: number | null,
    private readonly lists: SiteLists,
    private readonly at: number,
  ) {}
  get carriages(): string[] {
    return (this.carriageList ??= this.lists.carriages(this.at));
  }
  get services(): string[] {
    return (this.serviceList ??= this.lists.services(this.at));
  }
}

/**
 * The model straight from the server's columns (already checked with
 * checkDrawing): positions are followed as numbers and feeds merged under a
 * numeric key, with no row objects or text keys made on the way. At 20,000
 * sites the rows and their text-keyed maps cost the first frame about half a
 * second, most of it in making and collecting garbage.
 */
export function buildDiagram(d: DrawingDocument, service: string | null): DiagramModel {
  const nSites = d.sites.code.length;
  const nCarriages = d.carriages.site.length;
  const carriageSite = d.carriages.site;
  const carriageService = d.carriages.service;
  // -1 for a service nobody has: then no carriage is kept.
  const wanted = service === null ? -1 : d.services.findIndex((s) => s.code === service);
  const kept = new Uint8Array(nCarriages);
  // The kept carriages grouped by site (a count per site, then the carriages in site order).
  const start = new Int32Array(nSites + 1);
  for (let c = 0; c < nCarriages; c++) {
    if (service !== null && carriageService[c] !== wanted) continue;
    kept[c] = 1;
    start[carriageSite[c] + 1]++;
  }
  for (let i = 0; i < nSites; i++) start[i + 1] += start[i];
  const bySite = new Int32Array(start[nSites]);
  const fill = start.slice(0, nSites);
  for (let c = 0; c < nCarriages; c++) if (kept[c]) bySite[fill[carriageSite[c]]++] = c;

  let codeOf: ((c: number) => string) | null = null;
  const lists: SiteLists = {
    carriages(i) {
      codeOf ??= carriageCodeOf(d);
      const out: string[] = [];
      for (let k = start[i]; k < start[i + 1]; k++) out.push(codeOf(bySite[k]));
      return out.sort();
    },
    services(i) {
      const out: string[] = [];
      for (let k = start[i]; k < start[i + 1]; k++) {
        const code = d.services[carriageService[bySite[k]]].code;
        if (!out.includes(code)) out.push(code);
      }
      return out.sort();
    },
  };
  const sites: DiagramSite[] = [];
  const siteAt = new Int32Array(nSites).fill(-1);
  for (let i = 0; i < nSites; i++) {
    if (service !== null && start[i] === start[i + 1]) continue;
    siteAt[i] = sites.length;
    sites.push(new ModelSite(d.sites.code[i], d.sites.name[i], SITE_ROLES[d.sites.role[i]], d.sites.lat[i], d.sites.lon[i], d.sites.households[i] ?? null, lists, i));
  }

  // One line per site pair (in feed direction), medium and role, in the order first met.
  const links: DiagramLink[] = [];
  const merged = new Map<number, number>();
  const nSiteKept = sites.length;
  let feedCount = 0;
  const { from: feedFrom, to: feedTo, medium: feedMedium, role: feedRole } = d.feeds;
  for (let f = 0; f < feedFrom.length; f++) {
    const a = feedFrom[f];
    const b = feedTo[f];
    if (!kept[a] || !kept[b]) continue;
    const from = siteAt[carriageSite[a]];
    const to = siteAt[carriageSite[b]];
    feedCount++;
    // Below 2^53 for any network a browser could hold: (sites^2) x media x roles.
    const key = ((from * nSiteKept + to) * MEDIA.length + feedMedium[f]) * FEED_ROLES.length + feedRole[f];
    const at = merged.get(key);
    if (at !== undefined) links[at].feeds++;
    else {
      merged.set(key, links.length);
      links.push({ from, to, medium: MEDIA[feedMedium[f]], role: FEED_ROLES[feedRole[f]], feeds: 1 });
    }
  }
  return { sites, links, feedCount };
}

export interface PlacedDiagram {
  xs: Float64Array;
  ys: Float64Array;
  linkFrom: Int32Array;
  linkTo: Int32Array;
  /** The projection that placed them (null with no sites): the land and the scale use the same. */
  fit?: FittedProjection | null;
}

/**
 * Diagram px of every site and the end indices of every link, for a box of
 * width x height; `alsoShow` are further places the fit keeps in the box
 * (the demo island's corners).
 */
export function placeDiagram(model: DiagramModel, width: number, height: number, pad = 28, alsoShow: readonly LonLat[] = []): PlacedDiagram {
  const fit = fitProjection(alsoShow.length > 0 && model.sites.length > 0 ? [...model.sites, ...alsoShow] : model.sites, width, height, pad);
  const xs = new Float64Array(model.sites.length);
  const ys = new Float64Array(model.sites.length);
  if (fit) {
    const { sites } = model;
    for (let i = 0; i < sites.length; i++) {
      xs[i] = fit.x(sites[i].lon);
      ys[i] = fit.y(sites[i].lat);
    }
  }
  const linkFrom = new Int32Array(model.links.length);
  const linkTo = new Int32Array(model.links.length);
  model.links.forEach((l, i) => {
    linkFrom[i] = l.from;
    linkTo[i] = l.to;
  });
  return { xs, ys, linkFrom, linkTo, fit };
}

export type SiteStatus = 'off-air' | 'on-reserve';

const NO_STATUSES: ReadonlyMap<string, SiteStatus> = new Map();

/**
 * Sites marked by a reach answer: "off air" where at least one carriage (of
 * the filtered service, when there is one) loses programme, "on reserve"
 * where none does but at least one runs on a reserve feed.
 */
export function siteStatuses(reach: ReachResult | undefined, service: string | null): ReadonlyMap<string, SiteStatus> {
  // One empty set for every "no answer yet": the drawing compares failure sets by identity and is not redrawn for a new empty one.
  if (!reach) return NO_STATUSES;
  const out = new Map<string, SiteStatus>();
  const keep = (list: readonly string[] | undefined) => (list ?? []).filter((s) => !service || s === service);
  for (const row of reach.sites) {
    if (keep(row.lost).length > 0) out.set(row.site, 'off-air');
    else if (keep(row.fallback).length > 0) out.set(row.site, 'on-reserve');
  }
  return out;
}

/** Every site's index by households (most first), then code: made once per model and kept. */
const byHouseholds = new WeakMap<readonly DiagramSite[], Int32Array>();

function householdOrder(sites: readonly DiagramSite[]): Int32Array {
  let order = byHouseholds.get(sites);
  if (!order) {
    // codes compared by code unit, not localeCompare: this sorts every site of the network
    const all = Array.from({ length: sites.length }, (_, i) => i).sort((a, b) => (sites[b].households ?? 0) - (sites[a].households ?? 0) || (sites[a].code < sites[b].code ? -1 : sites[a].code > sites[b].code ? 1 : 0));
    byHouseholds.set(sites, (order = Int32Array.from(all)));
  }
  return order;
}

/**
 * The sites on screen in the order a person wants them: off air first, then
 * on reserve, then by households (most first), then by code. Indices past
 * the end of `sites` (left from the view of a previous filter for one render)
 * are skipped. It runs after every drawing and every new failure set over up
 * to every site, so it sorts nothing itself: it walks the model's one
 * ordering by households (made once) and takes the sites in view, the
 * marked ones first (a sort with a failure-set lookup per comparison took
 * some 200 ms at 20,000 sites in view, before the overlay could be drawn).
 */
export function orderSitesInView(sites: readonly DiagramSite[], inView: readonly number[], statuses: ReadonlyMap<string, SiteStatus>): number[] {
  // Nothing drawn yet (the screen's first render, before the first frame): no ordering to make.
  if (inView.length === 0) return [];
  const inside = new Uint8Array(sites.length);
  for (const i of inView) if (i >= 0 && i < sites.length) inside[i] = 1;
  // The failure set is a few sites: looked up by code once each, not once per site in view.
  const mark = new Uint8Array(sites.length);
  if (statuses.size > 0) {
    const at = codeIndex(sites);
    for (const [code, st] of statuses) {
      const i = at.get(code);
      if (i !== undefined) mark[i] = st === 'off-air' ? 1 : 2;
    }
  }
  const off: number[] = [];
  const reserve: number[] = [];
  const rest: number[] = [];
  for (const i of householdOrder(sites)) {
    if (!inside[i]) continue;
    (mark[i] === 1 ? off : mark[i] === 2 ? reserve : rest).push(i);
  }
  return off.concat(reserve, rest);
}

/** Each site's index by code, made once per model and kept. */
const byCode = new WeakMap<readonly DiagramSite[], Map<string, number>>();

function codeIndex(sites: readonly DiagramSite[]): Map<string, number> {
  let at = byCode.get(sites);
  if (!at) byCode.set(sites, (at = new Map(sites.map((s, i) => [s.code, i]))));
  return at;
}

/**
 * The network document as integer-indexed arrays: the single adapter between
 * the document's string codes and the engine's integer ids.
 *
 * Every kind is sorted by code (plain UTF-16 order, the same order as
 * `compareElements`), so sorting ids sorts codes, and element ids
 * (sites, then feeds, then groups) are already in `compareElements` order.
 */
import type { NetworkDocument, Site, Carriage, Feed, Service, Group, Medium, FeedRole } from '@/shared/schemas/network';
import type { Element } from '@/shared/schemas/analysis';
import type { ElementKind } from '@/shared/schemas/network';

export class NetworkModelError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'NetworkModelError';
  }
}

/** Codes are case-sensitive as given; only surrounding white space is dropped. */
export const normaliseCode = (code: string): string => code.trim();

const byCode = <T extends { code: string }>(a: T, b: T) => (a.code < b.code ? -1 : a.code > b.code ? 1 : 0);

function sortedIndex<T extends { code: string }>(kind: string, items: T[]): { items: T[]; index: Map<string, number>; codes: string[] } {
  const copy = items.map((item) => ({ ...item, code: normaliseCode(item.code) }));
  copy.sort(byCode);
  const index = new Map<string, number>();
  copy.forEach((item, i) => {
    if (index.has(item.code)) throw new NetworkModelError(`${kind} ${item.code}: the code is used twice`);
    index.set(item.code, i);
  });
  return { items: copy, index, codes: copy.map((i) => i.code) };
}

export interface NetworkModel {
  sites: Site[];
  services: Service[];
  groups: Group[];
  carriages: Carriage[];
  feeds: Feed[];
  siteIndex: Map<string, number>;
  serviceIndex: Map<string, number>;
  groupIndex: Map<string, number>;
  carriageIndex: Map<string, number>;
  feedIndex: Map<string, number>;
  siteOrigin: Uint8Array;
  siteHouseholds: Float64Array;
  /** group ids of each site, without repeats */
  siteGroups: Int32Array[];
  carriageSite: Int32Array;
  carriageService: Int32Array;
  feedFrom: Int32Array;
  feedTo: Int32Array;
  feedReserve: Uint8Array;
  feedMedium: Medium[];
  feedRole: FeedRole[];
  /** via-site ids of each feed, in path order, without repeats */
  feedVia: Int32Array[];
  /** group ids of each feed, without repeats */
  feedGroups: Int32Array[];
  /** feeds into each carriage / out of each carriage, ids ascending (= code order) */
  feedsInto: Int32Array[];
  feedsOutOf: Int32Array[];
  /** element ids: sites [0, feedBase), feeds [feedBase, groupBase), groups [groupBase, elementCount) */
  feedBase: number;
  groupBase: number;
  elementCount: number;
  /** one shared, frozen Element object per element id */
  elements: Element[];
}

function uniqueIds(ids: number[]): Int32Array {
  return Int32Array.from(new Set(ids));
}

export function buildNetworkModel(doc: NetworkDocument): NetworkModel {
  const sites = sortedIndex('site', doc.sites);
  const services = sortedIndex('service', doc.services);
  const groups = sortedIndex('group', doc.groups);
  const carriages = sortedIndex('carriage', doc.carriages);
  const feeds = sortedIndex('feed', doc.feeds);

  const groupId = (owner: string, code: string) => {
    const id = groups.index.get(normaliseCode(code));
    if (id === undefined) throw new NetworkModelError(`${owner}: group ${normaliseCode(code)} does not exist`);
    return id;
  };
  const siteId = (owner: string, code: string) => {
    const id = sites.index.get(normaliseCode(code));
    if (id === undefined) throw new NetworkModelError(`${owner}: site ${normaliseCode(code)} does not exist`);
    return id;
  };

  const S = sites.items.length;
  const siteOrigin = new Uint8Array(S);
  const siteHouseholds = new Float64Array(S);
  const siteGroups: Int32Array[] = [];
  sites.items.forEach((site, i) => {
    siteOrigin[i] = site.role === 'origin' ? 1 : 0;
    siteHouseholds[i] = site.households ?? 0;
    siteGroups.push(uniqueIds((site.groups ?? []).map((g) => groupId(`site ${site.code}`, g))));
  });

  const C = carriages.items.length;
  const carriageSite = new Int32Array(C);
  const carriageService = new Int32Array(C);
  carriages.items.forEach((c, i) => {
    carriageSite[i] = siteId(`carriage ${c.code}`, c.site);
    const service = services.index.get(normaliseCode(c.service));
    if (service === undefined) throw new NetworkModelError(`carriage ${c.code}: service ${normaliseCode(c.service)} does not exist`);
    carriageService[i] = service;
  });

  const F = feeds.items.length;
  const feedFrom = new Int32Array(F);
  const feedTo = new Int32Array(F);
  const feedReserve = new Uint8Array(F);
  const feedVia: Int32Array[] = [];
  const feedGroups: Int32Array[] = [];
  const feedsInto: number[][] = Array.from({ length: C }, () => []);
  const feedsOutOf: number[][] = Array.from({ length: C }, () => []);
  feeds.items.forEach((f, i) => {
    const from = carriages.index.get(normaliseCode(f.from));
    const to = carriages.index.get(normaliseCode(f.to));
    if (from === undefined) throw new NetworkModelError(`feed ${f.code}: source carriage ${normaliseCode(f.from)} does not exist`);
    if (to === undefined) throw new NetworkModelError(`feed ${f.code}: target carriage ${normaliseCode(f.to)} does not exist`);
    if (carriageService[from] !== carriageService[to]) {
      throw new NetworkModelError(`feed ${f.code}: carriages ${carriages.codes[from]} and ${carriages.codes[to]} carry different services`);
    }
    feedFrom[i] = from;
    feedTo[i] = to;
    feedReserve[i] = f.role === 'reserve' ? 1 : 0;
    feedVia.push(uniqueIds((f.via ?? []).map((s) => siteId(`feed ${f.code}`, s))));
    feedGroups.push(uniqueIds((f.groups ?? []).map((g) => groupId(`feed ${f.code}`, g))));
    feedsInto[to].push(i);
    feedsOutOf[from].push(i);
  });

  const feedBase = S;
  const groupBase = S + F;
  const elementCount = groupBase + groups.items.length;
  const elements: Element[] = new Array(elementCount);
  for (let i = 0; i < S; i++) elements[i] = Object.freeze({ kind: 'site' as const, code: sites.codes[i] });
  for (let i = 0; i < F; i++) elements[feedBase + i] = Object.freeze({ kind: 'feed' as const, code: feeds.codes[i] });
  for (let i = 0; i < groups.items.length; i++) elements[groupBase + i] = Object.freeze({ kind: 'group' as const, code: groups.codes[i] });

  return {
    sites: sites.items,
    services: services.items,
    groups: groups.items,
    carriages: carriages.items,
    feeds: feeds.items,
    siteIndex: sites.index,
    serviceIndex: services.index,
    groupIndex: groups.index,
    carriageIndex: carriages.index,
    feedIndex: feeds.index,
    siteOrigin,
    siteHouseholds,
    siteGroups,
    carriageSite,
    carriageService,
    feedFrom,
    feedTo,
    feedReserve,
    feedMedium: feeds.items.map((f) => f.medium),
    feedRole: feeds.items.map((f) => f.role),
    feedVia,
    feedGroups,
    feedsInto: feedsInto.map((l) => Int32Array.from(l)),
    feedsOutOf: feedsOutOf.map((l) => Int32Array.from(l)),
    feedBase,
    groupBase,
    elementCount,
    elements,
  };
}

/** The element id of `{ kind, code }`, or -1 when the network has no such element. */
export function elementId(model: NetworkModel, kind: ElementKind, code: string): number {
  const c = normaliseCode(code);
  if (kind === 'site') return model.siteIndex.get(c) ?? -1;
  if (kind === 'feed') {
    const f = model.feedIndex.get(c);
    return f === undefined ? -1 : model.feedBase + f;
  }
  if (kind === 'group') {
    const g = model.groupIndex.get(c);
    return g === undefined ? -1 : model.groupBase + g;
  }
  return -1;
}

/**
 * The network document as integer-indexed arrays: the single adapter between
 * the document's string codes and the engine's integer ids.
 *
 * Every kind is sorted by code (plain UTF-16 order, the same order as
 * `compareElements`), so sorting ids sorts codes, and element ids
 * (sites, then carriages, then feeds, then groups) are already in
 * `compareElements` order.
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

/**
 * The items of one kind in code order (the document's own objects, not copies:
 * a national network has hundreds of thousands), their trimmed codes and a
 * code -> id map.
 */
function sortedIndex<T extends { code: string }>(kind: string, items: T[]): { items: T[]; index: Map<string, number>; codes: string[] } {
  const n = items.length;
  const codes: string[] = new Array(n);
  let ascending = true;
  for (let i = 0; i < n; i++) {
    codes[i] = normaliseCode(items[i].code);
    if (i > 0 && !(codes[i - 1] < codes[i])) ascending = false;
  }
  const index = new Map<string, number>();
  // Exports and generators usually list codes in order already: then no sort and no repeats.
  if (ascending) {
    for (let i = 0; i < n; i++) index.set(codes[i], i);
    return { items: items.slice(), index, codes };
  }
  for (let i = 0; i < n; i++) {
    if (index.has(codes[i])) throw new NetworkModelError(`${kind} ${codes[i]}: the code is used twice`);
    index.set(codes[i], i);
  }
  // The default sort compares UTF-16 code units, the same order as `<` and compareElements.
  const sortedCodes = codes.slice().sort();
  const sorted: T[] = new Array(n);
  for (let i = 0; i < n; i++) {
    sorted[i] = items[index.get(sortedCodes[i])!];
    index.set(sortedCodes[i], i);
  }
  return { items: sorted, index, codes: sortedCodes };
}

/**
 * Lists of ids per item without one small array per item (hundreds of
 * thousands of tiny typed arrays cost more to allocate than the data):
 * item i's list is ids[offsets[i] .. offsets[i + 1]).
 */
export interface IdLists {
  offsets: Int32Array;
  ids: Int32Array;
}

/** Item i's list as a view (allocates a view: keep out of hot loops). */
export const listOf = (l: IdLists, i: number): Int32Array => l.ids.subarray(l.offsets[i], l.offsets[i + 1]);

/** Builds IdLists item by item; repeats within one item's list are dropped. */
export class IdListBuilder {
  private offsets: Int32Array;
  private ids: Int32Array;
  private length = 0;
  private item = 0;
  constructor(items: number, capacity: number) {
    this.offsets = new Int32Array(items + 1);
    this.ids = new Int32Array(Math.max(16, capacity));
  }
  add(id: number): void {
    for (let k = this.offsets[this.item]; k < this.length; k++) if (this.ids[k] === id) return;
    if (this.length === this.ids.length) {
      const bigger = new Int32Array(this.ids.length * 2);
      bigger.set(this.ids);
      this.ids = bigger;
    }
    this.ids[this.length++] = id;
  }
  /** closes the current item's list */
  next(): void {
    this.offsets[++this.item] = this.length;
  }
  done(): IdLists {
    return { offsets: this.offsets, ids: this.ids.slice(0, this.length) };
  }
}

/** Groups (item -> key) pairs by key, items ascending within a key. */
export function invert(keyCount: number, keys: Int32Array): IdLists {
  const offsets = new Int32Array(keyCount + 1);
  for (let i = 0; i < keys.length; i++) offsets[keys[i] + 1]++;
  for (let k = 0; k < keyCount; k++) offsets[k + 1] += offsets[k];
  const fill = offsets.slice(0, keyCount);
  const ids = new Int32Array(keys.length);
  for (let i = 0; i < keys.length; i++) ids[fill[keys[i]]++] = i;
  return { offsets, ids };
}

export interface NetworkModel {
  /** the document's entities in code order; their `code` fields may still carry white space: use the *Codes arrays */
  sites: Site[];
  services: Service[];
  groups: Group[];
  carriages: Carriage[];
  feeds: Feed[];
  siteCodes: string[];
  serviceCodes: string[];
  groupCodes: string[];
  carriageCodes: string[];
  feedCodes: string[];
  siteIndex: Map<string, number>;
  serviceIndex: Map<string, number>;
  groupIndex: Map<string, number>;
  carriageIndex: Map<string, number>;
  feedIndex: Map<string, number>;
  siteOrigin: Uint8Array;
  siteHouseholds: Float64Array;
  /** group ids of each site */
  siteGroups: IdLists;
  carriageSite: Int32Array;
  carriageService: Int32Array;
  feedFrom: Int32Array;
  feedTo: Int32Array;
  feedReserve: Uint8Array;
  feedMedium: Medium[];
  feedRole: FeedRole[];
  /** via-site ids of each feed, in path order */
  feedVia: IdLists;
  /** group ids of each feed */
  feedGroups: IdLists;
  /** feeds into each carriage / out of each carriage, ids ascending (= code order) */
  feedsInto: IdLists;
  feedsOutOf: IdLists;
  /** element ids: sites [0, carriageBase), carriages [carriageBase, feedBase), feeds [feedBase, groupBase), groups [groupBase, elementCount) */
  carriageBase: number;
  feedBase: number;
  groupBase: number;
  elementCount: number;
  /** one shared, frozen Element object per element id */
  elements: Element[];
}

export function buildNetworkModel(doc: NetworkDocument): NetworkModel {
  const sites = sortedIndex('site', doc.sites);
  const services = sortedIndex('service', doc.services);
  const groups = sortedIndex('group', doc.groups);
  const carriages = sortedIndex('carriage', doc.carriages);
  const feeds = sortedIndex('feed', doc.feeds);

  // The referring entity is named only when a reference is wrong (a national network makes ~10^6 look-ups).
  const missing = (kind: string, owner: string[], i: number, what: string, code: string) =>
    new NetworkModelError(`${kind} ${owner[i]}: ${what} ${normaliseCode(code)} does not exist`);
  const groupId = (kind: string, owner: string[], i: number, code: string) => {
    const id = groups.index.get(normaliseCode(code));
    if (id === undefined) throw missing(kind, owner, i, 'group', code);
    return id;
  };
  const siteId = (kind: string, owner: string[], i: number, code: string) => {
    const id = sites.index.get(normaliseCode(code));
    if (id === undefined) throw missing(kind, owner, i, 'site', code);
    return id;
  };

  const S = sites.items.length;
  const siteOrigin = new Uint8Array(S);
  const siteHouseholds = new Float64Array(S);
  const siteGroups = new IdListBuilder(S, S);
  for (let i = 0; i < S; i++) {
    const site = sites.items[i];
    siteOrigin[i] = site.role === 'origin' ? 1 : 0;
    siteHouseholds[i] = site.households ?? 0;
    if (site.groups) for (const g of site.groups) siteGroups.add(groupId('site', sites.codes, i, g));
    siteGroups.next();
  }

  const C = carriages.items.length;
  const carriageSite = new Int32Array(C);
  const carriageService = new Int32Array(C);
  for (let i = 0; i < C; i++) {
    const c = carriages.items[i];
    carriageSite[i] = siteId('carriage', carriages.codes, i, c.site);
    const service = services.index.get(normaliseCode(c.service));
    if (service === undefined) throw missing('carriage', carriages.codes, i, 'service', c.service);
    carriageService[i] = service;
  }

  const F = feeds.items.length;
  const feedFrom = new Int32Array(F);
  const feedTo = new Int32Array(F);
  const feedReserve = new Uint8Array(F);
  const feedVia = new IdListBuilder(F, F / 4);
  const feedGroups = new IdListBuilder(F, F / 4);
  for (let i = 0; i < F; i++) {
    const f = feeds.items[i];
    const from = carriages.index.get(normaliseCode(f.from));
    const to = carriages.index.get(normaliseCode(f.to));
    if (from === undefined) throw missing('feed', feeds.codes, i, 'source carriage', f.from);
    if (to === undefined) throw missing('feed', feeds.codes, i, 'receiving carriage', f.to);
    if (carriageService[from] !== carriageService[to]) {
      throw new NetworkModelError(`feed ${feeds.codes[i]}: carriages ${carriages.codes[from]} and ${carriages.codes[to]} carry different services`);
    }
    feedFrom[i] = from;
    feedTo[i] = to;
    feedReserve[i] = f.role === 'reserve' ? 1 : 0;
    if (f.via) for (const v of f.via) feedVia.add(siteId('feed', feeds.codes, i, v));
    feedVia.next();
    if (f.groups) for (const g of f.groups) feedGroups.add(groupId('feed', feeds.codes, i, g));
    feedGroups.next();
  }

  const { carriageBase, feedBase, groupBase, elementCount } = elementBases(S, C, F, groups.items.length);
  const elements: Element[] = new Array(elementCount);
  for (let i = 0; i < S; i++) elements[i] = Object.freeze({ kind: 'site' as const, code: sites.codes[i] });
  for (let i = 0; i < C; i++) elements[carriageBase + i] = Object.freeze({ kind: 'carriage' as const, code: carriages.codes[i] });
  for (let i = 0; i < F; i++) elements[feedBase + i] = Object.freeze({ kind: 'feed' as const, code: feeds.codes[i] });
  for (let i = 0; i < groups.items.length; i++) elements[groupBase + i] = Object.freeze({ kind: 'group' as const, code: groups.codes[i] });

  const parts = { siteOrigin, siteHouseholds, siteGroups: siteGroups.done(), carriageSite, carriageService, feedFrom, feedTo, feedReserve };
  return assembleModel({ sites, services, groups, carriages, feeds }, { ...parts, feedVia: feedVia.done(), feedGroups: feedGroups.done(), elements });
}

/** Element ids run sites, carriages, feeds, groups: where each kind starts. */
export function elementBases(sites: number, carriages: number, feeds: number, groups: number) {
  return { carriageBase: sites, feedBase: sites + carriages, groupBase: sites + carriages + feeds, elementCount: sites + carriages + feeds + groups };
}

interface Indexed<T> {
  items: T[];
  codes: string[];
  index: Map<string, number>;
}

/** The per-entity arrays of a model, read from a document (`buildNetworkModel`) or patched after an edit (update.ts). */
export type ModelArrays = Pick<
  NetworkModel,
  'siteOrigin' | 'siteHouseholds' | 'siteGroups' | 'carriageSite' | 'carriageService' | 'feedFrom' | 'feedTo' | 'feedReserve' | 'feedVia' | 'feedGroups' | 'elements'
>;

/** A model from each kind in code order and its arrays; what follows from them (feed look-ups, element id bases) is filled in here. */
export function assembleModel(
  k: { sites: Indexed<Site>; services: Indexed<Service>; groups: Indexed<Group>; carriages: Indexed<Carriage>; feeds: Indexed<Feed> },
  arrays: ModelArrays,
): NetworkModel {
  const C = k.carriages.items.length;
  return {
    sites: k.sites.items,
    services: k.services.items,
    groups: k.groups.items,
    carriages: k.carriages.items,
    feeds: k.feeds.items,
    siteCodes: k.sites.codes,
    serviceCodes: k.services.codes,
    groupCodes: k.groups.codes,
    carriageCodes: k.carriages.codes,
    feedCodes: k.feeds.codes,
    siteIndex: k.sites.index,
    serviceIndex: k.services.index,
    groupIndex: k.groups.index,
    carriageIndex: k.carriages.index,
    feedIndex: k.feeds.index,
    ...arrays,
    feedMedium: k.feeds.items.map((f) => f.medium),
    feedRole: k.feeds.items.map((f) => f.role),
    feedsInto: invert(C, arrays.feedTo),
    feedsOutOf: invert(C, arrays.feedFrom),
    ...elementBases(k.sites.items.length, C, k.feeds.items.length, k.groups.items.length),
  };
}

/** The element id of `{ kind, code }`, or -1 when the network has no such element. */
export function elementId(model: NetworkModel, kind: ElementKind, code: string): number {
  const c = normaliseCode(code);
  if (kind === 'site') return model.siteIndex.get(c) ?? -1;
  if (kind === 'carriage') {
    const k = model.carriageIndex.get(c);
    return k === undefined ? -1 : model.carriageBase + k;
  }
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

export const isCarriageId = (model: NetworkModel, x: number): boolean => x >= model.carriageBase && x < model.feedBase;

/** One bit per element kind, for filters over element ids. */
export const KIND_BIT: Readonly<Record<ElementKind, number>> = { site: 1, carriage: 2, feed: 4, group: 8 };

/** The bits of a non-empty list of kinds; a RangeError for anything else. */
export function kindMask(kinds: readonly ElementKind[]): number {
  let mask = 0;
  if (Array.isArray(kinds)) for (const k of kinds as readonly string[]) mask |= Object.hasOwn(KIND_BIT, k) ? KIND_BIT[k as ElementKind] : 0x100;
  if (!Array.isArray(kinds) || kinds.length === 0 || mask & 0x100) {
    throw new RangeError(`kinds is a non-empty list of site, carriage, feed, group (got ${JSON.stringify(kinds)})`);
  }
  return mask;
}

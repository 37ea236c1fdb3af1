/**
 * An edit's update of the engine's compiled state: the network after one
 * create, update or delete (with what it cascaded to) differs from the one
 * before in a few entities, so only the service graphs those entities touch
 * are rebuilt, compiled and given new dominator trees. Every other service
 * keeps its graph and trees; only the integer ids inside it move when codes
 * were added or removed (ids are in code order, model.ts), which is one pass
 * over typed arrays.
 *
 * The result is the same core a full build of the new document gives (the
 * property test test/unit/engine/incremental.test.ts compares them after
 * 1,000 random edits). Anything outside what this handles throws
 * `IncrementalUpdateError`, and the caller builds from scratch instead:
 * a change to the services themselves, a document out of code order, or a
 * reference the changed codes do not account for.
 */
import type { NetworkDocument, Site, Carriage, Feed } from '@/shared/schemas/network';
import { assembleModel, elementBases, IdListBuilder, normaliseCode, type NetworkModel } from './model';
import { buildSomeFlowSpecs, compileFlowSpec, NODE_CARRIAGE, NODE_FEED, NODE_HOP, type CompiledService, type FlowSpec } from './graphs';
import { assembleCore, fullView, mainView, type EngineCore } from './core';
import type { FlowView } from './removal-walk';
import type { Element } from '@/shared/schemas/analysis';

/** The codes an edit created, changed or deleted, per kind (a deleted site's carriages and feeds included). */
export interface ChangedCodes {
  sites?: Iterable<string>;
  services?: Iterable<string>;
  groups?: Iterable<string>;
  carriages?: Iterable<string>;
  feeds?: Iterable<string>;
}

export class IncrementalUpdateError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'IncrementalUpdateError';
  }
}

/** One kind after the edit: codes, index, and old id <-> new id (null when the codes are the same). */
interface KindUpdate<T> {
  items: T[];
  codes: string[];
  index: Map<string, number>;
  oldToNew: Int32Array | null;
  newToOld: Int32Array | null;
  /** new ids whose entity was created or changed */
  dirty: Uint8Array;
}

function updateKind<T extends { code: string }>(kind: string, oldCodes: string[], oldIndex: Map<string, number>, items: T[], changed: Set<string>): KindUpdate<T> {
  const n = items.length;
  const codes: string[] = new Array(n);
  for (let i = 0; i < n; i++) {
    codes[i] = normaliseCode(items[i].code);
    if (i > 0 && !(codes[i - 1] < codes[i])) throw new IncrementalUpdateError(`${kind}: the document is not in code order at ${codes[i]}`);
  }
  let same = n === oldCodes.length;
  if (same) for (const c of changed) if (!oldIndex.has(c) || !has(codes, c)) same = false;
  const dirty = new Uint8Array(n);
  if (same) {
    for (const c of changed) dirty[oldIndex.get(c)!] = 1;
    return { items, codes: oldCodes, index: oldIndex, oldToNew: null, newToOld: null, dirty };
  }
  const index = new Map<string, number>();
  for (let i = 0; i < n; i++) index.set(codes[i], i);
  const oldToNew = new Int32Array(oldCodes.length);
  const newToOld = new Int32Array(n).fill(-1);
  for (let o = 0; o < oldCodes.length; o++) {
    const i = index.get(oldCodes[o]);
    oldToNew[o] = i ?? -1;
    if (i !== undefined) newToOld[i] = o;
  }
  for (const c of changed) {
    const i = index.get(c);
    if (i !== undefined) dirty[i] = 1;
  }
  for (let i = 0; i < n; i++) if (newToOld[i] < 0 && !dirty[i]) throw new IncrementalUpdateError(`${kind} ${codes[i]} is new but not among the changed codes`);
  return { items, codes, index, oldToNew, newToOld, dirty };
}

function has(sorted: string[], code: string): boolean {
  let lo = 0;
  let hi = sorted.length - 1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    if (sorted[mid] === code) return true;
    if (sorted[mid] < code) lo = mid + 1;
    else hi = mid - 1;
  }
  return false;
}

/** old id -> new id through a kind's remap; throws for an id whose entity is gone but was not listed as changed */
function mapper(kind: string, u: KindUpdate<unknown>): (old: number) => number {
  const m = u.oldToNew;
  if (!m) return (old) => old;
  return (old) => {
    const id = m[old];
    if (id < 0) throw new IncrementalUpdateError(`a ${kind} that is gone is still referred to by an entity that did not change`);
    return id;
  };
}

const oldOf = (u: KindUpdate<unknown>, i: number) => (u.dirty[i] ? -1 : u.newToOld ? u.newToOld[i] : i);

function lookup(kind: string, index: Map<string, number>, code: string, owner: string): number {
  const id = index.get(normaliseCode(code));
  if (id === undefined) throw new IncrementalUpdateError(`${owner}: ${kind} ${normaliseCode(code)} does not exist`);
  return id;
}

interface ModelUpdate {
  model: NetworkModel;
  sites: KindUpdate<Site>;
  groups: KindUpdate<unknown>;
  carriages: KindUpdate<Carriage>;
  feeds: KindUpdate<Feed>;
  /** old element id -> new element id (-1: gone) */
  elementMap: Int32Array | null;
}

function updateModel(old: NetworkModel, doc: NetworkDocument, changed: Record<'sites' | 'groups' | 'carriages' | 'feeds', Set<string>>): ModelUpdate {
  if (doc.services.length !== old.services.length || doc.services.some((s, i) => normaliseCode(s.code) !== old.serviceCodes[i])) {
    throw new IncrementalUpdateError('the services changed');
  }
  const sites = updateKind('site', old.siteCodes, old.siteIndex, doc.sites, changed.sites);
  const groups = updateKind('group', old.groupCodes, old.groupIndex, doc.groups, changed.groups);
  const carriages = updateKind('carriage', old.carriageCodes, old.carriageIndex, doc.carriages, changed.carriages);
  const feeds = updateKind('feed', old.feedCodes, old.feedIndex, doc.feeds, changed.feeds);
  const site = mapper('site', sites);
  const group = mapper('group', groups);
  const carriage = mapper('carriage', carriages);

  const S = sites.items.length;
  const siteOrigin = new Uint8Array(S);
  const siteHouseholds = new Float64Array(S);
  const siteGroups = new IdListBuilder(S, S);
  for (let i = 0; i < S; i++) {
    const o = oldOf(sites, i);
    if (o >= 0) {
      siteOrigin[i] = old.siteOrigin[o];
      siteHouseholds[i] = old.siteHouseholds[o];
      for (let k = old.siteGroups.offsets[o]; k < old.siteGroups.offsets[o + 1]; k++) siteGroups.add(group(old.siteGroups.ids[k]));
    } else {
      const s = sites.items[i];
      siteOrigin[i] = s.role === 'origin' ? 1 : 0;
      siteHouseholds[i] = s.households ?? 0;
      for (const g of s.groups ?? []) siteGroups.add(lookup('group', groups.index, g, `site ${sites.codes[i]}`));
    }
    siteGroups.next();
  }

  const C = carriages.items.length;
  const carriageSite = new Int32Array(C);
  const carriageService = new Int32Array(C);
  for (let i = 0; i < C; i++) {
    const o = oldOf(carriages, i);
    if (o >= 0) {
      carriageSite[i] = site(old.carriageSite[o]);
      carriageService[i] = old.carriageService[o];
    } else {
      const c = carriages.items[i];
      carriageSite[i] = lookup('site', sites.index, c.site, `carriage ${carriages.codes[i]}`);
      carriageService[i] = lookup('service', old.serviceIndex, c.service, `carriage ${carriages.codes[i]}`);
    }
  }

  const F = feeds.items.length;
  const feedFrom = new Int32Array(F);
  const feedTo = new Int32Array(F);
  const feedReserve = new Uint8Array(F);
  const feedVia = new IdListBuilder(F, F / 4);
  const feedGroups = new IdListBuilder(F, F / 4);
  for (let i = 0; i < F; i++) {
    const o = oldOf(feeds, i);
    const f = feeds.items[i];
    feedReserve[i] = f.role === 'reserve' ? 1 : 0;
    if (o >= 0) {
      feedFrom[i] = carriage(old.feedFrom[o]);
      feedTo[i] = carriage(old.feedTo[o]);
      for (let k = old.feedVia.offsets[o]; k < old.feedVia.offsets[o + 1]; k++) feedVia.add(site(old.feedVia.ids[k]));
      for (let k = old.feedGroups.offsets[o]; k < old.feedGroups.offsets[o + 1]; k++) feedGroups.add(group(old.feedGroups.ids[k]));
    } else {
      const owner = `feed ${feeds.codes[i]}`;
      feedFrom[i] = lookup('carriage', carriages.index, f.from, owner);
      feedTo[i] = lookup('carriage', carriages.index, f.to, owner);
      if (carriageService[feedFrom[i]] !== carriageService[feedTo[i]]) throw new IncrementalUpdateError(`${owner}: its carriages carry different services`);
      for (const v of f.via ?? []) feedVia.add(lookup('site', sites.index, v, owner));
      for (const g of f.groups ?? []) feedGroups.add(lookup('group', groups.index, g, owner));
    }
    feedVia.next();
    feedGroups.next();
  }

  // Element ids run sites, carriages, feeds, groups (model.ts).
  const { carriageBase, feedBase, groupBase, elementCount } = elementBases(S, C, F, groups.items.length);
  let elements = old.elements;
  let elementMap: Int32Array | null = null;
  if (sites.oldToNew || carriages.oldToNew || feeds.oldToNew || groups.oldToNew) {
    elements = new Array(elementCount);
    const fresh = (kind: Element['kind'], code: string) => Object.freeze({ kind, code }) as Element;
    const reuse = (u: KindUpdate<unknown>, i: number, oldBase: number, kind: Element['kind']) => {
      const o = u.newToOld ? u.newToOld[i] : i;
      return o >= 0 ? old.elements[oldBase + o] : fresh(kind, u.codes[i]);
    };
    for (let i = 0; i < S; i++) elements[i] = reuse(sites, i, 0, 'site');
    for (let i = 0; i < C; i++) elements[carriageBase + i] = reuse(carriages, i, old.carriageBase, 'carriage');
    for (let i = 0; i < F; i++) elements[feedBase + i] = reuse(feeds, i, old.feedBase, 'feed');
    for (let i = 0; i < groups.items.length; i++) elements[groupBase + i] = reuse(groups, i, old.groupBase, 'group');
    elementMap = new Int32Array(old.elementCount);
    const through = (m: Int32Array | null, o: number, base: number) => {
      const id = m ? m[o] : o;
      return id < 0 ? -1 : base + id;
    };
    for (let x = 0; x < old.elementCount; x++) {
      if (x < old.carriageBase) elementMap[x] = through(sites.oldToNew, x, 0);
      else if (x < old.feedBase) elementMap[x] = through(carriages.oldToNew, x - old.carriageBase, carriageBase);
      else if (x < old.groupBase) elementMap[x] = through(feeds.oldToNew, x - old.feedBase, feedBase);
      else elementMap[x] = through(groups.oldToNew, x - old.groupBase, groupBase);
    }
  }

  const services = { items: doc.services, codes: old.serviceCodes, index: old.serviceIndex };
  const parts = { siteOrigin, siteHouseholds, siteGroups: siteGroups.done(), carriageSite, carriageService, feedFrom, feedTo, feedReserve };
  const model = assembleModel(
    { sites, services, groups: groups as KindUpdate<NetworkModel['groups'][number]>, carriages, feeds },
    { ...parts, feedVia: feedVia.done(), feedGroups: feedGroups.done(), elements },
  );
  return { model, sites, groups, carriages, feeds, elementMap };
}

/** The services whose graphs an edit touches: through the changed carriages and feeds (before and after) and every node the changed sites and groups owned. */
function touchedServices(prev: EngineCore, u: ModelUpdate, changed: Record<'sites' | 'groups' | 'carriages' | 'feeds', Set<string>>): Uint8Array {
  const old = prev.model;
  const { model } = u;
  const out = new Uint8Array(model.services.length);
  for (const code of changed.carriages) {
    const o = old.carriageIndex.get(code);
    if (o !== undefined) out[old.carriageService[o]] = 1;
    const i = model.carriageIndex.get(code);
    if (i !== undefined) out[model.carriageService[i]] = 1;
  }
  for (const code of changed.feeds) {
    const o = old.feedIndex.get(code);
    if (o !== undefined) out[old.carriageService[old.feedFrom[o]]] = 1;
    const i = model.feedIndex.get(code);
    if (i !== undefined) out[model.carriageService[model.feedFrom[i]]] = 1;
  }
  const ownedBy = (x: number) => {
    for (let k = prev.elementNodeOffsets[x]; k < prev.elementNodeOffsets[x + 1]; k++) out[prev.nodeService[prev.elementNodes[k]]] = 1;
  };
  for (const code of changed.sites) {
    const o = old.siteIndex.get(code);
    if (o !== undefined) ownedBy(o);
  }
  for (const code of changed.groups) {
    const o = old.groupIndex.get(code);
    if (o !== undefined) ownedBy(old.groupBase + o);
  }
  return out;
}

/** An untouched service with its ids moved to the new model's (its nodes, edges and trees stay). */
function moveService(svc: CompiledService, spec: FlowSpec, base: number, u: ModelUpdate): { svc: CompiledService; spec: FlowSpec } {
  if (!u.carriages.oldToNew && !u.feeds.oldToNew && !u.elementMap) return { svc: { ...svc, base }, spec };
  const carriage = mapper('carriage', u.carriages);
  const feed = mapper('feed', u.feeds);
  const em = u.elementMap;
  const element = (x: number) => {
    const id = em ? em[x] : x;
    if (id < 0) throw new IncrementalUpdateError('an element that is gone still owns a node of an untouched service');
    return id;
  };
  const { n, kind } = spec;
  const ref = new Int32Array(n).fill(-1);
  const hopFeed = new Int32Array(n).fill(-1);
  for (let v = 0; v < n; v++) {
    if (kind[v] === NODE_CARRIAGE) ref[v] = carriage(spec.ref[v]);
    else if (kind[v] === NODE_FEED) ref[v] = feed(spec.ref[v]);
    else if (kind[v] === NODE_HOP) {
      ref[v] = element(spec.ref[v]);
      hopFeed[v] = feed(spec.hopFeed[v]);
    }
  }
  const owners = new Int32Array(svc.owners.length);
  for (let j = 0; j < owners.length; j++) owners[j] = element(svc.owners[j]);
  return { svc: { ...svc, base, ref, owners }, spec: { ...spec, ref, hopFeed } };
}

/**
 * The core of `doc`, which is `prev`'s document after an edit that created,
 * changed or deleted exactly the `changed` codes (documents in code order).
 */
export function updateCore(prev: EngineCore, doc: NetworkDocument, changedCodes: ChangedCodes): EngineCore {
  const set = (codes?: Iterable<string>) => new Set(Array.from(codes ?? [], normaliseCode));
  if (set(changedCodes.services).size > 0) throw new IncrementalUpdateError('the services changed');
  const changed = { sites: set(changedCodes.sites), groups: set(changedCodes.groups), carriages: set(changedCodes.carriages), feeds: set(changedCodes.feeds) };
  const t0 = performance.now();
  const u = updateModel(prev.model, doc, changed);
  const modelMs = performance.now() - t0;

  let t = performance.now();
  const touched = touchedServices(prev, u, changed);
  const fresh = buildSomeFlowSpecs(u.model, touched);
  const flowMs = performance.now() - t;

  t = performance.now();
  const specs: FlowSpec[] = [];
  const services: CompiledService[] = [];
  const full: FlowView[] = [];
  const main: FlowView[] = [];
  let base = 0;
  for (let s = 0; s < u.model.services.length; s++) {
    const spec = fresh[s];
    if (spec) {
      const svc = compileFlowSpec(spec, u.model, base);
      specs.push(spec);
      services.push(svc);
      full.push(fullView(svc));
      main.push(mainView(svc));
    } else {
      const moved = moveService(prev.services[s], prev.specs[s], base, u);
      specs.push(moved.spec);
      services.push(moved.svc);
      full.push(prev.full[s]);
      main.push(prev.main[s]);
    }
    base += specs[s].n;
  }
  const treesMs = performance.now() - t;
  t = performance.now();
  const core = assembleCore(u.model, specs, services, full, main, { modelMs, flowMs, compileMs: 0, idomMs: 0, treesMs, rebuiltServices: touched.reduce((n, t) => n + t, 0) });
  core.timings.compileMs = performance.now() - t;
  return core;
}

/**
 * Reach of a failure set for planned work and incidents, and the joint loss
 * of two sets (rule 10), on top of the engine's reach.
 *
 * One `OperationsReachCache` per network model: a work's reach is computed
 * once per network version and kept (a WeakMap keyed by the model, so an old
 * version's cache goes with its model). A pair's joint loss needs the union's
 * reach only when both sets touch a common service graph: a service that
 * only one of them touches loses under the union exactly what that one loses
 * alone, so its joint loss there is empty.
 */
import type { Element } from '@/shared/schemas/analysis';
import { compareElements, elementKey } from '@/shared/schemas/analysis';
import type { FrozenReach, OperationsReach } from '@/shared/schemas/operations';
import type { NetworkModel } from '../services/networkModel';

export interface ReachSets {
  reach: OperationsReach;
  lost: Set<string>;
  /** elements of the set the network does not have (left out of the reach) */
  missing: Element[];
  /** service codes whose graphs the set removes something from */
  services: Set<string>;
}

/** Sorted, without duplicates: the canonical form a failure set is stored and keyed in. */
export function canonicalElements(elements: readonly Element[]): Element[] {
  const seen = new Map<string, Element>();
  for (const e of elements) seen.set(elementKey(e), { kind: e.kind, code: e.code.trim() });
  return [...seen.values()].sort(compareElements);
}

const setKey = (elements: readonly Element[]) => canonicalElements(elements).map(elementKey).join('|');

export class OperationsReachCache {
  private readonly sets = new Map<string, ReachSets>();
  private touchIndex?: Map<string, Set<string>>;

  constructor(readonly model: NetworkModel) {}

  get networkVersion() {
    return this.model.networkVersion;
  }

  /** Reach of the set at this network version; elements the network lacks are reported, not counted. */
  of(elements: readonly Element[]): ReachSets {
    const key = setKey(elements);
    let r = this.sets.get(key);
    if (!r) {
      const engine = this.model.engine;
      const all = canonicalElements(elements);
      const known = all.filter((e) => engine.hasElement(e));
      const missing = all.filter((e) => !engine.hasElement(e));
      const { networkVersion: _v, ...reach } = known.length
        ? engine.reach(known)
        : { networkVersion: 0, lost: [], fallback: [], households: { lost: 0, fallback: 0 }, byService: [], sites: [] };
      const services = new Set<string>();
      const index = this.touches();
      for (const e of known) for (const s of index.get(elementKey(e)) ?? []) services.add(s);
      r = { reach, lost: new Set(reach.lost), missing, services };
      // A long-running process sees many ad-hoc sets; keep the cache bounded.
      if (this.sets.size > 20_000) this.sets.clear();
      this.sets.set(key, r);
    }
    return r;
  }

  /** The reach as stored with an incident step: lost carriages placed at their site and service. */
  frozen(elements: readonly Element[]): FrozenReach {
    const { reach } = this.of(elements);
    const places = reach.lost.map((carriage) => {
      const c = this.model.carriages.get(carriage)!;
      return { carriage, site: c.site, service: c.service };
    });
    return { ...reach, places };
  }

  /**
   * Joint loss of A and B (rule 10): carriages lost under A ∪ B and under
   * neither alone, and the households of sites with such a carriage and none
   * lost under A or B alone. Null when empty.
   */
  joint(a: readonly Element[], b: readonly Element[]): { jointLost: string[]; households: number } | null {
    const ra = this.of(a);
    const rb = this.of(b);
    let shared = false;
    for (const s of ra.services) if (rb.services.has(s)) shared = true;
    if (!shared) return null;
    const ru = this.of([...a, ...b]);
    const jointLost = ru.reach.lost.filter((c) => !ra.lost.has(c) && !rb.lost.has(c));
    if (jointLost.length === 0) return null;
    const siteOf = (c: string) => this.model.carriages.get(c)!.site;
    const alone = new Set<string>();
    for (const c of ra.lost) alone.add(siteOf(c));
    for (const c of rb.lost) alone.add(siteOf(c));
    const counted = new Set<string>();
    let households = 0;
    for (const c of jointLost) {
      const site = siteOf(c);
      if (alone.has(site) || counted.has(site)) continue;
      counted.add(site);
      households += this.model.sites.get(site)?.households ?? 0;
    }
    return { jointLost, households };
  }

  /** Which service graphs each element owns nodes in (rules 1 and 2 read off the document). */
  private touches(): Map<string, Set<string>> {
    if (this.touchIndex) return this.touchIndex;
    const index = new Map<string, Set<string>>();
    const add = (e: Element, service: string) => {
      const k = elementKey(e);
      let s = index.get(k);
      if (!s) index.set(k, (s = new Set()));
      s.add(service);
    };
    const doc = this.model.document;
    const siteGroups = new Map(doc.sites.map((s) => [s.code, s.groups ?? []]));
    const atSite = (site: string, service: string) => {
      add({ kind: 'site', code: site }, service);
      for (const g of siteGroups.get(site) ?? []) add({ kind: 'group', code: g }, service);
    };
    for (const c of doc.carriages) atSite(c.site, c.service);
    for (const f of doc.feeds) {
      const service = this.model.carriages.get(f.to)?.service;
      if (!service) continue;
      add({ kind: 'feed', code: f.code }, service);
      for (const g of f.groups ?? []) add({ kind: 'group', code: g }, service);
      for (const v of f.via ?? []) atSite(v, service);
    }
    return (this.touchIndex = index);
  }
}

const caches = new WeakMap<NetworkModel, OperationsReachCache>();
export function reachCacheFor(model: NetworkModel): OperationsReachCache {
  let c = caches.get(model);
  if (!c) caches.set(model, (c = new OperationsReachCache(model)));
  return c;
}

/** The reach in the shape events carry. */
export const eventReach = (r: OperationsReach) => ({ lost: r.lost, fallback: r.fallback, households: r.households });

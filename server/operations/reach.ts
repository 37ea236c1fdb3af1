/**
 * Reach of a failure set for planned work and incidents, and the joint loss
 * of two sets (rule 10), on top of the engine's reach.
 *
 * One `OperationsReachCache` per network model: a work's reach, and the
 * joint loss of a pair of works, is computed once per network version and
 * kept (a WeakMap keyed by the model, so an old version's cache goes with its
 * model). Clash detection works from lost sets
 * only (the engine's lean `lost`), and walks the union A ∪ B only when some
 * carriage lies downstream of both sets and is lost by neither: a carriage no
 * element of A can reach has, under A ∪ B, exactly what it has under B alone.
 */
import type { Element } from '@/shared/schemas/analysis';
import { compareElements, elementKey } from '@/shared/schemas/analysis';
import type { FrozenReach, OperationsReach } from '@/shared/schemas/operations';
import type { ServedNetwork } from '../services/servedNetwork';

export interface ReachSets {
  reach: OperationsReach;
  /** elements of the set the network does not have (left out of the reach) */
  missing: Element[];
}

/** What clash detection needs of a set: its lost carriages and what lies downstream of it. */
interface LostSet {
  lost: Set<string>;
  downstream: Set<string>;
}

export interface JointLoss {
  jointLost: string[];
  households: number;
}

/** Sorted, without duplicates: the canonical form a failure set is stored and keyed in. */
export function canonicalElements(elements: readonly Element[]): Element[] {
  const seen = new Map<string, Element>();
  for (const e of elements) seen.set(elementKey(e), { kind: e.kind, code: e.code.trim() });
  return [...seen.values()].sort(compareElements);
}

const setKey = (elements: readonly Element[]) => canonicalElements(elements).map(elementKey).join('|');
/** Between the two set keys of a pair: a set key never holds it (element keys are never empty). */
const PAIR = '||';

export class OperationsReachCache {
  private readonly sets = new Map<string, ReachSets>();
  private readonly lostSets = new Map<string, LostSet>();
  /** Joint loss per pair of sets: the works list asks for the same pairs on every read. */
  private readonly pairs = new Map<string, JointLoss | null>();

  constructor(readonly model: ServedNetwork) {}

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
      // Even the empty set goes through the engine: rule 5 puts carriages fed only by a reserve on fallback with nothing failed.
      const { networkVersion: _v, ...reach } = engine.reach(known);
      r = { reach, missing };
      // A long-running process sees many ad-hoc sets; keep the cache bounded.
      if (this.sets.size > 20_000) this.sets.clear();
      this.sets.set(key, r);
    }
    return r;
  }

  /** Drops what is kept for one set and its pairs (the operations bench times a set computed afresh among warm ones). */
  forget(elements: readonly Element[]) {
    const key = setKey(elements);
    this.sets.delete(key);
    this.lostSets.delete(key);
    for (const pair of this.pairs.keys()) if (pair.split(PAIR).includes(key)) this.pairs.delete(pair);
  }

  /** Lost carriages only (the engine's lean path: no fallback, no answer), for the many sets clash detection combines. */
  private lostOf(elements: readonly Element[]): LostSet {
    const key = setKey(elements);
    let r = this.lostSets.get(key);
    if (!r) {
      const engine = this.model.engine;
      const known = canonicalElements(elements).filter((e) => engine.hasElement(e));
      r = { lost: new Set(engine.lost(known)), downstream: downstreamOf(this.model, known) };
      if (this.lostSets.size > 50_000) this.lostSets.clear();
      this.lostSets.set(key, r);
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
  joint(a: readonly Element[], b: readonly Element[]): JointLoss | null {
    const [ka, kb] = [setKey(a), setKey(b)];
    const key = ka < kb ? `${ka}${PAIR}${kb}` : `${kb}${PAIR}${ka}`;
    let r = this.pairs.get(key);
    if (r === undefined) {
      r = this.jointOnce(a, b);
      if (this.pairs.size > 50_000) this.pairs.clear();
      this.pairs.set(key, r);
    }
    return r;
  }

  private jointOnce(a: readonly Element[], b: readonly Element[]): JointLoss | null {
    const ra = this.lostOf(a);
    const rb = this.lostOf(b);
    // A joint-lost carriage is downstream of both sets and lost by neither: without one, skip the union's walk.
    const [small, large] = ra.downstream.size <= rb.downstream.size ? [ra.downstream, rb.downstream] : [rb.downstream, ra.downstream];
    let candidate = false;
    for (const c of small) {
      if (large.has(c) && !ra.lost.has(c) && !rb.lost.has(c)) {
        candidate = true;
        break;
      }
    }
    if (!candidate) return null;
    const known = canonicalElements([...a, ...b]).filter((e) => this.model.engine.hasElement(e));
    const jointLost = this.model.engine.lost(known).filter((c) => !ra.lost.has(c) && !rb.lost.has(c));
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
}

/** Per model, once: who feeds whom and which elements bring which feeds and carriages down (rules 1 and 2). */
interface Adjacency {
  feedTargets: Map<string, string[]>; // carriage -> carriages it feeds
  siteCarriages: Map<string, string[]>;
  groupSites: Map<string, string[]>;
  groupFeedTargets: Map<string, string[]>;
  viaFeedTargets: Map<string, string[]>; // site -> targets of feeds passing via it
  feedTarget: Map<string, string>;
}
const adjacencies = new WeakMap<ServedNetwork, Adjacency>();
function adjacencyFor(model: ServedNetwork): Adjacency {
  let a = adjacencies.get(model);
  if (a) return a;
  const push = (m: Map<string, string[]>, k: string, v: string) => {
    const l = m.get(k);
    if (l) l.push(v);
    else m.set(k, [v]);
  };
  a = { feedTargets: new Map(), siteCarriages: new Map(), groupSites: new Map(), groupFeedTargets: new Map(), viaFeedTargets: new Map(), feedTarget: new Map() };
  const doc = model.document;
  for (const c of doc.carriages) push(a.siteCarriages, c.site, c.code);
  for (const s of doc.sites) for (const g of s.groups ?? []) push(a.groupSites, g, s.code);
  for (const f of doc.feeds) {
    push(a.feedTargets, f.from, f.to);
    a.feedTarget.set(f.code, f.to);
    for (const g of f.groups ?? []) push(a.groupFeedTargets, g, f.to);
    for (const v of f.via ?? []) push(a.viaFeedTargets, v, f.to);
  }
  adjacencies.set(model, a);
  return a;
}

/**
 * Carriages downstream of what the set brings down: the carriages at its
 * down sites, its failed carriages and the targets of its down feeds, and
 * everything they feed. A
 * carriage the set's removal can affect, alone or with another set, is in here.
 */
function downstreamOf(model: ServedNetwork, elements: readonly Element[]): Set<string> {
  const a = adjacencyFor(model);
  const start: string[] = [];
  const downSite = (site: string) => {
    start.push(...(a.siteCarriages.get(site) ?? []), ...(a.viaFeedTargets.get(site) ?? []));
  };
  for (const e of elements) {
    if (e.kind === 'site') downSite(e.code);
    else if (e.kind === 'carriage') start.push(e.code);
    else if (e.kind === 'feed') {
      const t = a.feedTarget.get(e.code);
      if (t) start.push(t);
    } else {
      for (const site of a.groupSites.get(e.code) ?? []) downSite(site);
      start.push(...(a.groupFeedTargets.get(e.code) ?? []));
    }
  }
  const seen = new Set<string>();
  while (start.length) {
    const c = start.pop()!;
    if (seen.has(c)) continue;
    seen.add(c);
    for (const t of a.feedTargets.get(c) ?? []) if (!seen.has(t)) start.push(t);
  }
  return seen;
}

const caches = new WeakMap<ServedNetwork, OperationsReachCache>();
export function reachCacheFor(model: ServedNetwork): OperationsReachCache {
  let c = caches.get(model);
  if (!c) caches.set(model, (c = new OperationsReachCache(model)));
  return c;
}

/** The reach in the shape events carry. */
export const eventReach = (r: OperationsReach) => ({ lost: r.lost, fallback: r.fallback, households: r.households });

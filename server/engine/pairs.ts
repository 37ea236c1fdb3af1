/**
 * Critical pairs (rule 10): every pair of elements {x, y} whose joint failure
 * takes off air carriages that neither takes alone, with the households of
 * that joint loss. Exact, without trying every pair.
 *
 * Per service graph G (graphs.ts), with D its dominator tree:
 *
 * 1. The region of X. Removing X's nodes can only change the root paths of
 *    nodes reachable from X (R_X, forward from X's nodes): a node outside R_X
 *    has no root path through X. A joint loss of {X, Y} lies in R_X ∩ R_Y.
 *
 * 2. Dominators of G − X without walking G. Every entry into R_X comes from a
 *    node a outside it, whose root paths do not touch X, so a's dominators in
 *    G − X are its D ancestors. H_X = R_X plus the D ancestors of the entry
 *    nodes, with the D edges idom(a) -> a, the entry edges and the edges
 *    inside R_X, has exactly the dominators of G − X on R_X: a node w is on
 *    every root path to v ∈ R_X in G − X iff it is on every path of H_X (the
 *    prefixes up to an entry a are replaced by a's dominator chain, and a
 *    prefix-node is on every prefix iff it dominates a). The immediate
 *    dominators of H_X come from Cooper-Harvey-Kennedy (dominators.ts), as
 *    a second-level dominator computation per removed element.
 *
 * 3. Single-node partners. If Y owns one node w of G and v ∈ R_X keeps
 *    programme under X, then v is lost under X ∪ Y iff w dominates v in
 *    G − X, and not lost under Y alone iff w does not dominate v in G (D's
 *    preorder intervals, dominator-tree.ts). So the joint loss with every
 *    single-node partner is read off v's dominator chain in H_X: the chain
 *    nodes that are not D ancestors of v. Found from both sides when X is
 *    single-node too: recorded once, from the smaller id.
 *
 * 4. Both elements own several nodes of G (a group, a via-site that also
 *    carries the service): no dominator stands for either, so the pair is
 *    removed and walked (removal-walk.ts), as the engine does for single
 *    failures; only pairs whose kept regions M_X, M_Y (nodes of R that keep
 *    programme alone) share a carriage are walked, and the loss is M_X ∩ M_Y ∩
 *    lost(X ∪ Y).
 *
 * Cost: per element and service, O(|H_X| α) for the dominators plus the
 * dominator chains of R_X's carriages, so O(elements × (nodes + edges))
 * in the worst case instead of O(elements² × edges) for all pairs, plus the
 * walks of step 4 (few elements own several nodes of one service).
 *
 * Households (rule 10): sites with a carriage in the joint loss and none in
 * Reach({x}) ∪ Reach({y}), over all services.
 *
 * The work runs in steps (`step(deadlineMs)`) so a server can yield to its
 * event loop between them and report progress.
 */
import type { ElementKind } from '@/shared/schemas/network';
import type { EngineCore } from './core';
import { csrFromEdges } from './csr';
import { immediateDominators } from './dominators';
import { IntList } from './removal-walk';
import { KIND_BIT } from './model';

export interface PairRow {
  /** element ids, a < b (compareElements order) */
  a: number;
  b: number;
  /** carriage ids, ascending (code order) */
  jointLost: Int32Array;
  households: number;
}


export class PairsJob {
  readonly total: number;
  done = 0;
  private readonly core: EngineCore;
  private readonly wanted: Uint8Array;
  private service = 0;
  private queue: Int32Array = new Int32Array(0);
  private position = 0;
  private started = false;
  /** per current service: alive node count per element */
  private readonly aliveCount: Int32Array;
  /** service id + 1 of the last service an element was counted in (progress) */
  private readonly seen: Int32Array;
  /** per current service: kept region M_X of each multi-node element (global carriage ids are not needed here: local nodes) */
  private multiKept = new Map<number, Int32Array>();
  /** pair key (a * E + b) -> joint lost carriage ids */
  private readonly joint = new Map<number, IntList>();
  private readonly stampA: Int32Array;
  private readonly stampB: Int32Array;
  private readonly local: Int32Array;
  private epoch = 0;
  private readonly reachSitesCache = new Map<number, Int32Array>();
  private finished: PairRow[] | null = null;

  constructor(core: EngineCore, kinds: readonly ElementKind[]) {
    this.core = core;
    const { model } = core;
    const mask = kinds.reduce((m, k) => m | KIND_BIT[k], 0);
    this.wanted = new Uint8Array(model.elementCount);
    for (let x = 0; x < model.elementCount; x++) this.wanted[x] = KIND_BIT[model.elements[x].kind] & mask ? 1 : 0;
    let total = 0;
    for (let x = 0; x < model.elementCount; x++) {
      if (!this.wanted[x]) continue;
      let last = -1;
      for (let k = core.elementNodeOffsets[x]; k < core.elementNodeOffsets[x + 1]; k++) {
        const s = core.nodeService[core.elementNodes[k]];
        if (s !== last) total++;
        last = s;
      }
    }
    this.total = total;
    this.aliveCount = new Int32Array(model.elementCount);
    this.seen = new Int32Array(model.elementCount);
    const maxN = core.services.reduce((m, svc) => Math.max(m, svc.n), 1);
    this.stampA = new Int32Array(maxN);
    this.stampB = new Int32Array(maxN);
    this.local = new Int32Array(maxN);
  }

  get isDone(): boolean {
    return this.finished !== null;
  }

  /** Works until `deadline` (performance.now() value) or the end; true when finished. */
  step(deadline: number): boolean {
    if (this.finished) return true;
    const services = this.core.services;
    while (this.service < services.length) {
      if (!this.started) this.openService();
      while (this.position < this.queue.length) {
        this.primary(this.queue[this.position++]);
        this.done++;
        if (performance.now() >= deadline) return false;
      }
      this.closeService();
      this.service++;
      this.started = false;
    }
    this.finished = this.rank();
    return true;
  }

  /** All pairs with a non-empty joint loss, highest households first, ties by a then b. */
  result(): PairRow[] {
    if (!this.finished) throw new Error('the pairs are still being computed');
    return this.finished;
  }

  private nextEpoch(): number {
    if (this.epoch === 0x7fffffff) {
      this.stampA.fill(0);
      this.stampB.fill(0);
      this.epoch = 0;
    }
    return ++this.epoch;
  }

  private openService(): void {
    const svc = this.core.services[this.service];
    const tree = this.core.full[this.service].tree;
    const list = new IntList();
    for (let u = 0; u < svc.n; u++) {
      if (!tree.alive[u]) continue;
      for (let j = svc.ownerOffsets[u]; j < svc.ownerOffsets[u + 1]; j++) {
        const x = svc.owners[j];
        if (this.aliveCount[x]++ === 0 && this.wanted[x]) list.push(x);
      }
    }
    // Every element with a node here counts one unit of progress, alive or not.
    const queue = list.toArray().sort();
    let owned = 0;
    for (let j = 0; j < svc.owners.length; j++) {
      const x = svc.owners[j];
      if (this.wanted[x] && this.seen[x] !== this.service + 1) {
        this.seen[x] = this.service + 1;
        owned++;
      }
    }
    this.done += owned - queue.length;
    this.queue = queue;
    this.position = 0;
    this.started = true;
    this.multiKept = new Map();
  }

  private closeService(): void {
    this.multiPairs();
    const svc = this.core.services[this.service];
    for (let j = 0; j < svc.owners.length; j++) this.aliveCount[svc.owners[j]] = 0;
  }

  private record(x: number, y: number, carriage: number): void {
    const a = x < y ? x : y;
    const b = x < y ? y : x;
    const key = a * this.core.model.elementCount + b;
    let l = this.joint.get(key);
    if (!l) this.joint.set(key, (l = new IntList(4)));
    l.push(carriage);
  }

  /** Alive local nodes of element x in the current service. */
  private nodesOf(x: number): number[] {
    const { core } = this;
    const svc = core.services[this.service];
    const alive = core.full[this.service].tree.alive;
    const out: number[] = [];
    for (let k = core.elementNodeOffsets[x]; k < core.elementNodeOffsets[x + 1]; k++) {
      const g = core.elementNodes[k];
      if (core.nodeService[g] === this.service && alive[g - svc.base]) out.push(g - svc.base);
    }
    return out;
  }

  /** Steps 1-3 for element x in the current service. */
  private primary(x: number): void {
    const { core } = this;
    const s = this.service;
    const svc = core.services[s];
    const { out, in: pred, tree } = core.full[s];
    const { tin, tout, idom: dIdom, alive } = tree;
    const xNodes = this.nodesOf(x);
    const xMulti = xNodes.length > 1;
    const ep = this.nextEpoch();
    const removed = this.stampB;
    const inR = this.stampA;
    for (const u of xNodes) removed[u] = ep;

    // 1. R_X, forward from X's nodes.
    const region = new IntList(64);
    let marked = 0;
    for (const u of xNodes) {
      for (let e = out.offsets[u]; e < out.offsets[u + 1]; e++) {
        const v = out.targets[e];
        if (removed[v] !== ep && inR[v] !== ep) {
          inR[v] = ep;
          region.push(v);
        }
      }
    }
    for (let head = 0; head < region.length; head++) {
      const u = region.data[head];
      if (svc.isCarriage[u]) marked++;
      for (let e = out.offsets[u]; e < out.offsets[u + 1]; e++) {
        const v = out.targets[e];
        if (removed[v] !== ep && inR[v] !== ep) {
          inR[v] = ep;
          region.push(v);
        }
      }
    }
    if (marked === 0) {
      if (xMulti) this.multiKept.set(x, new Int32Array(0));
      return;
    }

    // 2. H_X: D ancestors of the entry nodes, then R_X. `local` maps node -> H index; removed marks A with -ep.
    const local = this.local;
    const hNodes = new IntList(region.length + 16);
    const inA = removed; // A nodes get -ep (X nodes hold ep)
    const addA = (a: number) => {
      let w = a;
      while (w >= 0 && inA[w] !== -ep) {
        inA[w] = -ep;
        local[w] = hNodes.length;
        hNodes.push(w);
        w = dIdom[w];
      }
    };
    const src = new IntList(region.length * 2);
    const dst = new IntList(region.length * 2);
    addA(tree.root);
    for (let i = 0; i < region.length; i++) {
      const r = region.data[i];
      for (let e = pred.offsets[r]; e < pred.offsets[r + 1]; e++) {
        const w = pred.targets[e];
        if (inR[w] !== ep && removed[w] !== ep && alive[w]) addA(w);
      }
    }
    const aCount = hNodes.length;
    for (let i = 0; i < aCount; i++) {
      const a = hNodes.data[i];
      if (a !== tree.root) {
        src.push(local[dIdom[a]]);
        dst.push(i);
      }
    }
    for (let i = 0; i < region.length; i++) {
      local[region.data[i]] = hNodes.length;
      hNodes.push(region.data[i]);
    }
    for (let i = 0; i < region.length; i++) {
      const r = region.data[i];
      for (let e = pred.offsets[r]; e < pred.offsets[r + 1]; e++) {
        const w = pred.targets[e];
        if (inR[w] === ep || (inA[w] === -ep && alive[w])) {
          src.push(local[w]);
          dst.push(local[r]);
        }
      }
    }
    const h = csrFromEdges(hNodes.length, src.data, dst.data, src.length);
    const hIdom = immediateDominators(h, local[tree.root]);
    const hRoot = local[tree.root];

    // 3. Chains of the carriages that keep programme under X alone.
    const kept = xMulti ? new IntList(marked) : null;
    for (let i = 0; i < region.length; i++) {
      const v = region.data[i];
      if (!svc.isCarriage[v]) continue;
      const hv = local[v];
      if (hIdom[hv] === -1) continue; // lost under X alone
      kept?.push(v);
      const carriage = svc.ref[v];
      for (let w = hIdom[hv]; w !== hRoot && w !== -1; w = hIdom[w]) {
        const g = hNodes.data[w];
        if (tin[g] <= tin[v] && tin[v] < tout[g]) continue; // dominates v in G already: v lost under its owners alone
        for (let j = svc.ownerOffsets[g]; j < svc.ownerOffsets[g + 1]; j++) {
          const y = svc.owners[j];
          if (y === x || !this.wanted[y] || this.aliveCount[y] !== 1) continue;
          if (!xMulti && y < x) continue; // found from y's side
          this.record(x, y, carriage);
        }
      }
    }
    if (kept) this.multiKept.set(x, kept.toArray());
  }

  /** Step 4: pairs of multi-node elements of the current service, removed and walked. */
  private multiPairs(): void {
    if (this.multiKept.size < 2) return;
    const { core } = this;
    const s = this.service;
    const svc = core.services[s];
    const view = core.full[s];
    const byNode = new Map<number, number[]>();
    for (const [x, kept] of this.multiKept) {
      for (const v of kept) {
        const l = byNode.get(v);
        if (l) l.push(x);
        else byNode.set(v, [x]);
      }
    }
    const candidates = new Set<number>();
    const E = core.model.elementCount;
    for (const list of byNode.values()) {
      for (let i = 0; i < list.length; i++) for (let j = i + 1; j < list.length; j++) {
        const a = Math.min(list[i], list[j]);
        const b = Math.max(list[i], list[j]);
        candidates.add(a * E + b);
      }
    }
    const lost = new IntList(64);
    for (const key of [...candidates].sort((p, q) => p - q)) {
      const a = Math.floor(key / E);
      const b = key - a * E;
      const nodes = [...this.nodesOf(a), ...this.nodesOf(b)];
      lost.clear();
      core.walker.lostMarked(view, nodes, nodes.length, lost);
      const ep = this.nextEpoch();
      for (const v of this.multiKept.get(a)!) this.stampA[v] = ep;
      for (const v of this.multiKept.get(b)!) this.stampB[v] = ep;
      for (let i = 0; i < lost.length; i++) {
        const v = lost.data[i];
        if (this.stampA[v] === ep && this.stampB[v] === ep) this.record(a, b, svc.ref[v]);
      }
    }
  }

  /** Sites (ascending) with a carriage lost when element x alone fails. */
  private reachSites(x: number): Int32Array {
    let sites = this.reachSitesCache.get(x);
    if (sites) return sites;
    const { core } = this;
    const lost = new IntList(16);
    const bySvc = new Map<number, number[]>();
    for (let k = core.elementNodeOffsets[x]; k < core.elementNodeOffsets[x + 1]; k++) {
      const g = core.elementNodes[k];
      const s = core.nodeService[g];
      const l = bySvc.get(s);
      if (l) l.push(g - core.services[s].base);
      else bySvc.set(s, [g - core.services[s].base]);
    }
    const out = new Set<number>();
    for (const [s, nodes] of bySvc) {
      lost.clear();
      core.walker.lostMarked(core.full[s], nodes, nodes.length, lost);
      for (let i = 0; i < lost.length; i++) out.add(core.model.carriageSite[core.services[s].ref[lost.data[i]]]);
    }
    sites = Int32Array.from(out).sort();
    this.reachSitesCache.set(x, sites);
    return sites;
  }

  private rank(): PairRow[] {
    const { model } = this.core;
    const E = model.elementCount;
    const rows: PairRow[] = [];
    for (const [key, list] of this.joint) {
      const a = Math.floor(key / E);
      const b = key - a * E;
      const jointLost = list.toArray().sort();
      const ra = this.reachSites(a);
      const rb = this.reachSites(b);
      let households = 0;
      let lastSite = -1;
      const counted = new Set<number>();
      for (const c of jointLost) {
        const site = model.carriageSite[c];
        if (site === lastSite || counted.has(site)) continue;
        lastSite = site;
        counted.add(site);
        if (!has(ra, site) && !has(rb, site)) households += model.siteHouseholds[site];
      }
      rows.push({ a, b, jointLost, households });
    }
    this.joint.clear();
    this.reachSitesCache.clear();
    return rows.sort((p, q) => q.households - p.households || p.a - q.a || p.b - q.b);
  }
}

function has(sorted: Int32Array, v: number): boolean {
  let lo = 0;
  let hi = sorted.length - 1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    if (sorted[mid] === v) return true;
    if (sorted[mid] < v) lo = mid + 1;
    else hi = mid - 1;
  }
  return false;
}

/** Runs a job to the end in one go (tests, benchmark). */
export function allPairs(core: EngineCore, kinds: readonly ElementKind[]): PairRow[] {
  const job = new PairsJob(core, kinds);
  job.step(Number.POSITIVE_INFINITY);
  return job.result();
}

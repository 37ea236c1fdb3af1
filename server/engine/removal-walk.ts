/**
 * Who loses programme when a set of nodes is removed from one service graph.
 *
 * One node: its dominator subtree (Lengauer & Tarjan 1979, section 1: v is
 * cut off from the root by removing u iff u dominates v).
 *
 * Several nodes: every lost node is dominated by their nearest common
 * dominator L (each root path to a lost node passes a removed node, hence L).
 * If L itself is removed the answer is L's subtree. Otherwise only the nodes
 * inside L's subtree that a removed node reaches forward can be lost (any
 * other node keeps a root path avoiding the removed ones); among those, a
 * node survives iff a walk from their surviving predecessors reaches it. The
 * work is bounded by that affected region, not by the whole graph.
 */
import type { Csr } from './csr';
import { commonDominator, type DominatorTree } from './dominator-tree';

export interface FlowView {
  out: Csr;
  in: Csr;
  tree: DominatorTree;
}

/** A growable list of int32 values, reused between calls to avoid garbage. */
export class IntList {
  data: Int32Array;
  length = 0;
  constructor(capacity = 64) {
    this.data = new Int32Array(Math.max(4, capacity));
  }
  push(v: number): void {
    if (this.length === this.data.length) {
      const bigger = new Int32Array(this.data.length * 2);
      bigger.set(this.data);
      this.data = bigger;
    }
    this.data[this.length++] = v;
  }
  clear(): void {
    this.length = 0;
  }
  toArray(): Int32Array {
    return this.data.slice(0, this.length);
  }
}

export class RemovalWalker {
  private removed: Int32Array;
  private inRegion: Int32Array;
  private saved: Int32Array;
  private epoch = 0;
  private region: Int32Array;
  private queue: Int32Array;
  private distinct: Int32Array;

  constructor(maxNodes: number) {
    this.removed = new Int32Array(maxNodes);
    this.inRegion = new Int32Array(maxNodes);
    this.saved = new Int32Array(maxNodes);
    this.region = new Int32Array(maxNodes);
    this.queue = new Int32Array(maxNodes);
    this.distinct = new Int32Array(maxNodes);
  }

  private nextEpoch(): number {
    if (this.epoch === 0x7fffffff) {
      this.removed.fill(0);
      this.inRegion.fill(0);
      this.saved.fill(0);
      this.epoch = 0;
    }
    return ++this.epoch;
  }

  /**
   * Appends to `out` the marked nodes (carriages) of `view` that were reachable
   * and are not once `nodes[0 .. count)` are removed.
   */
  lostMarked(view: FlowView, nodes: ArrayLike<number>, count: number, out: IntList): void {
    const t = view.tree;
    const ep = this.nextEpoch();
    const removed = this.removed;
    let k = 0;
    for (let i = 0; i < count; i++) {
      const u = nodes[i];
      if (t.alive[u] && removed[u] !== ep) {
        removed[u] = ep;
        this.distinct[k++] = u;
      }
    }
    if (k === 0) return;
    let lca = this.distinct[0];
    for (let i = 1; i < k; i++) lca = commonDominator(t, lca, this.distinct[i]);
    if (removed[lca] === ep) {
      emitSubtree(t, lca, out);
      return;
    }
    const lo = t.tin[lca];
    const hi = t.tout[lca];
    const { offsets: oOff, targets: oTgt } = view.out;
    const { offsets: iOff, targets: iTgt } = view.in;
    const alive = t.alive;
    const tin = t.tin;
    const inRegion = this.inRegion;
    const saved = this.saved;
    const region = this.region;

    let size = 0;
    for (let i = 0; i < k; i++) {
      inRegion[this.distinct[i]] = ep;
      region[size++] = this.distinct[i];
    }
    for (let head = 0; head < size; head++) {
      const u = region[head];
      for (let e = oOff[u]; e < oOff[u + 1]; e++) {
        const v = oTgt[e];
        if (inRegion[v] !== ep && alive[v] && tin[v] > lo && tin[v] < hi) {
          inRegion[v] = ep;
          region[size++] = v;
        }
      }
    }

    const queue = this.queue;
    let qn = 0;
    for (let r = 0; r < size; r++) {
      const v = region[r];
      if (removed[v] === ep) continue;
      for (let e = iOff[v]; e < iOff[v + 1]; e++) {
        const w = iTgt[e];
        if (alive[w] && inRegion[w] !== ep) {
          saved[v] = ep;
          queue[qn++] = v;
          break;
        }
      }
    }
    for (let head = 0; head < qn; head++) {
      const u = queue[head];
      for (let e = oOff[u]; e < oOff[u + 1]; e++) {
        const v = oTgt[e];
        if (inRegion[v] === ep && removed[v] !== ep && saved[v] !== ep) {
          saved[v] = ep;
          queue[qn++] = v;
        }
      }
    }
    const marked = t.marked;
    for (let r = 0; r < size; r++) {
      const v = region[r];
      if (saved[v] !== ep && marked[v]) out.push(v);
    }
  }

  /**
   * The plain method, kept as the yardstick: mark the removed nodes, walk the
   * whole graph from the root, and take the reachable marked nodes not reached
   * (appended to `out` when given). Returns how many there are.
   */
  floorLost(view: FlowView, nodes: ArrayLike<number>, count: number, out?: IntList): number {
    const ep = this.nextEpoch();
    const removed = this.removed;
    for (let i = 0; i < count; i++) removed[nodes[i]] = ep;
    const seen = this.inRegion;
    const queue = this.queue;
    const { offsets, targets } = view.out;
    const root = view.tree.root;
    let qn = 0;
    seen[root] = ep;
    queue[qn++] = root;
    for (let head = 0; head < qn; head++) {
      const u = queue[head];
      for (let e = offsets[u]; e < offsets[u + 1]; e++) {
        const v = targets[e];
        if (seen[v] !== ep && removed[v] !== ep) {
          seen[v] = ep;
          queue[qn++] = v;
        }
      }
    }
    let lost = 0;
    const { alive, marked } = view.tree;
    for (let v = 0; v < alive.length; v++) {
      if (alive[v] && marked[v] && seen[v] !== ep) {
        lost++;
        if (out) out.push(v);
      }
    }
    return lost;
  }
}

export function emitSubtree(t: DominatorTree, u: number, out: IntList): void {
  const pre = t.markedPre;
  for (let i = t.markStart[u]; i < t.markEnd[u]; i++) out.push(pre[i]);
}

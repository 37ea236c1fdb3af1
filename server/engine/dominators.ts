/**
 * Immediate dominators of a directed graph, by the iterative algorithm of
 * K. D. Cooper, T. J. Harvey and K. Kennedy, "A Simple, Fast Dominance
 * Algorithm", Software Practice & Experience (2001); Rice University
 * technical report TR-06-33870, hdl 1911/96345 (Figure 3, with the
 * two-finger `intersect` over postorder numbers).
 *
 * Runs over an Int32Array CSR with explicit stacks (no recursion), so a chain
 * of half a million nodes does not overflow the call stack.
 *
 * Convention (pinned; networkx differs between versions): the root and every
 * node unreachable from it get -1.
 */
import { reverseCsr, type Csr } from './csr';

export class DominatorInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'DominatorInputError';
  }
}

/** Nodes reachable from `root` in depth-first postorder, and each node's postorder number (-1 if unreachable). */
export function depthFirstPostorder(g: Csr, root: number): { order: Int32Array; count: number; post: Int32Array } {
  const { n, offsets, targets } = g;
  const post = new Int32Array(n).fill(-1);
  const order = new Int32Array(n);
  const stackNode = new Int32Array(n);
  const stackEdge = new Int32Array(n);
  const seen = new Uint8Array(n);
  let sp = 1; // the root is pushed just below
  let count = 0;
  seen[root] = 1;
  stackNode[0] = root;
  stackEdge[0] = offsets[root];
  while (sp > 0) {
    const u = stackNode[sp - 1];
    const e = stackEdge[sp - 1];
    if (e < offsets[u + 1]) {
      stackEdge[sp - 1] = e + 1;
      const v = targets[e];
      if (!seen[v]) {
        seen[v] = 1;
        stackNode[sp] = v;
        stackEdge[sp] = offsets[v];
        sp++;
      }
    } else {
      sp--;
      post[u] = count;
      order[count++] = u;
    }
  }
  return { order, count, post };
}

/**
 * idom[v] for every node v of `g` (-1 for `root` and for nodes `root` cannot reach).
 * `preds` (the reversed graph) may be passed when the caller already has it.
 */
export function immediateDominators(g: Csr, root: number, preds?: Csr): Int32Array {
  if (!g || !(g.offsets instanceof Int32Array) || !(g.targets instanceof Int32Array) || g.offsets.length !== g.n + 1) {
    throw new DominatorInputError('graph must be a CSR with Int32Array offsets (n + 1 long) and targets');
  }
  if (!Number.isInteger(root) || root < 0 || root >= g.n) {
    throw new DominatorInputError(`root must be a node index in 0..${g.n - 1} (got ${String(root)})`);
  }
  const rev = preds ?? reverseCsr(g);
  if (rev.n !== g.n) throw new DominatorInputError(`predecessor graph has ${rev.n} nodes, graph has ${g.n}`);

  const { order, count, post } = depthFirstPostorder(g, root);
  const idom = new Int32Array(g.n).fill(-1);
  idom[root] = root;
  const pOff = rev.offsets;
  const pTgt = rev.targets;

  let changed = true;
  while (changed) {
    changed = false;
    // Reverse postorder, root (the last in postorder) excluded.
    for (let k = count - 2; k >= 0; k--) {
      const b = order[k];
      let newIdom = -1;
      for (let i = pOff[b]; i < pOff[b + 1]; i++) {
        const p = pTgt[i];
        // Unprocessed predecessors and unreachable ones still hold -1.
        if (idom[p] === -1) continue;
        if (newIdom === -1) {
          newIdom = p;
          continue;
        }
        let f1 = p;
        let f2 = newIdom;
        while (f1 !== f2) {
          while (post[f1] < post[f2]) f1 = idom[f1];
          while (post[f2] < post[f1]) f2 = idom[f2];
        }
        newIdom = f1;
      }
      if (idom[b] !== newIdom) {
        idom[b] = newIdom;
        changed = true;
      }
    }
  }
  idom[root] = -1;
  return idom;
}

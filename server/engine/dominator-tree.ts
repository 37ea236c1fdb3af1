/**
 * Preorder (Euler-tour) intervals over a dominator tree, so that "every node
 * that loses its only path when u is removed" (u's subtree) is a contiguous
 * range: v is in u's subtree iff tin[u] <= tin[v] < tout[u]. The marked nodes
 * (carriages) are also listed in preorder, so a subtree's carriages are
 * markedPre[markStart[u] .. markEnd[u]) without touching the other nodes.
 */
export interface DominatorTree {
  root: number;
  idom: Int32Array;
  /** 1 for the root and every node reachable from it */
  alive: Uint8Array;
  tin: Int32Array;
  tout: Int32Array;
  /** the marked nodes (carriages), as given */
  marked: Uint8Array;
  markedPre: Int32Array;
  markStart: Int32Array;
  markEnd: Int32Array;
}

export function indexDominatorTree(idom: Int32Array, root: number, marked: Uint8Array): DominatorTree {
  const n = idom.length;
  const childOffsets = new Int32Array(n + 1);
  for (let v = 0; v < n; v++) if (idom[v] >= 0) childOffsets[idom[v] + 1]++;
  for (let u = 0; u < n; u++) childOffsets[u + 1] += childOffsets[u];
  const fill = childOffsets.slice(0, n);
  const children = new Int32Array(childOffsets[n]);
  for (let v = 0; v < n; v++) if (idom[v] >= 0) children[fill[idom[v]]++] = v;

  const alive = new Uint8Array(n);
  const tin = new Int32Array(n).fill(-1);
  const tout = new Int32Array(n).fill(-1);
  const markStart = new Int32Array(n).fill(-1);
  const markEnd = new Int32Array(n).fill(-1);
  let markedCount = 0;
  for (let v = 0; v < n; v++) markedCount += marked[v];
  const markedPre = new Int32Array(markedCount);
  let mk = 0;
  const stackNode = new Int32Array(n);
  const stackChild = new Int32Array(n);
  let sp = 1; // the root is pushed just below
  let clock = 0;
  stackNode[0] = root;
  stackChild[0] = childOffsets[root];
  tin[root] = clock++;
  alive[root] = 1;
  markStart[root] = 0;
  if (marked[root]) markedPre[mk++] = root;
  while (sp > 0) {
    const u = stackNode[sp - 1];
    const c = stackChild[sp - 1];
    if (c < childOffsets[u + 1]) {
      stackChild[sp - 1] = c + 1;
      const v = children[c];
      tin[v] = clock++;
      alive[v] = 1;
      markStart[v] = mk;
      if (marked[v]) markedPre[mk++] = v;
      stackNode[sp] = v;
      stackChild[sp] = childOffsets[v];
      sp++;
    } else {
      sp--;
      tout[u] = clock;
      markEnd[u] = mk;
    }
  }
  // Unreachable marked nodes never enter the preorder; the tail stays unused.
  return { root, idom, alive, tin, tout, marked, markedPre: markedPre.subarray(0, mk), markStart, markEnd };
}

/** Nearest common dominator of two reachable nodes. */
export function commonDominator(t: DominatorTree, a: number, b: number): number {
  let x = a;
  while (!(t.tin[x] <= t.tin[b] && t.tin[b] < t.tout[x])) x = t.idom[x];
  return x;
}

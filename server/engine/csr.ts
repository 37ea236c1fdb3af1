/**
 * Compressed sparse row adjacency: the out-neighbours of node u are
 * targets[offsets[u] .. offsets[u + 1]). Hot loops of the engine run over
 * these typed arrays rather than over graphology's keyed maps (the same
 * choice graphology's own metrics make, e.g. graphology-indices'
 * neighborhood index), because at national scale (~470k nodes) a keyed walk
 * is one to two orders of magnitude slower.
 */
export interface Csr {
  n: number;
  offsets: Int32Array;
  targets: Int32Array;
}

/** Builds a CSR from parallel edge arrays; `keep`, when given, selects which edges to take. */
export function csrFromEdges(n: number, sources: Int32Array, targets: Int32Array, edgeCount: number, keep?: Uint8Array): Csr {
  const offsets = new Int32Array(n + 1);
  let m = 0;
  for (let e = 0; e < edgeCount; e++) {
    if (keep && !keep[e]) continue;
    offsets[sources[e] + 1]++;
    m++;
  }
  for (let u = 0; u < n; u++) offsets[u + 1] += offsets[u];
  const fill = offsets.slice(0, n);
  const out = new Int32Array(m);
  for (let e = 0; e < edgeCount; e++) {
    if (keep && !keep[e]) continue;
    out[fill[sources[e]]++] = targets[e];
  }
  return { n, offsets, targets: out };
}

/** The same graph with every edge turned round (predecessor lists). */
export function reverseCsr(g: Csr): Csr {
  const { n, offsets, targets } = g;
  const rOffsets = new Int32Array(n + 1);
  for (let i = 0; i < targets.length; i++) rOffsets[targets[i] + 1]++;
  for (let u = 0; u < n; u++) rOffsets[u + 1] += rOffsets[u];
  const fill = rOffsets.slice(0, n);
  const rTargets = new Int32Array(targets.length);
  for (let u = 0; u < n; u++) {
    for (let i = offsets[u]; i < offsets[u + 1]; i++) rTargets[fill[targets[i]]++] = u;
  }
  return { n, offsets: rOffsets, targets: rTargets };
}

/** A CSR from a list of [source, target] pairs (tests and small tools). */
export function csrFromPairs(n: number, pairs: ReadonlyArray<readonly [number, number]>): Csr {
  const s = new Int32Array(pairs.length);
  const t = new Int32Array(pairs.length);
  pairs.forEach(([a, b], i) => {
    if (!Number.isInteger(a) || !Number.isInteger(b) || a < 0 || b < 0 || a >= n || b >= n) {
      throw new RangeError(`edge ${i} (${a} -> ${b}) names a node outside 0..${n - 1}`);
    }
    s[i] = a;
    t[i] = b;
  });
  return csrFromEdges(n, s, t, pairs.length);
}

import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { immediateDominators, DominatorInputError } from '@/server/engine/dominators';
import { csrFromPairs, reverseCsr, type Csr } from '@/server/engine/csr';
import { findNetworkxPython, networkxImmediateDominatorsMany } from '@/test/helpers/networkx';
import { nationalNetwork, prng } from '@/test/helpers/random-network';
import { NetworkEngine } from '@/server/engine/engine';
import { flowGraphs } from '@/test/helpers/engine-yardsticks';

type Pairs = [number, number][];
const idomOf = (n: number, edges: Pairs, root: number) => Array.from(immediateDominators(csrFromPairs(n, edges), root));
/** Expected idom as an array: -1 for the root and for nodes not listed. */
const expected = (n: number, map: Record<number, number>) => Array.from({ length: n }, (_, v) => map[v] ?? -1);

describe('immediateDominators: argument guards', () => {
  it('rejects a root outside the graph', () => {
    expect(() => immediateDominators(csrFromPairs(3, [[0, 1]]), 3)).toThrow(DominatorInputError);
    expect(() => immediateDominators(csrFromPairs(3, [[0, 1]]), -1)).toThrow(/root must be a node index in 0..2/);
  });
  it('rejects something that is not a CSR', () => {
    const bad = { n: 3, offsets: new Int32Array(2), targets: new Int32Array(0) } as Csr;
    expect(() => immediateDominators(bad, 0)).toThrow(/Int32Array offsets \(n \+ 1 long\)/);
  });
  it('rejects edges naming nodes outside the graph', () => {
    expect(() => csrFromPairs(2, [[0, 2]])).toThrow(/edge 0 \(0 -> 2\) names a node outside 0..1/);
  });
});

describe('immediateDominators: published graphs', () => {
  // Lengauer & Tarjan, ACM TOPLAS 1(1):121-141 (1979), Fig. 1; expected array as in
  // boostorg/graph test/dominator_tree_test.cpp testSet[0] (R=0, A=1, ... L=12), docs/checks.md, "Dominators".
  it('Lengauer-Tarjan Fig. 1', () => {
    const [R, A, B, C, D, E, F, G, H, I, J, K, L] = Array.from({ length: 13 }, (_, i) => i);
    const edges: Pairs = [
      [R, A], [R, B], [R, C], [A, D], [B, A], [B, D], [B, E], [C, F], [C, G], [D, L], [E, H], [F, I],
      [G, I], [G, J], [H, E], [H, K], [I, K], [J, I], [K, I], [K, R], [L, H],
    ];
    expect(idomOf(13, edges, R)).toEqual([-1, 0, 0, 0, 0, 0, 3, 3, 0, 0, 7, 0, 4]);
  });

  // Cooper, Harvey & Kennedy, "A Simple, Fast Dominance Algorithm" (2001), Fig. 2 (irreducible);
  // as in networkx networkx/algorithms/tests/test_dominance.py (docs/checks.md, "Dominators").
  it('Cooper-Harvey-Kennedy Fig. 2', () => {
    const edges: Pairs = [[1, 2], [2, 1], [3, 2], [4, 1], [5, 3], [5, 4]];
    expect(idomOf(6, edges, 5)).toEqual(expected(6, { 1: 5, 2: 5, 3: 5, 4: 5 }));
  });

  // Cooper, Harvey & Kennedy (2001), Fig. 4; networkx test_dominance.py.
  it('Cooper-Harvey-Kennedy Fig. 4', () => {
    const edges: Pairs = [[1, 2], [2, 1], [2, 3], [3, 2], [4, 2], [4, 3], [5, 1], [6, 4], [6, 5]];
    expect(idomOf(7, edges, 6)).toEqual(expected(7, { 1: 6, 2: 6, 3: 6, 4: 6, 5: 6 }));
  });

  // Boost Graph Library documentation Fig. 1, as in networkx test_dominance.py (test_boost_example).
  const boost: Pairs = [[0, 1], [1, 2], [1, 3], [2, 7], [3, 4], [4, 5], [4, 6], [5, 7], [6, 4]];
  it('Boost documentation Fig. 1: dominators', () => {
    expect(idomOf(8, boost, 0)).toEqual(expected(8, { 1: 0, 2: 1, 3: 1, 4: 3, 5: 4, 6: 4, 7: 1 }));
  });
  it('Boost documentation Fig. 1: post-dominators (reversed graph from 7)', () => {
    const reversed = reverseCsr(csrFromPairs(8, boost));
    expect(Array.from(immediateDominators(reversed, 7))).toEqual(expected(8, { 0: 1, 1: 7, 2: 7, 3: 4, 4: 5, 5: 7, 6: 4 }));
  });

  // "Domrel.png" example of networkx test_dominance.py (test_domrel_png).
  it('networkx domrel example', () => {
    const edges: Pairs = [[1, 2], [2, 3], [2, 4], [2, 6], [3, 5], [4, 5], [5, 2]];
    expect(idomOf(7, edges, 1)).toEqual(expected(7, { 2: 1, 3: 2, 4: 2, 5: 2, 6: 2 }));
  });

  it('leaves unreachable nodes and the root at -1, also with edges out of unreachable nodes', () => {
    expect(idomOf(5, [[0, 1], [3, 1], [3, 4], [4, 2]], 0)).toEqual([-1, 0, -1, -1, -1]);
  });

  it('walks a 300 000-node chain without recursion', () => {
    const n = 300_000;
    const edges: Pairs = Array.from({ length: n - 1 }, (_, i) => [i, i + 1] as [number, number]);
    const idom = immediateDominators(csrFromPairs(n, edges), 0);
    expect(idom[n - 1]).toBe(n - 2);
    expect(idom[1]).toBe(0);
  });
});

function randomGraph(seed: number, n: number, m: number): Pairs {
  const rnd = prng(seed);
  return Array.from({ length: m }, () => [Math.floor(rnd() * n), Math.floor(rnd() * n)] as [number, number]);
}

/** Dominance by its definition: d dominates v iff v is reachable and removing d cuts it off from the root. */
function definitionalIdom(n: number, edges: Pairs, root: number): number[] {
  const out: number[][] = Array.from({ length: n }, () => []);
  for (const [a, b] of edges) out[a].push(b);
  const reach = (removed: number) => {
    const seen = new Array<boolean>(n).fill(false);
    if (removed === root) return seen;
    const stack = [root];
    seen[root] = true;
    while (stack.length) {
      for (const v of out[stack.pop()!]) {
        if (v !== removed && !seen[v]) {
          seen[v] = true;
          stack.push(v);
        }
      }
    }
    return seen;
  };
  const base = reach(-1);
  const doms = Array.from({ length: n }, () => [] as number[]);
  for (let d = 0; d < n; d++) {
    if (!base[d]) continue;
    const r = reach(d);
    for (let v = 0; v < n; v++) if (base[v] && v !== d && !r[v]) doms[v].push(d);
  }
  // The immediate dominator is the strict dominator that every other strict dominator dominates.
  return Array.from({ length: n }, (_, v) => (v === root || !base[v] ? -1 : doms[v].find((d) => doms[v].every((o) => o === d || doms[d].includes(o)))!));
}

describe('immediateDominators: generated graphs', () => {
  it('agrees with the definition (remove each node, walk again) on 300 random graphs', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 1e9 }), fc.integer({ min: 1, max: 25 }), fc.integer({ min: 0, max: 60 }), (seed, n, m) => {
        const edges = randomGraph(seed, n, m);
        expect(idomOf(n, edges, 0)).toEqual(definitionalIdom(n, edges, 0));
      }),
      { numRuns: 300 },
    );
  });

  const nx = findNetworkxPython();
  // npm test installs Debian's python3-networkx and, under CI, sets HEADWATER_REQUIRE_NETWORKX, so there a missing networkx fails instead of skipping
  it.runIf(!!process.env.HEADWATER_REQUIRE_NETWORKX)('finds python3 with networkx where it is required', () => {
    expect(nx).not.toBeNull();
  });
  it.skipIf(!nx)(`agrees with networkx immediate_dominators on random graphs${nx ? ` (networkx ${nx.version})` : ' (skipped: no python3 with networkx found)'}`, () => {
    const shapes = [
      [30, 45],
      [200, 400],
      [2000, 2600],
      [5000, 15000],
    ];
    const graphs = shapes.flatMap(([n, m], k) => Array.from({ length: 5 }, (_, seed) => ({ graph: csrFromPairs(n, randomGraph(1000 * k + seed, n, m)), root: 0 })));
    const theirs = networkxImmediateDominatorsMany(graphs);
    expect(theirs).toHaveLength(graphs.length);
    graphs.forEach(({ graph }, i) => {
      expect(Array.from(immediateDominators(graph, 0))).toEqual(Array.from(theirs[i].idom));
    });
  });

  it.skipIf(!nx)(`agrees with networkx on the engine's own service graphs${nx ? '' : ' (skipped: no python3 with networkx found)'}`, () => {
    const engine = NetworkEngine.build(nationalNetwork({ sites: 1500, seed: 21, services: 4 }), 1);
    const graphs = flowGraphs(engine);
    expect(graphs.length).toBe(4);
    const theirs = networkxImmediateDominatorsMany(graphs.map(({ graph }) => ({ graph, root: 0 })));
    graphs.forEach(({ idom }, i) => expect(Array.from(idom)).toEqual(Array.from(theirs[i].idom)));
  });
});

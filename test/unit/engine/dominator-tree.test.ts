import { describe, expect, it } from 'vitest';
import { immediateDominators } from '@/server/engine/dominators';
import { commonDominator, indexDominatorTree } from '@/server/engine/dominator-tree';
import { csrFromPairs } from '@/server/engine/csr';

// Lengauer & Tarjan (1979) Fig. 1 (R=0, A=1, ... L=12), dominator tree as in docs/checks.md, "Dominators":
// R -> {A, B, C, D, E, H, I, K}, C -> {F, G}, G -> J, D -> L; plus an unreachable node 13.
const [R, A, B, C, D, E, F, G, H, I, J, K, L] = Array.from({ length: 13 }, (_, i) => i);
const edges: [number, number][] = [
  [R, A], [R, B], [R, C], [A, D], [B, A], [B, D], [B, E], [C, F], [C, G], [D, L], [E, H], [F, I],
  [G, I], [G, J], [H, E], [H, K], [I, K], [J, I], [K, I], [K, R], [L, H], [13, A],
];
const marked = new Uint8Array(14);
for (const v of [F, J, L, I, 13]) marked[v] = 1;
const tree = indexDominatorTree(immediateDominators(csrFromPairs(14, edges), R), R, marked);
const subtree = (u: number) => Array.from({ length: 14 }, (_, v) => v).filter((v) => tree.tin[v] >= tree.tin[u] && tree.tin[v] < tree.tout[u] && tree.tin[v] >= 0);
const markedUnder = (u: number) => Array.from(tree.markedPre.subarray(tree.markStart[u], tree.markEnd[u])).sort((a, b) => a - b);

describe('indexDominatorTree', () => {
  it('gives each node its dominator subtree as a preorder interval', () => {
    expect(subtree(C)).toEqual([C, F, G, J]);
    expect(subtree(D)).toEqual([D, L]);
    expect(subtree(G)).toEqual([G, J]);
    expect(subtree(R)).toEqual([R, A, B, C, D, E, F, G, H, I, J, K, L]);
  });
  it('lists the marked nodes of a subtree without visiting the others, and leaves out unreachable ones', () => {
    expect(markedUnder(C)).toEqual([F, J]);
    expect(markedUnder(D)).toEqual([L]);
    expect(markedUnder(R)).toEqual([F, I, J, L]);
    expect(tree.alive[13]).toBe(0);
    expect(tree.tin[13]).toBe(-1);
  });
  it('finds the nearest common dominator', () => {
    expect(commonDominator(tree, F, J)).toBe(C);
    expect(commonDominator(tree, J, G)).toBe(G);
    expect(commonDominator(tree, L, F)).toBe(R);
  });
});

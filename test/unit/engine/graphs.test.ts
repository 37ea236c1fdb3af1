/**
 * The graphology model and the compiled arrays are the same graph: every
 * node of the graphology graph, in insertion order, is the compiled node of
 * the same index, with the same out-neighbours.
 */
import { describe, expect, it } from 'vitest';
import { NetworkEngine } from '@/server/engine/engine';
import { flowGraphs } from '@/test/helpers/engine-yardsticks';
import { nationalNetwork, smallRandomNetwork } from '@/test/helpers/random-network';
import type { NetworkDocument } from '@/shared/schemas/network';
import { valleyNetwork } from './fixtures';

function sameGraphs(doc: NetworkDocument) {
  const engine = NetworkEngine.build(doc, 1);
  for (const { service, graph } of flowGraphs(engine)) {
    const g = engine.serviceGraph(service)!;
    expect(g.order).toBe(graph.n);
    expect(g.size).toBe(graph.targets.length);
    const ids = new Map<string, number>();
    g.forEachNode((key) => ids.set(key, ids.size));
    const fromGraphology: number[][] = Array.from({ length: graph.n }, () => []);
    g.forEachEdge((_e, _a, source, target) => fromGraphology[ids.get(source)!].push(ids.get(target)!));
    const compiled = Array.from({ length: graph.n }, (_, u) => Array.from(graph.targets.subarray(graph.offsets[u], graph.offsets[u + 1])));
    expect(fromGraphology.map((l) => l.sort((a, b) => a - b))).toEqual(compiled.map((l) => l.sort((a, b) => a - b)));
  }
  // built once, then kept
  const first = flowGraphs(engine)[0].service;
  expect(engine.serviceGraph(first)).toBe(engine.serviceGraph(first));
}

describe('graphology model and compiled arrays', () => {
  it('agree on the hand-built network', () => sameGraphs(valleyNetwork()));
  it('agree on random small networks', () => {
    for (let seed = 0; seed < 30; seed++) {
      sameGraphs(smallRandomNetwork({ seed, sites: 8, services: 2, groups: 2, feeds: 14, originChance: 0.3, carriageChance: 0.8 }));
    }
  });
  it('agree on a generated national network', () => sameGraphs(nationalNetwork({ sites: 800, seed: 3, services: 4 })));
});

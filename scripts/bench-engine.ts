/**
 * Timing of the analysis engine alone (no database, no HTTP) on one network
 * document. `benchEngine` is called by the main benchmark; run this file
 * directly to time a generated network:
 *
 *   npx tsx scripts/bench-engine.ts --sites 20000 --seed 1
 *
 * Every number is measured on this machine in this run; the baseline for
 * "every element's exposure" is extrapolated from a timed sample and says so.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { NetworkDocument } from '@/shared/schemas/network';
import type { Element } from '@/shared/schemas/analysis';
import { NetworkEngine } from '@/server/engine/engine';
import { immediateDominators } from '@/server/engine/dominators';
import { timeNetworkxDominators } from '@/test/helpers/networkx';
import { baselineExposure, flowGraphs, recomputeResilience, walkFloor } from '@/test/helpers/engine-yardsticks';
import { nationalNetwork, prng } from '@/test/helpers/random-network';
import { benchPlanner, type PlannerBenchResult } from './bench-planner';
import { wholeArgument } from './lib/args';

export interface EngineBenchOptions {
  /** seed of the random choices of failed elements */
  seed?: number;
  /** reach trials per kind (one site; 2-5 random elements) */
  trials?: number;
  /** elements timed by remove-and-walk to estimate the baseline */
  baselineSample?: number;
  /** also time networkx's immediate_dominators on the same graphs (needs python3 with networkx) */
  networkx?: boolean;
  /** time the resilience planner too (proposals, critical pairs); default true */
  planner?: boolean;
}

export interface EngineBenchResult extends Partial<PlannerBenchResult> {
  sites: number;
  carriages: number;
  feeds: number;
  elements: number;
  nodes: number;
  edges: number;
  /** NetworkEngine.build from the document, everything precomputed */
  buildMs: number;
  /** process CPU time of the build (all threads, GC helpers included): less sensitive to other load than buildMs */
  buildCpuMs: number;
  buildBreakdownMs: Record<string, number>;
  /** reach of one random site */
  reachOneP50Ms: number;
  reachOneP95Ms: number;
  /** reach of 2-5 random elements (sites, feeds, groups drawn alike) */
  reachMultiP50Ms: number;
  reachMultiP95Ms: number;
  /** reach of one random carriage (one transmitter) */
  reachCarriageP95Ms: number;
  /** reach of 2-5 random sites (each site has nodes in most service graphs) */
  reachMultiSitesP95Ms: number;
  /** plain typed-array BFS of every service graph with the same failed elements removed */
  walkFloorMs: number;
  walkFloorP95Ms: number;
  /** reachMultiP95Ms / walkFloorP95Ms */
  reachMultiToFloorP95: number;
  /** single points of failure of every fed carriage and exposure of every element (carriages included) */
  spofAllMs: number;
  spofAllCpuMs: number;
  /** remove-and-walk of a timed sample of elements, scaled to every element (an estimate) */
  baselineSpofAllMsEstimate: number;
  baselineSampleSize: number;
  /** our immediate dominators over every service's full graph */
  idomMs: number;
  /** networkx immediate_dominators over the same graphs; null without networkx */
  networkxIdomMs: number | null;
  /** 1-minute load average before and after (other work on the machine inflates every time above) */
  loadAverage: [number, number];
}

export function percentile(values: number[], p: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))];
}

export const round = (ms: number) => Math.round(ms * 1000) / 1000;

export function benchEngine(doc: NetworkDocument, opts: EngineBenchOptions = {}): EngineBenchResult {
  const trials = opts.trials ?? 200;
  const sampleSize = opts.baselineSample ?? 200;
  const rnd = prng(opts.seed ?? 1);
  const loadBefore = os.loadavg()[0];

  const cpu = () => {
    const u = process.cpuUsage();
    return (u.user + u.system) / 1000;
  };
  let c = cpu();
  let t = performance.now();
  const engine = NetworkEngine.build(doc, 1);
  const buildMs = performance.now() - t;
  const buildCpuMs = cpu() - c;
  const allElements = engine.elements();
  // Failure sets are drawn from sites, feeds and groups as before carriages could fail, so runs stay comparable.
  const elements = allElements.filter((e) => e.kind !== 'carriage');
  const carriages = allElements.filter((e) => e.kind === 'carriage');
  const sites = elements.filter((e) => e.kind === 'site');
  if (sites.length === 0) throw new Error('the network has no sites to fail');
  const anyElement = () => elements[Math.floor(rnd() * elements.length)];
  const timed = (f: () => unknown) => {
    const s = performance.now();
    f();
    return performance.now() - s;
  };

  // Warm the JIT on the paths being timed, then time.
  for (let i = 0; i < 20; i++) {
    engine.reach([sites[Math.floor(rnd() * sites.length)]]);
    walkFloor(engine, [anyElement(), anyElement()]);
  }
  const one = Array.from({ length: trials }, () => {
    const failed = [sites[Math.floor(rnd() * sites.length)]];
    return timed(() => engine.reach(failed));
  });
  const multi: number[] = [];
  const floor: number[] = [];
  for (let i = 0; i < trials; i++) {
    const failed: Element[] = Array.from({ length: 2 + Math.floor(rnd() * 4) }, anyElement);
    multi.push(timed(() => engine.reach(failed)));
    floor.push(timed(() => walkFloor(engine, failed)));
  }

  const oneCarriage = carriages.length === 0 ? [0] : Array.from({ length: trials }, () => {
    const failed = [carriages[Math.floor(rnd() * carriages.length)]];
    return timed(() => engine.reach(failed));
  });

  const multiSites = Array.from({ length: trials }, () => {
    const failed = Array.from({ length: 2 + Math.floor(rnd() * 4) }, () => sites[Math.floor(rnd() * sites.length)]);
    return timed(() => engine.reach(failed));
  });

  c = cpu();
  const spofAllMs = recomputeResilience(engine).ms;
  const spofAllCpuMs = cpu() - c;
  const sample = Array.from({ length: sampleSize }, () => allElements[Math.floor(rnd() * allElements.length)]);
  const baselineMs = timed(() => baselineExposure(engine, sample));

  const graphs = flowGraphs(engine);
  t = performance.now();
  for (const g of graphs) immediateDominators(g.graph, 0);
  const idomMs = performance.now() - t;
  const networkxIdomMs = opts.networkx === false ? null : timeNetworkxDominators(graphs.map((g) => ({ graph: g.graph, root: 0 })));

  const planner = opts.planner === false ? {} : benchPlanner(engine);
  const counts = engine.counts;
  const { totalMs: _total, ...breakdown } = engine.timings;
  return {
    ...planner,
    sites: counts.sites,
    carriages: counts.carriages,
    feeds: counts.feeds,
    elements: allElements.length,
    nodes: counts.nodes,
    edges: counts.edges,
    buildMs: round(buildMs),
    buildCpuMs: round(buildCpuMs),
    buildBreakdownMs: Object.fromEntries(Object.entries(breakdown).map(([k, v]) => [k, round(v)])),
    reachOneP50Ms: round(percentile(one, 50)),
    reachOneP95Ms: round(percentile(one, 95)),
    reachMultiP50Ms: round(percentile(multi, 50)),
    reachMultiP95Ms: round(percentile(multi, 95)),
    reachMultiSitesP95Ms: round(percentile(multiSites, 95)),
    reachCarriageP95Ms: round(percentile(oneCarriage, 95)),
    walkFloorMs: round(percentile(floor, 50)),
    walkFloorP95Ms: round(percentile(floor, 95)),
    reachMultiToFloorP95: round(percentile(multi, 95) / percentile(floor, 95)),
    spofAllMs: round(spofAllMs),
    spofAllCpuMs: round(spofAllCpuMs),
    baselineSpofAllMsEstimate: round((baselineMs / sampleSize) * allElements.length),
    baselineSampleSize: sampleSize,
    idomMs: round(idomMs),
    networkxIdomMs: networkxIdomMs === null ? null : round(networkxIdomMs),
    loadAverage: [round(loadBefore), round(os.loadavg()[0])],
  };
}

/** The project's seeded generator when it is there, else the test helper's. */
async function generate(sites: number, seed: number): Promise<{ doc: NetworkDocument; generator: string }> {
  const shared = path.join(__dirname, 'generator', 'index.ts');
  if (fs.existsSync(shared)) {
    const mod = (await import('./generator/index')) as { generateNetwork?: (o: { sites: number; seed: number }) => NetworkDocument };
    if (typeof mod.generateNetwork === 'function') return { doc: mod.generateNetwork({ sites, seed }), generator: 'scripts/generator' };
  }
  return { doc: nationalNetwork({ sites, seed }), generator: 'test/helpers/random-network' };
}


async function main() {
  const sites = wholeArgument('sites', 20000);
  const seed = wholeArgument('seed', 1);
  const helper = process.argv.includes('--helper-generator');
  const generated = helper ? { doc: nationalNetwork({ sites, seed }), generator: 'test/helpers/random-network' } : await generate(sites, seed);
  const generator = generated.generator;
  // The server builds from a document read from PostgreSQL; a JSON round trip gives the same
  // flat strings (a generator's template strings are concatenation trees, slower to hash once).
  const doc = JSON.parse(JSON.stringify(generated.doc)) as NetworkDocument;
  const result = benchEngine(doc, { seed, networkx: !process.argv.includes('--no-networkx'), planner: !process.argv.includes('--no-planner') });
  console.log(JSON.stringify({ generator, services: doc.services.length, ...result }, null, 2));
}

if (require.main === module) {
  main().catch((e: unknown) => {
    console.error(e instanceof Error ? e.message : e);
    process.exit(1);
  });
}

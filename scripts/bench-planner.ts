/**
 * Timing of the resilience planner on one engine (called by bench-engine.ts):
 * proposals for one carriage (p50 and p95 over a sample of gap carriages),
 * the best 100 proposals over the network, and the exact top 100 critical
 * pairs of sites and groups. Every number is measured in this run.
 */
import type { NetworkEngine } from '@/server/engine/engine';

export interface PlannerBenchResult {
  gapCarriages: number;
  /** median time of `proposals({ carriage })` over the sampled gap carriages */
  proposalsOneMs: number;
  proposalsOneP95Ms: number;
  proposalsOneSample: number;
  /** the best 100 proposals over the network (each gap carriage's best, ranked) */
  proposalsTop100Ms: number;
  /** exact top 100 critical pairs over sites and groups (the whole ranking is computed) */
  pairsTop100Ms: number | null;
  pairsFound: number | null;
}

const round = (ms: number) => Math.round(ms * 1000) / 1000;
const at = (sorted: number[], p: number) => sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))] ?? 0;

export function benchPlanner(engine: NetworkEngine, opts: { sample?: number; pairs?: boolean } = {}): PlannerBenchResult {
  const gaps = engine.diversity().carriages.map((c) => c.carriage);
  const step = Math.max(1, Math.floor(gaps.length / (opts.sample ?? 50)));
  const sample = gaps.filter((_, i) => i % step === 0);
  const one: number[] = [];
  for (const carriage of sample) {
    const t = performance.now();
    engine.proposals({ carriage });
    one.push(performance.now() - t);
  }
  one.sort((a, b) => a - b);
  let t = performance.now();
  engine.proposals({ limit: 100 });
  const proposalsTop100Ms = performance.now() - t;
  let pairsTop100Ms: number | null = null;
  let pairsFound: number | null = null;
  if (opts.pairs !== false) {
    t = performance.now();
    const job = engine.pairsJob(['site', 'group']);
    job.step(Number.POSITIVE_INFINITY);
    engine.pairsAnswer(job.result(), 100);
    pairsTop100Ms = performance.now() - t;
    pairsFound = job.result().length;
  }
  return {
    gapCarriages: gaps.length,
    proposalsOneMs: round(at(one, 50)),
    proposalsOneP95Ms: round(at(one, 95)),
    proposalsOneSample: one.length,
    proposalsTop100Ms: round(proposalsTop100Ms),
    pairsTop100Ms: pairsTop100Ms === null ? null : round(pairsTop100Ms),
    pairsFound,
  };
}

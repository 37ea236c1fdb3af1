/**
 * Timing of planned-work clash detection (rule 10) alone, no database: 500
 * planned works spread over a year on a generated network. Called by the main
 * benchmark for each size; run directly for one network:
 *
 *   npx tsx scripts/bench-operations.ts --sites 20000 --seed 7 [--works 500] [--out FILE]
 *
 * - whole set: every clash among the works with an empty reach cache (sort
 *   windows, sweep, reach per work once, union reach only for overlapping
 *   pairs that share a service graph);
 * - one work: the clashes of one work against the other 499: with its own
 *   sets computed afresh and the others' kept (a work just drafted or edited,
 *   the usual case), with everything afresh (the first request after a
 *   network edit replaced the model), and with everything kept.
 */
import fs from 'node:fs';
import type { NetworkDocument } from '@/shared/schemas/network';
import type { Element } from '@/shared/schemas/analysis';
import { buildServedNetwork } from '@/server/services/servedNetwork';
import { OperationsReachCache } from '@/server/operations/reach';
import { allClashes, clashesWith, overlaps, type Spell } from '@/server/operations/clashes';
import { Prng } from './generator/prng';
import { generateNetwork } from './generator';
import { percentile, round } from './bench-engine';

export interface OperationsBenchResult {
  works: number;
  overlappingPairs: number;
  clashingPairs: number;
  wholeSetMs: number;
  oneWorkColdP50Ms: number;
  oneWorkColdP95Ms: number;
  /** the work's own sets computed afresh, the others' kept (a work just drafted or edited) */
  oneWorkOwnColdP50Ms: number;
  oneWorkOwnColdP95Ms: number;
  oneWorkWarmP95Ms: number;
}

const HOUR = 3_600_000;

/** 500 works over a year: windows of 2 hours to 5 days; 1-3 elements, many of them feeds of main stations and their sites, where works pile up. */
export function randomWorks(doc: NetworkDocument, count: number, seed: number): Spell[] {
  const rnd = new Prng(seed);
  const pick = <T>(l: readonly T[]) => l[Math.floor(rnd.next() * l.length)];
  const siteRole = new Map(doc.sites.map((s) => [s.code, s.role]));
  const carriageSite = new Map(doc.carriages.map((c) => [c.code, c.site]));
  const mainFeeds = doc.feeds.filter((f) => siteRole.get(carriageSite.get(f.to)!) === 'main');
  const mains = doc.sites.filter((s) => s.role === 'main');
  const element = (): Element => {
    const r = rnd.next();
    if (r < 0.45 && mainFeeds.length) return { kind: 'feed', code: pick(mainFeeds).code };
    if (r < 0.6 && mains.length) return { kind: 'site', code: pick(mains).code };
    if (r < 0.85) return { kind: 'site', code: pick(doc.sites).code };
    if (r < 0.95 || doc.groups.length === 0) return { kind: 'feed', code: pick(doc.feeds).code };
    return { kind: 'group', code: pick(doc.groups).code };
  };
  const year = Date.UTC(2027, 0, 1);
  return Array.from({ length: count }, (_, i) => {
    const start = year + Math.floor(rnd.next() * 365 * 24) * HOUR;
    const hours = 2 + Math.floor(rnd.next() * 118);
    const n = 1 + Math.floor(rnd.next() * 3);
    return { code: `W-${String(i + 1).padStart(4, '0')}`, kind: 'work', state: 'approved', start, end: start + hours * HOUR, elements: Array.from({ length: n }, element) };
  });
}

export function benchOperations(doc: NetworkDocument, opts: { seed?: number; works?: number } = {}): OperationsBenchResult {
  const seed = opts.seed ?? 7;
  const model = buildServedNetwork(doc, 1);
  const works = randomWorks(doc, opts.works ?? 500, seed);
  let overlappingPairs = 0;
  for (let i = 0; i < works.length; i++) for (let j = i + 1; j < works.length; j++) if (overlaps(works[i], works[j])) overlappingPairs++;

  // Warm the JIT on a throwaway cache first, so the timings are of steady code.
  allClashes(new OperationsReachCache(model), works.slice(0, 50));

  let t = performance.now();
  const all = allClashes(new OperationsReachCache(model), works);
  const wholeSetMs = performance.now() - t;
  let clashing = 0;
  for (const l of all.values()) clashing += l.length;

  const cold: number[] = [];
  const ownCold: number[] = [];
  const warm: number[] = [];
  const shared = new OperationsReachCache(model);
  allClashes(shared, works);
  for (const w of works) {
    const cache = new OperationsReachCache(model);
    t = performance.now();
    clashesWith(cache, w, works);
    cold.push(performance.now() - t);
    shared.forget(w.elements);
    t = performance.now();
    clashesWith(shared, w, works);
    ownCold.push(performance.now() - t);
    t = performance.now();
    clashesWith(shared, w, works);
    warm.push(performance.now() - t);
  }
  return {
    works: works.length,
    overlappingPairs,
    clashingPairs: clashing / 2,
    wholeSetMs: round(wholeSetMs),
    oneWorkColdP50Ms: round(percentile(cold, 50)),
    oneWorkColdP95Ms: round(percentile(cold, 95)),
    oneWorkOwnColdP50Ms: round(percentile(ownCold, 50)),
    oneWorkOwnColdP95Ms: round(percentile(ownCold, 95)),
    oneWorkWarmP95Ms: round(percentile(warm, 95)),
  };
}

export function describeOperations(r: OperationsBenchResult): string {
  return [
    `  clashes: ${r.works} works over a year, ${r.overlappingPairs} overlapping pairs, ${r.clashingPairs} clashing`,
    `  clashes: whole set ${r.wholeSetMs} ms (target <= 5000 ms)`,
    `  clashes of one work (target p95 <= 50 ms): just drafted or edited (its own reach afresh, the others' kept) p50 ${r.oneWorkOwnColdP50Ms} ms, p95 ${r.oneWorkOwnColdP95Ms} ms;`,
    `    everything afresh (first request after a network change) p50 ${r.oneWorkColdP50Ms} ms, p95 ${r.oneWorkColdP95Ms} ms; all kept p95 ${r.oneWorkWarmP95Ms} ms`,
  ].join('\n');
}

if (process.argv[1] && /bench-operations\.ts$/.test(process.argv[1])) {
  const arg = (name: string) => {
    const i = process.argv.indexOf(`--${name}`);
    return i >= 0 ? process.argv[i + 1] : undefined;
  };
  const sites = Number(arg('sites') ?? 20000);
  const seed = Number(arg('seed') ?? 7);
  const worksCount = Number(arg('works') ?? 500);
  let t = performance.now();
  const doc = generateNetwork({ sites, seed });
  const genMs = performance.now() - t;
  t = performance.now();
  const r = benchOperations(doc, { seed, works: worksCount });
  const lines = [
    `clash detection benchmark, ${new Date().toISOString()}, node ${process.version}`,
    `network: ${sites.toLocaleString('en')} generated sites (seed ${seed}), ${doc.carriages.length.toLocaleString('en')} carriages, ${doc.feeds.length.toLocaleString('en')} feeds; generated in ${(genMs / 1000).toFixed(1)} s`,
    describeOperations(r),
    `whole run ${((performance.now() - t) / 1000).toFixed(1)} s`,
  ].join('\n');
  console.log(lines);
  const out = arg('out');
  if (out) {
    fs.writeFileSync(out, lines + '\n' + JSON.stringify({ sites, seed, ...r }, null, 2) + '\n');
    console.log(`wrote ${out}`);
  }
}

/**
 * The longest event-loop stall of the network-wide proposals ("the best 100
 * over the network") on a generated network: worked out in one go (what the
 * route did before the ranking became a job) and in slices as the server
 * runs it now (server/services/planner.ts), each on a fresh engine of the
 * same document, with the diversity gaps worked out beforehand (they are
 * shared with the diversity list and timed on their own). Checks that both
 * give the same rows. Measured with perf_hooks.monitorEventLoopDelay.
 *
 *   npx tsx scripts/bench-planner-stall.ts --sites 20000 [--seed 1] [--limit 100]
 */
import { monitorEventLoopDelay } from 'node:perf_hooks';
import { isDeepStrictEqual } from 'node:util';
import { generateNetwork } from './generator';
import { NetworkEngine } from '@/server/engine/engine';
import { proposalsWhenDone } from '@/server/services/planner';
import { wholeArgument } from './lib/args';


const tick = () => new Promise<void>((resolve) => setImmediate(resolve));
const ms = (ns: number) => Math.round(ns / 1e4) / 100;

/** Runs `work` with the event-loop delay monitored: its longest stall and its wall time, ms. */
async function stallOf<T>(work: () => Promise<T> | T): Promise<{ value: T; maxStallMs: number; p99StallMs: number; wallMs: number }> {
  const h = monitorEventLoopDelay({ resolution: 1 });
  h.enable();
  await tick();
  const started = performance.now();
  const value = await new Promise<T>((resolve, reject) => setImmediate(() => Promise.resolve().then(work).then(resolve, reject)));
  const wallMs = performance.now() - started;
  await tick();
  h.disable();
  return { value, maxStallMs: ms(h.max), p99StallMs: ms(h.percentile(99)), wallMs: Math.round(wallMs) };
}

async function main() {
  const sites = wholeArgument('sites', 20000);
  const seed = wholeArgument('seed', 1);
  const limit = wholeArgument('limit', 100);
  const doc = generateNetwork({ sites, seed });
  const fresh = () => NetworkEngine.build(doc, 1);

  const before = fresh();
  const gaps = await stallOf(() => before.diversity().carriages.length);
  const oneGo = await stallOf(() => before.proposals({ limit }).proposals);

  const after = fresh();
  after.diversity();
  const sliced = await stallOf(async () => {
    const s = await proposalsWhenDone(after, limit);
    if (s.state !== 'done') throw new Error(`the ranking ended ${s.state}`);
    return s.answer.proposals;
  });

  const out = {
    sites,
    seed,
    limit,
    gapCarriages: gaps.value,
    diversityGapsStallMs: gaps.maxStallMs,
    oneGo: { maxStallMs: oneGo.maxStallMs, wallMs: oneGo.wallMs },
    inSlices: { maxStallMs: sliced.maxStallMs, p99StallMs: sliced.p99StallMs, wallMs: sliced.wallMs },
    sameRows: isDeepStrictEqual(oneGo.value, sliced.value),
    rows: sliced.value.length,
  };
  console.log(JSON.stringify(out, null, 2));
  if (!out.sameRows) process.exitCode = 1;
}

void main();

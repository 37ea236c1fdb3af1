/**
 * A plan: new reserve feeds picked one by one for a budget of k feeds
 * (greedy). Each pick is the best proposal over the network (proposals.ts) on
 * the network with the earlier picks already added, so a later pick never
 * counts protection an earlier one already gave. Greedy is not optimal in
 * general (choosing k feeds to maximise protection is a coverage problem);
 * it is the usual first answer and each step is exact.
 *
 * The result carries the sandbox: the network document with the picks
 * added and its engine. Nothing is stored.
 */
import type { Feed, NetworkDocument } from '@/shared/schemas/network';
import { MAX_BUDGET, type Proposal } from '@/shared/schemas/analysis';
import { patchList } from './codeOrder';
import { NetworkEngine } from './engine';

export const MAX_PLAN_BUDGET = MAX_BUDGET;
/** the longest piece of work between two yields, ms */
export const PLAN_SLICE_MS = 25;

export interface PlanPick extends Proposal {
  /** the code the new feed gets in the sandbox and when created for real */
  feed: string;
}

export interface GreedyPlan {
  picks: PlanPick[];
  feeds: Feed[];
  doc: NetworkDocument;
  sandbox: NetworkEngine;
}

/** A feed code not used yet: the receiving carriage's code with a reserve number. */
function freshCode(taken: Set<string>, carriage: string): string {
  for (let n = 1; ; n++) {
    const code = `${carriage.slice(0, 56)}-RSV${n}`;
    if (!taken.has(code)) return code;
  }
}

/**
 * Picks up to `budget` feeds. `yieldNow` runs between slices of the work (a
 * server passes an event-loop yield); `current` is the engine of `doc` when the
 * caller already has it.
 */
export async function greedyPlan(doc: NetworkDocument, networkVersion: number, budget: number, current?: NetworkEngine, yieldNow: () => Promise<void> = async () => {}): Promise<GreedyPlan> {
  if (!Number.isInteger(budget) || budget < 1 || budget > MAX_PLAN_BUDGET) throw new RangeError(`budget is a whole number of feeds from 1 to ${MAX_PLAN_BUDGET} (got ${String(budget)})`);
  let engine = current ?? NetworkEngine.build(doc, networkVersion);
  let sandboxDoc = doc;
  const taken = new Set(doc.feeds.map((f) => f.code.trim()));
  const picks: PlanPick[] = [];
  const feeds: Feed[] = [];
  for (let i = 0; i < budget; i++) {
    // The weak points, the gaps and the network ranking are seconds of work at national scale: worked in slices with a yield between them.
    while (!engine.prepare('diversity', performance.now() + PLAN_SLICE_MS)) await yieldNow();
    const job = engine.proposalsJob(1);
    while (!job.step(performance.now() + PLAN_SLICE_MS)) await yieldNow();
    const best = engine.proposals({ limit: 1 }).proposals[0];
    if (!best) break;
    const code = freshCode(taken, best.carriage);
    taken.add(code);
    const feed: Feed = { code, from: best.from, to: best.carriage, medium: best.medium, role: 'reserve' };
    feeds.push(feed);
    picks.push({ ...best, feed: code });
    sandboxDoc = { ...sandboxDoc, feeds: patchList(sandboxDoc.feeds, [], [feed]) };
    await yieldNow();
    // Only the service graph the new feed joins is rebuilt (the incremental update; a full build when it cannot).
    engine = NetworkEngine.update(engine, sandboxDoc, networkVersion, { feeds: [code] });
  }
  return { picks, feeds, doc: sandboxDoc, sandbox: engine };
}

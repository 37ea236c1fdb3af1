/**
 * The resilience planner's state in one server process: critical-pair jobs
 * run in steps between other requests, and plans held as sandboxes for a
 * while. Both belong to one network version: a new version starts afresh.
 *
 * - Pairs: one job per (engine, kinds), stepped for PAIRS_SLICE_MS at a time
 *   with setImmediate in between, so other requests keep being answered;
 *   the result is kept with the engine (a WeakMap: it goes when the engine
 *   does).
 * - Proposals over the network: the same, one job per (engine, limit); the
 *   first slice runs in the request itself, so a small network answers at
 *   once. The engine keeps the finished ranking (`holdsProposals`), which
 *   then answers every smaller limit too. A job is asked for at least
 *   PROPOSALS_LIMIT_FLOOR rows, so the screen's short list and a longer
 *   ask share one.
 * - Plans: the greedy picks, the sandbox document and its engine, by id, for
 *   PLAN_TTL_MS; at most MAX_PLANS (the oldest goes first).
 */
import crypto from 'node:crypto';
import type { ElementKind } from '@/shared/schemas/network';
import type { PlanAnswer } from '@/shared/schemas/analysis';
import type { NetworkEngine } from '../engine/engine';
import { prepared } from './prepared';
import type { PairsJob, PairRow } from '../engine/pairs';
import type { BestProposalsJob } from '../engine/proposals-ranking';
import type { ProposalsAnswer } from '@/shared/schemas/analysis';
import { greedyPlan, type GreedyPlan } from '../engine/plan';
import type { ServedNetwork } from './servedNetwork';

export const PAIRS_SLICE_MS = 25;
export const PLAN_TTL_MS = 30 * 60_000;
export const MAX_PLANS = 5;
const EXPOSURE_SHOWN = 10;

/** A job that works in steps until a deadline (pairs.ts, proposals-ranking.ts). */
interface SteppedJob {
  readonly done: number;
  readonly total: number;
  step(deadlineMs: number): boolean;
}

interface JobEntry<J extends SteppedJob> {
  job: J;
  finished: boolean;
  error: unknown;
  startedAt: number;
  finishedMs: number | null;
}

const yieldNow = () => new Promise<void>((resolve) => setImmediate(resolve));

/**
 * Steps `job` PAIRS_SLICE_MS at a time with a yield to the event loop in
 * between, after a first slice right now when `firstSliceNow` (in the
 * caller's request).
 */
function runInSlices<J extends SteppedJob>(job: J, what: string, firstSliceNow: boolean): JobEntry<J> {
  const e: JobEntry<J> = { job, finished: false, error: null, startedAt: performance.now(), finishedMs: null };
  const finish = () => {
    e.finished = true;
    e.finishedMs = performance.now() - e.startedAt;
  };
  const fail = (err: unknown) => {
    e.error = err;
    console.error(`[planner] ${what} failed`, err);
  };
  try {
    if (firstSliceNow && job.step(performance.now() + PAIRS_SLICE_MS)) {
      finish();
      return e;
    }
  } catch (err) {
    fail(err);
    return e;
  }
  void (async () => {
    try {
      for (;;) {
        await yieldNow();
        if (job.step(performance.now() + PAIRS_SLICE_MS)) break;
      }
      finish();
    } catch (err) {
      fail(err);
    }
  })();
  return e;
}

type PairsEntry = JobEntry<PairsJob>;
const pairsByEngine = new WeakMap<NetworkEngine, Map<string, PairsEntry>>();

export type PairsState = { state: 'running'; done: number; total: number } | { state: 'done'; rows: PairRow[]; ms: number } | { state: 'failed'; error: unknown };

/** Starts the job if needed and reports where it is. */
export function pairsState(engine: NetworkEngine, kinds: readonly ElementKind[]): PairsState {
  const key = [...new Set(kinds)].sort().join(',');
  let jobs = pairsByEngine.get(engine);
  if (!jobs) pairsByEngine.set(engine, (jobs = new Map()));
  let entry = jobs.get(key);
  if (!entry) jobs.set(key, (entry = runInSlices(engine.pairsJob(key.split(',') as ElementKind[]), 'critical pairs', false)));
  if (entry.error) return { state: 'failed', error: entry.error };
  if (entry.finished) return { state: 'done', rows: entry.job.result(), ms: entry.finishedMs ?? 0 };
  return { state: 'running', done: entry.job.done, total: entry.job.total };
}

export const PROPOSALS_LIMIT_FLOOR = 100;
const proposalsByEngine = new WeakMap<NetworkEngine, Map<number, JobEntry<BestProposalsJob>>>();

export type ProposalsState = { state: 'running'; done: number; total: number } | { state: 'done'; answer: ProposalsAnswer } | { state: 'failed'; error: unknown };

/** The best `limit` proposals over the network: starts the ranking job if needed and reports where it is. */
export function proposalsState(engine: NetworkEngine, limit: number): ProposalsState {
  if (engine.holdsProposals(limit)) return { state: 'done', answer: engine.proposals({ limit }) };
  let jobs = proposalsByEngine.get(engine);
  if (!jobs) proposalsByEngine.set(engine, (jobs = new Map()));
  // a job asked for at least as many rows answers this ask too
  let entry = [...jobs.values()].find((j) => (j.job.limit ?? Number.POSITIVE_INFINITY) >= limit && !j.finished);
  if (!entry) {
    const asked = Math.max(limit, PROPOSALS_LIMIT_FLOOR);
    jobs.set(asked, (entry = runInSlices(engine.proposalsJob(asked), 'proposals ranking', true)));
  }
  if (entry.error) {
    jobs.delete(entry.job.limit ?? 0);
    return { state: 'failed', error: entry.error };
  }
  if (entry.finished) return { state: 'done', answer: engine.proposals({ limit }) };
  return { state: 'running', done: entry.job.done, total: entry.job.total };
}

/** Waits for the proposals ranking to finish (tests and scripts). */
export async function proposalsWhenDone(engine: NetworkEngine, limit: number): Promise<ProposalsState> {
  for (;;) {
    const s = proposalsState(engine, limit);
    if (s.state !== 'running') return s;
    await new Promise((resolve) => setTimeout(resolve, 5));
  }
}

/** Waits for a pairs job to finish (tests and scripts). */
export async function pairsWhenDone(engine: NetworkEngine, kinds: readonly ElementKind[]): Promise<PairsState> {
  for (;;) {
    const s = pairsState(engine, kinds);
    if (s.state !== 'running') return s;
    await new Promise((resolve) => setTimeout(resolve, 5));
  }
}

export interface StoredPlan {
  id: string;
  networkVersion: number;
  budget: number;
  plan: GreedyPlan;
  answer: PlanAnswer;
  expires: number;
}

const plans = new Map<string, StoredPlan>();

function sweep(now: number): void {
  for (const [id, p] of plans) if (p.expires <= now) plans.delete(id);
  while (plans.size >= MAX_PLANS) plans.delete(plans.keys().next().value!);
}

/** Makes a greedy plan on the current model and keeps it as a sandbox. */
export async function makePlan(model: ServedNetwork, budget: number): Promise<StoredPlan> {
  const plan = await greedyPlan(model.document, model.networkVersion, budget, model.engine, yieldNow);
  await prepared(model.engine, 'diversity');
  await prepared(plan.sandbox, 'diversity');
  const now = Date.now();
  sweep(now);
  const id = crypto.randomBytes(9).toString('base64url');
  const before = model.engine;
  const after = plan.sandbox;
  const answer: PlanAnswer = {
    id,
    networkVersion: model.networkVersion,
    budget,
    expiresAt: new Date(now + PLAN_TTL_MS).toISOString(),
    picks: plan.picks,
    householdsProtected: plan.picks.reduce((sum, p) => sum + p.householdsProtected, 0),
    gaps: { before: before.diversity().carriages.length, after: after.diversity().carriages.length },
    exposure: { before: before.exposure(EXPOSURE_SHOWN).elements, after: after.exposure(EXPOSURE_SHOWN).elements },
  };
  const stored: StoredPlan = { id, networkVersion: model.networkVersion, budget, plan, answer, expires: now + PLAN_TTL_MS };
  plans.set(id, stored);
  return stored;
}

export function findPlan(id: string): StoredPlan | undefined {
  const p = plans.get(id);
  if (p && p.expires <= Date.now()) {
    plans.delete(id);
    return undefined;
  }
  return p;
}

export function forgetPlan(id: string): void {
  plans.delete(id);
}

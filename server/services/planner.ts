/**
 * The resilience planner's state in one server process: critical-pair jobs
 * run in steps between other requests, and plans held as sandboxes for a
 * while. Both belong to one network version: a new version starts afresh.
 *
 * - Pairs: one job per (engine, kinds), stepped for PAIRS_SLICE_MS at a time
 *   with setImmediate in between, so other requests keep being answered;
 *   the result is kept with the engine (a WeakMap: it goes when the engine
 *   does).
 * - Plans: the greedy picks, the sandbox document and its engine, by id, for
 *   PLAN_TTL_MS; at most MAX_PLANS (the oldest goes first).
 */
import crypto from 'node:crypto';
import type { ElementKind } from '@/shared/schemas/network';
import type { PlanAnswer } from '@/shared/schemas/analysis';
import type { NetworkEngine } from '../engine/engine';
import type { PairsJob, PairRow } from '../engine/pairs';
import { greedyPlan, type GreedyPlan } from '../engine/plan';
import type { ServedNetwork } from './servedNetwork';

export const PAIRS_SLICE_MS = 25;
export const PLAN_TTL_MS = 30 * 60_000;
export const MAX_PLANS = 5;
const EXPOSURE_SHOWN = 10;

interface PairsEntry {
  job: PairsJob;
  rows: PairRow[] | null;
  error: unknown;
  startedAt: number;
  finishedMs: number | null;
}

const pairsByEngine = new WeakMap<NetworkEngine, Map<string, PairsEntry>>();
const yieldNow = () => new Promise<void>((resolve) => setImmediate(resolve));

export type PairsState = { state: 'running'; done: number; total: number } | { state: 'done'; rows: PairRow[]; ms: number } | { state: 'failed'; error: unknown };

/** Starts the job if needed and reports where it is. */
export function pairsState(engine: NetworkEngine, kinds: readonly ElementKind[]): PairsState {
  const key = [...new Set(kinds)].sort().join(',');
  let jobs = pairsByEngine.get(engine);
  if (!jobs) pairsByEngine.set(engine, (jobs = new Map()));
  let entry = jobs.get(key);
  if (!entry) {
    const e: PairsEntry = { job: engine.pairsJob(key.split(',') as ElementKind[]), rows: null, error: null, startedAt: performance.now(), finishedMs: null };
    jobs.set(key, (entry = e));
    void (async () => {
      try {
        while (!e.job.step(performance.now() + PAIRS_SLICE_MS)) await yieldNow();
        e.rows = e.job.result();
        e.finishedMs = performance.now() - e.startedAt;
      } catch (err) {
        e.error = err;
        console.error('[planner] critical pairs failed', err);
      }
    })();
  }
  if (entry.error) return { state: 'failed', error: entry.error };
  if (entry.rows) return { state: 'done', rows: entry.rows, ms: entry.finishedMs ?? 0 };
  return { state: 'running', done: entry.job.done, total: entry.job.total };
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

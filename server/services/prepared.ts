/**
 * The network-wide answers (weak points, exposure, diversity gaps) need work
 * that an engine does once per network version: seconds at 100,000 sites.
 * A request that needs it awaits `prepared`, which does that work in 25 ms
 * slices with a turn of the event loop between them, so the server keeps
 * answering (fault reach above all) while it runs. Requests that arrive
 * meanwhile share the same work.
 */
import { DEFAULT_WEAK_POINT_KINDS, type ElementKind } from '@/shared/schemas/network';
import type { NetworkEngine } from '../engine/engine';
import { nextTurn } from '../interchange/turns';

export const PREPARE_SLICE_MS = 25;

type Need = 'resilience' | 'diversity';
const inFlight = new WeakMap<NetworkEngine, Map<string, Promise<void>>>();

/** Runs `step` (work until a deadline; true when done) in `sliceMs` slices with a turn between them, once per engine and key. */
function inSlices(engine: NetworkEngine, key: string, step: (deadlineMs: number) => boolean, sliceMs: number): Promise<void> {
  let jobs = inFlight.get(engine);
  if (!jobs) inFlight.set(engine, (jobs = new Map()));
  const running = jobs.get(key);
  if (running) return running;
  const job = (async () => {
    try {
      while (!step(performance.now() + sliceMs)) await nextTurn();
    } finally {
      jobs.delete(key);
    }
  })();
  jobs.set(key, job);
  return job;
}

/** Resolves once `engine` holds what `need` asks for (at once when it already does). `sliceMs`: the work between two turns. */
export function prepared(engine: NetworkEngine, need: Need, sliceMs = PREPARE_SLICE_MS): Promise<void> {
  if (engine.holds(need)) return Promise.resolve();
  return inSlices(engine, need, (deadline) => engine.prepare(need, deadline), sliceMs);
}

const kindsKey = (kinds: readonly ElementKind[] | undefined) => [...new Set(kinds ?? DEFAULT_WEAK_POINT_KINDS)].sort().join(',');

/** The answers an engine keeps per set of element kinds, each worked out after the weak points. */
const KEPT = {
  /** the weak points of every carriage */
  spof: { holds: (e: NetworkEngine, k?: readonly ElementKind[]) => e.holdsSpof(k), prepare: (e: NetworkEngine, k: readonly ElementKind[] | undefined, d: number) => e.prepareSpof(k, d) },
  /** the whole exposure ranking */
  exposure: { holds: (e: NetworkEngine, k?: readonly ElementKind[]) => e.holdsExposure(k), prepare: (e: NetworkEngine, k: readonly ElementKind[] | undefined, d: number) => e.prepareExposure(k, d) },
  /** the grouped exposure ranking */
  groups: { holds: (e: NetworkEngine, k?: readonly ElementKind[]) => e.holdsExposureGroups(k), prepare: (e: NetworkEngine, k: readonly ElementKind[] | undefined, d: number) => e.prepareExposureGroups(k, d) },
};

/** Resolves once `engine` holds `answer` for `kinds` (default sites, feeds and groups), worked out in slices as `prepared`. */
export function preparedFor(engine: NetworkEngine, answer: keyof typeof KEPT, kinds: readonly ElementKind[] | undefined, sliceMs = PREPARE_SLICE_MS): Promise<void> {
  const { holds, prepare } = KEPT[answer];
  if (holds(engine, kinds)) return Promise.resolve();
  return inSlices(engine, `${answer}:${kindsKey(kinds)}`, (deadline) => prepare(engine, kinds, deadline), sliceMs);
}

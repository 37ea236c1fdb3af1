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

/** Resolves once `engine` holds the grouped exposure ranking of `kinds` (the weak points first). */
export function preparedExposureGroups(engine: NetworkEngine, kinds: readonly ElementKind[] | undefined, sliceMs = PREPARE_SLICE_MS): Promise<void> {
  if (engine.holdsExposureGroups(kinds)) return Promise.resolve();
  return inSlices(engine, `groups:${kindsKey(kinds)}`, (deadline) => engine.prepareExposureGroups(kinds, deadline), sliceMs);
}

/** Resolves once `engine` holds the weak points of `kinds` as an answer (the weak points first). */
export function preparedSpof(engine: NetworkEngine, kinds: readonly ElementKind[] | undefined, sliceMs = PREPARE_SLICE_MS): Promise<void> {
  if (engine.holdsSpof(kinds)) return Promise.resolve();
  return inSlices(engine, `spof:${kindsKey(kinds)}`, (deadline) => engine.prepareSpof(kinds, deadline), sliceMs);
}

/** Resolves once `engine` holds the whole exposure ranking of `kinds` (the weak points first). */
export function preparedExposure(engine: NetworkEngine, kinds: readonly ElementKind[] | undefined, sliceMs = PREPARE_SLICE_MS): Promise<void> {
  if (engine.holdsExposure(kinds)) return Promise.resolve();
  return inSlices(engine, `exposure:${kindsKey(kinds)}`, (deadline) => engine.prepareExposure(kinds, deadline), sliceMs);
}

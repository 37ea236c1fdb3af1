/**
 * The network-wide answers (weak points, exposure, diversity gaps) need work
 * that an engine does once per network version: seconds at 100,000 sites.
 * A request that needs it awaits `prepared`, which does that work in 25 ms
 * slices with a turn of the event loop between them, so the server keeps
 * answering (fault reach above all) while it runs. Requests that arrive
 * meanwhile share the same work.
 */
import type { NetworkEngine } from '../engine/engine';
import { nextTurn } from '../interchange/turns';

export const PREPARE_SLICE_MS = 25;

type Need = 'resilience' | 'diversity';
const inFlight = new WeakMap<NetworkEngine, Map<Need, Promise<void>>>();

/** Resolves once `engine` holds what `need` asks for (at once when it already does). `sliceMs`: the work between two turns. */
export function prepared(engine: NetworkEngine, need: Need, sliceMs = PREPARE_SLICE_MS): Promise<void> {
  if (engine.holds(need)) return Promise.resolve();
  let jobs = inFlight.get(engine);
  if (!jobs) inFlight.set(engine, (jobs = new Map()));
  const running = jobs.get(need);
  if (running) return running;
  const job = (async () => {
    try {
      while (!engine.prepare(need, performance.now() + sliceMs)) await nextTurn();
    } finally {
      jobs.delete(need);
    }
  })();
  jobs.set(need, job);
  return job;
}

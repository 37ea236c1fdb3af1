/**
 * The analysis engine itself (server/engine, plain TypeScript with no server
 * dependency), run in the browser on the offline copy. It is loaded with a
 * dynamic import so that its code is fetched only when the app first needs it
 * offline or warms it up, never on the first screen.
 *
 * The engine answers exactly as the server does: the same code, on the same
 * document, at the same network version.
 */
import type { Element } from '@/shared/schemas/analysis';
import { ApiError } from '@/src/api/client';
import type { ReachResult } from '@/src/api/queries/analysis';
import { recording } from '@/src/testHooks';
import type { OfflineCopy } from './copyStore';

type EngineModule = typeof import('@/server/engine/engine');
type Engine = ReturnType<EngineModule['NetworkEngine']['build']>;

/** What the browser benchmark reads (scripts/bench-browser-offline.ts); kept only when the page records (src/testHooks.ts). */
export interface OfflineEngineHook {
  /** the engine built from the stored copy, in this page (ms) */
  buildMs: number;
  sites: number;
  networkVersion: number;
  /** fault reach of one failure set on this engine, timed in the page (ms) */
  timeReach(failed: Element[]): number;
  /** the carriages that failure set takes off air on this engine, and their households (to check the engine the figures time) */
  offAir(failed: Element[]): { carriages: number; households: number };
}

declare global {
  interface Window {
    __headwaterOffline?: OfflineEngineHook;
  }
}

function recordEngine(engine: Engine, copy: OfflineCopy, buildMs: number) {
  window.__headwaterOffline = {
    buildMs,
    sites: copy.document.sites.length,
    networkVersion: copy.networkVersion,
    timeReach(failed) {
      const t0 = performance.now();
      engine.reach(failed);
      return performance.now() - t0;
    },
    offAir(failed) {
      const answer = engine.reach(failed);
      return { carriages: answer.lost.length, households: answer.households.lost };
    },
  };
}

/** Only the latest copy's engine is kept: a national network's engine is large. */
let built: { copy: OfflineCopy; engine: Promise<Engine> } | null = null;

/** The engine for this copy (the same stored object), built once (a build takes seconds at national scale). */
export function engineFor(copy: OfflineCopy): Promise<Engine> {
  if (built && built.copy === copy) return built.engine;
  const engine = import('@/server/engine/engine').then(({ NetworkEngine }) => {
    const t0 = performance.now();
    const e = NetworkEngine.build(copy.document, copy.networkVersion);
    if (recording()) recordEngine(e, copy, performance.now() - t0);
    return e;
  });
  built = { copy, engine };
  engine.catch(() => {
    if (built?.engine === engine) built = null;
  });
  return engine;
}

/** Fault reach from the copy, failing as the server would (404 naming the unknown elements). */
export async function localReach(copy: OfflineCopy, failed: readonly Element[]): Promise<ReachResult> {
  const engine = await engineFor(copy);
  try {
    return engine.reach([...failed]);
  } catch (e) {
    if (e instanceof Error && e.name === 'UnknownElementsError') {
      throw new ApiError(404, 'not-found', e.message, { unknown: (e as Error & { elements: Element[] }).elements });
    }
    throw e;
  }
}

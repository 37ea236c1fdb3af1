/**
 * WORKERS=N: the primary of node's cluster module keeps N server processes
 * running that share one listening port (the primary hands connections out
 * in turn). Each worker holds its own in-memory network model, kept current
 * by PostgreSQL notifications like any other server process; nothing is
 * shared between workers but the database.
 *
 * Workers start one after the other (the next once the previous listens), so
 * that start-up work (admin account, demo accounts) never races. A worker
 * that exits unasked is started again after the supervisor's back-off
 * (supervisor.ts restartDelay).
 */
import type { EventEmitter } from 'node:events';
import { howItExited, restartDelay, type RestartTiming } from './supervisor';

/** What the pool needs of a cluster worker (node:cluster's Worker has it). */
export interface WorkerLike extends EventEmitter {
  readonly process: { pid?: number };
  kill(signal?: string): void;
}

export interface WorkerPoolOptions extends RestartTiming {
  count: number;
  /** how long stop() waits for a worker after SIGTERM before SIGKILL (default 10 s) */
  killAfterMs?: number;
  /** cluster.fork, or a stand-in in tests */
  fork: () => WorkerLike;
  log?: (message: string) => void;
}

export interface WorkerPool {
  readonly running: number;
  readonly restarts: number;
  /** resolves when every worker has listened once */
  readonly ready: Promise<void>;
  stop(): Promise<void>;
}

/** How many workers WORKERS asks for: a whole number from 1 to 64, 1 when unset. */
export function workerCount(value: string | undefined): number {
  if (value === undefined || value.trim() === '') return 1;
  const n = Number(value);
  if (!Number.isInteger(n) || n < 1 || n > 64) throw new Error(`WORKERS must be a whole number from 1 to 64 (got "${value}")`);
  return n;
}

export function startWorkerPool(o: WorkerPoolOptions): WorkerPool {
  const log = o.log ?? ((m: string) => console.error(`[workers] ${m}`));
  const delayAfter = restartDelay(o);
  const live = new Set<WorkerLike>();
  const timers = new Set<NodeJS.Timeout>();
  let stopping = false;
  let restarts = 0;

  const start = (slot: number): Promise<void> =>
    new Promise((resolve) => {
      const startedAt = Date.now();
      const w = o.fork();
      live.add(w);
      w.once('listening', () => resolve());
      w.once('exit', (code: number | null, signal: string | null) => {
        live.delete(w);
        resolve();
        if (stopping) return;
        const upMs = Date.now() - startedAt;
        const delay = delayAfter(upMs);
        log(`worker ${slot} (pid ${w.process.pid}) ${howItExited(code, signal)} after ${(upMs / 1000).toFixed(1)} s; starting it again in ${(delay / 1000).toFixed(1)} s`);
        const t = setTimeout(() => {
          timers.delete(t);
          if (stopping) return;
          restarts += 1;
          void start(slot);
        }, delay) as unknown as NodeJS.Timeout;
        timers.add(t);
      });
    });

  const ready = (async () => {
    for (let slot = 1; slot <= o.count && !stopping; slot++) await start(slot);
  })();

  return {
    get running() {
      return live.size;
    },
    get restarts() {
      return restarts;
    },
    ready,
    async stop() {
      stopping = true;
      for (const t of timers) clearTimeout(t);
      timers.clear();
      // a worker that does not end on SIGTERM (stuck in a loop, say) is killed, so stopping always ends
      await Promise.all(
        [...live].map(
          (w) =>
            new Promise<void>((r) => {
              const kill = setTimeout(() => w.kill('SIGKILL'), o.killAfterMs ?? 10_000);
              w.once('exit', () => {
                clearTimeout(kill);
                r();
              });
              w.kill('SIGTERM');
            }),
        ),
      );
    },
  };
}

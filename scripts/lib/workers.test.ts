/**
 * The WORKERS=N pool (workers.ts) with stand-in workers: it starts N one
 * after the other, starts a crashed one again after a back-off, and stops
 * them all without restarting any.
 */
import { EventEmitter } from 'node:events';
import { describe, expect, it } from 'vitest';
import { startWorkerPool, workerCount, type WorkerLike } from './workers';

class FakeWorker extends EventEmitter implements WorkerLike {
  static pid = 100;
  readonly process = { pid: FakeWorker.pid++ };
  killed: string[] = [];
  kill(signal = 'SIGTERM') {
    this.killed.push(signal);
    setImmediate(() => this.emit('exit', null, signal));
  }
  listen() {
    setImmediate(() => this.emit('listening', { port: 8080 }));
  }
}

describe('WORKERS', () => {
  it('is 1 when unset and refuses anything but a whole number from 1 to 64', () => {
    expect(workerCount(undefined)).toBe(1);
    expect(workerCount('')).toBe(1);
    expect(workerCount('4')).toBe(4);
    for (const bad of ['0', '-1', '1.5', 'two', '65']) expect(() => workerCount(bad)).toThrow(/WORKERS must be a whole number/);
  });

  it('starts N workers one after the other, restarts a crashed one, and stops them all', async () => {
    const forked: FakeWorker[] = [];
    const logs: string[] = [];
    const pool = startWorkerPool({
      count: 3,
      minDelayMs: 5,
      maxDelayMs: 20,
      log: (m) => logs.push(m),
      fork: () => {
        const w = new FakeWorker();
        forked.push(w);
        w.listen();
        return w;
      },
    });
    // the second is forked only once the first listens
    expect(forked).toHaveLength(1);
    await pool.ready;
    expect(forked).toHaveLength(3);
    expect(pool.running).toBe(3);

    forked[1].emit('exit', 1, null);
    expect(pool.running).toBe(2);
    await new Promise((r) => setTimeout(r, 50));
    expect(forked).toHaveLength(4);
    expect(pool.running).toBe(3);
    expect(pool.restarts).toBe(1);
    expect(logs[0]).toMatch(/worker 2 \(pid \d+\) exited with code 1 .*starting it again in 0\.0 s/);

    await pool.stop();
    expect(pool.running).toBe(0);
    expect([forked[0], forked[2], forked[3]].every((w) => w.killed.includes('SIGTERM'))).toBe(true);
    await new Promise((r) => setTimeout(r, 30));
    expect(forked).toHaveLength(4);
  });

  it('kills a worker that does not end on SIGTERM, so stopping always ends', async () => {
    class StuckWorker extends FakeWorker {
      kill(signal = 'SIGTERM') {
        this.killed.push(signal);
        if (signal === 'SIGKILL') setImmediate(() => this.emit('exit', null, signal));
      }
    }
    const forked: StuckWorker[] = [];
    const pool = startWorkerPool({
      count: 2,
      killAfterMs: 20,
      log: () => undefined,
      fork: () => {
        const w = new StuckWorker();
        forked.push(w);
        w.listen();
        return w;
      },
    });
    await pool.ready;
    await pool.stop();
    expect(pool.running).toBe(0);
    for (const w of forked) expect(w.killed).toEqual(['SIGTERM', 'SIGKILL']);
  });
});

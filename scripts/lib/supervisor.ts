/**
 * Keeps one child process running: when it exits without being asked to
 * (a crash, running out of memory), the reason goes to the log and it is
 * started again after a back-off that doubles on each quick crash (from
 * `minDelayMs` to `maxDelayMs`) and starts over once the child has stayed up
 * for `stableAfterMs`. `stop()` sends SIGTERM, waits for the child (SIGKILL
 * after `killAfterMs`) and restarts nothing more. Used by `npm start`.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { Backoff } from '@/server/services/backoff';

export interface SuperviseOptions extends RestartTiming {
  command: string;
  args: string[];
  env?: NodeJS.ProcessEnv;
  cwd?: string;
  killAfterMs?: number;
  log?: (message: string) => void;
}

export interface Supervisor {
  /** how many times the child was started again after an exit */
  readonly restarts: number;
  /** the delays waited before each restart, in order */
  readonly delays: readonly number[];
  readonly child: ChildProcess | null;
  stop(): Promise<void>;
}

export interface RestartTiming {
  minDelayMs?: number;
  maxDelayMs?: number;
  stableAfterMs?: number;
}

/**
 * The wait before starting again a process that exited unasked after running
 * `upMs`: doubles on each quick crash (from minDelayMs to maxDelayMs) and
 * starts over once a process stayed up for stableAfterMs. Shared by the
 * supervisor and the WORKERS pool (workers.ts).
 */
export function restartDelay(o: RestartTiming): (upMs: number) => number {
  const backoff = new Backoff(o.minDelayMs ?? 1000, o.maxDelayMs ?? 30_000);
  const stableAfterMs = o.stableAfterMs ?? 60_000;
  return (upMs) => {
    if (upMs >= stableAfterMs) backoff.reset();
    return backoff.next();
  };
}

/** How a process ended, for the log: "was killed by SIGKILL" or "exited with code 1". */
export const howItExited = (code: number | null, signal: string | null) => (signal ? `was killed by ${signal}` : `exited with code ${code}`);

export function supervise(o: SuperviseOptions): Supervisor {
  const log = o.log ?? ((m: string) => console.error(`[supervisor] ${m}`));
  const delayAfter = restartDelay(o);
  const delays: number[] = [];
  let child: ChildProcess | null = null;
  let stopping = false;
  let timer: NodeJS.Timeout | null = null;
  let restarts = 0;

  const start = () => {
    const startedAt = Date.now();
    const tail: string[] = [];
    const c = spawn(o.command, o.args, { env: o.env ?? process.env, cwd: o.cwd, stdio: ['ignore', 'inherit', 'pipe'] });
    child = c;
    // pass the child's errors through, keeping the last lines as the reason for a crash
    c.stderr?.on('data', (d: Buffer) => {
      process.stderr.write(d);
      for (const line of d.toString().split('\n')) if (line.trim()) tail.push(line.trim());
      tail.splice(0, Math.max(0, tail.length - 3));
    });
    c.on('error', (e) => log(`could not start the server: ${e.message}`));
    c.on('exit', (code, signal) => {
      if (child === c) child = null;
      if (stopping) return;
      const upMs = Date.now() - startedAt;
      const delay = delayAfter(upMs);
      delays.push(delay);
      const reason = tail.length ? `; last words: ${tail.join(' | ')}` : '';
      log(`the server ${howItExited(code, signal)} after ${(upMs / 1000).toFixed(1)} s${reason}. Starting it again in ${(delay / 1000).toFixed(1)} s.`);
      timer = setTimeout(() => {
        timer = null;
        if (stopping) return;
        restarts += 1;
        start();
      }, delay) as unknown as NodeJS.Timeout;
    });
  };
  start();

  return {
    get restarts() {
      return restarts;
    },
    delays,
    get child() {
      return child;
    },
    async stop() {
      stopping = true;
      if (timer) clearTimeout(timer);
      if (child) await stopChild(child, o.killAfterMs ?? 10_000);
    },
  };
}

/** SIGTERM, then SIGKILL if the child has not exited after `killAfterMs`; resolves once it has exited. */
export async function stopChild(c: ChildProcess, killAfterMs: number) {
  if (c.exitCode !== null || c.signalCode !== null) return;
  const exited = new Promise<void>((r) => c.once('exit', () => r()));
  c.kill('SIGTERM');
  const kill = setTimeout(() => c.kill('SIGKILL'), killAfterMs);
  await exited;
  clearTimeout(kill);
}

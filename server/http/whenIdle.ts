/**
 * Runs background work once the server has had no request for a while: the
 * diagram's columns are made ahead of the first person to open the diagram,
 * but making them (seconds at 100,000 sites, in slices) should not share the
 * first busy seconds after a start with people's requests.
 */
import type { EventEmitter } from 'node:events';

/** Calls `run` once, after `idleMs` with no 'request' event on `server`; the answer stops the wait. */
export function whenIdle(server: EventEmitter, idleMs: number, run: () => unknown): () => void {
  let last = Date.now();
  const seen = () => {
    last = Date.now();
  };
  const stop = () => {
    clearInterval(timer);
    server.off('request', seen);
  };
  server.on('request', seen);
  const timer = setInterval(() => {
    if (Date.now() - last < idleMs) return;
    stop();
    void run();
  }, Math.max(50, Math.min(idleMs / 2, 500)));
  timer.unref?.();
  return stop;
}

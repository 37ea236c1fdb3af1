/**
 * Runs work that can wait (the service worker's registration, reading and
 * fetching the offline copy) after a delay, at the browser's next idle
 * moment, so that it does not share the machine with a screen's first load.
 */
export const QUIET_MS = 3_000;
export const IDLE_TIMEOUT_MS = 5_000;

/** Calls `run` after `delayMs`, when the browser is next idle (at most `idleTimeoutMs` later); the returned function cancels it. */
export function laterWhenIdle(run: () => void, delayMs: number, idleTimeoutMs: number): () => void {
  let idle: number | null = null;
  const timer = setTimeout(() => {
    if (typeof window !== 'undefined' && typeof window.requestIdleCallback === 'function') idle = window.requestIdleCallback(run, { timeout: idleTimeoutMs });
    else run();
  }, delayMs);
  return () => {
    clearTimeout(timer);
    if (idle !== null && typeof window.cancelIdleCallback === 'function') window.cancelIdleCallback(idle);
  };
}

/** Calls `run` once the page has loaded, QUIET_MS have passed and the browser is next idle; the returned function cancels it. */
export function whenSettled(run: () => void): () => void {
  let cancelLater: (() => void) | null = null;
  const onLoad = () => {
    cancelLater = laterWhenIdle(run, QUIET_MS, IDLE_TIMEOUT_MS);
  };
  if (document.readyState === 'complete') onLoad();
  else window.addEventListener('load', onLoad, { once: true });
  return () => {
    window.removeEventListener('load', onLoad);
    cancelLater?.();
  };
}

/**
 * Runs work that can wait (the service worker's registration, reading the
 * stored offline copy) once the page has loaded, QUIET_MS have passed and
 * the browser is next idle, so that it does not share the machine with a
 * screen's first load.
 */
export const QUIET_MS = 3_000;
export const IDLE_TIMEOUT_MS = 5_000;

/** Calls `run` once the page has loaded, QUIET_MS have passed and the browser is next idle; the returned function cancels it. */
export function whenSettled(run: () => void): () => void {
  let timer: ReturnType<typeof setTimeout> | null = null;
  let idle: number | null = null;
  let cancelled = false;
  const afterQuiet = () => {
    if (cancelled) return;
    if (typeof window.requestIdleCallback === 'function') idle = window.requestIdleCallback(run, { timeout: IDLE_TIMEOUT_MS });
    else run();
  };
  const onLoad = () => {
    if (!cancelled) timer = setTimeout(afterQuiet, QUIET_MS);
  };
  if (document.readyState === 'complete') onLoad();
  else window.addEventListener('load', onLoad, { once: true });
  return () => {
    cancelled = true;
    window.removeEventListener('load', onLoad);
    if (timer !== null) clearTimeout(timer);
    if (idle !== null && typeof window.cancelIdleCallback === 'function') window.cancelIdleCallback(idle);
  };
}

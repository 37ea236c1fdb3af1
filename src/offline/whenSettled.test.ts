/**
 * whenSettled waits for the page's load, then QUIET_MS, then the browser's
 * next idle moment, and can be cancelled at any of those steps. The page is a
 * small stand-in (a load event, an idle queue) under vitest's fake clock.
 */
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { IDLE_TIMEOUT_MS, laterWhenIdle, QUIET_MS, whenSettled } from './whenSettled';

interface FakePage {
  readyState: string;
  fireLoad(): void;
  idle: Map<number, { run: () => void; timeout?: number }>;
  runIdle(): void;
}

function fakePage({ readyState = 'loading', idleCallbacks = true } = {}): FakePage {
  const loads = new Set<() => void>();
  const idle = new Map<number, { run: () => void; timeout?: number }>();
  let next = 1;
  const page: FakePage = {
    readyState,
    fireLoad() {
      page.readyState = 'complete';
      for (const f of [...loads]) f();
      loads.clear();
    },
    idle,
    runIdle() {
      for (const [id, cb] of [...idle]) {
        idle.delete(id);
        cb.run();
      }
    },
  };
  vi.stubGlobal('document', {
    get readyState() {
      return page.readyState;
    },
  });
  vi.stubGlobal('window', {
    addEventListener: (type: string, f: () => void) => type === 'load' && loads.add(f),
    removeEventListener: (type: string, f: () => void) => type === 'load' && loads.delete(f),
    ...(idleCallbacks
      ? {
          requestIdleCallback: (run: () => void, opts?: { timeout?: number }) => {
            idle.set(next, { run, timeout: opts?.timeout });
            return next++;
          },
          cancelIdleCallback: (id: number) => idle.delete(id),
        }
      : {}),
  });
  return page;
}

describe('whenSettled', () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => {
    vi.useRealTimers();
    vi.unstubAllGlobals();
  });

  it('waits for the load, then QUIET_MS, then an idle moment', () => {
    const page = fakePage();
    const run = vi.fn();
    whenSettled(run);
    vi.advanceTimersByTime(QUIET_MS * 10);
    expect(run).not.toHaveBeenCalled(); // no load yet
    page.fireLoad();
    vi.advanceTimersByTime(QUIET_MS - 1);
    expect(page.idle.size).toBe(0);
    vi.advanceTimersByTime(1);
    expect(page.idle.size).toBe(1);
    expect([...page.idle.values()][0].timeout).toBe(IDLE_TIMEOUT_MS);
    expect(run).not.toHaveBeenCalled();
    page.runIdle();
    expect(run).toHaveBeenCalledTimes(1);
  });

  it('counts QUIET_MS from now when the page has already loaded', () => {
    const page = fakePage({ readyState: 'complete' });
    const run = vi.fn();
    whenSettled(run);
    vi.advanceTimersByTime(QUIET_MS);
    page.runIdle();
    expect(run).toHaveBeenCalledTimes(1);
  });

  it('runs after QUIET_MS where the browser has no idle callbacks', () => {
    const page = fakePage({ idleCallbacks: false });
    const run = vi.fn();
    whenSettled(run);
    page.fireLoad();
    vi.advanceTimersByTime(QUIET_MS - 1);
    expect(run).not.toHaveBeenCalled();
    vi.advanceTimersByTime(1);
    expect(run).toHaveBeenCalledTimes(1);
  });

  it('laterWhenIdle waits its own delay and asks for an idle moment with its own timeout (the copy refresh: 3 s, then at most 10 s)', () => {
    const page = fakePage({ readyState: 'complete' });
    const run = vi.fn();
    laterWhenIdle(run, 3_000, 10_000);
    vi.advanceTimersByTime(2_999);
    expect(page.idle.size).toBe(0);
    vi.advanceTimersByTime(1);
    expect([...page.idle.values()][0].timeout).toBe(10_000);
    page.runIdle();
    expect(run).toHaveBeenCalledTimes(1);
    const cancelled = vi.fn();
    laterWhenIdle(cancelled, 3_000, 10_000)();
    vi.advanceTimersByTime(10_000);
    page.runIdle();
    expect(cancelled).not.toHaveBeenCalled();
  });

  it.each(['before the load', 'during the wait after the load', 'while waiting for an idle moment'])('runs nothing when cancelled %s', (when) => {
    const page = fakePage();
    const run = vi.fn();
    const cancel = whenSettled(run);
    if (when !== 'before the load') page.fireLoad();
    if (when === 'while waiting for an idle moment') vi.advanceTimersByTime(QUIET_MS);
    cancel();
    page.fireLoad();
    vi.advanceTimersByTime(QUIET_MS * 10);
    page.runIdle();
    expect(run).not.toHaveBeenCalled();
    expect(page.idle.size).toBe(0);
  });
});

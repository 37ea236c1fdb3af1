import { EventEmitter } from 'node:events';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { whenIdle } from './whenIdle';

afterEach(() => vi.useRealTimers());

describe('work when the server is idle', () => {
  it('waits while requests keep coming, then runs once', () => {
    vi.useFakeTimers();
    const server = new EventEmitter();
    const run = vi.fn();
    whenIdle(server, 2_000, run);
    for (let i = 0; i < 10; i++) {
      vi.advanceTimersByTime(1_000);
      server.emit('request');
    }
    expect(run).not.toHaveBeenCalled();
    vi.advanceTimersByTime(2_600);
    expect(run).toHaveBeenCalledTimes(1);
    vi.advanceTimersByTime(10_000);
    server.emit('request');
    vi.advanceTimersByTime(10_000);
    expect(run).toHaveBeenCalledTimes(1);
    expect(server.listenerCount('request')).toBe(0);
  });

  it('stopped before the server fell idle, never runs', () => {
    vi.useFakeTimers();
    const server = new EventEmitter();
    const run = vi.fn();
    const stop = whenIdle(server, 1_000, run);
    vi.advanceTimersByTime(500);
    stop();
    vi.advanceTimersByTime(5_000);
    expect(run).not.toHaveBeenCalled();
    expect(server.listenerCount('request')).toBe(0);
  });
});

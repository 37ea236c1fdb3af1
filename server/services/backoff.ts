/**
 * Exponential back-off: each `next()` waits twice as long as the one before,
 * from `minMs` up to `maxMs`; `reset()` after a success starts again at `minMs`.
 * Used for reconnecting to PostgreSQL, retrying a rebuild and restarting a
 * crashed server process.
 */
export class Backoff {
  private delay: number;

  constructor(
    private readonly minMs: number,
    private readonly maxMs: number,
  ) {
    this.delay = minMs;
  }

  next(): number {
    const d = this.delay;
    this.delay = Math.min(this.maxMs, this.delay * 2);
    return d;
  }

  /** the delay the next `next()` returns, without taking it */
  peek(): number {
    return this.delay;
  }

  reset() {
    this.delay = this.minMs;
  }
}

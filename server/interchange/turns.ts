/**
 * When a long pass over a document should give the event loop back. Counting
 * entities alone is not enough: the same 2,000 entities take 10 ms on a quiet
 * machine and 200 ms on a loaded one, and what another request waits for is
 * wall time. So a pass asks `due()` as it goes (cheap: the clock is read
 * once every CHECK_EVERY calls) and pauses when its turn has lasted TURN_MS.
 */
const TURN_MS = 12;
const CHECK_EVERY = 64;

export class Turns {
  private calls = 0;
  private started = performance.now();

  /** `checkEvery`: calls between two looks at the clock (1 when each call is itself milliseconds of work). */
  constructor(
    private readonly turnMs = TURN_MS,
    private readonly checkEvery = CHECK_EVERY,
  ) {}

  /** True when this turn has lasted long enough; the next turn starts now. */
  due(): boolean {
    if (++this.calls % this.checkEvery !== 0) return false;
    const now = performance.now();
    if (now - this.started < this.turnMs) return false;
    this.started = now;
    return true;
  }

  /** Starts a new turn (after the caller paused for another reason). */
  restart(): void {
    this.started = performance.now();
  }
}

/** One turn of the event loop: timers and I/O that waited get their go. */
export const nextTurn = () => new Promise<void>((resolve) => setImmediate(resolve));

/**
 * Runs `steps` (a generator that pauses with a bare `yield`) to its end,
 * giving the event loop a turn whenever `turns` says one is due.
 */
export async function stepsInTurns<T>(steps: Generator<void, T, void>, turns = new Turns()): Promise<T> {
  for (;;) {
    const step = steps.next();
    if (step.done) return step.value;
    if (turns.due()) {
      await nextTurn();
      turns.restart();
    }
  }
}

/** A turn clock and its pause as one value, for code that may not import this file (it is bundled for the browser too). */
export function turnPacer(turns = new Turns()): { due(): boolean; pause(): Promise<void> } {
  return { due: () => turns.due(), pause: () => nextTurn().then(() => turns.restart()) };
}

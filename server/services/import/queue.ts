/**
 * Imports take turns, one at a time per process: each holds a whole network
 * document in memory while it is checked, so two side by side would double
 * the peak. A request waits for its turn in order of arrival; when
 * `maxWaiting` are already waiting, it is refused at once (the route answers
 * 429 with Retry-After) rather than holding its upload in memory for long.
 */
export class ImportQueue {
  private running = false;
  private readonly waiting: Array<() => void> = [];

  constructor(readonly maxWaiting = 4) {}

  /** How many imports are running or waiting now. */
  get load(): number {
    return (this.running ? 1 : 0) + this.waiting.length;
  }

  /** Resolves with a release function when it is this caller's turn; undefined when the queue is full. */
  enter(): Promise<() => void> | undefined {
    if (this.running && this.waiting.length >= this.maxWaiting) return undefined;
    let released = false;
    const release = () => {
      if (released) return;
      released = true;
      const next = this.waiting.shift();
      if (next) next();
      else this.running = false;
    };
    if (!this.running) {
      this.running = true;
      return Promise.resolve(release);
    }
    return new Promise((resolve) => this.waiting.push(() => resolve(release)));
  }
}

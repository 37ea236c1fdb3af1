/**
 * An import's write started before its checks are over. Once every entity
 * has passed its own check, the plan and the write can begin while the rules
 * between entities are still checked (server/interchange/validate.ts,
 * `onEntitiesChecked`): PostgreSQL writes on one core while the checks run
 * on the other, instead of one after the other. At 100,000 sites those rules
 * and the plan are several seconds of the import.
 *
 * Nothing changes for the user: it all runs inside the import's one
 * transaction, so a document the later checks refuse is rolled back as
 * before, its report carrying the checks' errors (never an error of the
 * write they made pointless); the write is stopped and waited for before the
 * transaction ends, so no statement of it outlives the transaction. Progress
 * of the write is held back until the checks are done, so the stages still
 * come one after the other (validating, then writing).
 */
import type { ImportProgress } from '@/shared/schemas/import';

export class OverlappedWrite<T> {
  private running: Promise<T> | null = null;
  private readonly stopper = new AbortController();
  /** checking: the write's progress is held; passed: passed on; stopped: dropped */
  private state: 'checking' | 'passed' | 'stopped' = 'checking';
  private held: ImportProgress | null = null;
  /** the import's own signal (the client gone) or this write stopped */
  readonly signal: AbortSignal;

  constructor(private readonly opts: { signal?: AbortSignal; onProgress?: (progress: ImportProgress) => void }) {
    this.signal = opts.signal ? AbortSignal.any([opts.signal, this.stopper.signal]) : this.stopper.signal;
  }

  /** The write's progress: passed on once the checks are done, the latest value held until then. */
  readonly progress = (progress: ImportProgress): void => {
    if (this.state === 'checking') this.held = progress;
    else if (this.state === 'passed') this.opts.onProgress?.(progress);
  };

  /** Starts the write (at most once); its failure is heard by `afterChecks`. */
  start(write: () => Promise<T>): void {
    if (this.running) return;
    this.running = write();
    // awaited in afterChecks or stop; until then a failure must not count as unhandled
    this.running.catch(() => {});
  }

  /**
   * The checks are over and passed: answers the write's outcome (starting it
   * now if it was not started early), its held progress passed on first.
   */
  async afterChecks(write: () => Promise<T>): Promise<T> {
    this.state = 'passed';
    if (this.held) this.opts.onProgress?.(this.held);
    this.start(write);
    return this.running as Promise<T>;
  }

  /** The checks failed (or were stopped): stops the write and waits until it has let go of the transaction. */
  async stop(): Promise<void> {
    this.state = 'stopped';
    this.stopper.abort(new Error('the import was refused before its write was done'));
    await this.running?.catch(() => {});
  }
}

/**
 * The best proposals over the network: each gap carriage's best proposal
 * (proposals.ts), ranked. Ranking by households protected needs only each
 * carriage's best, and a carriage can protect at most the households that
 * come back when all its weak points are removed (its bound). Carriages are
 * visited by falling bound; once `limit` proposals are held and the next
 * bound is below the households of the limit-th best, no carriage left can
 * enter the answer, so the search stops (the answer is the same as ranking
 * every carriage: test/unit/engine/proposals-fast.test.ts).
 *
 * At 20,000 sites this is seconds of work, so it is a job that works in
 * steps (`step(deadlineMs)`), as the critical pairs do (pairs.ts): a server
 * yields to other requests between steps. A step ends after the carriage in
 * hand once the deadline has passed; the answer does not depend on where the
 * steps fall. Progress counts carriages: each gap carriage once for its
 * bound, once more when visited; the job may finish before it visits them
 * all (the early stop), and then `done` jumps to `total`.
 */
import { compareProposals, gridOf, householdsOfWeak, proposalsFor, weakPoints, type ProposalContext, type ProposalRow } from './proposals';

const byRank = (a: ProposalRow, b: ProposalRow) => compareProposals(a, b) || (a.carriage < b.carriage ? -1 : a.carriage > b.carriage ? 1 : 0);

interface Visit {
  c: number;
  avoidable: readonly number[];
  bound: number;
}

export class BestProposalsJob {
  readonly limit: number | undefined;
  private readonly ctx: ProposalContext;
  private readonly gaps: [number, readonly number[]][];
  private readonly order: Visit[] = [];
  private sorted = false;
  private next = 0;
  private finished = false;
  private readonly best: ProposalRow[] = [];
  /** households of the proposals held, largest first, at most `limit` of them: the last is the limit-th best */
  private readonly top: number[] = [];
  private rows: ProposalRow[] | null = null;
  private readonly onDone?: (rows: ProposalRow[]) => void;

  /** `onDone` gets the ranked rows once, when the last step finishes (the engine keeps them). */
  constructor(ctx: ProposalContext, gaps: ReadonlyMap<number, readonly number[]>, limit?: number, onDone?: (rows: ProposalRow[]) => void) {
    this.ctx = ctx;
    this.gaps = Array.from(gaps);
    this.limit = limit;
    this.onDone = onDone;
  }

  get total(): number {
    return 2 * this.gaps.length;
  }

  get done(): number {
    return this.finished ? this.total : this.order.length + this.next;
  }

  /** Works until `deadlineMs` (performance.now()) has passed; true once the ranking is complete. */
  step(deadlineMs: number): boolean {
    const { core } = this.ctx;
    while (this.order.length < this.gaps.length) {
      const [c, avoidable] = this.gaps[this.order.length];
      this.order.push({ c, avoidable, bound: householdsOfWeak(core, weakPoints(core, c, avoidable)) });
      if (performance.now() >= deadlineMs) return false;
    }
    if (!this.sorted) {
      this.order.sort((a, b) => b.bound - a.bound || a.c - b.c);
      this.sorted = true;
    }
    const { limit, top } = this;
    while (!this.finished && this.next < this.order.length) {
      const { c, avoidable, bound } = this.order[this.next];
      if (limit !== undefined && top.length === limit && bound < top[limit - 1]) break;
      // A service's candidate grid (built once, tens of ms for a large one) gets a step of its own before the carriage's screening.
      const s = core.model.carriageService[c];
      if (this.ctx.grids[s] === undefined) {
        gridOf(this.ctx, s);
        if (performance.now() >= deadlineMs) return false;
      }
      this.next++;
      for (const row of proposalsFor(this.ctx, c, avoidable, true)) {
        this.best.push(row);
        if (limit === undefined) continue;
        let at = top.length;
        while (at > 0 && top[at - 1] < row.householdsProtected) at--;
        top.splice(at, 0, row.householdsProtected);
        if (top.length > limit) top.pop();
      }
      if (this.next < this.order.length && performance.now() >= deadlineMs) return false;
    }
    this.finished = true;
    this.onDone?.(this.result());
    return true;
  }

  /** Each gap carriage's best proposal, ranked; only the first `limit` when given. Once `step` has answered true. */
  result(): ProposalRow[] {
    if (!this.finished) throw new Error('the proposals ranking has not finished: step it until it answers true');
    if (!this.rows) {
      this.best.sort(byRank);
      this.rows = this.limit === undefined ? this.best : this.best.slice(0, this.limit);
    }
    return this.rows;
  }
}


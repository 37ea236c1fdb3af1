/**
 * The best proposals over the network: each gap carriage's best proposal
 * (proposals.ts), ranked. Ranking by households protected needs only each
 * carriage's best, and a carriage can protect at most the households that
 * come back when all its weak points are removed (its bound). Carriages are
 * visited by falling bound; once `limit` proposals are held and the next
 * bound is below the households of the limit-th best, no carriage left can
 * enter the answer, so the search stops (the answer is the same as ranking
 * every carriage: test/unit/engine/proposals-fast.test.ts).
 */
import { compareProposals, householdsOfWeak, proposalsFor, weakPoints, type ProposalContext, type ProposalRow } from './proposals';

const byRank = (a: ProposalRow, b: ProposalRow) => compareProposals(a, b) || (a.carriage < b.carriage ? -1 : a.carriage > b.carriage ? 1 : 0);

/** Each gap carriage's best proposal, ranked; only the first `limit` when given. */
export function bestOverNetwork(ctx: ProposalContext, gaps: ReadonlyMap<number, readonly number[]>, limit?: number): ProposalRow[] {
  const { core } = ctx;
  const order = Array.from(gaps, ([c, avoidable]) => ({ c, avoidable, bound: householdsOfWeak(core, weakPoints(core, c, avoidable)) }));
  order.sort((a, b) => b.bound - a.bound || a.c - b.c);
  const best: ProposalRow[] = [];
  // Households of the proposals held, largest first, at most `limit` of them: the last is the limit-th best.
  const top: number[] = [];
  for (const { c, avoidable, bound } of order) {
    if (limit !== undefined && top.length === limit && bound < top[limit - 1]) break;
    for (const row of proposalsFor(ctx, c, avoidable, true)) {
      best.push(row);
      if (limit === undefined) continue;
      let at = top.length;
      while (at > 0 && top[at - 1] < row.householdsProtected) at--;
      top.splice(at, 0, row.householdsProtected);
      if (top.length > limit) top.pop();
    }
  }
  best.sort(byRank);
  return limit === undefined ? best : best.slice(0, limit);
}

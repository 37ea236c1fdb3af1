/**
 * The straightforward path for proposals, kept as the yardstick for the fast
 * one in server/engine (proposals.ts with its candidate grid and
 * proposals-ranking.ts with its early stop): every fed carriage of the
 * service is a candidate and goes to the feed checks when it is within the
 * horizon, and the network ranking takes every gap carriage's best.
 */
import type { NetworkDocument } from '@/shared/schemas/network';
import { buildCore, type EngineCore } from '@/server/engine/core';
import { elementId } from '@/server/engine/model';
import { NetworkEngine } from '@/server/engine/engine';
import { candidateEffects, compareProposals, originsOf, rankCandidates, weakPoints, type ProposalRow } from '@/server/engine/proposals';

export class ReferenceProposals {
  private readonly core: EngineCore;
  private readonly gaps = new Map<number, number[]>();

  constructor(doc: NetworkDocument) {
    this.core = buildCore(doc);
    const { model } = this.core;
    for (const row of NetworkEngine.build(doc, 1).diversity().carriages) {
      const c = model.carriageIndex.get(row.carriage)!;
      this.gaps.set(
        c,
        row.avoidable.map((e) => elementId(model, e.kind, e.code)),
      );
    }
  }

  gapCarriages(): string[] {
    return [...this.gaps.keys()].map((c) => this.core.model.carriageCodes[c]);
  }

  /** Every proposal for one carriage, best first (empty without a gap). */
  forCarriage(code: string, bestOnly = false): ProposalRow[] {
    const c = this.core.model.carriageIndex.get(code)!;
    const avoidable = this.gaps.get(c);
    if (!avoidable) return [];
    const core = this.core;
    const s = core.model.carriageService[c];
    const all: number[] = [];
    for (let u = 1; u < core.services[s].n; u++) all.push(u);
    const effects = candidateEffects(core, c, weakPoints(core, c, avoidable), all);
    return rankCandidates(core, c, effects, originsOf(core, s), () => true, bestOnly);
  }

  /** Each gap carriage's best proposal, all of them ranked. */
  network(): ProposalRow[] {
    return this.gapCarriages()
      .flatMap((code) => this.forCarriage(code, true))
      .sort((a, b) => compareProposals(a, b) || (a.carriage < b.carriage ? -1 : a.carriage > b.carriage ? 1 : 0));
  }
}

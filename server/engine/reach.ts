/**
 * Reach, fallback and households under a set of failed elements (rules 4, 5, 7).
 *
 * Lost(F): carriage nodes cut off from the root once F's nodes are removed
 * from the full graph. Fallback(F): carriages that still have programme under
 * F but not in the main-only graph (every reserve feed also down), i.e. the
 * carriages that need a reserve even with nothing failed, plus those F cuts
 * off in the main-only graph, less the lost ones.
 */
import type { ReachAnswer } from '@/shared/schemas/analysis';
import type { EngineCore } from './core';
import { IntList } from './removal-walk';

export interface ReachScratch {
  perService: IntList[];
  lostNodes: IntList;
  mainLostNodes: IntList;
  carriageStamp: Int32Array;
  epoch: number;
}

export function createReachScratch(core: EngineCore): ReachScratch {
  return {
    perService: core.services.map(() => new IntList()),
    lostNodes: new IntList(1024),
    mainLostNodes: new IntList(1024),
    carriageStamp: new Int32Array(core.model.carriages.length),
    epoch: 0,
  };
}

/** Groups the nodes of the given element ids by service; returns the services touched. */
export function removedNodesByService(core: EngineCore, elementIds: ArrayLike<number>, perService: IntList[]): number[] {
  const touched: number[] = [];
  for (const list of perService) list.clear();
  for (let i = 0; i < elementIds.length; i++) {
    const x = elementIds[i];
    for (let k = core.elementNodeOffsets[x]; k < core.elementNodeOffsets[x + 1]; k++) {
      const g = core.elementNodes[k];
      const s = core.nodeService[g];
      if (perService[s].length === 0) touched.push(s);
      perService[s].push(g - core.services[s].base);
    }
  }
  return touched;
}

/**
 * Lost and fallback carriage ids (ascending, so in code order) under the
 * failure of the given elements.
 */
export function lostAndFallback(
  core: EngineCore,
  staticFallback: Int32Array,
  elementIds: ArrayLike<number>,
  scratch: ReachScratch,
): { lost: Int32Array; fallback: Int32Array } {
  const touched = removedNodesByService(core, elementIds, scratch.perService);
  const { lostNodes, mainLostNodes } = scratch;
  const lost = new IntList(64);
  const mainLost = new IntList(64);
  for (const s of touched) {
    const nodes = scratch.perService[s];
    const svc = core.services[s];
    lostNodes.clear();
    mainLostNodes.clear();
    core.walker.lostMarked(core.full[s], nodes.data, nodes.length, lostNodes);
    core.walker.lostMarked(core.main[s], nodes.data, nodes.length, mainLostNodes);
    for (let i = 0; i < lostNodes.length; i++) lost.push(svc.ref[lostNodes.data[i]]);
    for (let i = 0; i < mainLostNodes.length; i++) mainLost.push(svc.ref[mainLostNodes.data[i]]);
  }
  const ep = ++scratch.epoch;
  const stamp = scratch.carriageStamp;
  for (let i = 0; i < lost.length; i++) stamp[lost.data[i]] = ep;
  const fallback = new IntList(staticFallback.length + mainLost.length + 1);
  for (let i = 0; i < staticFallback.length; i++) if (stamp[staticFallback[i]] !== ep) fallback.push(staticFallback[i]);
  for (let i = 0; i < mainLost.length; i++) if (stamp[mainLost.data[i]] !== ep) fallback.push(mainLost.data[i]);
  const lostIds = lost.toArray().sort();
  const fallbackIds = fallback.toArray().sort();
  return { lost: lostIds, fallback: fallbackIds };
}

/** Builds the answer of rules 4, 5 and 7 from sorted lost and fallback carriage ids. */
export function reachAnswer(core: EngineCore, networkVersion: number, lost: Int32Array, fallback: Int32Array): ReachAnswer {
  const { model } = core;
  const serviceCount = model.services.length;
  const lostByService = new Int32Array(serviceCount);
  const fallbackByService = new Int32Array(serviceCount);
  // Per touched site: lost and fallback service ids.
  const bySite = new Map<number, { lost: number[]; fallback: number[] }>();
  const entry = (site: number) => {
    let e = bySite.get(site);
    if (!e) {
      e = { lost: [], fallback: [] };
      bySite.set(site, e);
    }
    return e;
  };
  for (const c of lost) {
    lostByService[model.carriageService[c]]++;
    entry(model.carriageSite[c]).lost.push(model.carriageService[c]);
  }
  for (const c of fallback) {
    fallbackByService[model.carriageService[c]]++;
    entry(model.carriageSite[c]).fallback.push(model.carriageService[c]);
  }
  let householdsLost = 0;
  let householdsFallback = 0;
  const siteIds = [...bySite.keys()].sort((a, b) => a - b);
  const sites: ReachAnswer['sites'] = siteIds.map((site) => {
    const e = bySite.get(site)!;
    if (e.lost.length > 0) householdsLost += model.siteHouseholds[site];
    else householdsFallback += model.siteHouseholds[site];
    return {
      site: model.siteCodes[site],
      lost: e.lost.sort((a, b) => a - b).map((s) => model.serviceCodes[s]),
      fallback: e.fallback.sort((a, b) => a - b).map((s) => model.serviceCodes[s]),
    };
  });
  const byService: ReachAnswer['byService'] = [];
  for (let s = 0; s < serviceCount; s++) {
    if (lostByService[s] > 0 || fallbackByService[s] > 0) {
      byService.push({ service: model.serviceCodes[s], lost: lostByService[s], fallback: fallbackByService[s] });
    }
  }
  return {
    networkVersion,
    lost: Array.from(lost, (c) => model.carriageCodes[c]),
    fallback: Array.from(fallback, (c) => model.carriageCodes[c]),
    households: { lost: householdsLost, fallback: householdsFallback },
    byService,
    sites,
  };
}

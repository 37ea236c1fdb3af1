/**
 * The slow, plain methods the engine is timed and checked against, kept out
 * of the production class (server/engine/engine.ts): a whole-graph walk for
 * reach, remove-and-walk for exposure, a fresh resilience computation to time
 * it, and the compiled flow graphs to hand to another dominator
 * implementation. Used by scripts/bench-engine.ts and the engine tests.
 */
import type { Element, ExposureRow } from '@/shared/schemas/analysis';
import { engineCore, type NetworkEngine } from '@/server/engine/engine';
import type { EngineCore } from '@/server/engine/core';
import type { Csr } from '@/server/engine/csr';
import { elementId } from '@/server/engine/model';
import { removedNodesByService } from '@/server/engine/reach';
import { IntList } from '@/server/engine/removal-walk';
import { computeResilience } from '@/server/engine/resilience';

function ids(core: EngineCore, failed: readonly Element[]): number[] {
  return failed.map((e) => {
    const id = elementId(core.model, e.kind, e.code);
    if (id < 0) throw new RangeError(`the network has no ${e.kind} ${e.code}`);
    return id;
  });
}

const perServiceLists = new WeakMap<EngineCore, IntList[]>();
function perService(core: EngineCore): IntList[] {
  let lists = perServiceLists.get(core);
  if (!lists) perServiceLists.set(core, (lists = core.services.map(() => new IntList())));
  return lists;
}

/**
 * The yardstick for reach: remove the failed elements' nodes and walk every
 * service graph from its root with a plain typed-array BFS. Returns the
 * number of carriages lost (no fallback, no answer building).
 */
export function walkFloor(engine: NetworkEngine, failed: readonly Element[]): number {
  const core = engineCore(engine);
  const lists = perService(core);
  removedNodesByService(core, ids(core, failed), lists);
  let lost = 0;
  for (let s = 0; s < core.services.length; s++) lost += core.walker.floorLost(core.full[s], lists[s].data, lists[s].length);
  return lost;
}

/**
 * The obvious method for exposure: per element, remove its nodes and walk
 * every service graph it has nodes in. Used to time the baseline and to
 * cross-check the dominator method.
 */
export function baselineExposure(engine: NetworkEngine, sample: readonly Element[]): ExposureRow[] {
  const core = engineCore(engine);
  const { model, services, full, walker } = core;
  const lists = perService(core);
  const lostNodes = new IntList(1024);
  const siteStamp = new Uint8Array(model.sites.length);
  return ids(core, sample).map((x) => {
    const touched = removedNodesByService(core, [x], lists);
    const sites: number[] = [];
    let carriages = 0;
    let households = 0;
    for (const s of touched) {
      lostNodes.clear();
      carriages += walker.floorLost(full[s], lists[s].data, lists[s].length, lostNodes);
      for (let i = 0; i < lostNodes.length; i++) {
        const site = model.carriageSite[services[s].ref[lostNodes.data[i]]];
        if (!siteStamp[site]) {
          siteStamp[site] = 1;
          sites.push(site);
          households += model.siteHouseholds[site];
        }
      }
    }
    for (const site of sites) siteStamp[site] = 0;
    return { element: model.elements[x], households, carriages };
  });
}

/** Recomputes single points of failure and exposure for every element (what `build` did), for timing. */
export function recomputeResilience(engine: NetworkEngine): { ms: number; elements: number } {
  const core = engineCore(engine);
  const t = performance.now();
  computeResilience(core);
  return { ms: performance.now() - t, elements: core.model.elementCount };
}

/** The compiled full graph of every service (root = node 0), e.g. to compare dominators with another implementation. */
export function flowGraphs(engine: NetworkEngine): { service: string; graph: Csr; idom: Int32Array; isCarriage: Uint8Array; ref: Int32Array }[] {
  const core = engineCore(engine);
  return core.services.map((svc, s) => ({
    service: core.model.serviceCodes[s],
    graph: svc.full,
    idom: core.full[s].tree.idom,
    isCarriage: svc.isCarriage,
    ref: svc.ref,
  }));
}

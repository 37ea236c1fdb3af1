/**
 * Single points of failure (rule 6) of every fed carriage and the exposure
 * (rule 7) of every element, computed once per network version.
 *
 * An element owning exactly one reachable node u in a service graph cuts off
 * exactly u's dominator subtree there, so its single points of failure are
 * read off the dominator chain and its exposure off the subtree's carriages.
 * An element owning several nodes in one service graph (a via-site that also
 * carries the service, a group on several feeds or sites) is not a single
 * dominator: it is removed and walked (removal-walk.ts) once per such service.
 * A carriage owns exactly one node (its own), so it is always a single
 * dominator: a parent transmitter is a single point of failure of everything
 * its node dominates.
 */
import type { EngineCore } from './core';
import { IntList } from './removal-walk';

export interface Resilience {
  /** element ids (= compareElements order) per carriage: spofElements[spofOffsets[c] .. spofOffsets[c + 1]) */
  spofOffsets: Int32Array;
  spofElements: Int32Array;
  /** households lost and carriages lost when the element alone fails, per element id */
  exposureHouseholds: Float64Array;
  exposureCarriages: Int32Array;
  /** element ids by exposure, highest first, ties in compareElements order */
  ranked: Int32Array;
}

/** CSR grouping of (key, value) pairs by key. */
function groupPairs(keyCount: number, keys: IntList, values: IntList): { offsets: Int32Array; values: Int32Array } {
  const offsets = new Int32Array(keyCount + 1);
  for (let i = 0; i < keys.length; i++) offsets[keys.data[i] + 1]++;
  for (let k = 0; k < keyCount; k++) offsets[k + 1] += offsets[k];
  const fill = offsets.slice(0, keyCount);
  const out = new Int32Array(keys.length);
  for (let i = 0; i < keys.length; i++) out[fill[keys.data[i]]++] = values.data[i];
  return { offsets, values: out };
}

/** Units of work (nodes, carriages, elements visited) between two pauses of `resilienceSteps`. */
const STEP_WORK = 4096;

/** The weak points at once (for a test, a benchmark, or an engine asked before they were prepared). */
export function computeResilience(core: EngineCore): Resilience {
  const steps = resilienceSteps(core);
  for (;;) {
    const r = steps.next();
    if (r.done) return r.value;
  }
}

/**
 * The same computation, pausing (a bare `yield`) after every STEP_WORK units
 * of work, so a server can answer other requests between pieces: at 100,000
 * sites the whole is seconds of work. Where the pauses fall changes nothing.
 */
export function* resilienceSteps(core: EngineCore): Generator<void, Resilience, void> {
  const { model, services, full, walker, carriageNode, fed } = core;
  let work = 0;
  const E = model.elementCount;
  const C = model.carriages.length;
  const aliveCount = new Int32Array(E);
  const touched = new IntList();
  const ownerSingle: Uint8Array[] = [];
  const singleElement = new IntList();
  const singleNode = new IntList();
  const multiElement = new IntList();
  const multiRecord = new IntList();
  const multiStart = new IntList();
  const multiLost = new IntList();
  const extraCarriage = new IntList();
  const extraElement = new IntList();
  const lostNodes = new IntList();

  for (const svc of services) {
    const tree = full[svc.service].tree;
    const { ownerOffsets, owners } = svc;
    for (let u = 0; u < svc.n; u++) {
      if ((++work & (STEP_WORK - 1)) === 0) yield;
      if (!tree.alive[u]) continue;
      for (let j = ownerOffsets[u]; j < ownerOffsets[u + 1]; j++) if (aliveCount[owners[j]]++ === 0) touched.push(owners[j]);
    }
    const single = new Uint8Array(owners.length);
    const multiNodes = new Map<number, number[]>();
    for (let u = 0; u < svc.n; u++) {
      if ((++work & (STEP_WORK - 1)) === 0) yield;
      if (!tree.alive[u]) continue;
      for (let j = ownerOffsets[u]; j < ownerOffsets[u + 1]; j++) {
        const x = owners[j];
        if (aliveCount[x] === 1) {
          single[j] = 1;
          singleElement.push(x);
          singleNode.push(svc.base + u);
        } else {
          const list = multiNodes.get(x);
          if (list) list.push(u);
          else multiNodes.set(x, [u]);
        }
      }
    }
    ownerSingle.push(single);
    for (const [x, nodes] of multiNodes) {
      // a removal walk can cover a whole service graph: a pause after each
      work += STEP_WORK;
      yield;
      lostNodes.clear();
      walker.lostMarked(full[svc.service], nodes, nodes.length, lostNodes);
      multiElement.push(x);
      multiRecord.push(multiStart.length);
      multiStart.push(multiLost.length);
      for (let i = 0; i < lostNodes.length; i++) {
        const c = svc.ref[lostNodes.data[i]];
        multiLost.push(c);
        if (model.carriageSite[c] !== x) {
          extraCarriage.push(c);
          extraElement.push(x);
        }
      }
    }
    for (let i = 0; i < touched.length; i++) aliveCount[touched.data[i]] = 0;
    touched.clear();
  }
  multiStart.push(multiLost.length);

  const extra = groupPairs(C, extraCarriage, extraElement);
  const spofOffsets = new Int32Array(C + 1);
  const spof = new IntList(C * 4);
  for (let c = 0; c < C; c++) {
    if ((++work & (STEP_WORK - 1)) === 0) yield;
    if (fed[c]) {
      const s = model.carriageService[c];
      const svc = services[s];
      const idom = full[s].tree.idom;
      const single = ownerSingle[s];
      const ownSite = model.carriageSite[c];
      const self = model.carriageBase + c;
      const start = spof.length;
      for (let w = carriageNode[c]; w > 0; w = idom[w]) {
        for (let j = svc.ownerOffsets[w]; j < svc.ownerOffsets[w + 1]; j++) {
          if (single[j] && svc.owners[j] !== ownSite && svc.owners[j] !== self) spof.push(svc.owners[j]);
        }
      }
      for (let i = extra.offsets[c]; i < extra.offsets[c + 1]; i++) spof.push(extra.values[i]);
      if (spof.length - start > 1) spof.data.subarray(start, spof.length).sort();
    }
    spofOffsets[c + 1] = spof.length;
  }

  const singles = groupPairs(E, singleElement, singleNode);
  const multis = groupPairs(E, multiElement, multiRecord);
  const exposureHouseholds = new Float64Array(E);
  const exposureCarriages = new Int32Array(E);
  const siteStamp = new Int32Array(model.sites.length).fill(-1);
  const { carriageSite, siteHouseholds } = model;
  for (let x = 0; x < E; x++) {
    if ((++work & (STEP_WORK - 1)) === 0) yield;
    let households = 0;
    let carriages = 0;
    for (let i = singles.offsets[x]; i < singles.offsets[x + 1]; i++) {
      const g = singles.values[i];
      const svc = services[core.nodeService[g]];
      const tree = full[svc.service].tree;
      const u = g - svc.base;
      for (let k = tree.markStart[u]; k < tree.markEnd[u]; k++) {
        const site = carriageSite[svc.ref[tree.markedPre[k]]];
        carriages++;
        if (siteStamp[site] !== x) {
          siteStamp[site] = x;
          households += siteHouseholds[site];
        }
      }
    }
    for (let i = multis.offsets[x]; i < multis.offsets[x + 1]; i++) {
      const r = multis.values[i];
      for (let k = multiStart.data[r]; k < multiStart.data[r + 1]; k++) {
        const site = carriageSite[multiLost.data[k]];
        carriages++;
        if (siteStamp[site] !== x) {
          siteStamp[site] = x;
          households += siteHouseholds[site];
        }
      }
    }
    exposureHouseholds[x] = households;
    exposureCarriages[x] = carriages;
  }
  yield;
  return { spofOffsets, spofElements: spof.toArray(), exposureHouseholds, exposureCarriages, ranked: rankByExposure(exposureHouseholds) };
}

/**
 * Element ids by households, highest first, ties by id. Each id is packed
 * with its households into one float, -households * 2^bits + id, and the
 * floats sorted without a comparator: about three times faster than a
 * comparator sort at national scale (some 900,000 elements). The packing is
 * exact while households * 2^bits stays below 2^53; past that (sums of
 * households no real network has) the comparator sort does it.
 */
export function rankByExposure(households: Float64Array): Int32Array {
  const E = households.length;
  const ranked = new Int32Array(E);
  let most = 0;
  for (let x = 0; x < E; x++) if (households[x] > most) most = households[x];
  const scale = 2 ** Math.max(1, Math.ceil(Math.log2(E + 1)));
  if (most * scale >= Number.MAX_SAFE_INTEGER || !households.every(Number.isInteger)) {
    for (let x = 0; x < E; x++) ranked[x] = x;
    return ranked.sort((a, b) => households[b] - households[a] || a - b);
  }
  const keys = new Float64Array(E);
  for (let x = 0; x < E; x++) keys[x] = x - households[x] * scale;
  keys.sort();
  for (let i = 0; i < E; i++) ranked[i] = ((keys[i] % scale) + scale) % scale;
  return ranked;
}

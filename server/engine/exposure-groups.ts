/**
 * The exposure ranking with elements that take off exactly the same
 * carriages folded into one row: a site and the feeds that only serve it, a
 * transmitter and its site when the site carries nothing else, a group and
 * the one feed it holds. Exact: elements are first bucketed by (households,
 * carriages lost), which equal sets share, and only buckets of two or more
 * compare their lost carriage sets, walked once each (removal-walk.ts).
 */
import type { Element } from '@/shared/schemas/analysis';
import type { EngineCore } from './core';
import { removedNodesByService } from './reach';
import { IntList } from './removal-walk';

export interface ExposureGroupRow {
  /** in element order: the first one names the row */
  elements: Element[];
  households: number;
  carriages: number;
}

/** Lost carriage ids (ascending) when element x alone fails. */
function lostIds(core: EngineCore, x: number, perService: IntList[], lostNodes: IntList): Int32Array {
  const out = new IntList(16);
  for (const s of removedNodesByService(core, [x], perService)) {
    lostNodes.clear();
    core.walker.lostMarked(core.full[s], perService[s].data, perService[s].length, lostNodes);
    for (let i = 0; i < lostNodes.length; i++) out.push(core.services[s].ref[lostNodes.data[i]]);
  }
  return out.toArray().sort();
}

/** removal walks between two pauses of `groupExposureSteps` */
const WALKS_PER_STEP = 32;

/**
 * `ranked` holds element ids by exposure (highest first, ties in element
 * order), already filtered to the kinds asked for; each group keeps the
 * position of its first element.
 */
export function groupExposure(
  core: EngineCore,
  ranked: readonly number[],
  households: Float64Array,
  carriages: Int32Array,
): ExposureGroupRow[] {
  const run = groupExposureSteps(core, ranked, households, carriages);
  let r = run.next();
  while (!r.done) r = run.next();
  return r.value;
}

/**
 * `groupExposure` as steps: it pauses after every few removal walks (a walk
 * is a service graph's worth of work; at 20,000 sites the whole is most of a
 * second), so a server can give other requests turns between them.
 */
export function* groupExposureSteps(
  core: EngineCore,
  ranked: readonly number[],
  households: Float64Array,
  carriages: Int32Array,
): Generator<void, ExposureGroupRow[], void> {
  const buckets = new Map<string, number[]>();
  for (let i = 0; i < ranked.length; i++) {
    const x = ranked[i];
    const key = `${households[x]}:${carriages[x]}`;
    const b = buckets.get(key);
    if (b) b.push(x);
    else buckets.set(key, [x]);
    if ((i & 4095) === 4095) yield;
  }
  yield;
  const perService = core.services.map(() => new IntList());
  const lostNodes = new IntList(1024);
  // leader element id -> its members (itself first)
  const groupOf = new Map<number, number[]>();
  let walks = 0;
  let plain = 0;
  for (const members of buckets.values()) {
    if (members.length === 1 || carriages[members[0]] === 0) {
      // One element, or elements that take nothing off air: nothing to fold (a row of everything harmless helps nobody).
      for (const x of members) groupOf.set(x, [x]);
      if ((plain += members.length) >= 4096) {
        plain = 0;
        yield;
      }
      continue;
    }
    const bySet = new Map<string, number[]>();
    for (const x of members) {
      const key = lostIds(core, x, perService, lostNodes).join(',');
      const g = bySet.get(key);
      if (g) g.push(x);
      else bySet.set(key, [x]);
      if (++walks % WALKS_PER_STEP === 0) yield;
    }
    for (const g of bySet.values()) groupOf.set(g[0], g);
  }
  yield;
  const rows: ExposureGroupRow[] = [];
  for (let i = 0; i < ranked.length; i++) {
    const x = ranked[i];
    const g = groupOf.get(x);
    if (g) rows.push({ elements: g.map((y) => core.model.elements[y]), households: households[x], carriages: carriages[x] });
    if ((i & 4095) === 4095) yield;
  }
  return rows;
}

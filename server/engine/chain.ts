/**
 * Chain trees (docs/api.md): upstream from a carriage through
 * each feed into it to the origins, or downstream to every carriage it feeds.
 *
 * Built breadth first, so each carriage is expanded at its shallowest place;
 * a carriage met again on the path from the tree's root closes a loop
 * (`loop`, cut there), met again elsewhere it is shown once (`repeated`, cut
 * there). With reserve feeds the number of paths grows exponentially with
 * depth; this keeps the tree no larger than the number of feeds.
 */
import type { ChainAnswer, ChainNode } from '@/shared/schemas/analysis';
import { geodesicInverse } from '@/shared/rf/geodesy';
import type { EngineCore } from './core';
import { listOf } from './model';

export type ChainDirection = 'up' | 'down';

export interface ChainOptions {
  /** screening warnings to show on a hop, by feed code */
  warningsFor?: (feedCode: string) => string[];
}

function carriageNode(core: EngineCore, c: number): ChainNode {
  const { model } = core;
  const site = model.sites[model.carriageSite[c]];
  return {
    carriage: model.carriageCodes[c],
    site: model.siteCodes[model.carriageSite[c]],
    siteName: site.name,
    service: model.serviceCodes[model.carriageService[c]],
    origin: model.siteOrigin[model.carriageSite[c]] === 1,
    onAir: core.fed[c] === 1,
    children: [],
  };
}

function distanceKm(core: EngineCore, fromSite: number, toSite: number): number | null {
  const a = core.model.sites[fromSite];
  const b = core.model.sites[toSite];
  try {
    return geodesicInverse(a.lat, a.lon, b.lat, b.lon).distanceKm;
  } catch {
    return null;
  }
}

export function chainTree(core: EngineCore, networkVersion: number, start: number, direction: ChainDirection, opts: ChainOptions = {}): ChainAnswer {
  const { model } = core;
  const byRoleThenCode = (a: number, b: number) => (model.feedReserve[a] - model.feedReserve[b]) || a - b;
  const root = carriageNode(core, start);
  // Parallel arrays over the tree's expanded entries: its carriage and the entry it hangs from.
  const entryNode: ChainNode[] = [root];
  const entryCarriage: number[] = [start];
  const entryParent: number[] = [-1];
  const expanded = new Set<number>([start]);
  const onPath = (entry: number, c: number) => {
    for (let e = entry; e >= 0; e = entryParent[e]) if (entryCarriage[e] === c) return true;
    return false;
  };

  for (let head = 0; head < entryNode.length; head++) {
    const c = entryCarriage[head];
    const node = entryNode[head];
    if (direction === 'up' && node.origin) continue;
    const feeds = Array.from(listOf(direction === 'up' ? model.feedsInto : model.feedsOutOf, c)).sort(byRoleThenCode);
    if (direction === 'up' && feeds.length === 0) {
      node.deadEnd = true;
      continue;
    }
    for (const f of feeds) {
      const next = direction === 'up' ? model.feedFrom[f] : model.feedTo[f];
      const source = model.feedFrom[f];
      const child = carriageNode(core, next);
      child.via = {
        feed: model.feedCodes[f],
        medium: model.feedMedium[f],
        role: model.feedRole[f],
        up: core.fed[source] === 1,
        distanceKm: distanceKm(core, model.carriageSite[source], model.carriageSite[model.feedTo[f]]),
        hops: Array.from(listOf(model.feedVia, f), (s) => model.siteCodes[s]),
        warnings: opts.warningsFor?.(model.feedCodes[f]) ?? [],
      };
      node.children.push(child);
      if (onPath(head, next)) {
        child.loop = true;
      } else if (expanded.has(next)) {
        child.repeated = true;
      } else {
        expanded.add(next);
        entryNode.push(child);
        entryCarriage.push(next);
        entryParent.push(head);
      }
    }
  }
  return { networkVersion, direction, root };
}

/**
 * One graphology graph per service (handbook domain.md, "How to compute it
 * fast"), and its compilation to integer-indexed typed arrays.
 *
 * Nodes: a virtual root; one node per carriage (in one service a site has at
 * most one carriage, so the carriage node also stands for "its site is up");
 * one node per feed; one hop node per (feed, via-site) and per (feed, group)
 * on the feed's path:
 *
 *   root -> origin carriage
 *   source carriage -> hop(feed, via-site)... -> hop(feed, group)... -> feed -> target carriage
 *
 * Rules 1-3 are then reachability from the root once every node owned by a
 * failed element is removed. Owners of a node: a carriage node belongs to its
 * site and the site's groups (rule 1), a feed node to the feed, a hop
 * (feed, via-site) to the via-site and the via-site's groups, a hop
 * (feed, group) to the group (rule 2).
 *
 * graphology stays the model other server code inspects; the engine's hot
 * loops run over the compiled CSR arrays instead (see csr.ts for why).
 */
import GraphModule from 'graphology';
import type { Element } from '@/shared/schemas/analysis';
import type { FeedRole } from '@/shared/schemas/network';
import { csrFromEdges, reverseCsr, type Csr } from './csr';
import type { NetworkModel } from './model';

export type FlowNode =
  | { kind: 'root' }
  | { kind: 'carriage'; carriage: string; site: string; origin: boolean }
  | { kind: 'feed'; feed: string; role: FeedRole }
  | { kind: 'hop'; feed: string; element: Element };

/** Edges on a reserve feed's path are left out of the main-only graph (rule 5). */
export interface FlowEdge {
  reserve: boolean;
}

/**
 * The part of graphology's API the engine uses. The installed graphology ships
 * its types through the `graphology-types` package, which is not installed,
 * so the constructor is typed here rather than left as `any`.
 */
export interface ServiceGraph {
  readonly order: number;
  readonly size: number;
  addNode(key: string, attributes: FlowNode): string;
  addDirectedEdge(source: string, target: string, attributes: FlowEdge): string;
  hasNode(key: string): boolean;
  getNodeAttributes(key: string): FlowNode;
  getAttribute(name: string): unknown;
  setAttribute(name: string, value: unknown): void;
  outNeighbors(key: string): string[];
  inNeighbors(key: string): string[];
  forEachNode(callback: (key: string, attributes: FlowNode) => void): void;
  forEachEdge(callback: (edge: string, attributes: FlowEdge, source: string, target: string) => void): void;
}
type GraphConstructor = new (options: { type: 'directed'; multi: boolean; allowSelfLoops: boolean }) => ServiceGraph;
const Graph: GraphConstructor =
  (GraphModule as unknown as { default?: GraphConstructor }).default ?? (GraphModule as unknown as GraphConstructor);

export const ROOT_KEY = 'root';
export const carriageKey = (code: string) => `carriage:${code}`;
export const feedKey = (code: string) => `feed:${code}`;
export const hopKey = (feed: string, e: Element) => `hop:${feed}:${e.kind}:${e.code}`;

/** One graph per service, indexed by service id (model order = service code order). */
export function buildServiceGraphs(model: NetworkModel): ServiceGraph[] {
  const graphs = model.services.map((s) => {
    const g = new Graph({ type: 'directed', multi: false, allowSelfLoops: false });
    g.setAttribute('service', s.code);
    g.addNode(ROOT_KEY, { kind: 'root' });
    return g;
  });
  model.carriages.forEach((c, i) => {
    const g = graphs[model.carriageService[i]];
    const site = model.carriageSite[i];
    const origin = model.siteOrigin[site] === 1;
    g.addNode(carriageKey(c.code), { kind: 'carriage', carriage: c.code, site: model.sites[site].code, origin });
    if (origin) g.addDirectedEdge(ROOT_KEY, carriageKey(c.code), { reserve: false });
  });
  model.feeds.forEach((f, i) => {
    const g = graphs[model.carriageService[model.feedFrom[i]]];
    const edge = { reserve: model.feedReserve[i] === 1 };
    let previous = carriageKey(model.carriages[model.feedFrom[i]].code);
    const hops: Element[] = [
      ...Array.from(model.feedVia[i], (s) => model.elements[s]),
      ...Array.from(model.feedGroups[i], (gr) => model.elements[model.groupBase + gr]),
    ];
    for (const element of hops) {
      const key = hopKey(f.code, element);
      g.addNode(key, { kind: 'hop', feed: f.code, element });
      g.addDirectedEdge(previous, key, edge);
      previous = key;
    }
    g.addNode(feedKey(f.code), { kind: 'feed', feed: f.code, role: f.role });
    g.addDirectedEdge(previous, feedKey(f.code), edge);
    g.addDirectedEdge(feedKey(f.code), carriageKey(model.carriages[model.feedTo[i]].code), edge);
  });
  return graphs;
}

export const NODE_ROOT = 0;
export const NODE_CARRIAGE = 1;
export const NODE_FEED = 2;
export const NODE_HOP = 3;

/** A service graph as typed arrays. Local node 0 is the root. */
export interface CompiledService {
  service: number;
  /** global id of local node 0: global = base + local */
  base: number;
  n: number;
  kind: Uint8Array;
  /** carriage id, feed id, or the hop's element id; -1 for the root */
  ref: Int32Array;
  /** 1 for carriage nodes (the nodes a reach counts) */
  isCarriage: Uint8Array;
  /** element ids owning each node: owners[ownerOffsets[u] .. ownerOffsets[u + 1]) */
  ownerOffsets: Int32Array;
  owners: Int32Array;
  full: Csr;
  fullIn: Csr;
  /** without the edges of reserve feeds (rule 5) */
  main: Csr;
  mainIn: Csr;
}

export function compileServiceGraph(graph: ServiceGraph, model: NetworkModel, service: number, base: number): CompiledService {
  const n = graph.order;
  const ids = new Map<string, number>();
  const kind = new Uint8Array(n);
  const ref = new Int32Array(n).fill(-1);
  const isCarriage = new Uint8Array(n);
  const ownerOffsets = new Int32Array(n + 1);
  const ownerList: number[] = [];
  const siteWithGroups = (site: number) => {
    ownerList.push(site);
    for (const g of model.siteGroups[site]) ownerList.push(model.groupBase + g);
  };
  const lookup = (map: Map<string, number>, code: string, what: string) => {
    const id = map.get(code);
    if (id === undefined) throw new Error(`service graph ${String(graph.getAttribute('service'))}: ${what} ${code} is not in the network`);
    return id;
  };
  let next = 0;
  graph.forEachNode((key, a) => {
    const u = next++;
    ids.set(key, u);
    if (a.kind === 'root') {
      if (u !== 0) throw new Error('the root must be the first node of a service graph');
      kind[u] = NODE_ROOT;
    } else if (a.kind === 'carriage') {
      kind[u] = NODE_CARRIAGE;
      isCarriage[u] = 1;
      ref[u] = lookup(model.carriageIndex, a.carriage, 'carriage');
      siteWithGroups(model.carriageSite[ref[u]]);
    } else if (a.kind === 'feed') {
      kind[u] = NODE_FEED;
      ref[u] = lookup(model.feedIndex, a.feed, 'feed');
      ownerList.push(model.feedBase + ref[u]);
    } else {
      kind[u] = NODE_HOP;
      if (a.element.kind === 'site') {
        ref[u] = lookup(model.siteIndex, a.element.code, 'site');
        siteWithGroups(ref[u]);
      } else {
        ref[u] = model.groupBase + lookup(model.groupIndex, a.element.code, 'group');
        ownerList.push(ref[u]);
      }
    }
    ownerOffsets[u + 1] = ownerList.length;
  });

  const m = graph.size;
  const sources = new Int32Array(m);
  const targets = new Int32Array(m);
  const notReserve = new Uint8Array(m);
  let e = 0;
  graph.forEachEdge((_edge, a, s, t) => {
    sources[e] = ids.get(s)!;
    targets[e] = ids.get(t)!;
    notReserve[e] = a.reserve ? 0 : 1;
    e++;
  });
  const full = csrFromEdges(n, sources, targets, m);
  const main = csrFromEdges(n, sources, targets, m, notReserve);
  return {
    service,
    base,
    n,
    kind,
    ref,
    isCarriage,
    ownerOffsets,
    owners: Int32Array.from(ownerList),
    full,
    fullIn: reverseCsr(full),
    main,
    mainIn: reverseCsr(main),
  };
}

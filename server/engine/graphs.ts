/**
 * One graph per service (docs/domain.md, "How the engine computes them"): the
 * single adapter from the network model to flow graphs, their graphology form
 * and their compilation to integer-indexed typed arrays.
 *
 * Nodes: a virtual root; one node per carriage (in one service a site has at
 * most one carriage, so the carriage node also stands for "its site is up");
 * one node per feed; one hop node per (feed, via-site) and per (feed, group)
 * on the feed's path:
 *
 *   root -> origin carriage
 *   source carriage -> hop(feed, via-site)... -> hop(feed, group)... -> feed -> receiving carriage
 *
 * Rules 1-3 are then reachability from the root once every node owned by a
 * failed element is removed. Owners of a node: a carriage node belongs to the
 * carriage itself (removing it is exactly "no programme, and every feed it is
 * the source of is down"), its site and the site's groups (rule 1), a feed node to the feed, a hop
 * (feed, via-site) to the via-site and the via-site's groups, a hop
 * (feed, group) to the group (rule 2).
 *
 * `buildFlowSpecs` decides nodes and edges once, as typed arrays. From that
 * one description come both the graphology graph (the model other server
 * code inspects, built on first use: at national scale, ~470k nodes, building
 * it costs seconds of keyed-object allocation) and the CSR arrays the engine's
 * hot loops run over (see csr.ts for why).
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

export const NODE_ROOT = 0;
export const NODE_CARRIAGE = 1;
export const NODE_FEED = 2;
export const NODE_HOP = 3;

/** The nodes and edges of one service graph. Local node 0 is the root. */
export interface FlowSpec {
  service: number;
  n: number;
  kind: Uint8Array;
  /** carriage id, feed id, or the hop's element id; -1 for the root */
  ref: Int32Array;
  /** the feed a hop node lies on; -1 for other nodes */
  hopFeed: Int32Array;
  m: number;
  source: Int32Array;
  target: Int32Array;
  /** 1 on every edge of a reserve feed's path */
  reserve: Uint8Array;
}

/** The flow graph of every service, indexed by service id. */
export function buildFlowSpecs(model: NetworkModel): FlowSpec[] {
  return buildSomeFlowSpecs(model, null) as FlowSpec[];
}

/**
 * The flow graphs of the services marked in `only` (all when null); the
 * others are left undefined. An edit rebuilds only the services it touches
 * (update.ts): the loops stay over every carriage and feed, which is cheap
 * typed-array work next to compiling and dominators.
 */
export function buildSomeFlowSpecs(model: NetworkModel, only: Uint8Array | null): (FlowSpec | undefined)[] {
  const serviceCount = model.services.length;
  const want = (s: number) => only === null || only[s] === 1;
  const nodes = new Int32Array(serviceCount).fill(1);
  const edges = new Int32Array(serviceCount);
  const C = model.carriages.length;
  const F = model.feeds.length;
  for (let c = 0; c < C; c++) {
    nodes[model.carriageService[c]]++;
    if (model.siteOrigin[model.carriageSite[c]]) edges[model.carriageService[c]]++;
  }
  for (let f = 0; f < F; f++) {
    const s = model.carriageService[model.feedFrom[f]];
    const hops = model.feedVia.offsets[f + 1] - model.feedVia.offsets[f] + model.feedGroups.offsets[f + 1] - model.feedGroups.offsets[f];
    nodes[s] += 1 + hops;
    edges[s] += 2 + hops;
  }
  const specs: (FlowSpec | undefined)[] = Array.from({ length: serviceCount }, (_, s) =>
    want(s)
      ? {
          service: s,
          n: nodes[s],
          kind: new Uint8Array(nodes[s]),
          ref: new Int32Array(nodes[s]).fill(-1),
          hopFeed: new Int32Array(nodes[s]).fill(-1),
          m: edges[s],
          source: new Int32Array(edges[s]),
          target: new Int32Array(edges[s]),
          reserve: new Uint8Array(edges[s]),
        }
      : undefined,
  );
  const nextNode = new Int32Array(serviceCount).fill(1);
  const nextEdge = new Int32Array(serviceCount);
  const edge = (spec: FlowSpec, a: number, b: number, reserve: number) => {
    const e = nextEdge[spec.service]++;
    spec.source[e] = a;
    spec.target[e] = b;
    spec.reserve[e] = reserve;
  };
  const local = new Int32Array(C);
  for (let c = 0; c < C; c++) {
    const spec = specs[model.carriageService[c]];
    if (!spec) continue;
    const u = nextNode[spec.service]++;
    local[c] = u;
    spec.kind[u] = NODE_CARRIAGE;
    spec.ref[u] = c;
    if (model.siteOrigin[model.carriageSite[c]]) edge(spec, 0, u, 0);
  }
  const hop = (spec: FlowSpec, f: number, element: number, previous: number, reserve: number) => {
    const u = nextNode[spec.service]++;
    spec.kind[u] = NODE_HOP;
    spec.ref[u] = element;
    spec.hopFeed[u] = f;
    edge(spec, previous, u, reserve);
    return u;
  };
  for (let f = 0; f < F; f++) {
    const spec = specs[model.carriageService[model.feedFrom[f]]];
    if (!spec) continue;
    const reserve = model.feedReserve[f];
    let previous = local[model.feedFrom[f]];
    const { feedVia, feedGroups } = model;
    for (let k = feedVia.offsets[f]; k < feedVia.offsets[f + 1]; k++) previous = hop(spec, f, feedVia.ids[k], previous, reserve);
    for (let k = feedGroups.offsets[f]; k < feedGroups.offsets[f + 1]; k++) previous = hop(spec, f, model.groupBase + feedGroups.ids[k], previous, reserve);
    const u = nextNode[spec.service]++;
    spec.kind[u] = NODE_FEED;
    spec.ref[u] = f;
    edge(spec, previous, u, reserve);
    edge(spec, u, local[model.feedTo[f]], reserve);
  }
  return specs;
}

/** The graphology key and attributes of local node u. */
export function flowNode(spec: FlowSpec, model: NetworkModel, u: number): { key: string; attributes: FlowNode } {
  const ref = spec.ref[u];
  switch (spec.kind[u]) {
    case NODE_CARRIAGE: {
      const site = model.carriageSite[ref];
      const carriage = model.carriageCodes[ref];
      return { key: carriageKey(carriage), attributes: { kind: 'carriage', carriage, site: model.siteCodes[site], origin: model.siteOrigin[site] === 1 } };
    }
    case NODE_FEED:
      return { key: feedKey(model.feedCodes[ref]), attributes: { kind: 'feed', feed: model.feedCodes[ref], role: model.feedRole[ref] } };
    case NODE_HOP: {
      const feed = model.feedCodes[spec.hopFeed[u]];
      const element = model.elements[ref];
      return { key: hopKey(feed, element), attributes: { kind: 'hop', feed, element } };
    }
    default:
      return { key: ROOT_KEY, attributes: { kind: 'root' } };
  }
}

/** The graphology graph of one service: the same nodes (in local id order) and edges as the spec. */
export function toGraphology(spec: FlowSpec, model: NetworkModel): ServiceGraph {
  const g = new Graph({ type: 'directed', multi: false, allowSelfLoops: false });
  g.setAttribute('service', model.serviceCodes[spec.service]);
  const keys: string[] = new Array(spec.n);
  for (let u = 0; u < spec.n; u++) {
    const { key, attributes } = flowNode(spec, model, u);
    keys[u] = key;
    g.addNode(key, attributes);
  }
  for (let e = 0; e < spec.m; e++) g.addDirectedEdge(keys[spec.source[e]], keys[spec.target[e]], { reserve: spec.reserve[e] === 1 });
  return g;
}

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

export function compileFlowSpec(spec: FlowSpec, model: NetworkModel, base: number): CompiledService {
  const { n, kind, ref } = spec;
  const isCarriage = new Uint8Array(n);
  const ownerOffsets = new Int32Array(n + 1);
  let count = 0;
  const sg = model.siteGroups;
  const groupCount = (site: number) => sg.offsets[site + 1] - sg.offsets[site];
  const ownerCount = (u: number) => {
    switch (kind[u]) {
      case NODE_CARRIAGE:
        return 2 + groupCount(model.carriageSite[ref[u]]);
      case NODE_FEED:
        return 1;
      case NODE_HOP:
        return ref[u] < model.carriageBase ? 1 + groupCount(ref[u]) : 1;
      default:
        return 0;
    }
  };
  for (let u = 0; u < n; u++) {
    count += ownerCount(u);
    ownerOffsets[u + 1] = count;
  }
  const owners = new Int32Array(count);
  // Owners of a node stay ascending (site < carriage < group ids), as the element order.
  const siteWithGroups = (at: number, site: number, carriage = -1) => {
    owners[at] = site;
    if (carriage >= 0) owners[++at] = model.carriageBase + carriage;
    for (let k = sg.offsets[site]; k < sg.offsets[site + 1]; k++) owners[++at] = model.groupBase + sg.ids[k];
  };
  for (let u = 0; u < n; u++) {
    const at = ownerOffsets[u];
    if (kind[u] === NODE_CARRIAGE) {
      isCarriage[u] = 1;
      siteWithGroups(at, model.carriageSite[ref[u]], ref[u]);
    } else if (kind[u] === NODE_FEED) {
      owners[at] = model.feedBase + ref[u];
    } else if (kind[u] === NODE_HOP) {
      if (ref[u] < model.carriageBase) siteWithGroups(at, ref[u]);
      else owners[at] = ref[u];
    }
  }
  const keepMain = new Uint8Array(spec.m);
  for (let e = 0; e < spec.m; e++) keepMain[e] = spec.reserve[e] ? 0 : 1;
  const full = csrFromEdges(n, spec.source, spec.target, spec.m);
  const main = csrFromEdges(n, spec.source, spec.target, spec.m, keepMain);
  return {
    service: spec.service,
    base,
    n,
    kind,
    ref,
    isCarriage,
    ownerOffsets,
    owners,
    full,
    fullIn: reverseCsr(full),
    main,
    mainIn: reverseCsr(main),
  };
}

/**
 * The engine's compiled state: the integer model, the flow graph of each
 * service (graphs.ts) and its CSR compilation, a dominator tree per service for the full graph and for the
 * main-only graph (rule 5), and the element -> node index.
 */
import type { NetworkDocument } from '@/shared/schemas/network';
import { buildNetworkModel, type NetworkModel } from './model';
import { buildFlowSpecs, compileFlowSpec, type CompiledService, type FlowSpec } from './graphs';
import { immediateDominators } from './dominators';
import { indexDominatorTree } from './dominator-tree';
import { RemovalWalker, type FlowView } from './removal-walk';

export interface BuildTimings {
  modelMs: number;
  /** deciding every service graph's nodes and edges */
  flowMs: number;
  compileMs: number;
  /** immediate dominators of every service's full graph */
  idomMs: number;
  /** the same for the main-only graphs, plus the tree indexes */
  treesMs: number;
  /** service graphs built (all of them in a full build, those an edit touched in an update) */
  rebuiltServices: number;
}

export interface EngineCore {
  model: NetworkModel;
  specs: FlowSpec[];
  services: CompiledService[];
  full: FlowView[];
  main: FlowView[];
  /** local node of each carriage in its service graph */
  carriageNode: Int32Array;
  /** per carriage: has programme with nothing failed (full graph / main feeds only) */
  fed: Uint8Array;
  mainFed: Uint8Array;
  /** global node ids (base + local) owned by each element, ascending, so grouped by service */
  elementNodeOffsets: Int32Array;
  elementNodes: Int32Array;
  nodeService: Int32Array;
  totalNodes: number;
  totalEdges: number;
  walker: RemovalWalker;
  timings: BuildTimings;
}

const now = () => performance.now();

export function buildCore(doc: NetworkDocument): EngineCore {
  let t = now();
  const model = buildNetworkModel(doc);
  const modelMs = now() - t;

  t = now();
  const specs = buildFlowSpecs(model);
  const flowMs = now() - t;

  t = now();
  const services: CompiledService[] = [];
  let base = 0;
  for (const spec of specs) {
    services.push(compileFlowSpec(spec, model, base));
    base += spec.n;
  }
  const compileMs = now() - t;

  t = now();
  const fullIdoms = services.map((svc) => immediateDominators(svc.full, 0, svc.fullIn));
  const idomMs = now() - t;

  t = now();
  const full: FlowView[] = services.map((svc, s) => ({ out: svc.full, in: svc.fullIn, tree: indexDominatorTree(fullIdoms[s], 0, svc.isCarriage) }));
  const main: FlowView[] = services.map((svc) => mainView(svc));
  const treesMs = now() - t;

  t = now();
  const core = assembleCore(model, specs, services, full, main, { modelMs, flowMs, compileMs: 0, idomMs, treesMs, rebuiltServices: specs.length });
  core.timings.compileMs = compileMs + now() - t;
  return core;
}

/** The main-only view of a compiled service: its graph and dominator tree without reserve feeds (rule 5). */
export function mainView(svc: CompiledService): FlowView {
  return { out: svc.main, in: svc.mainIn, tree: indexDominatorTree(immediateDominators(svc.main, 0, svc.mainIn), 0, svc.isCarriage) };
}

/** The full view of a compiled service: its graph and dominator tree. */
export function fullView(svc: CompiledService): FlowView {
  return { out: svc.full, in: svc.fullIn, tree: indexDominatorTree(immediateDominators(svc.full, 0, svc.fullIn), 0, svc.isCarriage) };
}

/**
 * The network-wide indexes over the compiled services (node -> service,
 * element -> nodes, carriage -> node, fed): shared by a full build and an
 * edit's update (update.ts), which hands in services whose `base` is set.
 */
export function assembleCore(
  model: NetworkModel,
  specs: FlowSpec[],
  services: CompiledService[],
  full: FlowView[],
  main: FlowView[],
  timings: BuildTimings,
): EngineCore {
  const totalNodes = services.reduce((n, svc) => n + svc.n, 0);
  const carriageNode = new Int32Array(model.carriages.length).fill(-1);
  const nodeService = new Int32Array(totalNodes);
  for (const svc of services) {
    nodeService.fill(svc.service, svc.base, svc.base + svc.n);
    for (let u = 0; u < svc.n; u++) if (svc.isCarriage[u]) carriageNode[svc.ref[u]] = u;
  }
  const elementNodeOffsets = new Int32Array(model.elementCount + 1);
  for (const svc of services) for (let i = 0; i < svc.owners.length; i++) elementNodeOffsets[svc.owners[i] + 1]++;
  for (let x = 0; x < model.elementCount; x++) elementNodeOffsets[x + 1] += elementNodeOffsets[x];
  const fill = elementNodeOffsets.slice(0, model.elementCount);
  const elementNodes = new Int32Array(elementNodeOffsets[model.elementCount]);
  for (const svc of services) {
    for (let u = 0; u < svc.n; u++) {
      for (let j = svc.ownerOffsets[u]; j < svc.ownerOffsets[u + 1]; j++) elementNodes[fill[svc.owners[j]]++] = svc.base + u;
    }
  }

  const fed = new Uint8Array(model.carriages.length);
  const mainFed = new Uint8Array(model.carriages.length);
  for (let c = 0; c < model.carriages.length; c++) {
    const s = model.carriageService[c];
    fed[c] = full[s].tree.alive[carriageNode[c]];
    mainFed[c] = main[s].tree.alive[carriageNode[c]];
  }
  let totalEdges = 0;
  for (const svc of services) totalEdges += svc.full.targets.length;
  const maxN = services.reduce((m, svc) => Math.max(m, svc.n), 1);

  return {
    model,
    specs,
    services,
    full,
    main,
    carriageNode,
    fed,
    mainFed,
    elementNodeOffsets,
    elementNodes,
    nodeService,
    totalNodes,
    totalEdges,
    walker: new RemovalWalker(maxN),
    timings,
  };
}

/**
 * The analysis engine: one immutable instance per network version, built from
 * a validated network document. Answers rules 1-9 of docs/domain.md.
 * `build` (or an edit's `update`) computes the graphs, dominator trees and
 * unfed carriages; single points of failure, exposure and diversity are
 * computed on first use and kept; `reach` and `chain` work from the trees.
 */
import type { NetworkDocument } from '@/shared/schemas/network';
import type {
  ChainAnswer,
  DiversityAnswer,
  Element,
  ExposureAnswer,
  ExposureGroupsAnswer,
  ExposureRow,
  PairsAnswer,
  ProposalsAnswer,
  ReachAnswer,
  SpofAnswer,
  UnfedAnswer,
} from '@/shared/schemas/analysis';
import { elementKey } from '@/shared/schemas/analysis';
import { buildCore, type BuildTimings, type EngineCore } from './core';
import { elementId, isCarriageId, KIND_BIT, kindMask, listOf, normaliseCode } from './model';
import { groupExposureSteps } from './exposure-groups';
import { resilienceSteps, type Resilience } from './resilience';
import { avoidableOf, unavoidableByService } from './avoidable';
import { createReachScratch, lostAndFallback, reachAnswer, removedNodesByService, type ReachScratch } from './reach';
import { chainTree, type ChainDirection, type ChainOptions } from './chain';
import { IntList } from './removal-walk';
import { PairsJob, type PairRow } from './pairs';
import { proposalContext, proposalsFor, type ProposalContext, type ProposalRow } from './proposals';
import { BestProposalsJob } from './proposals-ranking';
import { DEFAULT_WEAK_POINT_KINDS, type ElementKind } from '@/shared/schemas/network';
import { UnknownCarriageError, UnknownElementsError } from './errors';
import { toGraphology, type ServiceGraph } from './graphs';
import { IncrementalUpdateError, updateCore, type ChangedCodes } from './update';

export { UnknownElementsError, UnknownCarriageError } from './errors';
export type { ChangedCodes } from './update';

export interface EngineCounts {
  sites: number;
  services: number;
  groups: number;
  carriages: number;
  feeds: number;
  /** nodes and edges of all service graphs together (roots and hop nodes included) */
  nodes: number;
  edges: number;
  unfed: number;
}

export interface EngineTimings extends BuildTimings {
  resilienceMs: number;
  answersMs: number;
  totalMs: number;
}

/** What the engine computes for every carriage and element, on first use. */
interface Diversity {
  /** carriages with a diversity gap -> their avoidable weak points (element ids) */
  gaps: Map<number, number[]>;
  diversityAnswer: DiversityAnswer;
}

/** Each engine's compiled state, for code that times or checks its parts (`engineCore`). */
const cores = new WeakMap<NetworkEngine, EngineCore>();

/**
 * The compiled state behind an engine: for benchmarks and yardsticks that
 * time or cross-check the engine's parts (test/helpers/engine-yardsticks.ts),
 * never for answering requests.
 */
export function engineCore(engine: NetworkEngine): EngineCore {
  const core = cores.get(engine);
  if (!core) throw new TypeError('engineCore needs an engine made by NetworkEngine.build');
  return core;
}

/** A list's `limit`: absent (the whole list) or a whole number >= 1. */
function checkLimit(limit: number | undefined) {
  if (limit !== undefined && (!Number.isInteger(limit) || limit < 1)) throw new RangeError(`limit must be a whole number >= 1 (got ${String(limit)})`);
}

const firstRows = <R>(rows: readonly R[], limit: number | undefined) => (limit === undefined ? (rows as R[]) : rows.slice(0, limit));

function checkVersion(networkVersion: number) {
  if (!Number.isInteger(networkVersion) || networkVersion < 0) {
    throw new RangeError(`networkVersion must be a whole number >= 0 (got ${String(networkVersion)})`);
  }
}

export class NetworkEngine {
  readonly networkVersion: number;
  readonly timings: EngineTimings;
  private readonly core: EngineCore;
  /** carriages that have programme only through a reserve even with nothing failed (rule 5) */
  private readonly staticFallback: Int32Array;
  private readonly scratch: ReachScratch;
  private readonly unfedAnswer: UnfedAnswer;
  private resilienceHeld: Resilience | null = null;
  private diversityHeld: Diversity | null = null;
  /** the weak points and the diversity gaps while they are worked out in slices (`prepare`) */
  private resilienceRun: Generator<void, Resilience, void> | null = null;
  private diversityRun: Generator<void, Diversity, void> | null = null;
  /** per kinds mask (kindMask): single points of failure of every fed carriage, kept once asked */
  private readonly spofAnswers = new Map<number, SpofAnswer>();
  private readonly exposureRows = new Map<number, ExposureRow[]>();
  private readonly exposureGroupRows = new Map<number, ExposureGroupsAnswer['groups']>();
  private readonly spofRuns = new Map<number, Generator<void, SpofAnswer, void>>();
  private readonly exposureRuns = new Map<number, Generator<void, ExposureRow[], void>>();
  /** per kinds mask: the grouped ranking while it is worked out in slices (`prepareExposureGroups`) */
  private readonly exposureGroupRuns = new Map<number, Generator<void, ExposureGroupsAnswer['groups'], void>>();
  /** built by an edit's update rather than from scratch */
  incremental = false;
  private readonly graphology: (ServiceGraph | undefined)[] = [];
  private proposalCtx: ProposalContext | null = null;
  /** the network ranking's first rows, exact; `complete` when it holds every gap carriage's best */
  private bestProposals: { rows: ProposalRow[]; complete: boolean } | null = null;

  private constructor(core: EngineCore, networkVersion: number, started: number) {
    this.core = core;
    this.networkVersion = networkVersion;
    const { model, fed, mainFed } = core;
    const staticFallback = new IntList();
    for (let c = 0; c < model.carriages.length; c++) if (fed[c] && !mainFed[c]) staticFallback.push(c);
    this.staticFallback = staticFallback.toArray();
    this.scratch = createReachScratch(core);
    const unfedRows: UnfedAnswer['carriages'] = [];
    for (let c = 0; c < model.carriages.length; c++) if (!fed[c]) unfedRows.push(this.placed(c));
    this.unfedAnswer = { networkVersion, carriages: unfedRows };
    this.timings = { ...core.timings, resilienceMs: 0, answersMs: 0, totalMs: performance.now() - started };
    cores.set(this, core);
  }

  private placed(c: number) {
    const { model } = this.core;
    return { carriage: model.carriageCodes[c], service: model.serviceCodes[model.carriageService[c]], site: model.siteCodes[model.carriageSite[c]] };
  }

  /**
   * Single points of failure and exposure of every carriage and element, and
   * apart from them the diversity gaps: each computed on first use rather
   * than in `build`, so an edit's update (`NetworkEngine.update`) puts reach
   * and chains on the new network at once and the network-wide answers follow
   * when first asked for; asking for weak points does not pay for diversity.
   */
  private get resilience(): Resilience {
    this.prepare('resilience', Number.POSITIVE_INFINITY);
    return this.resilienceHeld!;
  }

  private get diversityState(): Diversity {
    this.prepare('diversity', Number.POSITIVE_INFINITY);
    return this.diversityHeld!;
  }

  /** True when the weak points (or the diversity gaps, which need them) are held: answers that need them are then instant. */
  holds(what: 'resilience' | 'diversity'): boolean {
    return what === 'resilience' ? this.resilienceHeld !== null : this.diversityHeld !== null;
  }

  /**
   * Works toward the weak points, and for 'diversity' then the diversity
   * gaps, until `deadlineMs` (performance.now()) has passed; true once they
   * are held. A server calls this in slices with a turn of the event loop
   * between them (at 100,000 sites the whole is seconds of work); asking for
   * an answer meanwhile finishes the work at once. The answers do not depend
   * on how the work was sliced.
   */
  prepare(what: 'resilience' | 'diversity', deadlineMs: number): boolean {
    if (!this.resilienceHeld) {
      this.resilienceRun ??= resilienceSteps(this.core);
      const r = this.runUntil(this.resilienceRun, deadlineMs, 'resilienceMs');
      if (!r.done) return false;
      this.resilienceHeld = r.value;
      this.resilienceRun = null;
    }
    if (what === 'resilience' || this.diversityHeld) return true;
    this.diversityRun ??= this.diversitySteps(this.resilienceHeld);
    const r = this.runUntil(this.diversityRun, deadlineMs, 'answersMs');
    if (!r.done) return false;
    this.diversityHeld = r.value;
    this.diversityRun = null;
    return true;
  }

  /** Resumes `run` until it finishes or `deadlineMs` has passed (at least one piece), the time spent counted under `timing`. */
  private runUntil<T>(run: Generator<void, T, void>, deadlineMs: number, timing: 'resilienceMs' | 'answersMs'): IteratorResult<void, T> {
    const t = performance.now();
    let r = run.next();
    while (!r.done && performance.now() < deadlineMs) r = run.next();
    const spent = performance.now() - t;
    this.timings[timing] += spent;
    this.timings.totalMs += spent;
    return r;
  }

  /** The diversity gaps, pausing after every 4,096 carriages (see `prepare`). */
  private *diversitySteps({ spofOffsets, spofElements }: Resilience): Generator<void, Diversity, void> {
    const { core, networkVersion } = this;
    const { model, fed } = core;
    const unavoidable = unavoidableByService(core);
    yield;
    const gaps = new Map<number, number[]>();
    // Diversity and proposals speak of sites, feeds and groups: a parent transmitter that is a weak point comes with its site.
    const diversityRows: DiversityAnswer['carriages'] = [];
    for (let c = 0; c < model.carriages.length; c++) {
      if ((c & 4095) === 4095) yield;
      if (!fed[c]) continue;
      const hasReserve = listOf(model.feedsInto, c).some((f) => model.feedReserve[f] === 1);
      if (!hasReserve || spofOffsets[c] === spofOffsets[c + 1]) continue;
      const spofIds = spofElements.subarray(spofOffsets[c], spofOffsets[c + 1]).filter((x) => !isCarriageId(model, x));
      const avoidable = avoidableOf(unavoidable, model.carriageService[c], spofIds);
      if (avoidable.length === 0) continue;
      gaps.set(c, avoidable);
      diversityRows.push({ ...this.placed(c), spof: Array.from(spofIds, (x) => model.elements[x]), avoidable: avoidable.map((x) => model.elements[x]) });
    }
    return { gaps, diversityAnswer: { networkVersion, carriages: diversityRows } };
  }

  static build(doc: NetworkDocument, networkVersion: number): NetworkEngine {
    checkVersion(networkVersion);
    if (!doc || !Array.isArray(doc.sites) || !Array.isArray(doc.carriages) || !Array.isArray(doc.feeds)) {
      throw new TypeError('build needs a validated network document (sites, services, groups, carriages, feeds)');
    }
    const started = performance.now();
    return new NetworkEngine(buildCore(doc), networkVersion, started);
  }

  /**
   * The engine of `doc`, which is `prev`'s document after an edit that
   * created, changed or deleted the `changed` codes: only the service graphs
   * the edit touches are rebuilt (update.ts). Falls back to a full build when
   * the edit is outside what an update handles; `incremental` says which ran.
   */
  static update(prev: NetworkEngine, doc: NetworkDocument, networkVersion: number, changed: ChangedCodes): NetworkEngine {
    checkVersion(networkVersion);
    const started = performance.now();
    try {
      const engine = new NetworkEngine(updateCore(prev.core, doc, changed), networkVersion, started);
      engine.incremental = true;
      return engine;
    } catch (e) {
      if (!(e instanceof IncrementalUpdateError)) throw e;
      return NetworkEngine.build(doc, networkVersion);
    }
  }

  get counts(): EngineCounts {
    const m = this.core.model;
    return {
      sites: m.sites.length,
      services: m.services.length,
      groups: m.groups.length,
      carriages: m.carriages.length,
      feeds: m.feeds.length,
      nodes: this.core.totalNodes,
      edges: this.core.totalEdges,
      unfed: this.unfedAnswer.carriages.length,
    };
  }

  hasElement(e: Element): boolean {
    return elementId(this.core.model, e.kind, e.code) >= 0;
  }

  hasCarriage(code: string): boolean {
    return this.core.model.carriageIndex.has(normaliseCode(code));
  }

  /**
   * The graphology model of one service, built on first use and kept (read
   * only: the engine answers from its compiled arrays, not from this graph).
   */
  serviceGraph(serviceCode: string): ServiceGraph | undefined {
    const s = this.core.model.serviceIndex.get(normaliseCode(serviceCode));
    if (s === undefined) return undefined;
    this.graphology[s] ??= toGraphology(this.core.specs[s], this.core.model);
    return this.graphology[s];
  }

  private resolve(failed: Element[]): number[] {
    if (!Array.isArray(failed)) throw new TypeError('failed must be an array of { kind, code } elements');
    const ids: number[] = [];
    const unknown = new Map<string, Element>();
    for (const e of failed) {
      const id = e && typeof e.code === 'string' ? elementId(this.core.model, e.kind, e.code) : -1;
      if (id >= 0) ids.push(id);
      else {
        const shown = { kind: e?.kind, code: typeof e?.code === 'string' ? normaliseCode(e.code) : String(e?.code) } as Element;
        unknown.set(elementKey(shown), shown);
      }
    }
    if (unknown.size > 0) throw new UnknownElementsError([...unknown.values()]);
    return ids;
  }

  reach(failed: Element[]): ReachAnswer {
    const ids = this.resolve(failed);
    const { lost, fallback } = lostAndFallback(this.core, this.staticFallback, ids, this.scratch);
    return reachAnswer(this.core, this.networkVersion, lost, fallback);
  }

  /**
   * Carriage codes lost under the failure (rule 4 alone, in code order):
   * no fallback and no answer building, for callers that combine many
   * failure sets (clash detection in server/operations).
   */
  lost(failed: Element[]): string[] {
    const ids = this.resolve(failed);
    const perService = this.scratch.perService;
    const touched = removedNodesByService(this.core, ids, perService);
    const { lostNodes } = this.scratch;
    const out: number[] = [];
    for (const s of touched) {
      lostNodes.clear();
      this.core.walker.lostMarked(this.core.full[s], perService[s].data, perService[s].length, lostNodes);
      const ref = this.core.services[s].ref;
      for (let i = 0; i < lostNodes.length; i++) out.push(ref[lostNodes.data[i]]);
    }
    out.sort((a, b) => a - b);
    return out.map((c) => this.core.model.carriageCodes[c]);
  }

  /**
   * Single points of failure (rule 6) of every fed carriage, in element
   * order, of the given kinds (default sites, feeds and groups; with
   * `carriage`, the parent transmitters too).
   */
  spof(kinds: readonly ElementKind[] = DEFAULT_WEAK_POINT_KINDS): SpofAnswer {
    this.prepareSpof(kinds, Number.POSITIVE_INFINITY);
    return this.spofAnswers.get(kindMask(kinds))!;
  }

  /** True when the weak points of these kinds are held as an answer: `spof` is then instant. */
  holdsSpof(kinds: readonly ElementKind[] | undefined): boolean {
    return this.spofAnswers.has(kindMask(kinds ?? DEFAULT_WEAK_POINT_KINDS));
  }

  /**
   * Works toward `spof(kinds)` (the weak points first, as `prepare`) until
   * `deadlineMs` has passed; true once the answer is held. At 100,000 sites
   * the answer lists some 400,000 carriages.
   */
  prepareSpof(kinds: readonly ElementKind[] | undefined, deadlineMs: number): boolean {
    const mask = kindMask(kinds ?? DEFAULT_WEAK_POINT_KINDS);
    return this.prepareKept(mask, this.spofAnswers, this.spofRuns, (held) => this.spofSteps(mask, held), deadlineMs);
  }

  /**
   * Works toward an answer kept per kinds mask in `kept` (the weak points
   * first), its steps resumed from `runs`, until `deadlineMs`; true once held.
   */
  private prepareKept<T>(mask: number, kept: Map<number, T>, runs: Map<number, Generator<void, T, void>>, steps: (held: Resilience) => Generator<void, T, void>, deadlineMs: number): boolean {
    if (kept.has(mask)) return true;
    if (!this.prepare('resilience', deadlineMs)) return false;
    let run = runs.get(mask);
    if (!run) runs.set(mask, (run = steps(this.resilienceHeld!)));
    const r = this.runUntil(run, deadlineMs, 'answersMs');
    if (!r.done) return false;
    kept.set(mask, r.value);
    runs.delete(mask);
    return true;
  }

  /** The answer of `spof`, pausing after every 4,096 carriages. */
  private *spofSteps(mask: number, { spofOffsets, spofElements }: Resilience): Generator<void, SpofAnswer, void> {
    const { model, fed } = this.core;
    const wanted = (x: number) => (KIND_BIT[model.elements[x].kind] & mask) !== 0;
    const carriages: SpofAnswer['carriages'] = [];
    for (let c = 0; c < model.carriages.length; c++) {
      if (!fed[c]) continue;
      const spof: Element[] = [];
      for (let i = spofOffsets[c]; i < spofOffsets[c + 1]; i++) if (wanted(spofElements[i])) spof.push(model.elements[spofElements[i]]);
      carriages.push({ carriage: model.carriageCodes[c], spof });
      if ((c & 4095) === 4095) yield;
    }
    return { networkVersion: this.networkVersion, carriages };
  }

  /** Exposure (rule 7) of every element of the given kinds (default sites, feeds and groups), highest households first. */
  exposure(limit?: number, kinds: readonly ElementKind[] = DEFAULT_WEAK_POINT_KINDS): ExposureAnswer {
    checkLimit(limit);
    const mask = kindMask(kinds);
    const { exposureHouseholds, exposureCarriages, ranked } = this.resilience;
    const { elements } = this.core.model;
    const row = (x: number) => ({ element: elements[x], households: exposureHouseholds[x], carriages: exposureCarriages[x] });
    let rows = this.exposureRows.get(mask);
    if (!rows && limit !== undefined) {
      // The first rows alone: the whole ranking is half a million rows at 100,000 sites, and screens ask for a hundred.
      const first: ExposureRow[] = [];
      for (let i = 0; i < ranked.length && first.length < limit; i++) if ((KIND_BIT[elements[ranked[i]].kind] & mask) !== 0) first.push(row(ranked[i]));
      return { networkVersion: this.networkVersion, elements: first };
    }
    if (!rows) {
      this.prepareExposure(kinds, Number.POSITIVE_INFINITY);
      rows = this.exposureRows.get(mask)!;
    }
    return { networkVersion: this.networkVersion, elements: firstRows(rows, limit) };
  }

  /** True when the whole exposure ranking of these kinds is held: `exposure` is then instant. */
  holdsExposure(kinds: readonly ElementKind[] | undefined): boolean {
    return this.exposureRows.has(kindMask(kinds ?? DEFAULT_WEAK_POINT_KINDS));
  }

  /** Works toward the whole exposure ranking of these kinds (half a million rows at 100,000 sites) until `deadlineMs`; true once held. */
  prepareExposure(kinds: readonly ElementKind[] | undefined, deadlineMs: number): boolean {
    const mask = kindMask(kinds ?? DEFAULT_WEAK_POINT_KINDS);
    return this.prepareKept(mask, this.exposureRows, this.exposureRuns, (held) => this.exposureSteps(mask, held), deadlineMs);
  }

  private *exposureSteps(mask: number, { exposureHouseholds, exposureCarriages, ranked }: Resilience): Generator<void, ExposureRow[], void> {
    const { elements } = this.core.model;
    const rows: ExposureRow[] = [];
    for (let i = 0; i < ranked.length; i++) {
      const x = ranked[i];
      if ((KIND_BIT[elements[x].kind] & mask) !== 0) rows.push({ element: elements[x], households: exposureHouseholds[x], carriages: exposureCarriages[x] });
      if ((i & 4095) === 4095) yield;
    }
    return rows;
  }

  private *exposureGroupSteps(mask: number, { exposureHouseholds, exposureCarriages, ranked }: Resilience): Generator<void, ExposureGroupsAnswer['groups'], void> {
    // the ranking filtered to the kinds asked for: a million elements at 100,000 sites, so in steps too
    const { elements } = this.core.model;
    const wanted: number[] = [];
    for (let i = 0; i < ranked.length; i++) {
      if ((KIND_BIT[elements[ranked[i]].kind] & mask) !== 0) wanted.push(ranked[i]);
      if ((i & 4095) === 4095) yield;
    }
    return yield* groupExposureSteps(this.core, wanted, exposureHouseholds, exposureCarriages);
  }

  /**
   * The exposure ranking with elements that take off exactly the same
   * carriages in one row (exposure-groups.ts), highest households first.
   */
  exposureGroups(limit?: number, kinds: readonly ElementKind[] = DEFAULT_WEAK_POINT_KINDS): ExposureGroupsAnswer {
    checkLimit(limit);
    this.prepareExposureGroups(kinds, Number.POSITIVE_INFINITY);
    return { networkVersion: this.networkVersion, groups: firstRows(this.exposureGroupRows.get(kindMask(kinds))!, limit) };
  }

  /** True when the grouped exposure ranking of these kinds is held: `exposureGroups` is then instant. */
  holdsExposureGroups(kinds: readonly ElementKind[] | undefined): boolean {
    return this.exposureGroupRows.has(kindMask(kinds ?? DEFAULT_WEAK_POINT_KINDS));
  }

  /**
   * Works toward the grouped exposure ranking of these kinds (the weak points
   * first, as `prepare`), until `deadlineMs` has passed; true once it is held.
   * Grouping walks the loss of every element that shares its figures with
   * another: most of a second at 20,000 sites, so a server runs it in slices.
   */
  prepareExposureGroups(kinds: readonly ElementKind[] | undefined, deadlineMs: number): boolean {
    const mask = kindMask(kinds ?? DEFAULT_WEAK_POINT_KINDS);
    return this.prepareKept(mask, this.exposureGroupRows, this.exposureGroupRuns, (held) => this.exposureGroupSteps(mask, held), deadlineMs);
  }

  diversity(): DiversityAnswer {
    return this.diversityState.diversityAnswer;
  }

  unfed(): UnfedAnswer {
    return this.unfedAnswer;
  }

  /**
   * New reserve feeds that close diversity gaps (proposals.ts). With a
   * carriage: all its proposals, best first (none when it has no gap). Without:
   * each gap carriage's best proposal, ranked over the network.
   */
  proposals(opts: { carriage?: string; limit?: number } = {}): ProposalsAnswer {
    const { limit } = opts;
    checkLimit(limit);
    this.proposalCtx ??= proposalContext(this.core);
    let rows: ProposalRow[];
    if (opts.carriage !== undefined) {
      const c = this.core.model.carriageIndex.get(normaliseCode(opts.carriage));
      if (c === undefined) throw new UnknownCarriageError(normaliseCode(opts.carriage));
      const avoidable = this.diversityState.gaps.get(c);
      rows = avoidable ? proposalsFor(this.proposalCtx, c, avoidable) : [];
    } else {
      if (!this.holdsProposals(limit)) this.proposalsJob(limit).step(Number.POSITIVE_INFINITY);
      rows = this.bestProposals!.rows;
    }
    return { networkVersion: this.networkVersion, proposals: firstRows(rows, limit) };
  }

  /** True when `proposals({ limit })` over the network answers from the ranking already held (no work). */
  holdsProposals(limit?: number): boolean {
    const held = this.bestProposals;
    return held !== null && (held.complete || (limit !== undefined && held.rows.length >= limit));
  }

  /**
   * The network ranking of proposals as a job that works in steps
   * (proposals-ranking.ts), so a server can yield between them; once it
   * finishes, the engine keeps its rows and `proposals({ limit })` answers
   * from them. The first call on an engine also works out the diversity
   * gaps (one piece, shared with `diversity()`).
   */
  proposalsJob(limit?: number): BestProposalsJob {
    checkLimit(limit);
    this.proposalCtx ??= proposalContext(this.core);
    return new BestProposalsJob(this.proposalCtx, this.diversityState.gaps, limit, (ranked) => {
      if (!this.holdsProposals(limit)) this.bestProposals = { rows: ranked, complete: limit === undefined || ranked.length < limit };
    });
  }

  /**
   * Critical pairs (rule 10) as a job that works in steps (pairs.ts), so a
   * server can yield between them; `pairsAnswer` turns its rows into the answer.
   */
  pairsJob(kinds: readonly ElementKind[] = ['site', 'group']): PairsJob {
    kindMask(kinds);
    return new PairsJob(this.core, kinds);
  }

  pairsAnswer(rows: readonly PairRow[], limit?: number): PairsAnswer {
    checkLimit(limit);
    const { model } = this.core;
    return {
      networkVersion: this.networkVersion,
      pairs: firstRows(rows, limit).map((r) => ({
        elements: [model.elements[r.a], model.elements[r.b]],
        jointLost: Array.from(r.jointLost, (c) => model.carriageCodes[c]),
        households: r.households,
      })),
    };
  }

  /** Critical pairs computed in one go (tests, benchmark, small networks). */
  pairs(opts: { kinds?: readonly ElementKind[]; limit?: number } = {}): PairsAnswer {
    checkLimit(opts.limit);
    const job = this.pairsJob(opts.kinds);
    job.step(Number.POSITIVE_INFINITY);
    return this.pairsAnswer(job.result(), opts.limit);
  }

  chain(carriageCode: string, direction: ChainDirection, opts?: ChainOptions): ChainAnswer {
    if (direction !== 'up' && direction !== 'down') throw new RangeError(`direction is up or down (got ${String(direction)})`);
    const c = this.core.model.carriageIndex.get(normaliseCode(carriageCode));
    if (c === undefined) throw new UnknownCarriageError(normaliseCode(carriageCode));
    return chainTree(this.core, this.networkVersion, c, direction, opts);
  }

  /** Every element of the network (carriages included), in compareElements order. */
  elements(): readonly Element[] {
    return this.core.model.elements;
  }
}

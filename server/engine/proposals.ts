/**
 * Proposals: the new reserve feed that closes a diversity gap (rule 9,
 * revised). For a carriage c with avoidable weak points W, a candidate is any
 * other fed carriage p of the same service; the new feed p -> c has no
 * via-sites and no groups.
 *
 * What a candidate removes, exactly (rules 1-9 with the feed added): the new
 * feed adds only paths that end at c, so c's single points of failure can
 * only shrink, and x ∈ W stops being one iff p has programme under {x}. (If p
 * keeps programme under {x} through a path that passes c, c would keep it
 * too, and x would not be a single point of failure of c.) So removes(p) =
 * { x ∈ W : p keeps programme under x }: a source that depends on the weak
 * point removes nothing and is never offered; an unavoidable weak point holds
 * every origin, so nothing removes it; nor does anything remove a group that
 * holds c's own site (c is down under it whatever feeds it).
 *
 * Households protected: under {x} with the feed added, the carriages that
 * come back are those reachable from c in G − X, among those lost under x.
 * A walk from c through the nodes lost under x finds them, once per weak
 * point (not per candidate). The households of their sites, over the
 * removed weak points, are protected.
 *
 * Off-air candidates are screened by the feed checks themselves
 * (server/checks/feedChecks.ts: P.525 / P.1546 free-space field strength, k =
 * 4/3 radio horizon, planning minimum, co-channel receive) on the feed as it
 * would be recorded; only candidates passing horizon, field strength and
 * channel are offered. A satellite or line feed from an origin carriage is
 * always possible; it ranks after off-air candidates of equal effect (no new
 * receiver on the mast is the cheaper change, as common practice: a rule of
 * thumb, not a costing).
 */
import type { Feed, Medium } from '@/shared/schemas/network';

import { computeFeedChecks } from '../checks/feedChecks';
import { receiveFrequency } from '../checks/checkInputs';
import { FIELD_CONSTANT_ERP_DB, pathHorizonKm } from '@/shared/rf/propagation';
import { offAirFeedMinimum } from '@/shared/rf/minimums';
import type { EngineCore } from './core';
import { CandidateGrid, distanceLowerBoundKm } from './candidate-grid';
import type { Proposal } from '@/shared/schemas/analysis';

/** One proposal, in the shape the API answers (shared/schemas/analysis.ts). */
export type ProposalRow = Proposal;

/** Height above sea level of a carriage's antenna (ground + antenna, else mast), or null when not recorded. */
export function heightAsl(core: EngineCore, c: number): number | null {
  const site = core.model.sites[core.model.carriageSite[c]];
  const above = core.model.carriages[c].antennaHeightM ?? site.mastHeightM;
  return site.groundHeightM === undefined || above === undefined ? null : site.groundHeightM + above;
}

export interface WeakPoint {
  x: number;
  /** true for local nodes of the service that keep programme under {x} */
  alive: (v: number) => boolean;
  /** site ids that come back when c is fed around x */
  sites: Int32Array;
}

/**
 * The weak-point side of one carriage: for each avoidable weak point, who
 * keeps programme under it and which sites come back when c does.
 */
export function weakPoints(core: EngineCore, c: number, avoidable: readonly number[]): WeakPoint[] {
  const { model, services, full, carriageNode } = core;
  const s = model.carriageService[c];
  const svc = services[s];
  const view = full[s];
  const { tin, tout, alive: fed } = view.tree;
  const cn = carriageNode[c];
  return avoidable.map((x) => {
    const nodes: number[] = [];
    for (let k = core.elementNodeOffsets[x]; k < core.elementNodeOffsets[x + 1]; k++) {
      const g = core.elementNodes[k];
      if (core.nodeService[g] === s && fed[g - svc.base]) nodes.push(g - svc.base);
    }
    let alive: (v: number) => boolean;
    if (nodes.includes(cn)) {
      // A group holding c's own site: c is down under it whatever feeds it, so no feed removes it.
      return { x, alive: () => false, sites: new Int32Array(0) };
    } else if (nodes.length === 1) {
      const u = nodes[0];
      alive = (v) => fed[v] === 1 && !(tin[u] <= tin[v] && tin[v] < tout[u]);
    } else {
      // Several nodes: a plain walk from the root with them removed.
      const removed = new Uint8Array(svc.n);
      for (const u of nodes) removed[u] = 1;
      const seen = new Uint8Array(svc.n);
      const queue = new Int32Array(svc.n);
      let qn = 0;
      seen[0] = 1;
      queue[qn++] = 0;
      for (let head = 0; head < qn; head++) {
        const u = queue[head];
        for (let e = view.out.offsets[u]; e < view.out.offsets[u + 1]; e++) {
          const v = view.out.targets[e];
          if (!seen[v] && !removed[v]) {
            seen[v] = 1;
            queue[qn++] = v;
          }
        }
      }
      alive = (v) => seen[v] === 1;
    }
    // Back on air with c fed around x: forward from c through nodes lost under x (never through x's own nodes).
    const own = new Set(nodes);
    const visited = new Set<number>([cn]);
    const stack = [cn];
    const sites = new Set<number>();
    while (stack.length > 0) {
      const u = stack.pop()!;
      if (svc.isCarriage[u]) sites.add(model.carriageSite[svc.ref[u]]);
      for (let e = view.out.offsets[u]; e < view.out.offsets[u + 1]; e++) {
        const v = view.out.targets[e];
        if (!visited.has(v) && !own.has(v) && fed[v] && !alive(v)) {
          visited.add(v);
          stack.push(v);
        }
      }
    }
    return { x, alive, sites: Int32Array.from(sites).sort() };
  });
}

export interface CandidateEffect {
  p: number;
  removes: number[];
  households: number;
}

/** Origin carriages of c's service (their nodes hang directly under the root). */
export function originsOf(core: EngineCore, s: number): Set<number> {
  const view = core.full[s];
  const origins = new Set<number>();
  for (let e = view.out.offsets[0]; e < view.out.offsets[1]; e++) origins.add(core.services[s].ref[view.out.targets[e]]);
  return origins;
}

/**
 * The candidates among `nodes` (local carriage nodes of c's service) that
 * remove at least one weak point, with their effect (no screening yet).
 */
export function candidateEffects(core: EngineCore, c: number, weak: readonly WeakPoint[], nodes: Iterable<number>): CandidateEffect[] {
  const { model, services, full, carriageNode } = core;
  const s = model.carriageService[c];
  const svc = services[s];
  const fed = full[s].tree.alive;
  const effects: CandidateEffect[] = [];
  // Households depend only on which weak points a candidate removes: one sum per distinct set.
  const householdsOf = new Map<string, number>();
  const ownSite = model.carriageSite[c];
  for (const u of nodes) {
    if (!svc.isCarriage[u] || !fed[u] || u === carriageNode[c]) continue;
    const p = svc.ref[u];
    if (model.carriageSite[p] === ownSite) continue;
    const removes: number[] = [];
    let key = '';
    for (let i = 0; i < weak.length; i++) {
      if (weak[i].alive(u)) {
        removes.push(weak[i].x);
        key += `${i},`;
      }
    }
    if (removes.length === 0) continue;
    let households = householdsOf.get(key);
    if (households === undefined) {
      households = householdsOfWeak(core, weak.filter((w) => removes.includes(w.x)));
      householdsOf.set(key, households);
    }
    effects.push({ p, removes, households });
  }
  return effects;
}

/** Households of the sites that come back when every weak point in `weak` is removed. */
export function householdsOfWeak(core: EngineCore, weak: readonly WeakPoint[]): number {
  const counted = new Set<number>();
  let households = 0;
  for (const w of weak) {
    for (const site of w.sites) {
      if (!counted.has(site)) {
        counted.add(site);
        households += core.model.siteHouseholds[site];
      }
    }
  }
  return households;
}

/** The feed checks of the new feed p -> c as it would be recorded. */
export function screenFeed(core: EngineCore, p: number, c: number, medium: Medium) {
  const { model } = core;
  const source = model.carriages[p];
  const target = model.carriages[c];
  const feed: Feed = { code: `new-${model.carriageCodes[p]}`, from: source.code, to: target.code, medium, role: 'reserve' };
  return computeFeedChecks({
    feed,
    source,
    target,
    sourceSite: model.sites[model.carriageSite[p]],
    targetSite: model.sites[model.carriageSite[c]],
    serviceKind: model.services[model.carriageService[c]].kind,
  });
}

export interface ProposalContext {
  core: EngineCore;
  /** the tallest antenna above sea level in the network, m, for the distance pre-filter */
  maxHeightAsl: number;
  /** per carriage: the farthest distance at which its field strength could still pass, km (-1: never; NaN: not yet known) */
  fieldRadiusKm: Float64Array;
  /** per service, built on first use: its fed carriages by position, and the largest field radius among them */
  grids: ({ grid: CandidateGrid; maxFieldRadiusKm: number } | undefined)[];
  /** by service kind and receive frequency: the field radius per sqrt(W) of e.r.p. (null: no planning minimum to pass) */
  radiusFactor: Map<string, number | null>;
}

export function proposalContext(core: EngineCore): ProposalContext {
  let max = 0;
  for (let c = 0; c < core.model.carriages.length; c++) max = Math.max(max, heightAsl(core, c) ?? 0);
  return { core, maxHeightAsl: max, fieldRadiusKm: new Float64Array(core.model.carriages.length).fill(Number.NaN), grids: [], radiusFactor: new Map() };
}

/**
 * The field-strength check passes when round(E(d), 2) >= limit, with E(d) =
 * e.r.p. (dBW) - 20 log d + 76.9 falling with distance (feedChecks.ts, the
 * same reads of the source): beyond this radius it cannot. 0.02 dB of slack
 * covers the rounding to 0.01 dB and floating point.
 */
function fieldRadiusKm(ctx: ProposalContext, p: number): number {
  const known = ctx.fieldRadiusKm[p];
  if (!Number.isNaN(known)) return known;
  const { model } = ctx.core;
  const source = model.carriages[p];
  const kind = model.services[model.carriageService[p]].kind;
  let radius = -1;
  if (source.erpW !== undefined && source.erpW > 0) {
    // The new feed records no receive frequency, so it is the source's: its frequencyMHz when recorded, else its channel.
    let mhz: number | null;
    if (source.frequencyMHz !== undefined) mhz = source.frequencyMHz;
    else {
      const feed: Feed = { code: 'new', from: source.code, to: source.code, medium: 'off-air', role: 'reserve' };
      const rx = receiveFrequency(feed, source, kind);
      mhz = rx.ok ? rx.value.mhz : null;
    }
    // 10^((e.r.p. dBW + 76.9 - minimum + 0.02) / 20) = sqrt(e.r.p. W) x a factor per planning minimum.
    const key = `${kind} ${mhz}`;
    let factor = ctx.radiusFactor.get(key);
    if (factor === undefined) {
      const min = offAirFeedMinimum(kind, mhz);
      factor = min.ok ? 10 ** ((FIELD_CONSTANT_ERP_DB - min.minimum.valueDbUvPerM + 0.02) / 20) : null;
      ctx.radiusFactor.set(key, factor);
    }
    if (factor !== null) radius = Math.sqrt(source.erpW) * factor;
  }
  ctx.fieldRadiusKm[p] = radius;
  return radius;
}

/** The candidate grid of service s, built on first use. */
export function gridOf(ctx: ProposalContext, s: number) {
  let entry = ctx.grids[s];
  if (!entry) {
    const { core } = ctx;
    const svc = core.services[s];
    const fed = core.full[s].tree.alive;
    const nodes: number[] = [];
    let maxFieldRadius = -1;
    for (let u = 1; u < svc.n; u++) {
      if (!svc.isCarriage[u] || !fed[u]) continue;
      nodes.push(u);
      maxFieldRadius = Math.max(maxFieldRadius, fieldRadiusKm(ctx, svc.ref[u]));
    }
    entry = { grid: new CandidateGrid(core, s, nodes), maxFieldRadiusKm: maxFieldRadius };
    ctx.grids[s] = entry;
  }
  return entry;
}

const MEDIUM_RANK = (m: Medium) => (m === 'off-air' ? 0 : 1);

export function compareProposals(a: ProposalRow, b: ProposalRow): number {
  const margin = (r: ProposalRow) => (r.fieldStrengthDbuvm !== null && r.minimumDbuvm !== null ? r.fieldStrengthDbuvm - r.minimumDbuvm : Number.NEGATIVE_INFINITY);
  return (
    b.householdsProtected - a.householdsProtected ||
    b.removes.length - a.removes.length ||
    MEDIUM_RANK(a.medium) - MEDIUM_RANK(b.medium) ||
    margin(b) - margin(a) ||
    a.distanceKm - b.distanceKm ||
    (a.from < b.from ? -1 : a.from > b.from ? 1 : 0)
  );
}

/**
 * Screens candidates tier by tier of effect (households, then weak points
 * removed), best first. `mayReach(p)`: false when an off-air feed from p
 * cannot pass (a cheap exact bound; the full checks decide the rest). With
 * `bestOnly`, stops at the first tier that yields a proposal.
 */
export function rankCandidates(
  core: EngineCore,
  c: number,
  effects: CandidateEffect[],
  origins: ReadonlySet<number>,
  mayReach: (p: number) => boolean,
  bestOnly: boolean,
): ProposalRow[] {
  const { model } = core;
  effects.sort((a, b) => b.households - a.households || b.removes.length - a.removes.length || a.p - b.p);
  const hc = heightAsl(core, c);
  const row = (e: CandidateEffect, medium: Medium): ProposalRow | null => {
    const checks = screenFeed(core, e.p, c, medium);
    let field: number | null = null;
    let minimum: number | null = null;
    if (medium === 'off-air') {
      const by = (name: string) => checks.checks.find((k) => k.name === name)!;
      const fs = by('field-strength');
      if (by('horizon').ok !== true || fs.ok !== true || by('channel-clash').ok === false) return null;
      field = fs.value;
      minimum = fs.limit ?? null;
    }
    return {
      carriage: model.carriageCodes[c],
      from: model.carriageCodes[e.p],
      medium,
      removes: e.removes.map((x) => model.elements[x]),
      householdsProtected: e.households,
      distanceKm: checks.distanceKm,
      bearingDeg: checks.bearingDeg,
      fieldStrengthDbuvm: field,
      minimumDbuvm: minimum,
      warnings: checks.warnings,
    };
  };
  const rows: ProposalRow[] = [];
  let i = 0;
  while (i < effects.length) {
    let j = i;
    while (j < effects.length && effects[j].households === effects[i].households && effects[j].removes.length === effects[i].removes.length) j++;
    const tier: ProposalRow[] = [];
    for (let k = i; k < j; k++) {
      const e = effects[k];
      // The horizon check's own formula on a distance that never exceeds the true one: only paths that cannot pass are skipped.
      const hp = hc === null ? null : heightAsl(core, e.p);
      if (hc !== null && hp !== null && mayReach(e.p) && distanceLowerBoundKm(core, model.carriageSite[e.p], model.carriageSite[c]) <= pathHorizonKm(hp, hc)) {
        const r = row(e, 'off-air');
        if (r) tier.push(r);
      }
      if (origins.has(e.p)) tier.push(row(e, 'satellite')!);
    }
    tier.sort(compareProposals);
    if (bestOnly && tier.length > 0) return [tier[0]];
    rows.push(...tier);
    i = j;
  }
  return rows;
}

/**
 * Proposals for carriage c, best first. Only sources that could pass the
 * off-air screening (the grid within the horizon and field-strength radii)
 * and origins (satellite or line) are looked at; the answer is the same as
 * screening every carriage of the service (test/unit/engine/proposals-fast.test.ts).
 * With `bestOnly`, only the best.
 */
export function proposalsFor(ctx: ProposalContext, c: number, avoidable: readonly number[], bestOnly = false, weak?: WeakPoint[]): ProposalRow[] {
  const { core } = ctx;
  const { model } = core;
  const s = model.carriageService[c];
  weak ??= weakPoints(core, c, avoidable);
  const origins = originsOf(core, s);
  const { grid, maxFieldRadiusKm } = gridOf(ctx, s);
  const hc = heightAsl(core, c);
  const site = model.carriageSite[c];
  // No off-air source can be farther than the horizon of the tallest antenna or the largest field radius.
  const radius = hc === null ? -1 : Math.min(pathHorizonKm(ctx.maxHeightAsl, Math.max(0, hc)), maxFieldRadiusKm);
  const near = grid.near(site, radius);
  const nodes = new Set(near);
  for (const p of origins) nodes.add(core.carriageNode[p]);
  const effects = candidateEffects(core, c, weak, nodes);
  const mayReach = (p: number) => distanceLowerBoundKm(core, model.carriageSite[p], site) <= fieldRadiusKm(ctx, p);
  return rankCandidates(core, c, effects, origins, mayReach, bestOnly);
}

/**
 * The schematic view's tree for one service: each carriage hangs under the
 * source of its main feed, from the origins down. Origins and main stations
 * are the branches; the relays below a branch (down to the next main
 * station) are folded into it as a count and listed as its leaves when the
 * branch is opened. Laid out over a d3-hierarchy tree, one row per node in
 * pre-order, indented by depth: a phone scrolls it like a long list, and
 * each origin heads its own tree.
 */
import { hierarchy, type HierarchyNode } from 'd3-hierarchy';
import type { SiteRole } from '@/shared/schemas/network';
import type { NetworkDrawing } from '@/src/api/schemas';
import type { SiteStatus } from './diagramModel';

export interface SchematicNode {
  carriage: string;
  site: string;
  siteName: string;
  role: SiteRole;
  /** Relay carriages folded under this branch (their nearest origin or main station ancestor is this one). */
  relays: string[];
  children: SchematicNode[];
  /** Set on relay leaves shown because their branch is open. */
  leaf?: boolean;
}

export interface SchematicTree {
  service: string;
  roots: SchematicNode[];
  /** Carriage -> its site code, site name and role (for leaves and the overlay). */
  carriageSite: Map<string, { site: string; name: string; role: SiteRole }>;
  /** Carriages of the service with no main feed in and no origin: shown as roots, said to be unfed. */
  unfedRoots: number;
  carriages: number;
}

/**
 * What the schematic reads: the drawing's rows (shared/schemas/drawing.ts
 * expandDrawing, feeds in code order and without their codes) or a network
 * document's (a feed's code, when given, orders the feeds instead).
 */
export interface SchematicSource {
  sites: readonly Pick<NetworkDrawing['sites'][number], 'code' | 'name' | 'role'>[];
  carriages: readonly Pick<NetworkDrawing['carriages'][number], 'code' | 'site' | 'service'>[];
  feeds: readonly (Pick<NetworkDrawing['feeds'][number], 'from' | 'to' | 'role'> & { code?: string })[];
}

const byFeedCode = (a: { code?: string }, b: { code?: string }) => (a.code === undefined || b.code === undefined ? 0 : a.code < b.code ? -1 : a.code > b.code ? 1 : 0);

export function buildSchematic(doc: SchematicSource, service: string): SchematicTree {
  const sites = new Map(doc.sites.map((s) => [s.code, s]));
  const carriageSite = new Map<string, { site: string; name: string; role: SiteRole }>();
  for (const c of doc.carriages) {
    if (c.service !== service) continue;
    const s = sites.get(c.site);
    carriageSite.set(c.code, { site: c.site, name: s?.name ?? c.site, role: s?.role ?? 'relay' });
  }
  // Parent: the source of the carriage's main feed (the first by feed code when a carriage has several).
  const parent = new Map<string, string>();
  const mainFeeds = doc.feeds.filter((f) => f.role === 'main' && carriageSite.has(f.from) && carriageSite.has(f.to) && f.from !== f.to).sort(byFeedCode);
  for (const f of mainFeeds) if (!parent.has(f.to)) parent.set(f.to, f.from);
  // A loop of main feeds has no root: cut it at its first carriage by code so every carriage is drawn once.
  const kids = new Map<string, string[]>();
  const codes = [...carriageSite.keys()].sort();
  const state = new Map<string, 1 | 2>();
  for (const start of codes) {
    const path: string[] = [];
    let c: string | undefined = start;
    while (c !== undefined && !state.has(c)) {
      state.set(c, 1);
      path.push(c);
      c = parent.get(c);
    }
    if (c !== undefined && state.get(c) === 1) parent.delete(c); // closes a loop: c becomes a root
    for (const p of path) state.set(p, 2);
  }
  for (const [child, p] of parent) {
    const list = kids.get(p);
    if (list) list.push(child);
    else kids.set(p, [child]);
  }
  const isBranch = (c: string) => carriageSite.get(c)!.role !== 'relay';
  const make = (c: string): SchematicNode => {
    const info = carriageSite.get(c)!;
    return { carriage: c, site: info.site, siteName: info.name, role: info.role, relays: [], children: [] };
  };
  // Walk down from each root without recursion (chains can be thousands deep).
  const roots: SchematicNode[] = [];
  let unfedRoots = 0;
  for (const c of codes) {
    if (parent.has(c)) continue;
    // A relay root (unfed, or cut from a loop) is still drawn, as a branch of its own.
    const root = make(c);
    if (carriageSite.get(c)!.role !== 'origin') unfedRoots++;
    roots.push(root);
    const stack: Array<[string, SchematicNode]> = [[c, root]];
    while (stack.length > 0) {
      const [code, branch] = stack.pop()!;
      for (const k of (kids.get(code) ?? []).sort()) {
        if (isBranch(k)) {
          const node = make(k);
          branch.children.push(node);
          stack.push([k, node]);
        } else {
          branch.relays.push(k);
          stack.push([k, branch]);
        }
      }
    }
  }
  const order = (n: SchematicNode) => {
    n.children.sort((a, b) => (a.carriage < b.carriage ? -1 : 1));
    n.relays.sort();
  };
  const walk: SchematicNode[] = [...roots];
  while (walk.length > 0) {
    const n = walk.pop()!;
    order(n);
    walk.push(...n.children);
  }
  roots.sort((a, b) => (a.role === b.role ? (a.carriage < b.carriage ? -1 : 1) : a.role === 'origin' ? -1 : 1));
  return { service, roots, carriageSite, unfedRoots, carriages: carriageSite.size };
}

export const ROW_PX = 48;
/** Indent per level of the tree, px. */
export const INDENT_PX = 28;
/** Room kept for a row's name and count beside its mark, px. */
export const ROW_TEXT_PX = 250;

export interface LaidOut {
  nodes: HierarchyNode<SchematicNode>[];
  /** Per node (same order): x across by depth, y down by row. */
  x: number[];
  y: number[];
  width: number;
  height: number;
}

/**
 * Rows for the tree with the `open` branches showing their relays as leaves:
 * one row per node in d3-hierarchy's pre-order (eachBefore), indented by
 * depth, so each origin heads its tree at the top and a branch's relays
 * follow it, the way a long list reads on a phone.
 */
export function layoutSchematic(t: SchematicTree, open: ReadonlySet<string>): LaidOut {
  const top: SchematicNode = { carriage: '', site: '', siteName: '', role: 'origin', relays: [], children: t.roots };
  const root = hierarchy(top, (n) => {
    if (!open.has(n.carriage) || n.relays.length === 0) return n.children;
    const leaves = n.relays.map((r): SchematicNode => {
      const info = t.carriageSite.get(r)!;
      return { carriage: r, site: info.site, siteName: info.name, role: info.role, relays: [], children: [], leaf: true };
    });
    // Its relays right beneath the branch that was opened, before the main stations it feeds.
    return [...leaves, ...n.children];
  });
  const nodes: HierarchyNode<SchematicNode>[] = [];
  const x: number[] = [];
  const y: number[] = [];
  let maxDepth = 0;
  root.eachBefore((n) => {
    if (n.depth === 0) return;
    x.push((n.depth - 1) * INDENT_PX);
    y.push(nodes.length * ROW_PX);
    nodes.push(n);
    maxDepth = Math.max(maxDepth, n.depth);
  });
  return { nodes, x, y, width: Math.max(0, maxDepth - 1) * INDENT_PX + ROW_TEXT_PX, height: nodes.length * ROW_PX };
}

/** The failure overlay for a branch: its own state and how many of its folded relays are off air or on reserve. */
export function branchMarks(n: SchematicNode, t: SchematicTree, statuses: ReadonlyMap<string, SiteStatus>) {
  let off = 0;
  let reserve = 0;
  for (const r of n.relays) {
    const st = statuses.get(t.carriageSite.get(r)!.site);
    if (st === 'off-air') off++;
    else if (st === 'on-reserve') reserve++;
  }
  return { self: statuses.get(n.site), off, reserve };
}

/**
 * A carriage's chain (GET /api/carriages/:code/chain) as something to draw
 * and to read: stable ids for nodes (a carriage may appear more than once,
 * say through its main and its reserve feed), subtrees folded away on
 * request, a tidy-tree layout (d3-hierarchy's Reingold-Tilford variant,
 * Buchheim et al. 2002) turned on its side so depth runs left to right, and
 * a flat list in reading order for screen readers and narrow screens.
 */
import { hierarchy, tree } from 'd3-hierarchy';
import { countOf } from '@/shared/format';
import type { ChainNode, ChainRow } from '@/shared/schemas/analysis';

/** A node's id is its path of child indices from the root: "0", "0.1", "0.1.0". */
export const ROOT_ID = '0';
const childId = (parent: string, i: number) => `${parent}.${i}`;

export interface ChainItem {
  id: string;
  node: ChainNode;
  depth: number;
  /** Children in the answer (before folding). */
  childCount: number;
  /** Nodes hidden under this one because it is folded. */
  hiddenCount: number;
  folded: boolean;
}

function countBelow(node: ChainNode): number {
  let n = 0;
  for (const c of node.children) n += 1 + countBelow(c);
  return n;
}

/** Every node in reading order (depth first, children in answer order), skipping what folded nodes hide. */
export function flattenChain(root: ChainNode, folded: ReadonlySet<string>): ChainItem[] {
  const out: ChainItem[] = [];
  const walk = (node: ChainNode, id: string, depth: number) => {
    const isFolded = folded.has(id) && node.children.length > 0;
    out.push({ id, node, depth, childCount: node.children.length, hiddenCount: isFolded ? countBelow(node) : 0, folded: isFolded });
    if (isFolded) return;
    node.children.forEach((c, i) => walk(c, childId(id, i), depth + 1));
  };
  walk(root, ROOT_ID, 0);
  return out;
}

/** Adds or removes one id from the folded set (a new set: React state stays immutable). */
export function toggleFold(folded: ReadonlySet<string>, id: string): Set<string> {
  const next = new Set(folded);
  if (next.has(id)) next.delete(id);
  else next.add(id);
  return next;
}

/**
 * Folds a big tree so about `maxVisible` nodes show at first: whole levels
 * open while they fit, and the nodes of the first level that would overflow
 * are folded. The root is always open.
 */
export function initialFolds(root: ChainNode, maxVisible = 60): Set<string> {
  const folded = new Set<string>();
  let level: { node: ChainNode; id: string }[] = [{ node: root, id: ROOT_ID }];
  let shown = 1;
  let depth = 0;
  while (level.length > 0) {
    const next = level.flatMap(({ node, id }) => node.children.map((c, i) => ({ node: c, id: childId(id, i) })));
    if (next.length === 0) break;
    if (depth > 0 && shown + next.length > maxVisible) {
      for (const { node, id } of level) if (node.children.length > 0) folded.add(id);
      break;
    }
    shown += next.length;
    level = next;
    depth++;
  }
  return folded;
}

export interface PlacedNode {
  item: ChainItem;
  /** Left edge and vertical centre of the node's box, px. */
  x: number;
  y: number;
}

export interface PlacedLink {
  /** The child's item: its node's `via` is the feed this line stands for. */
  child: ChainItem;
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

export interface ChainLayout {
  nodes: PlacedNode[];
  links: PlacedLink[];
  width: number;
  height: number;
}

export interface LayoutSizes {
  /** Width of a node's box. */
  boxWidth: number;
  /** Horizontal room between a box and its children (where the feed's words go). */
  gap: number;
  /** Vertical distance between neighbouring nodes. */
  rowHeight: number;
  margin: number;
}

export const DEFAULT_SIZES: LayoutSizes = { boxWidth: 196, gap: 150, rowHeight: 96, margin: 12 };

interface Shown {
  item: ChainItem;
  children: Shown[];
}

export function layoutChain(root: ChainNode, folded: ReadonlySet<string>, sizes: LayoutSizes = DEFAULT_SIZES): ChainLayout {
  const items = flattenChain(root, folded);
  const byId = new Map(items.map((it) => [it.id, it]));
  const build = (id: string): Shown => {
    const item = byId.get(id)!;
    const kids = item.folded ? [] : item.node.children.map((_, i) => build(childId(id, i)));
    return { item, children: kids };
  };
  const h = hierarchy<Shown>(build(ROOT_ID), (d) => d.children);
  // nodeSize is [breadth, depth]: breadth becomes screen y, depth screen x.
  const laid = tree<Shown>().nodeSize([sizes.rowHeight, sizes.boxWidth + sizes.gap])(h);
  let minBreadth = Infinity;
  let maxBreadth = -Infinity;
  let maxDepth = 0;
  laid.each((n) => {
    minBreadth = Math.min(minBreadth, n.x);
    maxBreadth = Math.max(maxBreadth, n.x);
    maxDepth = Math.max(maxDepth, n.y);
  });
  const top = sizes.margin + sizes.rowHeight / 2 - minBreadth;
  const nodes: PlacedNode[] = [];
  const links: PlacedLink[] = [];
  laid.each((n) => {
    nodes.push({ item: n.data.item, x: sizes.margin + n.y, y: top + n.x });
  });
  for (const l of laid.links()) {
    links.push({
      child: l.target.data.item,
      x0: sizes.margin + l.source.y + sizes.boxWidth,
      y0: top + l.source.x,
      x1: sizes.margin + l.target.y,
      y1: top + l.target.x,
    });
  }
  return {
    nodes,
    links,
    width: 2 * sizes.margin + maxDepth + sizes.boxWidth,
    height: 2 * sizes.margin + (maxBreadth - minBreadth) + sizes.rowHeight,
  };
}

/** The plain words that go with a node's shape: why the walk stops or what is odd here. */
export function nodeNotes(node: ChainNode, direction: 'up' | 'down'): string[] {
  const notes: string[] = [];
  if (node.origin) notes.push('origin');
  if (!node.onAir) notes.push('off air: no programme with nothing failed');
  if (node.loop) notes.push('loop: this carriage is already further along this path, so the walk stops here');
  if (node.deadEnd) notes.push('dead end: not an origin and no feed comes in');
  if (node.repeated) notes.push(direction === 'up' ? 'shown once: its own feeds are drawn where it first appears' : 'shown once: what it feeds is drawn where it first appears');
  return notes;
}

/** How many carriages sit at each depth of the tree: [1, children of the root, their children, ...]. */
export function levelCounts(root: ChainNode): number[] {
  const counts: number[] = [];
  let level: ChainNode[] = [root];
  while (level.length > 0) {
    counts.push(level.length);
    level = level.flatMap((n) => n.children);
  }
  return counts;
}

/** Folds that open every node above `depth` and fold the nodes at `depth`: the tree shown down to that level, with counts below. */
export function foldsToLevel(root: ChainNode, depth: number): Set<string> {
  const folded = new Set<string>();
  const walk = (node: ChainNode, id: string, d: number) => {
    if (node.children.length === 0) return;
    if (d >= depth) {
      folded.add(id);
      return;
    }
    node.children.forEach((c, i) => walk(c, childId(id, i), d + 1));
  };
  walk(root, ROOT_ID, 0);
  return folded;
}

/** Where a carriage of a folded chain's hop list hangs: "fed from X; 42 carriages further down" (downstream), "feeds X" (upstream). */
export function levelRowWords(row: ChainRow, direction: 'up' | 'down'): string {
  const parts: string[] = [];
  if (row.parent) parts.push(direction === 'down' ? `fed from ${row.parent}` : `feeds ${row.parent}`);
  if (row.below > 0) parts.push(`${countOf(row.below, 'carriage')} further ${direction === 'down' ? 'down' : 'up'}`);
  return parts.join('; ');
}

/** A folded chain's hop list row as the hop-by-hop list draws it (no fold button: the row's link opens its own chain). */
export function levelItem(row: ChainRow): ChainItem {
  return { id: `${row.depth}:${row.via?.feed ?? row.carriage}`, node: { ...row, children: [] }, depth: 0, childCount: 0, hiddenCount: 0, folded: false };
}

/** The words over a folded chain: "The downstream chain of X: 4,812 carriages over 6 hops, folded by hop; ..." (levels[0] is X itself). */
export function foldedSummary(code: string, direction: 'up' | 'down', levels: readonly number[], size: number): string {
  return `The ${direction === 'up' ? 'upstream' : 'downstream'} chain of ${code}: ${countOf(size, 'carriage')} over ${countOf(levels.length - 1, 'hop')}, folded by hop; show a hop to list its carriages.`;
}

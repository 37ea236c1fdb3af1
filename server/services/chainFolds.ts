/**
 * A chain tree served folded (GET /api/carriages/:code/chain with `view`,
 * `level` or `under`): an origin's downstream tree at 20,000 sites holds
 * thousands of carriages (about 2 MB whole), so the screen first gets the
 * count at each level, then the rows of one level or under one carriage a
 * page at a time. Every answer is cut from the one full tree the engine
 * builds (server/engine/chain.ts), so pages agree with the whole answer.
 */
import type { ChainAnswer, ChainLevelsAnswer, ChainNode, ChainRow } from '@/shared/schemas/analysis';

/** Trees of up to this many carriages are answered whole by `view=levels`: the screen draws them. */
export const COMPLETE_UP_TO = 150;

export interface FoldedChain {
  answer: ChainAnswer;
  levels: number[];
  size: number;
  /** rows by depth, in breadth-first (tree) order */
  byLevel: ChainRow[][];
  /** rows hanging directly from each expanded carriage, in tree order */
  childrenOf: Map<string, ChainRow[]>;
  /** every carriage that appears in the tree */
  carriages: Set<string>;
}

function rowOf(node: ChainNode, depth: number, parent: string | undefined, below: number): ChainRow {
  const { children, ...rest } = node;
  const row: ChainRow = { ...rest, depth, childCount: children.length, below };
  if (parent !== undefined) row.parent = parent;
  return row;
}

/** Counts below every node without recursion (a chain can be thousands of hops deep through relays). */
function belowCounts(root: ChainNode): Map<ChainNode, number> {
  const order: ChainNode[] = [];
  const stack = [root];
  while (stack.length) {
    const n = stack.pop()!;
    order.push(n);
    for (const c of n.children) stack.push(c);
  }
  const below = new Map<ChainNode, number>();
  for (let i = order.length - 1; i >= 0; i--) {
    const n = order[i];
    let sum = 0;
    for (const c of n.children) sum += 1 + below.get(c)!;
    below.set(n, sum);
  }
  return below;
}

export function foldChain(answer: ChainAnswer): FoldedChain {
  const below = belowCounts(answer.root);
  const byLevel: ChainRow[][] = [];
  const childrenOf = new Map<string, ChainRow[]>();
  const carriages = new Set<string>();
  let level: { node: ChainNode; parent?: string }[] = [{ node: answer.root }];
  for (let depth = 0; level.length > 0; depth++) {
    const rows: ChainRow[] = [];
    const next: typeof level = [];
    for (const { node, parent } of level) {
      const row = rowOf(node, depth, parent, below.get(node)!);
      rows.push(row);
      carriages.add(node.carriage);
      if (parent !== undefined) {
        let siblings = childrenOf.get(parent);
        if (!siblings) childrenOf.set(parent, (siblings = []));
        siblings.push(row);
      }
      for (const c of node.children) next.push({ node: c, parent: node.carriage });
    }
    byLevel.push(rows);
    level = next;
  }
  const levels = byLevel.map((l) => l.length);
  return { answer, levels, size: levels.reduce((a, b) => a + b, 0), byLevel, childrenOf, carriages };
}

/** The first answer: the levels with their counts, and the whole tree only when it is small. */
export function levelsAnswer(f: FoldedChain): ChainLevelsAnswer {
  const complete = f.size <= COMPLETE_UP_TO;
  const root = complete ? f.answer.root : { ...f.answer.root, children: [] };
  return { networkVersion: f.answer.networkVersion, direction: f.answer.direction, root, size: f.size, levels: f.levels, complete };
}

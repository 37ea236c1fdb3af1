import { describe, expect, it } from 'vitest';
import type { ChainNode, ChainRow } from '@/shared/schemas/analysis';
import { DEFAULT_SIZES, flattenChain, foldedSummary, foldsToLevel, initialFolds, layoutChain, levelCounts, levelItem, levelRowWords, nodeNotes, ROOT_ID, toggleFold } from './chainLayout';

const node = (carriage: string, children: ChainNode[] = [], extra: Partial<ChainNode> = {}): ChainNode => ({
  carriage,
  site: carriage.split('.')[0],
  siteName: `Site ${carriage}`,
  service: 'TV',
  origin: false,
  onAir: true,
  children,
  via: { feed: `${carriage}.M`, medium: 'off-air', role: 'main', up: true, distanceKm: 12.5, hops: [], warnings: [] },
  ...extra,
});

// R <- M (main) <- O ; R <- M again (reserve, repeated) : the shape of a relay with main and reserve off the same parent.
const upTree = node('R.TV', [node('M.TV', [node('O.TV', [], { origin: true })]), node('M.TV', [], { repeated: true })]);

describe('flattenChain', () => {
  it('lists nodes depth first with path ids', () => {
    const items = flattenChain(upTree, new Set());
    expect(items.map((i) => [i.id, i.node.carriage, i.depth])).toEqual([
      ['0', 'R.TV', 0],
      ['0.0', 'M.TV', 1],
      ['0.0.0', 'O.TV', 2],
      ['0.1', 'M.TV', 1],
    ]);
  });

  it('hides what a folded node holds and counts it', () => {
    const items = flattenChain(upTree, new Set(['0.0']));
    expect(items.map((i) => i.id)).toEqual(['0', '0.0', '0.1']);
    expect(items[1]).toMatchObject({ folded: true, hiddenCount: 1, childCount: 1 });
    const all = flattenChain(upTree, new Set([ROOT_ID]));
    expect(all).toHaveLength(1);
    expect(all[0].hiddenCount).toBe(3);
  });

  it('ignores a fold on a leaf', () => {
    const items = flattenChain(upTree, new Set(['0.1']));
    expect(items.find((i) => i.id === '0.1')).toMatchObject({ folded: false, hiddenCount: 0 });
  });
});

describe('toggleFold', () => {
  it('adds and removes without touching the old set', () => {
    const a = new Set<string>();
    const b = toggleFold(a, '0.1');
    expect([...b]).toEqual(['0.1']);
    expect(a.size).toBe(0);
    expect(toggleFold(b, '0.1').size).toBe(0);
  });
});

describe('initialFolds', () => {
  // A root with 4 children, each with 5 children, each with 1 child: 1 + 4 + 20 + 20 nodes.
  const wide = node('X', Array.from({ length: 4 }, (_, i) => node(`A${i}`, Array.from({ length: 5 }, (_, j) => node(`B${i}${j}`, [node(`C${i}${j}`)])))));

  it('opens whole levels while they fit', () => {
    expect(initialFolds(wide, 100).size).toBe(0);
    // 1 + 4 + 20 = 25 fit in 30; the next level (20 more) does not, so the 20 B nodes are folded.
    const f = initialFolds(wide, 30);
    expect(f.size).toBe(20);
    expect(flattenChain(wide, f)).toHaveLength(25);
  });

  it('always opens the root level', () => {
    const f = initialFolds(wide, 2);
    expect(f.has(ROOT_ID)).toBe(false);
    expect(flattenChain(wide, f)).toHaveLength(5);
  });
});

describe('layoutChain', () => {
  it('puts depth left to right and keeps siblings one row apart', () => {
    const s = DEFAULT_SIZES;
    const l = layoutChain(upTree, new Set());
    const at = (id: string) => l.nodes.find((n) => n.item.id === id)!;
    expect(at('0').x).toBe(s.margin);
    expect(at('0.0').x).toBe(s.margin + s.boxWidth + s.gap);
    expect(at('0.0.0').x).toBe(s.margin + 2 * (s.boxWidth + s.gap));
    expect(Math.abs(at('0.0').y - at('0.1').y)).toBeGreaterThanOrEqual(s.rowHeight);
    // Everything sits inside the reported size.
    for (const n of l.nodes) {
      expect(n.y - s.rowHeight / 2).toBeGreaterThanOrEqual(s.margin - 1e-9);
      expect(n.y + s.rowHeight / 2).toBeLessThanOrEqual(l.height - s.margin + 1e-9);
      expect(n.x + s.boxWidth).toBeLessThanOrEqual(l.width - s.margin + 1e-9);
    }
  });

  it('draws one line per shown child, from the parent box edge to the child', () => {
    const l = layoutChain(upTree, new Set());
    expect(l.links).toHaveLength(3);
    const toOrigin = l.links.find((k) => k.child.id === '0.0.0')!;
    const parent = l.nodes.find((n) => n.item.id === '0.0')!;
    expect(toOrigin.x0).toBe(parent.x + DEFAULT_SIZES.boxWidth);
    expect(toOrigin.y0).toBe(parent.y);
  });

  it('shrinks when a subtree is folded, and a lone root is one box', () => {
    expect(layoutChain(upTree, new Set(['0.0'])).nodes).toHaveLength(3);
    const lone = layoutChain(node('ONLY'), new Set());
    expect(lone.nodes).toHaveLength(1);
    expect(lone.links).toHaveLength(0);
    expect(lone.width).toBe(2 * DEFAULT_SIZES.margin + DEFAULT_SIZES.boxWidth);
    expect(lone.height).toBe(2 * DEFAULT_SIZES.margin + DEFAULT_SIZES.rowHeight);
  });
});

describe('nodeNotes', () => {
  it('says in words why a walk stops', () => {
    expect(nodeNotes(node('O', [], { origin: true }), 'up')).toEqual(['origin']);
    expect(nodeNotes(node('L', [], { loop: true, onAir: false }), 'up')).toEqual([
      'off air: no programme with nothing failed',
      'loop: this carriage is already further along this path, so the walk stops here',
    ]);
    expect(nodeNotes(node('D', [], { deadEnd: true }), 'up')[0]).toMatch(/^dead end/);
    expect(nodeNotes(node('P', [], { repeated: true }), 'down')[0]).toMatch(/what it feeds/);
  });
});

describe('levels', () => {
  // 1 + 3 + 6 + 6 nodes: a root, three children with two children each, each of those with one.
  const tree = node('R', Array.from({ length: 3 }, (_, i) => node(`A${i}`, Array.from({ length: 2 }, (_, j) => node(`B${i}${j}`, [node(`C${i}${j}`)])))));

  it('counts the carriages at each depth', () => {
    expect(levelCounts(tree)).toEqual([1, 3, 6, 6]);
    expect(levelCounts(node('alone'))).toEqual([1]);
  });

  it('opens the tree down to a level and folds what lies below it, with the hidden counts', () => {
    expect(flattenChain(tree, foldsToLevel(tree, 0)).map((i) => i.hiddenCount)).toEqual([15]);
    const two = flattenChain(tree, foldsToLevel(tree, 1));
    expect(two).toHaveLength(4);
    expect(two.slice(1).map((i) => [i.folded, i.hiddenCount])).toEqual([
      [true, 4],
      [true, 4],
      [true, 4],
    ]);
    expect(flattenChain(tree, foldsToLevel(tree, 2))).toHaveLength(10);
    // Past the deepest level nothing is folded: every node shows.
    expect(foldsToLevel(tree, 3).size).toBe(0);
    expect(flattenChain(tree, foldsToLevel(tree, 9))).toHaveLength(16);
  });
});

describe('a folded chain\'s hop list', () => {
  const row: ChainRow = { carriage: 'R7.TV', site: 'R7', siteName: 'Relay seven', service: 'TV', origin: false, onAir: true, depth: 2, parent: 'M1.TV', childCount: 3, below: 1234, via: { feed: 'F9', medium: 'off-air', role: 'main', up: true, distanceKm: 12, hops: [], warnings: [] } };

  it('says where a row hangs and how much lies beyond it, with thousands separators', () => {
    expect(levelRowWords(row, 'down')).toBe('fed from M1.TV; 1,234 carriages further down');
    expect(levelRowWords({ ...row, below: 1 }, 'up')).toBe('feeds M1.TV; 1 carriage further up');
    expect(levelRowWords({ ...row, below: 0, parent: undefined }, 'down')).toBe('');
  });

  it('keys rows by their feed (unique in a tree) and draws them without a fold button', () => {
    const item = levelItem(row);
    expect(item.id).toBe('2:F9');
    expect(levelItem({ ...row, via: { ...row.via!, feed: 'F10' } }).id).not.toBe(item.id);
    expect(item.childCount).toBe(0);
    expect(item.node.children).toEqual([]);
    expect(item.node.carriage).toBe('R7.TV');
  });

  it('sums up the folded chain in words', () => {
    expect(foldedSummary('O1.TV', 'down', [1, 40, 900, 3871], 4812)).toBe('The downstream chain of O1.TV: 4,812 carriages over 3 hops, folded by hop; show a hop to list its carriages.');
  });
});

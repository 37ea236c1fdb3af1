import { describe, expect, it } from 'vitest';
import type { NetworkDrawing } from '@/src/api/schemas';
import { branchMarks, buildSchematic, INDENT_PX, layoutSchematic, ROW_PX } from './schematicModel';

// O (origin) -> M1 (main) -> R1 -> R2 (relays), M1 -> M2 (main) -> R3; a reserve feed O -> R3 is not a tree edge;
// X and Y feed each other in a loop of main feeds with no origin; U is unfed.
const site = (code: string, role: 'origin' | 'main' | 'relay') => ({ code, name: `Name ${code}`, role, lat: 0, lon: 0 });
const doc: NetworkDrawing = {
  sites: [site('O', 'origin'), site('M1', 'main'), site('M2', 'main'), site('R1', 'relay'), site('R2', 'relay'), site('R3', 'relay'), site('X', 'main'), site('Y', 'relay'), site('U', 'relay')],
  services: [{ code: 'TV', name: 'TV', kind: 'dtt' }],
  groups: [],
  carriages: ['O', 'M1', 'M2', 'R1', 'R2', 'R3', 'X', 'Y', 'U'].map((s) => ({ code: `${s}.TV`, site: s, service: 'TV' })).concat([{ code: 'O.FM', site: 'O', service: 'FM' }]),
  feeds: [
    { code: 'f1', from: 'O.TV', to: 'M1.TV', medium: 'line', role: 'main' },
    { code: 'f2', from: 'M1.TV', to: 'R1.TV', medium: 'off-air', role: 'main' },
    { code: 'f3', from: 'R1.TV', to: 'R2.TV', medium: 'off-air', role: 'main' },
    { code: 'f4', from: 'M1.TV', to: 'M2.TV', medium: 'microwave', role: 'main' },
    { code: 'f5', from: 'M2.TV', to: 'R3.TV', medium: 'off-air', role: 'main' },
    { code: 'f6', from: 'O.TV', to: 'R3.TV', medium: 'satellite', role: 'reserve' },
    { code: 'f7', from: 'X.TV', to: 'Y.TV', medium: 'off-air', role: 'main' },
    { code: 'f8', from: 'Y.TV', to: 'X.TV', medium: 'off-air', role: 'main' },
  ],
};

describe('schematic tree', () => {
  const t = buildSchematic(doc, 'TV');

  it('hangs main stations under their main feed source and folds the relays below each into it', () => {
    expect(t.carriages).toBe(9);
    expect(t.roots.map((r) => r.carriage)).toEqual(['O.TV', 'U.TV', 'X.TV']);
    const o = t.roots[0];
    expect(o.relays).toEqual([]);
    expect(o.children.map((c) => c.carriage)).toEqual(['M1.TV']);
    const m1 = o.children[0];
    expect(m1.relays).toEqual(['R1.TV', 'R2.TV']); // R2 hangs under R1, folded into M1 all the same
    expect(m1.children.map((c) => c.carriage)).toEqual(['M2.TV']);
    expect(m1.children[0].relays).toEqual(['R3.TV']);
  });

  it('cuts a loop of main feeds so every carriage is drawn once, and counts the trees with no origin', () => {
    const x = t.roots.find((r) => r.carriage === 'X.TV')!;
    expect(x.relays).toEqual(['Y.TV']);
    expect(t.unfedRoots).toBe(2); // U and the loop
    const all: string[] = [];
    const walk = (n: (typeof t.roots)[number]) => {
      all.push(n.carriage, ...n.relays);
      n.children.forEach(walk);
    };
    t.roots.forEach(walk);
    expect(all.sort()).toEqual([...t.carriageSite.keys()].sort());
  });

  it('lays out one row per node in pre-order, indented by depth, and shows relays as leaves when opened', () => {
    const closed = layoutSchematic(t, new Set());
    expect(closed.nodes.map((n) => n.data.carriage)).toEqual(['O.TV', 'M1.TV', 'M2.TV', 'U.TV', 'X.TV']);
    expect(closed.x).toEqual([0, INDENT_PX, 2 * INDENT_PX, 0, 0]);
    expect(closed.y).toEqual([0, 1, 2, 3, 4].map((r) => r * ROW_PX));
    expect(closed.height).toBe(5 * ROW_PX);
    const opened = layoutSchematic(t, new Set(['M1.TV']));
    // M1's relays come right beneath it, as leaves one level in, before the main station it feeds.
    expect(opened.nodes.map((n) => n.data.carriage)).toEqual(['O.TV', 'M1.TV', 'R1.TV', 'R2.TV', 'M2.TV', 'U.TV', 'X.TV']);
    expect(opened.nodes.filter((n) => n.data.leaf).map((n) => n.data.carriage)).toEqual(['R1.TV', 'R2.TV']);
    expect(opened.nodes[2].parent!.data.carriage).toBe('M1.TV');
    expect(opened.x[2]).toBe(2 * INDENT_PX);
    expect(opened.x[4]).toBe(2 * INDENT_PX);
  });

  it('counts the folded relays off air under a failure set', () => {
    const m1 = t.roots[0].children[0];
    const marks = branchMarks(m1, t, new Map([['R2', 'off-air'], ['M1', 'on-reserve']] as const));
    expect(marks).toEqual({ self: 'on-reserve', off: 1, reserve: 0 });
  });
});

import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { DiagramModel, DiagramSite, PlacedDiagram } from './diagramModel';
import { buildLevel, buildLodIndex, CELL_PX, groupMarks, levelForZoom, MAX_LEVEL, MIXED } from './lod';
import { placeLabels, overlaps } from './labelPlacement';
import { planFrame } from './framePlan';

const site = (code: string, role: DiagramSite['role'], households = 0): DiagramSite => ({ code, name: `Name ${code}`, role, lat: 0, lon: 0, households, services: [], carriages: [] });

// Four sites: A and B share a cell at level 0 (36 px cells), C and D are far apart.
const model: DiagramModel = {
  sites: [site('A', 'relay', 10), site('B', 'main', 5), site('C', 'relay'), site('D', 'origin')],
  links: [
    { from: 1, to: 0, medium: 'off-air', role: 'main', feeds: 1 },
    { from: 3, to: 1, medium: 'line', role: 'main', feeds: 2 },
    { from: 3, to: 0, medium: 'satellite', role: 'main', feeds: 1 },
    { from: 3, to: 2, medium: 'microwave', role: 'reserve', feeds: 4 },
  ],
  feedCount: 8,
};
const placed: PlacedDiagram = {
  xs: Float64Array.from([10, 20, 100, 300]),
  ys: Float64Array.from([10, 12, 100, 300]),
  linkFrom: Int32Array.from([1, 3, 3, 3]),
  linkTo: Int32Array.from([0, 1, 0, 2]),
};

describe('level of detail', () => {
  it('picks the level whose cells are CELL_PX to twice that on screen', () => {
    expect(levelForZoom(1)).toBe(0);
    expect(levelForZoom(1.99)).toBe(0);
    expect(levelForZoom(2)).toBe(1);
    expect(levelForZoom(64)).toBe(MAX_LEVEL);
    expect(levelForZoom(1000)).toBe(MAX_LEVEL);
    expect(() => levelForZoom(0)).toThrow(RangeError);
  });

  it('groups sites sharing a cell, leads with the main station, and bundles lines per group pair and role', () => {
    const lv = buildLevel(model, placed, 0);
    expect(lv.cell).toBe(CELL_PX);
    expect(Array.from(lv.count)).toEqual([2, 1, 1]);
    expect(lv.lead[0]).toBe(1); // B, the main station, over A, the bigger relay
    expect(lv.x[0]).toBe(15); // mean of 10 and 20
    expect(lv.x[1]).toBe(100); // a lone site stays where it is
    expect(Array.from(lv.groupOf)).toEqual([0, 0, 1, 2]);
    // B->A is inside group 0 (dropped); D->B and D->A bundle into one main line carrying 3 feeds of two media.
    const lines = Array.from(lv.lineA, (a, i) => ({ a, b: lv.lineB[i], role: lv.lineRole[i], medium: lv.lineMedium[i], feeds: lv.lineFeeds[i] }));
    expect(lines).toEqual([
      { a: 0, b: 2, role: 'main', medium: MIXED, feeds: 3 },
      { a: 1, b: 2, role: 'reserve', medium: 'microwave', feeds: 4 },
    ]);
  });

  it('separates every site at the deepest level here, and builds each level once', () => {
    const lod = buildLodIndex(model, placed);
    const deep = lod.level(3);
    expect(Array.from(deep.count)).toEqual([1, 1, 1, 1]);
    expect(lod.level(3)).toBe(deep);
    expect(lod.built()).toEqual([3]);
    expect(() => lod.level(MAX_LEVEL + 1)).toThrow(RangeError);
  });

  it('keeps every site in exactly one group at every level (random positions)', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.double({ min: 0, max: 1000, noNaN: true }), fc.double({ min: 0, max: 1000, noNaN: true })), { minLength: 1, maxLength: 200 }), fc.integer({ min: 0, max: MAX_LEVEL }), (pts, l) => {
        const m: DiagramModel = { sites: pts.map((_, i) => site(`S${i}`, 'relay')), links: [], feedCount: 0 };
        const p: PlacedDiagram = { xs: Float64Array.from(pts, (q) => q[0]), ys: Float64Array.from(pts, (q) => q[1]), linkFrom: new Int32Array(0), linkTo: new Int32Array(0) };
        const lv = buildLevel(m, p, l);
        expect(lv.count.reduce((a, b) => a + b, 0)).toBe(pts.length);
        // Every site lies in its group's cell.
        pts.forEach(([x, y], i) => {
          const lead = lv.lead[lv.groupOf[i]];
          expect(Math.floor(x / lv.cell)).toBe(Math.floor(p.xs[lead] / lv.cell));
          expect(Math.floor(y / lv.cell)).toBe(Math.floor(p.ys[lead] / lv.cell));
        });
      }),
      { numRuns: 60 },
    );
  });

  it('sums failure marks per group from the marked sites', () => {
    const lv = buildLevel(model, placed, 0);
    const idx = new Map(model.sites.map((s, i) => [s.code, i]));
    const marks = groupMarks(lv, idx, new Map([['A', 'off-air'], ['B', 'on-reserve'], ['C', 'on-reserve'], ['GONE', 'off-air']] as const));
    expect(Array.from(marks.off)).toEqual([1, 0, 0]);
    expect(Array.from(marks.reserve)).toEqual([1, 1, 0]);
  });
});

describe('label placement', () => {
  it('never lets two labels overlap, and leaves out what finds no room', () => {
    fc.assert(
      fc.property(fc.array(fc.record({ x: fc.integer({ min: 0, max: 400 }), y: fc.integer({ min: 0, max: 300 }), w: fc.integer({ min: 10, max: 120 }) }), { maxLength: 150 }), (cs) => {
        const placedLabels = placeLabels(cs.map((c, i) => ({ x: c.x, y: c.y, r: 4, width: c.w, height: 16, text: `L${i}`, centred: i % 3 === 0 })), 400, 300);
        for (let i = 0; i < placedLabels.length; i++) {
          const l = placedLabels[i];
          expect(l.x >= 0 && l.y >= 0 && l.x + l.width <= 400 && l.y + l.height <= 300).toBe(true);
          for (let j = i + 1; j < placedLabels.length; j++) expect(overlaps(l, placedLabels[j])).toBe(false);
        }
      }),
      { numRuns: 80 },
    );
  });

  it('moves a label to the left of its mark when the right is taken', () => {
    const out = placeLabels(
      [
        { x: 100, y: 50, r: 0, width: 40, height: 10, text: 'first', centred: true },
        { x: 60, y: 50, r: 5, width: 30, height: 10, text: 'second' },
      ],
      300,
      200,
    );
    expect(out.map((l) => l.text)).toEqual(['first', 'second']);
    expect(out[1].x + out[1].width).toBeLessThanOrEqual(60);
  });
});

describe('frame plan', () => {
  const measure = (t: string, px: number) => t.length * px * 0.6;
  const base = { model, lod: buildLodIndex(model, placed), width: 400, height: 400, siteIndex: new Map(model.sites.map((s, i) => [s.code, i])), measure };

  it('writes the count in every group circle, however many there are (names alone are capped)', () => {
    // 20 x 15 groups of two sites, one per level-0 cell three cells apart: 300 circles, more than the names' cap.
    const sites: DiagramSite[] = [];
    const xs: number[] = [];
    const ys: number[] = [];
    for (let r = 0; r < 15; r++) {
      for (let c = 0; c < 20; c++) {
        for (const d of [0, 4]) {
          sites.push(site(`S${r}-${c}-${d}`, 'relay'));
          xs.push(CELL_PX * (3 * c + 1) + d);
          ys.push(CELL_PX * (3 * r + 1) + d);
        }
      }
    }
    const many: DiagramModel = { sites, links: [], feedCount: 0 };
    const where: PlacedDiagram = { xs: Float64Array.from(xs), ys: Float64Array.from(ys), linkFrom: new Int32Array(0), linkTo: new Int32Array(0) };
    const [width, height] = [CELL_PX * 60, CELL_PX * 45];
    const plan = planFrame({ model: many, lod: buildLodIndex(many, where), width, height, siteIndex: new Map(sites.map((x, i) => [x.code, i])), measure, view: { k: 1, tx: 0, ty: 0 }, statuses: new Map() });
    expect(plan.counts.groups).toBe(300);
    expect(plan.labels.filter((l) => l.text === '2')).toHaveLength(300);
    expect(plan.labels.length - 300).toBeLessThanOrEqual(120);
    for (let i = 0; i < plan.labels.length; i++) for (let j = i + 1; j < plan.labels.length; j++) expect(overlaps(plan.labels[i], plan.labels[j])).toBe(false);
  });

  it('draws a group with its count at zoom 1, and the lone sites by role', () => {
    const plan = planFrame({ ...base, view: { k: 1, tx: 0, ty: 0 }, statuses: new Map() });
    expect(plan.level).toBe(0);
    expect(plan.marks.map((m) => [m.role, m.count])).toEqual([
      [null, 2],
      ['relay', 1],
      ['origin', 1],
    ]);
    expect(plan.counts).toMatchObject({ groups: 1, singles: 2, sitesInGroups: 2, lines: 2 });
    expect(plan.labels.map((l) => l.text)).toContain('2');
    expect(plan.labels.map((l) => l.text)).toContain('Name B and 1 nearby');
  });

  it('separates the group when zoomed in, and marks the failure set on the sites', () => {
    const plan = planFrame({ ...base, view: { k: 8, tx: 0, ty: 0 }, statuses: new Map([['A', 'off-air']]) });
    expect(plan.level).toBe(3);
    // Only A and B are within the 400 px box at zoom 8 (C is at 800 px).
    expect(plan.marks.map((m) => model.sites[m.site].code)).toEqual(['A', 'B']);
    expect(plan.marks.find((m) => m.site === 0)?.off).toBe(1);
    expect(plan.counts.offMarks).toBe(1);
    expect(plan.labels[0].text).toBe('Name A: off air');
  });

  it('follows a new failure set on a level it has drawn before', () => {
    const view = { k: 8, tx: 0, ty: 0 };
    planFrame({ ...base, view, statuses: new Map([['A', 'off-air']]) });
    const next = planFrame({ ...base, view, statuses: new Map([['B', 'on-reserve']]) });
    expect(next.marks.map((m) => [model.sites[m.site].code, m.off, m.reserve])).toEqual([
      ['A', 0, 0],
      ['B', 0, 1],
    ]);
    expect(next.counts).toMatchObject({ offMarks: 0, reserveMarks: 1 });
    const cleared = planFrame({ ...base, view, statuses: new Map() });
    expect(cleared.marks.every((m) => m.off === 0 && m.reserve === 0)).toBe(true);
  });

  it('lists lines in paint order: main under reserve, thinner under wider', () => {
    // Three sites far apart; the reserve line comes first in the data and the wide main line before the thin one.
    const three: DiagramModel = {
      sites: [site('P', 'origin'), site('Q', 'relay'), site('R', 'relay')],
      links: [
        { from: 0, to: 1, medium: 'microwave', role: 'reserve', feeds: 1 },
        { from: 0, to: 2, medium: 'line', role: 'main', feeds: 20 },
        { from: 1, to: 2, medium: 'line', role: 'main', feeds: 1 },
      ],
      feedCount: 22,
    };
    const at: PlacedDiagram = { xs: Float64Array.from([10, 200, 10]), ys: Float64Array.from([10, 10, 200]), linkFrom: Int32Array.from([0, 0, 1]), linkTo: Int32Array.from([1, 2, 2]) };
    const plan = planFrame({ ...base, model: three, lod: buildLodIndex(three, at), siteIndex: new Map(three.sites.map((s, i) => [s.code, i])), view: { k: 1, tx: 0, ty: 0 }, statuses: new Map() });
    expect(plan.lines.map((l) => [l.role, l.weight, l.segs.length / 4])).toEqual([
      ['main', 1, 1],
      ['main', 4, 1],
      ['reserve', 1, 1],
    ]);
  });

  it('cuts long lines to the view and leaves out a line whose box meets the view but which passes it by', () => {
    const four: DiagramModel = {
      sites: [site('P', 'origin'), site('Q', 'relay'), site('U', 'main'), site('V', 'relay')],
      links: [
        { from: 0, to: 1, medium: 'line', role: 'main', feeds: 1 },
        { from: 2, to: 3, medium: 'line', role: 'main', feeds: 1 },
      ],
      feedCount: 2,
    };
    // P-Q runs straight across the 400 px box and far beyond it; U-V passes the top left corner outside (x + y = -200).
    const at: PlacedDiagram = { xs: Float64Array.from([-5000, 6000, -300, 100]), ys: Float64Array.from([200, 200, 100, -300]), linkFrom: Int32Array.from([0, 2]), linkTo: Int32Array.from([1, 3]) };
    const plan = planFrame({ ...base, model: four, lod: buildLodIndex(four, at), siteIndex: new Map(four.sites.map((s, i) => [s.code, i])), view: { k: 1, tx: 0, ty: 0 }, statuses: new Map() });
    expect(plan.counts.lines).toBe(1);
    expect(plan.lines).toHaveLength(1);
    const [x1, y1, x2, y2] = plan.lines[0].segs;
    expect([y1, y2]).toEqual([200, 200]);
    // Cut at the view's edges (with the plan's margin of a few dozen px), not 5,000 px away.
    expect(Math.min(x1, x2)).toBeGreaterThan(-100);
    expect(Math.min(x1, x2)).toBeLessThanOrEqual(0);
    expect(Math.max(x1, x2)).toBeLessThan(500);
    expect(Math.max(x1, x2)).toBeGreaterThanOrEqual(400);
  });
});

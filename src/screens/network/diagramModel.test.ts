import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { NetworkDrawing } from '@/src/api/schemas';
import { drawingOf } from '@/shared/schemas/drawing';
import { buildDiagram as fromColumns, orderSitesInView, placeDiagram, siteStatuses } from './diagramModel';

const doc: NetworkDrawing = {
  sites: [
    { code: 'O', name: 'Origin House', role: 'origin', lat: -38, lon: -29 },
    { code: 'M', name: 'Main Hill', role: 'main', lat: -38.2, lon: -29.3, households: 1000 },
    { code: 'R', name: 'Relay Knoll', role: 'relay', lat: -38.3, lon: -29.1, households: 50 },
  ],
  services: [
    { code: 'TV', name: 'TV', kind: 'dtt' },
    { code: 'FM', name: 'FM', kind: 'fm' },
  ],
  groups: [],
  carriages: [
    { code: 'O.TV', site: 'O', service: 'TV' },
    { code: 'O.FM', site: 'O', service: 'FM' },
    { code: 'M.TV', site: 'M', service: 'TV' },
    { code: 'M.FM', site: 'M', service: 'FM' },
    { code: 'R.TV', site: 'R', service: 'TV' },
  ],
  feeds: [
    { code: 'f1', from: 'O.TV', to: 'M.TV', medium: 'line', role: 'main' },
    { code: 'f2', from: 'O.FM', to: 'M.FM', medium: 'line', role: 'main' },
    { code: 'f3', from: 'O.TV', to: 'M.TV', medium: 'satellite', role: 'reserve' },
    { code: 'f4', from: 'M.TV', to: 'R.TV', medium: 'off-air', role: 'main' },
    { code: 'f5', from: 'GONE', to: 'R.TV', medium: 'off-air', role: 'reserve' },
  ],
};

/** The model of rows, through the server's columns (which leave out a feed naming a missing carriage). */
const buildDiagram = (rows: NetworkDrawing, service: string | null) => fromColumns(drawingOf(rows, 1), service);

describe('buildDiagram', () => {
  it('merges feeds per site pair, medium and role (a feed naming a missing carriage is not drawn)', () => {
    const m = buildDiagram(doc, null);
    expect(m.sites.map((s) => s.code)).toEqual(['O', 'M', 'R']);
    expect(m.sites[0].services).toEqual(['FM', 'TV']);
    expect(m.sites[1].households).toBe(1000);
    expect(m.sites[0].households).toBeNull();
    expect(m.links).toEqual([
      { from: 0, to: 1, medium: 'line', role: 'main', feeds: 2 },
      { from: 0, to: 1, medium: 'satellite', role: 'reserve', feeds: 1 },
      { from: 1, to: 2, medium: 'off-air', role: 'main', feeds: 1 },
    ]);
    expect(m.feedCount).toBe(4);
  });

  it('keeps only the sites and feeds of a chosen service', () => {
    const m = buildDiagram(doc, 'FM');
    expect(m.sites.map((s) => s.code)).toEqual(['O', 'M']);
    expect(m.sites[1].carriages).toEqual(['M.FM']);
    expect(m.links).toEqual([{ from: 0, to: 1, medium: 'line', role: 'main', feeds: 1 }]);
    expect(m.feedCount).toBe(1);
  });

  it('draws nothing for a service nobody carries', () => {
    const m = buildDiagram(doc, 'NONE');
    expect(m.sites).toEqual([]);
    expect(m.links).toEqual([]);
  });
});

describe('placeDiagram', () => {
  it('places sites inside the box and indexes link ends', () => {
    const m = buildDiagram(doc, null);
    const p = placeDiagram(m, 390, 500, 20);
    for (let i = 0; i < 3; i++) {
      expect(p.xs[i]).toBeGreaterThanOrEqual(20 - 1e-9);
      expect(p.xs[i]).toBeLessThanOrEqual(370 + 1e-9);
    }
    // North is up: the origin (furthest north) has the smallest y.
    expect(p.ys[0]).toBeLessThan(p.ys[1]);
    expect(Array.from(p.linkFrom)).toEqual([0, 0, 1]);
    expect(Array.from(p.linkTo)).toEqual([1, 1, 2]);
  });

  it('keeps further places in the box too when asked (the demo island), drawing the sites smaller', () => {
    const m = buildDiagram(doc, null);
    const plain = placeDiagram(m, 390, 500, 20);
    const lats = m.sites.map((s) => s.lat);
    const lons = m.sites.map((s) => s.lon);
    const far = [{ code: 'corner', lat: Math.min(...lats) - 1, lon: Math.max(...lons) + 1 }];
    const wider = placeDiagram(m, 390, 500, 20, far);
    const spread = (xs: Float64Array) => Math.max(...xs) - Math.min(...xs);
    expect(spread(wider.ys)).toBeLessThan(spread(plain.ys));
    for (let i = 0; i < m.sites.length; i++) {
      expect(wider.xs[i]).toBeGreaterThanOrEqual(20 - 1e-9);
      expect(wider.ys[i]).toBeLessThanOrEqual(480 + 1e-9);
    }
  });
});

describe('siteStatuses', () => {
  const reach = {
    networkVersion: 1,
    lost: ['R.TV'],
    fallback: ['M.FM'],
    households: { lost: 50, fallback: 1000 },
    byService: [],
    sites: [
      { site: 'R', lost: ['TV'], fallback: [] },
      { site: 'M', lost: [], fallback: ['FM'] },
    ],
  };

  it('marks off air before on reserve, in words', () => {
    const s = siteStatuses(reach, null);
    expect(s.get('R')).toBe('off-air');
    expect(s.get('M')).toBe('on-reserve');
    expect(s.has('O')).toBe(false);
  });

  it('looks only at the filtered service', () => {
    const s = siteStatuses(reach, 'TV');
    expect(s.get('R')).toBe('off-air');
    expect(s.has('M')).toBe(false);
    expect(siteStatuses(undefined, null).size).toBe(0);
  });

  it('is one and the same empty set while there is no answer (the drawing is not redrawn for a new empty one)', () => {
    expect(siteStatuses(undefined, null)).toBe(siteStatuses(undefined, 'TV'));
    expect(siteStatuses(reach, null)).not.toBe(siteStatuses(reach, null));
  });
});

describe('orderSitesInView', () => {
  const m = buildDiagram(doc, null);

  it('puts off air first, then on reserve, then by households', () => {
    const statuses = new Map([
      ['R', 'on-reserve' as const],
      ['O', 'off-air' as const],
    ]);
    expect(orderSitesInView(m.sites, [0, 1, 2], statuses).map((i) => m.sites[i].code)).toEqual(['O', 'R', 'M']);
    expect(orderSitesInView(m.sites, [0, 1, 2], new Map()).map((i) => m.sites[i].code)).toEqual(['M', 'R', 'O']);
  });

  it('skips indices left over from a larger view (a filter just narrowed the sites)', () => {
    expect(orderSitesInView(m.sites, [2, 7, 40, -1], new Map())).toEqual([2]);
  });

  it('gives the order of a plain sort by mark, households and code, for any sites, view and failure set', () => {
    const rank = { 'off-air': 0, 'on-reserve': 1 } as const;
    fc.assert(
      fc.property(
        fc.array(fc.record({ households: fc.option(fc.integer({ min: 0, max: 5 }), { nil: null }), mark: fc.constantFrom('off-air', 'on-reserve', null) }), { minLength: 1, maxLength: 60 }),
        fc.array(fc.nat(80), { maxLength: 70 }),
        (rows, view) => {
          const sites = rows.map((r, i) => ({ ...m.sites[0], code: `S${(i * 7) % 61}-${i}`, households: r.households }));
          const statuses = new Map(rows.flatMap((r, i) => (r.mark ? [[sites[i].code, r.mark] as const] : [])));
          const inView = [...new Set(view)];
          const key = (i: number) => { const st = statuses.get(sites[i].code); return st ? rank[st] : 2; };
          const want = inView
            .filter((i) => i < sites.length)
            .sort((a, b) => key(a) - key(b) || (sites[b].households ?? 0) - (sites[a].households ?? 0) || (sites[a].code < sites[b].code ? -1 : 1));
          expect(orderSitesInView(sites, inView, statuses)).toEqual(want);
        },
      ),
      { numRuns: 200 },
    );
  });
});

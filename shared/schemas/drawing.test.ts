import { describe, expect, it } from 'vitest';
import { smallNetwork } from '@/test/fixtures/small-network';
import { buildDiagram } from '@/src/screens/network/diagramModel';
import { networkDrawingSchema } from '@/src/api/schemas';
import { drawingDocumentSchema, drawingOf, expandDrawing } from './drawing';

describe('the diagram columns', () => {
  const doc = smallNetwork();
  // What the diagram read from the full export until now (its own parse keeps the drawn fields).
  const fromExport = networkDrawingSchema.parse(JSON.parse(JSON.stringify(doc)));

  it('come back as the export rows the diagram reads, feeds in code order, after a trip through JSON', () => {
    const columns = drawingDocumentSchema.parse(JSON.parse(JSON.stringify(drawingOf(doc, 7))));
    expect(columns.networkVersion).toBe(7);
    const rows = expandDrawing(columns);
    expect(rows.sites).toEqual(doc.sites.map((s) => ({ code: s.code, name: s.name, role: s.role, lat: s.lat, lon: s.lon, households: s.households ?? null })));
    expect(rows.carriages).toEqual(doc.carriages.map(({ code, site, service }) => ({ code, site, service })));
    expect(rows.feeds.map((f) => f.code)).toEqual(doc.feeds.map((f) => f.code).sort());
    expect(rows.feeds).toEqual(expect.arrayContaining(doc.feeds.map(({ code, from, to, medium, role }) => ({ code, from, to, medium, role }))));
    expect(rows.services).toEqual(doc.services.map(({ code, name, kind }) => ({ code, name, kind })));
    expect(rows.groups.map((g) => g.code)).toEqual(doc.groups.map((g) => g.code));
  });

  it('give the diagram the same model as the export, with and without a service filter', () => {
    const rows = expandDrawing(drawingOf(doc, 1));
    for (const service of [null, 'TV1', 'FM1']) {
      const a = buildDiagram(rows, service);
      const b = buildDiagram(fromExport, service);
      expect(a.sites).toEqual(b.sites);
      expect(new Set(a.links.map((l) => JSON.stringify(l)))).toEqual(new Set(b.links.map((l) => JSON.stringify(l))));
      expect([a.feedCount, a.skippedFeeds]).toEqual([b.feedCount, b.skippedFeeds]);
    }
  });

  it('refuse columns that do not line up or point past their table', () => {
    const good = drawingOf(doc, 1);
    expect(() => expandDrawing({ ...good, feeds: { ...good.feeds, to: good.feeds.to.slice(1) } })).toThrow(/feeds.to has \d+ entries, feeds.code \d+/);
    expect(() => expandDrawing({ ...good, carriages: { ...good.carriages, site: good.carriages.site.map(() => 99) } })).toThrow(/carriages.site points to entry 99 of 5/);
    expect(() => expandDrawing({ ...good, sites: { ...good.sites, role: good.sites.role.map(() => 3) } })).toThrow(/sites.role points to entry 3 of 3/);
  });

  it('are checked column by column, naming the column that is not what it should be', () => {
    const good = JSON.parse(JSON.stringify(drawingOf(doc, 1)));
    expect(drawingDocumentSchema.safeParse(good).success).toBe(true);
    const bad = (patch: (d: typeof good) => void) => {
      const d = JSON.parse(JSON.stringify(good));
      patch(d);
      const r = drawingDocumentSchema.safeParse(d);
      return r.success ? 'accepted' : `${r.error.issues[0].path.join('.')}: ${r.error.issues[0].message}`;
    };
    expect(bad((d) => (d.feeds.from[0] = -1))).toBe('feeds.from: a list of positions (whole numbers from 0)');
    expect(bad((d) => (d.sites.lat[1] = '12'))).toBe('sites.lat: a list of numbers');
    expect(bad((d) => (d.sites.households[0] = 1.5))).toBe('sites.households: a list of whole numbers or null');
    expect(bad((d) => (d.carriages.code = 'O1.TV1'))).toBe('carriages.code: a list of texts');
  });
});

import { describe, expect, it } from 'vitest';
import { smallNetwork } from '@/test/fixtures/small-network';
import { smallRandomNetwork } from '@/test/helpers/random-network';
import { buildDiagram } from '@/src/screens/network/diagramModel';
import { networkDrawingSchema, type NetworkDrawing } from '@/src/api/schemas';
import { generateNetwork } from '@/scripts/generator';
import { checkDrawing, drawingDocumentSchema, drawingOf, drawingSteps, expandDrawing } from './drawing';

describe('the diagram columns', () => {
  const doc = smallNetwork();
  it('come back as the export rows the diagram reads, feeds in code order, after a trip through JSON', () => {
    const columns = drawingDocumentSchema.parse(JSON.parse(JSON.stringify(drawingOf(doc, 7))));
    expect(columns.networkVersion).toBe(7);
    const rows = expandDrawing(columns);
    expect(rows.sites).toEqual(doc.sites.map((s) => ({ code: s.code, name: s.name, role: s.role, lat: s.lat, lon: s.lon, households: s.households ?? null })));
    expect(rows.carriages).toEqual(doc.carriages.map(({ code, site, service }) => ({ code, site, service })));
    // The feeds' codes are not sent; their order is theirs.
    const byCode = [...doc.feeds].sort((a, b) => (a.code < b.code ? -1 : a.code > b.code ? 1 : 0));
    expect(rows.feeds).toEqual(byCode.map(({ from, to, medium, role }) => ({ from, to, medium, role })));
    expect(JSON.stringify(columns)).not.toContain(doc.feeds[0].code);
    expect(rows.services).toEqual(doc.services.map(({ code, name, kind }) => ({ code, name, kind })));
    expect(rows.groups.map((g) => g.code)).toEqual(doc.groups.map((g) => g.code));
  });

  it('made in steps, pause along the way and give the columns made at once, feeds in code order however they came', () => {
    const big = generateNetwork({ sites: 2_000, seed: 4 });
    const shuffled = { ...big, feeds: [...big.feeds].reverse() };
    for (const network of [big, shuffled]) {
      const run = drawingSteps(network, 3);
      let steps = 0;
      let r = run.next();
      while (!r.done) {
        steps++;
        r = run.next();
      }
      // 2,000 sites hold some 8,000 carriages and 10,000 feeds: more than one step's worth of each
      expect(steps).toBeGreaterThan(10);
      expect(r.value).toEqual(drawingOf(big, 3));
      const ends = new Map(big.feeds.map((f) => [f.code, `${f.from}>${f.to}`]));
      expect(expandDrawing(r.value).feeds.map((f) => `${f.from}>${f.to}`)).toEqual(big.feeds.map((f) => f.code).sort().map((c) => ends.get(c)));
    }
  });

  it('give the diagram the same model as a plain count over the export rows, with and without a service filter', () => {
    // The model is read straight from the columns; this counts the same thing the obvious way, by codes over rows.
    const reference = (rows: NetworkDrawing, service: string | null) => {
      const carriages = new Map(rows.carriages.filter((c) => !service || c.service === service).map((c) => [c.code, c]));
      const sites = rows.sites.filter((s) => !service || [...carriages.values()].some((c) => c.site === s.code));
      const at = new Map(sites.map((s, i) => [s.code, i]));
      const lines = new Map<string, number>();
      let feeds = 0;
      for (const f of rows.feeds) {
        const a = carriages.get(f.from);
        const b = carriages.get(f.to);
        if (!a || !b) continue;
        feeds++;
        const key = JSON.stringify({ from: at.get(a.site), to: at.get(b.site), medium: f.medium, role: f.role });
        lines.set(key, (lines.get(key) ?? 0) + 1);
      }
      const own = (code: string) => [...carriages.values()].filter((c) => c.site === code);
      return {
        sites: sites.map((s) => ({ code: s.code, name: s.name, role: s.role, lat: s.lat, lon: s.lon, households: s.households ?? null, services: [...new Set(own(s.code).map((c) => c.service))].sort(), carriages: own(s.code).map((c) => c.code).sort() })),
        lines: [...lines].map(([k, n]) => `${k}x${n}`).sort(),
        feeds,
      };
    };
    const random = smallRandomNetwork({ seed: 11, sites: 40, services: 3, groups: 2, feeds: 120, originChance: 0.1, carriageChance: 0.6 });
    for (const [network, services] of [
      [doc, [null, 'TV1', 'FM1', 'NONE']],
      [random, [null, 'V0', 'V2']],
    ] as const) {
      const rows = networkDrawingSchema.parse(JSON.parse(JSON.stringify(network)));
      const columns = drawingDocumentSchema.parse(JSON.parse(JSON.stringify(drawingOf(network, 1))));
      for (const service of services) {
        const got = buildDiagram(columns, service);
        const want = reference(rows, service);
        // Each site's lists are made when read (the site card): read here, field by field.
        expect(got.sites.map(({ code, name, role, lat, lon, households, services, carriages }) => ({ code, name, role, lat, lon, households, services, carriages }))).toEqual(want.sites);
        expect(got.links.map(({ from, to, medium, role, feeds }) => `${JSON.stringify({ from, to, medium, role })}x${feeds}`).sort()).toEqual(want.lines);
        expect(got.feedCount).toBe(want.feeds);
      }
    }
    expect(buildDiagram(drawingOf(random, 1), null).links.length).toBeGreaterThan(20);
  });

  it('refuse columns that do not line up or point past their table', () => {
    const good = drawingOf(doc, 1);
    expect(() => expandDrawing({ ...good, feeds: { ...good.feeds, to: good.feeds.to.slice(1) } })).toThrow(/feeds.to has \d+ entries, feeds.from \d+/);
    expect(() => expandDrawing({ ...good, carriages: { ...good.carriages, site: good.carriages.site.map(() => 99) } })).toThrow(/carriages.site points to entry 99 of 5/);
    expect(() => expandDrawing({ ...good, sites: { ...good.sites, role: good.sites.role.map(() => 3) } })).toThrow(/sites.role points to entry 3 of 3/);
    // The diagram reads the columns after this check alone.
    expect(() => checkDrawing({ ...good, feeds: { ...good.feeds, to: good.feeds.to.map((t, i) => (i === 2 ? good.carriages.site.length : t)) } })).toThrow(`feeds.to points to entry ${good.carriages.site.length} of ${good.carriages.site.length}`);
    expect(() => checkDrawing({ ...good, feeds: { ...good.feeds, medium: good.feeds.medium.map(() => 4) } })).toThrow(/feeds.medium points to entry 4 of 4/);
    expect(() => checkDrawing({ ...good, carriages: { ...good.carriages, service: good.carriages.service.map(() => good.services.length) } })).toThrow(/carriages.service points to entry/);
    expect(() => checkDrawing(good)).not.toThrow();
    // the carriages whose codes are sent: lined up, within the carriages, each once and in order
    const other = (at: number[], code: string[]) => ({ ...good, carriages: { ...good.carriages, otherCodes: { at, code } } });
    expect(() => checkDrawing(other([1], []))).toThrow('carriages.otherCodes.code has 0 entries, carriages.otherCodes.at 1');
    expect(() => checkDrawing(other([good.carriages.site.length], ['X']))).toThrow(`carriages.otherCodes.at points to entry ${good.carriages.site.length} of ${good.carriages.site.length}`);
    expect(() => checkDrawing(other([2, 2], ['X', 'Y']))).toThrow('carriages.otherCodes.at is not increasing at entry 1 (2, then 2)');
    expect(() => checkDrawing(other([3, 1], ['X', 'Y']))).toThrow('carriages.otherCodes.at is not increasing at entry 1 (3, then 1)');
    expect(() => checkDrawing(other([1, 3], ['X', 'Y']))).not.toThrow();
  });

  it('send a carriage code only where it is not the site code, a dot and the service code', () => {
    // The small network is coded that way throughout: no carriage code travels.
    const plain = drawingOf(doc, 1);
    expect(doc.carriages.every((c) => c.code === `${c.site}.${c.service}`)).toBe(true);
    expect(plain.carriages.otherCodes).toEqual({ at: [], code: [] });
    for (const c of doc.carriages) expect(JSON.stringify(plain)).not.toContain(`"${c.code}"`);
    // Rename some carriages (and the feeds' ends with them): only those codes are sent, and they come back.
    const renamed = new Map(doc.carriages.filter((_, i) => i % 2 === 1).map((c, i) => [c.code, `TX-${i}`]));
    const named = (code: string) => renamed.get(code) ?? code;
    const odd = {
      ...doc,
      carriages: doc.carriages.map((c) => ({ ...c, code: named(c.code) })),
      feeds: doc.feeds.map((f) => ({ ...f, from: named(f.from), to: named(f.to) })),
    };
    const columns = drawingDocumentSchema.parse(JSON.parse(JSON.stringify(drawingOf(odd, 2))));
    expect(columns.carriages.otherCodes.code.sort()).toEqual([...renamed.values()].sort());
    const rows = expandDrawing(columns);
    expect(rows.carriages).toEqual(odd.carriages.map(({ code, site, service }) => ({ code, site, service })));
    const byCode = [...odd.feeds].sort((a, b) => (a.code < b.code ? -1 : a.code > b.code ? 1 : 0));
    expect(rows.feeds).toEqual(byCode.map(({ from, to, medium, role }) => ({ from, to, medium, role })));
    // The diagram's site card reads the same codes.
    const site = buildDiagram(columns, null).sites.find((s) => odd.carriages.some((c) => c.site === s.code && renamed.has(`${c.site}.${c.service}`)))!;
    expect(site.carriages).toEqual(odd.carriages.filter((c) => c.site === site.code).map((c) => c.code).sort());
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
    expect(bad((d) => (d.carriages.otherCodes.code = 'O1.TV1'))).toBe('carriages.otherCodes.code: a list of texts');
    expect(bad((d) => delete d.carriages.otherCodes)).toMatch(/^carriages.otherCodes: /);
    // a bad value anywhere in a column, the last entry included (the loops run to the end)
    expect(bad((d) => (d.sites.code[2] = 7))).toBe('sites.code: a list of texts');
    expect(bad((d) => (d.sites.lon[0] = null))).toBe('sites.lon: a list of numbers');
    expect(bad((d) => (d.feeds.role[1] = 0.5))).toBe('feeds.role: a list of positions (whole numbers from 0)');
    expect(bad((d) => (d.feeds.to[d.feeds.to.length - 1] = -2))).toBe('feeds.to: a list of positions (whole numbers from 0)');
    expect(bad((d) => (d.sites.households[d.sites.households.length - 1] = '3'))).toBe('sites.households: a list of whole numbers or null');
  });
});

/** The engine benchmark's report is complete and self-consistent (its times are not judged here). */
import { describe, expect, it } from 'vitest';
import { benchEngine } from '@/scripts/bench-engine';
import { nationalNetwork } from '@/test/helpers/random-network';

describe('benchEngine', () => {
  it('measures every figure on a small generated network', () => {
    const doc = nationalNetwork({ sites: 400, seed: 5, services: 4 });
    const r = benchEngine(doc, { trials: 20, baselineSample: 20, networkx: false });
    expect(r.sites).toBe(400);
    expect(r.carriages).toBe(doc.carriages.length);
    expect(r.feeds).toBe(doc.feeds.length);
    expect(r.elements).toBe(doc.sites.length + doc.carriages.length + doc.feeds.length + doc.groups.length);
    expect(r.nodes).toBeGreaterThan(r.carriages + r.feeds);
    for (const key of ['buildMs', 'reachOneP50Ms', 'reachOneP95Ms', 'reachMultiP95Ms', 'reachCarriageP95Ms', 'walkFloorMs', 'spofAllMs', 'baselineSpofAllMsEstimate', 'idomMs'] as const) {
      expect(Number.isFinite(r[key]) && r[key] >= 0, key).toBe(true);
    }
    expect(r.reachOneP95Ms).toBeGreaterThanOrEqual(r.reachOneP50Ms);
    expect(r.networkxIdomMs).toBeNull();
    for (const key of ['proposalsOneMs', 'proposalsTop100Ms', 'pairsTop100Ms'] as const) {
      expect(Number.isFinite(r[key]) && r[key]! >= 0, key).toBe(true);
    }
    expect(r.gapCarriages).toBeGreaterThan(0);
    expect(r.pairsFound).toBeGreaterThan(0);
  });
  it('refuses a network with nothing to fail', () => {
    expect(() => benchEngine({ format: 'network/1', sites: [], services: [], groups: [], carriages: [], feeds: [] })).toThrow(/no sites to fail/);
  });
});

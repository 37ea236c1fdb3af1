import { describe, expect, it } from 'vitest';
import type { CheckName, FeedChecksAnswer } from '@/shared/schemas/checks';
import { computeFeedChecks } from './feedChecks';
import { PARENT_POS, scenario, type Scenario } from './testFixtures';

const run = (s: Scenario = {}) => computeFeedChecks(scenario(s));
const get = (a: FeedChecksAnswer, name: CheckName) => a.checks.find((x) => x.name === name)!;

// 7.5 GHz over 30 km at mid-path: earth bulge 13.24 m (k = 4/3, 1000 d1 d2 / 2ae) and
// F1 17.31 m (P.530 eq. (2), worked value in docs/checks.md, "Horizon, earth bulge, Fresnel zone"), 0.6 F1 = 10.39 m.
const microwave = (over: Scenario = {}) => run({ km: 30, feed: { medium: 'microwave', rxFrequencyMHz: 7500 }, ...over });

describe('microwave feeds', () => {
  it('earth bulge and F1 at mid-path match the worked values', () => {
    const a = microwave();
    expect(get(a, 'earth-bulge')).toMatchObject({ unit: 'm', ok: true });
    expect(get(a, 'earth-bulge').value).toBeCloseTo(13.24, 2);
    expect(get(a, 'fresnel-f1').value).toBeCloseTo(17.31, 2);
    expect(get(a, 'free-space-loss').value).toBeCloseTo(139.49, 2);
  });

  it('clearance passes with tall masts: (450 + 130) / 2 - 13.24 - 10.39 = 266.37 m', () => {
    const c = get(microwave(), 'clearance');
    expect(c.value).toBeCloseTo(290 - 13.24 - 10.39, 1);
    expect(c.limit).toBe(0);
    expect(c.ok).toBe(true);
  });

  it('clearance fails at sea level with 10 m masts, with a warning', () => {
    const a = microwave({ sourceSite: { groundHeightM: 0, mastHeightM: 10 }, targetSite: { groundHeightM: 0, mastHeightM: 10 } });
    const c = get(a, 'clearance');
    expect(c.value).toBeCloseTo(10 - 13.24 - 10.39, 1);
    expect(c.ok).toBe(false);
    expect(a.warnings.some((w) => w.includes('lacks 13.6 m of clearance'))).toBe(true);
  });

  it('clearance not computed without a mast or antenna height, naming the field', () => {
    const c = get(microwave({ sourceSite: { mastHeightM: undefined } }), 'clearance');
    expect(c).toMatchObject({ value: null, ok: null, note: 'not computed: antenna height missing on carriage GF-1 and mast height missing on site GREYFELL' });
  });

  it('field strength and channel clash do not apply; horizon and bearing do', () => {
    const a = microwave({ target: { frequencyMHz: 7500 } });
    expect(get(a, 'field-strength')).toMatchObject({ value: null, ok: null, note: expect.stringMatching(/^not applicable: microwave/) });
    expect(get(a, 'channel-clash')).toMatchObject({ value: null, ok: null, note: expect.stringMatching(/^not applicable/) });
    expect(get(a, 'horizon').ok).toBe(true);
  });
});

describe('off-air feeds do not screen microwave path geometry', () => {
  it('earth bulge, F1 and clearance are not applicable', () => {
    const a = run();
    for (const n of ['earth-bulge', 'fresnel-f1', 'clearance'] as const) {
      expect(get(a, n)).toMatchObject({ value: null, ok: null, note: expect.stringMatching(/^not applicable: off-air feed/) });
    }
  });
});

describe('satellite and line feeds', () => {
  it.each(['satellite', 'line'] as const)('%s: distance and bearing only; every check is not applicable', (medium) => {
    const a = run({ km: 25, feed: { medium, bearingDeg: 123 }, source: { erpW: undefined } });
    expect(a.distanceKm).toBeCloseTo(25, 3);
    expect(a.bearingDeg).toBeGreaterThanOrEqual(0);
    expect(a.checks).toHaveLength(8);
    for (const c of a.checks) {
      expect(c.value).toBeNull();
      expect(c.ok).toBeNull();
      expect(c.note).toMatch(new RegExp(`^not applicable: ${medium} feed; path checks do not apply`));
    }
    expect(a.warnings).toEqual([]);
  });
});

describe('co-sited ends', () => {
  it('source and target at one position: path checks not computed, never 0 or infinite', () => {
    const a = run({ targetSite: { lat: PARENT_POS.lat, lon: PARENT_POS.lon }, source: { erpW: 1000 }, feed: { bearingDeg: 10 } });
    expect(a.distanceKm).toBe(0);
    for (const n of ['free-space-loss', 'field-strength', 'bearing-record'] as const) {
      expect(get(a, n)).toMatchObject({ value: null, ok: null, note: expect.stringMatching(/same position/) });
    }
    expect(JSON.stringify(a)).not.toMatch(/Infinity|NaN/);
  });
});

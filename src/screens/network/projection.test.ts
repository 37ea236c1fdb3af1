import { describe, expect, it } from 'vitest';
import { fitProjection } from './projection';

const rad = (d: number) => (d * Math.PI) / 180;
// Snyder (1987), USGS PP 1395, eq. (7-2): y = R ln tan(pi/4 + phi/2); eq. (7-1): x = R (lambda - lambda0).
const mercY = (latDeg: number) => Math.log(Math.tan(Math.PI / 4 + rad(latDeg) / 2));

const demo = [
  { code: 'A', lat: -39.55, lon: -30.44 },
  { code: 'B', lat: -37.52, lon: -28.31 },
  { code: 'C', lat: -38.6, lon: -29.4 },
];

describe('fitProjection', () => {
  it('checks the box and the positions, naming the site', () => {
    expect(() => fitProjection(demo, 40, 400)).toThrow(/40 x 400 px leaves no room/);
    expect(() => fitProjection([{ code: 'BAD', lat: 95, lon: 0 }], 400, 400)).toThrow(/site BAD: latitude 95/);
    expect(() => fitProjection([{ code: 'W', lat: 0, lon: -181 }], 400, 400)).toThrow(/site W: longitude -181/);
  });

  it('has nothing to fit for no sites', () => {
    expect(fitProjection([], 400, 400)).toBeNull();
  });

  it('puts every site inside the padded box and touches it on the tight side', () => {
    const W = 390;
    const H = 600;
    const pad = 20;
    const fit = fitProjection(demo, W, H, pad)!;
    const pts = demo.map((p) => fit.project(p.lon, p.lat));
    for (const [x, y] of pts) {
      expect(x).toBeGreaterThanOrEqual(pad - 1e-6);
      expect(x).toBeLessThanOrEqual(W - pad + 1e-6);
      expect(y).toBeGreaterThanOrEqual(pad - 1e-6);
      expect(y).toBeLessThanOrEqual(H - pad + 1e-6);
    }
    const xs = pts.map((p) => p[0]);
    // On a narrow box the east-west span is the tight one.
    expect(Math.max(...xs) - Math.min(...xs)).toBeCloseTo(W - 2 * pad, 6);
  });

  it('keeps Mercator proportions: north-south against east-west span as in Snyder eq. 7-1, 7-2', () => {
    const fit = fitProjection(demo, 800, 800)!;
    const [xa, ya] = fit.project(-30.44, -39.55);
    const [xb, yb] = fit.project(-28.31, -37.52);
    const expected = (mercY(-37.52) - mercY(-39.55)) / (rad(-28.31) - rad(-30.44));
    // Screen y grows downward, so north (B) has the smaller y.
    expect((ya - yb) / (xb - xa)).toBeCloseTo(expected, 9);
  });

  it('centres a single site with a finite scale', () => {
    const fit = fitProjection([{ code: 'ONE', lat: 51.5, lon: -0.1 }], 400, 300, 20)!;
    const [x, y] = fit.project(-0.1, 51.5);
    expect(x).toBeCloseTo(200, 6);
    // Mercator stretches northward, so the midpoint of the latitudes sits a hair off centre.
    expect(Math.abs(y - 150)).toBeLessThan(0.1);
    expect(Number.isFinite(fit.projection.scale())).toBe(true);
  });

  // d3-geo is the reference: the arithmetic must put every place on d3's pixel.
  it('places every site where the fitted d3-geo projection does, anywhere on the globe', () => {
    let seed = 7;
    const rnd = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
    for (const [w, h] of [
      [1440, 660],
      [390, 490],
    ]) {
      for (let region = 0; region < 12; region++) {
        const lon0 = -179 + rnd() * 300;
        const lat0 = -84 + rnd() * 150;
        const span = 0.01 + rnd() * 40;
        const places = Array.from({ length: 60 }, (_, i) => ({ code: `P${i}`, lon: Math.min(180, lon0 + rnd() * span), lat: Math.max(-90, Math.min(90, lat0 + rnd() * span)) }));
        const fit = fitProjection(places, w, h)!;
        for (const p of places) {
          const [x, y] = fit.project(p.lon, p.lat);
          const ref = fit.projection([p.lon, Math.max(-85, Math.min(85, p.lat))])!;
          expect(Math.abs(x - ref[0])).toBeLessThan(1e-6);
          expect(Math.abs(y - ref[1])).toBeLessThan(1e-6);
          expect(fit.x(p.lon)).toBe(x);
          expect(fit.y(p.lat)).toBe(y);
        }
      }
    }
  });
});

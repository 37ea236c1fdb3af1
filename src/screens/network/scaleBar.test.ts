import { describe, expect, it } from 'vitest';
import { fitProjection } from './projection';
import { roundDown125, scaleBar, scaleLabel } from './scaleBar';
import { IDENTITY, zoomAt } from './viewport';

describe('roundDown125', () => {
  it.each([
    [1, 1],
    [1.9, 1],
    [2, 2],
    [4.99, 2],
    [5, 5],
    [9.9, 5],
    [10, 10],
    [37, 20],
    [0.07, 0.05],
    [1234, 1000],
  ])('%f -> %f', (x, want) => expect(roundDown125(x)).toBeCloseTo(want, 12));
});

describe('scaleLabel', () => {
  it('says km from 1 km, m below, with thousands separators', () => {
    expect(scaleLabel(20)).toBe('20 km');
    expect(scaleLabel(1000)).toBe('1,000 km');
    expect(scaleLabel(0.5)).toBe('500 m');
    expect(scaleLabel(0.02)).toBe('20 m');
  });
});

describe('scaleBar', () => {
  // Two places one degree of latitude apart on a meridian: 111.2 km on a sphere of 6371 km (2 pi R / 360).
  const fit = fitProjection(
    [
      { code: 'A', lat: 0, lon: 0 },
      { code: 'B', lat: 1, lon: 0 },
    ],
    400,
    400,
    0,
  )!;

  it('matches the known length of a degree at the equator', () => {
    const bar = scaleBar(fit.projection, IDENTITY, 400, 400, 120)!;
    // The fit spans 1 deg of latitude over 400 px: about 0.278 km per px near the equator.
    const kmPerPx = bar.km / bar.px;
    expect(kmPerPx).toBeCloseTo(111.195 / 400, 3);
    expect(bar.px).toBeLessThanOrEqual(120);
    expect(bar.px).toBeGreaterThan(120 / 2.5);
    expect(bar.label).toBe(`${bar.km} km`);
  });

  it('shrinks what the bar stands for as the view zooms in, and never exceeds the room', () => {
    const wide = scaleBar(fit.projection, IDENTITY, 400, 400, 120)!;
    const zoomed = scaleBar(fit.projection, zoomAt(IDENTITY, 8, 200, 200, 400, 400), 400, 400, 120)!;
    expect(zoomed.km).toBeLessThan(wide.km / 4);
    expect(zoomed.px).toBeLessThanOrEqual(120);
    expect(zoomed.km / zoomed.px).toBeCloseTo(wide.km / wide.px / 8, 6);
  });

  it('measures on the ground at the centre, also far from the equator', () => {
    const north = fitProjection(
      [
        { code: 'A', lat: 60, lon: 0 },
        { code: 'B', lat: 61, lon: 0 },
      ],
      400,
      400,
      0,
    )!;
    const bar = scaleBar(north.projection, IDENTITY, 400, 400, 120)!;
    // One degree of latitude still spans the box, and is still 111.2 km on the ground.
    expect(bar.km / bar.px).toBeCloseTo(111.195 / 400, 2);
  });
});

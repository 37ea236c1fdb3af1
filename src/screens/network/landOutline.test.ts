import { describe, expect, it } from 'vitest';
import * as turf from '@turf/turf';
import type { Feature, MultiPolygon } from 'geojson';
import { fitProjection } from './projection';
import { geoPath } from 'd3-geo';
import { DEMO_COAST, landGeometry, landKindFor, landNear, landPath, onDemoLand } from './landOutline';

describe('landPath with Natural Earth', () => {
  it('draws land inside a box fitted to places on land (a stretch of western Europe)', () => {
    const fit = fitProjection(
      [
        { code: 'N', lat: 58.6, lon: -3.1 },
        { code: 'S', lat: 50.1, lon: -5.5 },
        { code: 'E', lat: 52.5, lon: 1.7 },
      ],
      400,
      500,
    )!;
    const d = landPath(landGeometry('natural-earth'), fit.projection, 400, 500);
    expect(d.length).toBeGreaterThan(100);
    expect(d.startsWith('M')).toBe(true);
  });

  it('draws nothing for open ocean far from any coast (where the demo region lies)', () => {
    const fit = fitProjection(
      [
        { code: 'A', lat: -39.5, lon: -30.4 },
        { code: 'B', lat: -37.5, lon: -28.3 },
      ],
      400,
      400,
    )!;
    expect(landPath(landGeometry('natural-earth'), fit.projection, 400, 400)).toBe('');
  });

  // The reference is d3-geo itself, given the whole outline: choosing the polygons near the view must not change a point of the path.
  it.each([
    ['a national network (the generator’s region)', [-40.7, -44.8, -19.7, -33.1]],
    ['a stretch of coast', [-5.5, 50.1, 1.7, 58.6]],
    ['across the antimeridian', [170, -50, 179.9, -30]],
    ['half the world', [-150, -60, 150, 70]],
    ['one site', [10, 10, 10, 10]],
  ] as const)('draws the same path as the whole outline for %s', (_what, [west, south, east, north]) => {
    for (const [w, h] of [
      [1440, 660],
      [390, 490],
    ]) {
      const fit = fitProjection(
        [
          { code: 'SW', lat: south, lon: west },
          { code: 'NE', lat: north, lon: east },
        ],
        w,
        h,
      )!;
      const whole = geoPath(fit.projection.clipExtent([[-w, -h], [2 * w, 2 * h]]))(landGeometry('natural-earth')) ?? '';
      fit.projection.clipExtent(null);
      expect(landPath(landGeometry('natural-earth'), fit.projection, w, h)).toBe(whole);
    }
  });

  it('keeps only the polygons near an area, and all of them for a view round the world', () => {
    const all = landNear(landGeometry('natural-earth'), -180, -90, 180, 90);
    expect(all).toBeNull();
    const near = landNear(landGeometry('natural-earth'), -5.5, 50.1, 1.7, 58.6) as MultiPolygon;
    const world = landNear(landGeometry('natural-earth'), -179, -89, 119, 89) as MultiPolygon;
    expect(near.coordinates.length).toBeGreaterThan(0);
    expect(near.coordinates.length).toBeLessThan(world.coordinates.length / 4);
    expect(landNear(landGeometry('natural-earth'), -31, -40, -28, -37)).toEqual({ type: 'MultiPolygon', coordinates: [] }); // open ocean
  });

  it('leaves the projection without a clip afterwards', () => {
    const fit = fitProjection([{ code: 'A', lat: 10, lon: 10 }], 300, 300)!;
    landPath(landGeometry('natural-earth'), fit.projection, 300, 300);
    expect(fit.projection.clipExtent()).toBeNull();
  });
});

describe('the invented demo coastline', () => {
  const feature = DEMO_COAST.features[0] as Feature<MultiPolygon>;

  it('is one island with a few islets, of a plausible size (20,000-60,000 km2), with closed rings', () => {
    expect(DEMO_COAST.features).toHaveLength(1);
    expect(feature.geometry.type).toBe('MultiPolygon');
    for (const polygon of feature.geometry.coordinates) {
      const ring = polygon[0];
      expect(ring.length).toBeGreaterThanOrEqual(6);
      expect(ring[ring.length - 1]).toEqual(ring[0]);
    }
    const km2 = turf.area(feature) / 1e6;
    expect(km2).toBeGreaterThan(20_000);
    expect(km2).toBeLessThan(60_000);
  });

  it('lies in open ocean, clear of every Natural Earth coast', () => {
    const fit = fitProjection(
      feature.geometry.coordinates.flatMap((p) => p[0].map(([lon, lat], i) => ({ code: String(i), lat, lon }))),
      600,
      600,
    )!;
    expect(landPath(landGeometry('natural-earth'), fit.projection, 600, 600)).toBe('');
  });

  it('is read by d3-geo as land, not as the rest of the globe (clockwise rings), and agrees with turf', () => {
    const inland = turf.centroid(turf.polygon(feature.geometry.coordinates[0]));
    const [lon, lat] = inland.geometry.coordinates;
    expect(turf.booleanPointInPolygon(inland, feature)).toBe(true);
    expect(onDemoLand(lon, lat)).toBe(true);
    expect(onDemoLand(lon + 5, lat)).toBe(false);
    expect(onDemoLand(0, 0)).toBe(false);
  });

  it('is chosen only when every site stands on it', () => {
    const inland = turf.centroid(turf.polygon(feature.geometry.coordinates[0])).geometry.coordinates;
    const onLand = { lon: inland[0], lat: inland[1] };
    expect(landKindFor([onLand])).toBe('demo');
    expect(landKindFor([onLand, { lon: inland[0] + 5, lat: inland[1] }])).toBe('natural-earth');
    expect(landKindFor([{ lon: -3, lat: 55 }])).toBe('natural-earth');
    expect(landKindFor([])).toBe('natural-earth');
  });
});

import { describe, expect, it } from 'vitest';
import * as turf from '@turf/turf';
import type { Feature, MultiPolygon } from 'geojson';
import { fitProjection } from './projection';
import { DEMO_COAST, landGeometry, landKindFor, landPath, onDemoLand } from './landOutline';

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

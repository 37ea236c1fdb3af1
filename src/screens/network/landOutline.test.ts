import { describe, expect, it } from 'vitest';
import type { Topology } from 'topojson-specification';
import land110 from 'world-atlas/land-110m.json';
import { fitProjection } from './projection';
import { landPath } from './landOutline';

const topology = land110 as unknown as Topology;

describe('landPath', () => {
  it('draws land inside a box fitted to places on land (Great Britain)', () => {
    const fit = fitProjection(
      [
        { code: 'N', lat: 58.6, lon: -3.1 },
        { code: 'S', lat: 50.1, lon: -5.5 },
        { code: 'E', lat: 52.5, lon: 1.7 },
      ],
      400,
      500,
    )!;
    const d = landPath(topology, fit.projection, 400, 500);
    expect(d.length).toBeGreaterThan(100);
    expect(d.startsWith('M')).toBe(true);
  });

  it('draws nothing for open ocean far from any coast (mid South Atlantic)', () => {
    const fit = fitProjection(
      [
        { code: 'A', lat: -39.5, lon: -30.4 },
        { code: 'B', lat: -37.5, lon: -28.3 },
      ],
      400,
      400,
    )!;
    expect(landPath(topology, fit.projection, 400, 400)).toBe('');
  });

  it('leaves the projection without a clip afterwards', () => {
    const fit = fitProjection([{ code: 'A', lat: 10, lon: 10 }], 300, 300)!;
    landPath(topology, fit.projection, 300, 300);
    expect(fit.projection.clipExtent()).toBeNull();
  });
});

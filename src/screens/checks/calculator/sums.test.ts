/**
 * Expected values are those of docs/checks.md, each marked there with its source:
 * section 1 free space (ITU-R P.525, P.1546 Annex 5), section 2 horizon, bulge and F1,
 * section 3 channel plans, section 5 GeographicLib's GeodSolve0.
 */
import { describe, expect, it } from 'vitest';
import { channelAt, channelOf, channelWords, horizonFigures, linkFigures, pathBetween, readPosition } from './sums';

const value = <T,>(p: { ok: true; value: T } | { ok: false; error: string }): T => {
  if (!p.ok) throw new Error(`expected a value, got error: ${p.error}`);
  return p.value;
};
const error = (p: { ok: boolean; error?: string }) => (p.ok ? null : p.error);

describe('channelOf (docs/checks.md, "Channels and frequencies")', () => {
  it('gives UHF centres and edges: 21 -> 474 (470-478), 39 -> 618, 69 -> 858 (854-862)', () => {
    expect(value(channelOf('uhf-tv', '21'))).toMatchObject({ centreMHz: 474, lowerMHz: 470, upperMHz: 478, widthMHz: 8 });
    expect(value(channelOf('uhf-tv', 'ch 39')).centreMHz).toBe(618);
    expect(value(channelOf('uhf-tv', '69'))).toMatchObject({ centreMHz: 858, lowerMHz: 854, upperMHz: 862 });
  });

  it('gives VHF Band III TV 5 -> 177.5 MHz, 7 MHz wide', () => {
    expect(value(channelOf('vhf-tv', '5'))).toMatchObject({ centreMHz: 177.5, widthMHz: 7 });
    expect(value(channelOf('vhf-tv', '12')).centreMHz).toBe(226.5);
  });

  it('reads DAB blocks from the published table: 12B -> 225.648, 5A -> 174.928', () => {
    expect(value(channelOf('dab', '12b')).centreMHz).toBe(225.648);
    expect(value(channelOf('dab', 'block 5A')).centreMHz).toBe(174.928);
  });

  it('names FM by frequency on the 100 kHz raster', () => {
    expect(value(channelOf('fm', '97,3')).label).toBe('97.3');
    expect(error(channelOf('fm', '97.35'))).toMatch(/not on the 100 kHz raster/);
  });

  it('says what is wrong with a channel outside the band', () => {
    expect(error(channelOf('uhf-tv', '70'))).toBe('Channel must be at most 69 (got 70); UHF TV channels are 21-69');
    expect(error(channelOf('vhf-tv', '4'))).toMatch(/^Channel must be at least 5 .*channels are 5-12$/);
    expect(error(channelOf('dab', '14A'))).toMatch(/"14A" is not a Band III DAB block/);
    expect(error(channelOf('dab', ''))).toMatch(/^Channel is empty/);
    expect(error(channelOf('uhf-tv', 'forty'))).toMatch(/^Channel must be a number/);
  });
});

describe('channelAt', () => {
  it('finds the channel holding a frequency', () => {
    expect(value(channelAt('uhf-tv', '618')).label).toBe('39');
    expect(value(channelAt('uhf-tv', '614')).label).toBe('39');
    expect(value(channelAt('dab', '225.648 MHz')).label).toBe('12B');
    expect(value(channelAt('fm', '97.31')).label).toBe('97.3');
  });

  it('says when no channel of the band holds it', () => {
    expect(error(channelAt('uhf-tv', '300'))).toBe('300 MHz is not in any UHF TV channel');
    expect(error(channelAt('fm', '0'))).toBe('Frequency must be above 0 MHz (got 0 MHz)');
  });
});

describe('pathBetween (docs/checks.md, "Distance and bearing", GeodSolve0)', () => {
  it('matches GeographicLib: 5853.226 km, 53.47022 deg out, 111.59367 + 180 deg back', () => {
    const p = pathBetween({ lat: 40.6, lon: -73.8 }, { lat: 49.01666667, lon: 2.55 });
    expect(p.distanceKm).toBeCloseTo(5853.226, 3);
    expect(p.bearingAtoBDeg).toBeCloseTo(53.47022, 4);
    // The reverse bearing is the initial bearing at B towards A: the arrival azimuth turned round.
    expect(p.bearingBtoADeg).toBeCloseTo(111.59367 + 180, 4);
  });

  it('reads positions and names the bad field', () => {
    expect(readPosition({ lat: '52.1', lon: '3.2 W' }, 'A')).toEqual({ position: { lat: 52.1, lon: -3.2 }, errors: {} });
    const bad = readPosition({ lat: '95', lon: '' }, 'B');
    expect(bad.position).toBeNull();
    expect(bad.errors.lat).toMatch(/^Latitude of B must be at most 90/);
    expect(bad.errors.lon).toMatch(/^Longitude of B is empty/);
  });
});

describe('linkFigures (docs/checks.md, "Free space" worked examples)', () => {
  it('free-space loss: 100 MHz 10 km 92.45 dB, 600 MHz 50 km 121.99 dB, 7.5 GHz 30 km 139.49 dB', () => {
    const loss = (f: string, d: string) => linkFigures({ frequencyMHz: f, distanceKm: d, power: '1', powerUnit: 'W', reference: 'erp' }).figures!.lossDb;
    expect(loss('100', '10')).toBeCloseTo(92.45, 2);
    expect(loss('600', '50')).toBeCloseTo(121.99, 2);
    expect(loss('7500', '30')).toBeCloseTo(139.49, 2);
  });

  it('field strength: 1 kW e.r.p. at 10 km 86.9, 10 kW e.r.p. at 30 km 87.4, 100 W e.i.r.p. at 1 km 94.8 dB(uV/m)', () => {
    const field = (power: string, unit: 'W' | 'dBW', reference: 'erp' | 'eirp', d: string) =>
      linkFigures({ frequencyMHz: '600', distanceKm: d, power, powerUnit: unit, reference }).figures!.fieldDbUvPerM;
    expect(field('1000', 'W', 'erp', '10')).toBeCloseTo(86.9, 6);
    expect(field('40', 'dBW', 'erp', '30')).toBeCloseTo(87.36, 2);
    expect(field('100', 'W', 'eirp', '1')).toBeCloseTo(94.8, 6);
  });

  it('converts between e.r.p. and e.i.r.p. by 2.15 dB (ITU-R BS.561)', () => {
    const f = linkFigures({ frequencyMHz: '600', distanceKm: '10', power: '30', powerUnit: 'dBW', reference: 'erp' }).figures!;
    expect(f.erpDbw).toBe(30);
    expect(f.eirpDbw).toBeCloseTo(32.15, 10);
    expect(f.pfdDbWPerM2).toBeCloseTo(86.9 - 145.8, 6);
  });

  it('gives every field its own error and no figures', () => {
    const r = linkFigures({ frequencyMHz: '', distanceKm: '-2', power: '0', powerUnit: 'W', reference: 'erp' });
    expect(r.figures).toBeNull();
    expect(r.errors.frequencyMHz).toMatch(/^Frequency is empty/);
    expect(r.errors.distanceKm).toBe('Distance must be above 0 km (got -2 km)');
    expect(r.errors.power).toBe('Power must be above 0 W (got 0 W)');
  });
});

describe('horizonFigures (docs/checks.md, "Horizon, earth bulge, Fresnel zone" worked examples)', () => {
  it('radio horizon 300 m -> 71.39 km, 300 m + 10 m -> 84.43 km (k = 4/3)', () => {
    const r = horizonFigures({ height1M: '300', height2M: '10', distanceKm: '', frequencyMHz: '' }).figures!;
    expect(r.horizon1Km).toBeCloseTo(71.39, 2);
    expect(r.pathHorizonKm).toBeCloseTo(84.43, 2);
    expect(r.midPath).toBeNull();
  });

  it('earth bulge 50 km mid-path 36.79 m; F1 at 600 MHz 79.03 m; within horizon', () => {
    const r = horizonFigures({ height1M: '300', height2M: '10', distanceKm: '50', frequencyMHz: '600' }).figures!;
    expect(r.midPath!.earthBulgeM).toBeCloseTo(36.79, 2);
    expect(r.midPath!.fresnelF1M!).toBeCloseTo(79.03, 2);
    expect(r.midPath!.withinHorizon).toBe(true);
  });

  it('F1 at 7.5 GHz over 30 km is 17.31 m; a 90 km path is beyond an 84.43 km horizon', () => {
    expect(horizonFigures({ height1M: '0', height2M: '0', distanceKm: '30', frequencyMHz: '7500' }).figures!.midPath!.fresnelF1M!).toBeCloseTo(17.31, 2);
    expect(horizonFigures({ height1M: '300', height2M: '10', distanceKm: '90', frequencyMHz: '' }).figures!.midPath).toMatchObject({ withinHorizon: false, fresnelF1M: null });
  });

  it('names each bad field', () => {
    const r = horizonFigures({ height1M: '-5', height2M: 'x', distanceKm: '0', frequencyMHz: 'abc' });
    expect(r.figures).toBeNull();
    expect(r.errors).toEqual({
      height1M: 'Height of antenna 1 must be at least 0 m (got -5 m)',
      height2M: 'Height of antenna 2 must be a number of m (got "x")',
      distanceKm: 'Path length must be above 0 km (got 0 km)',
      frequencyMHz: 'Frequency must be a number of MHz (got "abc")',
    });
  });
});

describe('channelWords', () => {
  it('says centre, edges and width for TV and DAB, and only the raster for FM', () => {
    expect(channelWords(value(channelOf('uhf-tv', '39')))).toBe('Channel 39, UHF TV: centre 618.0 MHz, 614.0-622.0 MHz (8.0 MHz wide)');
    expect(channelWords(value(channelOf('dab', '12B')))).toBe('Block 12B, DAB Band III: centre 225.648 MHz, 224.880-226.416 MHz (1.536 MHz wide)');
    expect(channelWords(value(channelOf('fm', '97.3')))).toBe('97.3 MHz, FM Band II: a carrier on the 100 kHz raster (raster value not checked against the published text)');
  });
});

import { describe, expect, it } from 'vitest';
import { parseCoordinate, parseNumber, parsePowerDbw, visibleError } from './input';

const err = (p: { ok: boolean; error?: string }) => (p.ok ? null : p.error);

describe('parseNumber', () => {
  const rule = { label: 'Distance', unit: 'km', min: 0, minExclusive: true };

  it('reads plain, signed, exponent and comma-decimal numbers', () => {
    expect(parseNumber(' 12.5 ', { label: 'x' })).toEqual({ ok: true, value: 12.5 });
    expect(parseNumber('-3', { label: 'x' })).toEqual({ ok: true, value: -3 });
    expect(parseNumber('1e3', { label: 'x' })).toEqual({ ok: true, value: 1000 });
    expect(parseNumber('97,3', { label: 'x' })).toEqual({ ok: true, value: 97.3 });
    expect(parseNumber('.5', { label: 'x' })).toEqual({ ok: true, value: 0.5 });
  });

  it('names the field and the unit when the field is empty or not a number', () => {
    expect(err(parseNumber('', rule))).toBe('Distance is empty: enter a number of km');
    expect(err(parseNumber('ten', rule))).toBe('Distance must be a number of km (got "ten")');
    expect(err(parseNumber('1,000.5', rule))).toMatch(/must be a number/);
    expect(err(parseNumber('1.2.3', rule))).toMatch(/must be a number/);
  });

  it('holds the range and says which end was crossed', () => {
    expect(err(parseNumber('0', rule))).toBe('Distance must be above 0 km (got 0 km)');
    expect(err(parseNumber('-1', { label: 'Height', unit: 'm', min: 0 }))).toBe('Height must be at least 0 m (got -1 m)');
    expect(err(parseNumber('70', { label: 'Channel', min: 21, max: 69 }))).toBe('Channel must be at most 69 (got 70)');
    expect(err(parseNumber('39.5', { label: 'Channel', integer: true }))).toBe('Channel must be a whole number (got 39.5)');
  });
});

describe('parseCoordinate', () => {
  it('reads signed decimal degrees and hemisphere letters', () => {
    expect(parseCoordinate('52.1', 'lat', 'Latitude')).toEqual({ ok: true, value: 52.1 });
    expect(parseCoordinate('52.1 s', 'lat', 'Latitude')).toEqual({ ok: true, value: -52.1 });
    expect(parseCoordinate('3.4W', 'lon', 'Longitude')).toEqual({ ok: true, value: -3.4 });
    expect(parseCoordinate('-3.4°', 'lon', 'Longitude')).toEqual({ ok: true, value: -3.4 });
    expect(parseCoordinate('0 E', 'lon', 'Longitude')).toEqual({ ok: true, value: 0 });
  });

  it('refuses out-of-range values, the wrong letter and a sign with a letter', () => {
    expect(err(parseCoordinate('91', 'lat', 'Latitude of A'))).toBe('Latitude of A must be at most 90 degrees (got 91 degrees)');
    expect(err(parseCoordinate('-181', 'lon', 'Longitude of A'))).toBe('Longitude of A must be at least -180 degrees (got -181 degrees)');
    expect(err(parseCoordinate('52 E', 'lat', 'Latitude'))).toBe('Latitude takes N or S, not E');
    expect(err(parseCoordinate('-52 N', 'lat', 'Latitude'))).toBe('Latitude: use either a sign or N or S, not both');
    expect(err(parseCoordinate('', 'lon', 'Longitude'))).toMatch(/^Longitude is empty/);
    expect(err(parseCoordinate('52°30\'', 'lat', 'Latitude'))).toMatch(/decimal degrees/);
  });
});

describe('parsePowerDbw', () => {
  it('turns W, dBW and dBm into dBW', () => {
    const w = parsePowerDbw('1000', 'W');
    expect(w.ok && w.value).toBeCloseTo(30, 12);
    expect(parsePowerDbw('30', 'dBW')).toEqual({ ok: true, value: 30 });
    const dbm = parsePowerDbw('60', 'dBm');
    expect(dbm.ok && dbm.value).toBeCloseTo(30, 12);
  });

  it('refuses a power of 0 W, which has no level in dB', () => {
    expect(err(parsePowerDbw('0', 'W'))).toBe('Power must be above 0 W (got 0 W)');
    expect(err(parsePowerDbw('', 'dBW'))).toBe('Power is empty: enter a number of dBW');
  });
});

describe('visibleError', () => {
  it('waits until the field has text or was left', () => {
    expect(visibleError('', false, 'Distance is empty')).toBeNull();
    expect(visibleError('', true, 'Distance is empty')).toBe('Distance is empty');
    expect(visibleError('x', false, 'Distance must be a number')).toBe('Distance must be a number');
    expect(visibleError('5', true, undefined)).toBeNull();
  });
});

import { describe, expect, it } from 'vitest';
import * as u from './units';

describe('power units', () => {
  // Definitions: dBW = 10 log10(P / 1 W), dBm = dBW + 30.
  it('converts W, dBW and dBm both ways', () => {
    expect(u.wattsToDbw(1000)).toBeCloseTo(30, 12);
    expect(u.wattsToDbm(1)).toBeCloseTo(30, 12);
    expect(u.dbwToWatts(40)).toBeCloseTo(10_000, 6);
    expect(u.dbmToWatts(0)).toBeCloseTo(0.001, 15);
    expect(u.dbmToDbw(u.dbwToDbm(-7.3))).toBeCloseTo(-7.3, 12);
    expect(u.wattsToDbw(u.dbwToWatts(13.7))).toBeCloseTo(13.7, 12);
  });

  // ITU-R BS.561 Annex 1 section 2: e.i.r.p. = e.r.p. + 2.15 dB (dipole gain 1.64).
  it('e.r.p. <-> e.i.r.p. differs by 2.15 dB, a factor of 1.64 in watts', () => {
    expect(u.erpToEirpDb(30)).toBeCloseTo(32.15, 12);
    expect(u.eirpToErpDb(32.15)).toBeCloseTo(30, 12);
    expect(u.erpToEirpWatts(1000)).toBeCloseTo(1640.6, 1);
    expect(u.eirpToErpWatts(u.erpToEirpWatts(250))).toBeCloseTo(250, 9);
  });

  it('rejects zero, negative or non-finite power with a message naming the quantity', () => {
    expect(() => u.wattsToDbw(0)).toThrow(/power in W/);
    expect(() => u.wattsToDbw(-5)).toThrow(/above 0/);
    expect(() => u.dbwToWatts(Number.NaN)).toThrow(/dBW/);
    expect(() => u.erpToEirpWatts(-1)).toThrow(/e\.r\.p\./);
  });
});

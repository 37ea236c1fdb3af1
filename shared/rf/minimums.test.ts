import { describe, expect, it } from 'vitest';
import { dabMinimum, dvbtMinimum, fmMinimum, offAirFeedMinimum } from './minimums';

describe('FM minimums, ITU-R BS.412-9', () => {
  // Stereo row [S] (secondary page quoting BS.412); mono row [M] (recalled). docs/checks.md, "Planning minimum field strengths".
  it.each([
    ['stereo', 'rural', 54, 'secondary'],
    ['stereo', 'urban', 66, 'secondary'],
    ['stereo', 'large-city', 74, 'secondary'],
    ['mono', 'rural', 48, 'recalled'],
    ['mono', 'urban', 60, 'recalled'],
    ['mono', 'large-city', 70, 'recalled'],
  ] as const)('%s %s -> %s dB(uV/m), %s', (mode, env, value, confidence) => {
    const m = fmMinimum(mode, env);
    expect(m.valueDbUvPerM).toBe(value);
    expect(m.confidence).toBe(confidence);
    expect(m.reception).toContain('10 m above ground');
  });
});

describe('DVB-T minimums, GE06 RPC1 with 20 log(f/fr)', () => {
  // Worked [X], docs/checks.md, "Planning minimum field strengths": ch21 -> 53.26, ch60 -> 57.65, ch69 -> 58.41.
  it.each([
    [474, 53.26],
    [786, 57.65],
    [858, 58.41],
    [650, 56],
    [200, 50],
  ])('%s MHz -> %s dB(uV/m)', (f, expected) => {
    const r = dvbtMinimum(f);
    if (!r.ok) throw new Error(r.reason);
    expect(r.minimum.valueDbUvPerM).toBeCloseTo(expected, 2);
    expect(r.minimum.confidence).toBe('recalled');
    expect(r.minimum.reception).toContain('fixed rooftop');
  });
  it('portable RPC3 uses 30 log(f/fr)', () => {
    const r = dvbtMinimum(786, 'RPC3');
    if (!r.ok) throw new Error(r.reason);
    expect(r.minimum.valueDbUvPerM).toBeCloseTo(88 + 30 * Math.log10(786 / 650), 9);
  });
  it('outside Band III and IV/V there is no value', () => {
    const r = dvbtMinimum(300);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.reason).toMatch(/outside Band III/);
  });
});

describe('minimum for an off-air feed', () => {
  it('FM: stereo rural 54', () => {
    const r = offAirFeedMinimum('fm', 97.3);
    expect(r.ok && r.minimum.valueDbUvPerM).toBe(54);
  });
  it('DAB: RPC4 60 [M], stated as mobile', () => {
    expect(dabMinimum().valueDbUvPerM).toBe(60);
    const r = offAirFeedMinimum('dab', 225.648);
    expect(r.ok && r.minimum.valueDbUvPerM).toBe(60);
    expect(r.ok && r.minimum.reception).toMatch(/mobile/);
  });
  it('DTT needs a frequency; AM and other have no value', () => {
    expect(offAirFeedMinimum('dtt', null)).toMatchObject({ ok: false, reason: expect.stringMatching(/frequency missing/) });
    expect(offAirFeedMinimum('am', 1.2)).toMatchObject({ ok: false, reason: expect.stringMatching(/AM/) });
    expect(offAirFeedMinimum('other', 100)).toMatchObject({ ok: false });
  });
});

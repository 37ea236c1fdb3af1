import { describe, expect, it } from 'vitest';
import { CHECK_NAMES, type FeedCheck } from '@/shared/schemas/checks';
import { CHECK_SHORT, CHECK_TITLES, checkState, confidenceWords, limitWords, stateWords, valueWords, verdictOf } from './checkWords';

const base: FeedCheck = { name: 'field-strength', value: 60.2, unit: 'dBuV/m', limit: 56, ok: true, note: 'free space from 1000 W e.r.p.' };

describe('checkState and stateWords', () => {
  it('says passes or fails for a check with a limit', () => {
    expect(stateWords(base)).toMatchObject({ state: 'passes', words: 'passes', shape: 'solid' });
    expect(stateWords({ ...base, value: 50, ok: false })).toMatchObject({ state: 'fails', words: 'fails', shape: 'cross' });
  });

  it('says a figure without a limit is for reference, not that it passes', () => {
    const loss: FeedCheck = { name: 'free-space-loss', value: 121.99, unit: 'dB', ok: true, note: 'free space at 600 MHz' };
    expect(stateWords(loss)).toMatchObject({ state: 'figure', words: 'for reference', shape: null });
  });

  it('names the missing field when a value was not computed', () => {
    const c: FeedCheck = { ...base, value: null, limit: undefined, ok: null, note: 'not computed: ERP missing on carriage C12' };
    expect(checkState(c)).toBe('notComputed');
    expect(stateWords(c).words).toBe('not computed: ERP missing on carriage C12');
    expect(stateWords(c).shape).toBe('ring');
  });

  it('says does not apply and keeps the reason apart', () => {
    const c: FeedCheck = { name: 'clearance', value: null, unit: 'm', ok: null, note: 'not applicable: off-air feed; earth bulge, Fresnel zone and clearance are screened for microwave feeds' };
    const w = stateWords(c);
    expect(w.state).toBe('notApplicable');
    expect(w.words).toBe('does not apply');
    expect(w.reason).toMatch(/^off-air feed; earth bulge/);
  });

  it('tells a computed value with no limit to compare from one not computed', () => {
    const c: FeedCheck = { ...base, limit: null, ok: null, note: 'free space from 50 W e.r.p.; no limit compared: no planning minimum for AM in the sources this check uses' };
    expect(stateWords(c)).toMatchObject({ state: 'figure', words: 'no limit to compare' });
  });

  it('still reads a failure with no value (an ERP of 0) as a failure', () => {
    expect(checkState({ ...base, value: null, ok: false, note: 'ERP is 0 W on carriage C3' })).toBe('fails');
  });
});

describe('limitWords and valueWords', () => {
  it('say which way each limit works', () => {
    expect(limitWords(base)).toBe('planning minimum 56.0 dBµV/m');
    expect(limitWords({ name: 'horizon', limit: 84.432, unit: 'km' })).toBe('radio horizon 84.4 km');
    expect(limitWords({ name: 'bearing-record', limit: 5, unit: 'deg' })).toBe('within 5.0°');
    expect(limitWords({ name: 'channel-clash', limit: 8, unit: 'MHz' })).toBe('at least 8.0 MHz');
    expect(limitWords({ name: 'clearance', limit: 0, unit: 'm' })).toBe('at least 0.0 m');
  });

  it('give nothing when there is no limit, and no value rather than 0', () => {
    expect(limitWords({ name: 'earth-bulge', limit: undefined, unit: 'm' })).toBeNull();
    expect(limitWords({ name: 'field-strength', limit: null, unit: 'dBuV/m' })).toBeNull();
    expect(valueWords({ value: null, unit: 'dB' })).toBe('no value');
    expect(valueWords({ value: 0, unit: 'm' })).toBe('0.0 m');
  });
});

describe('confidenceWords', () => {
  it('flags recalled and secondary limits only', () => {
    expect(confidenceWords('recalled')).toBe('value not checked against the published text');
    expect(confidenceWords('secondary')).toBe('value from a secondary source quoting it');
    expect(confidenceWords('confirmed')).toBeNull();
    expect(confidenceWords(undefined)).toBeNull();
  });
});

describe('titles', () => {
  it('name every check the API can send', () => {
    for (const n of CHECK_NAMES) {
      expect(CHECK_TITLES[n]).toMatch(/\w/);
      expect(CHECK_SHORT[n]).toMatch(/\w/);
    }
  });
});

describe('verdictOf', () => {
  const pass: FeedCheck = base;
  const fail: FeedCheck = { ...base, value: 50, ok: false };
  const missing: FeedCheck = { ...base, value: null, limit: undefined, ok: null, note: 'not computed: recorded bearing missing on feed F1' };
  const na = (why: string): FeedCheck => ({ name: 'clearance', value: null, unit: 'm', ok: null, note: `not applicable: ${why}` });

  it('counts problems from failing checks and warnings, whichever says more', () => {
    expect(verdictOf([pass, fail, missing], ['Feed F1: too weak.'])).toEqual({ kind: 'fails', words: '1 problem on this feed', notComputed: 1, reason: null });
    expect(verdictOf([fail, fail], ['a', 'b']).words).toBe('2 problems on this feed');
  });

  it('says nothing fails, and how many could not be computed', () => {
    expect(verdictOf([pass, missing, na('microwave only')], [])).toEqual({ kind: 'clear', words: 'No check fails on this feed', notComputed: 1, reason: null });
  });

  it('says once why no check applies when every check gives the same reason', () => {
    const why = 'line feed; path checks do not apply (distance and bearing are given for reference)';
    expect(verdictOf([na(why), na(why)], [])).toEqual({ kind: 'noneApply', words: 'No path check applies to this feed', notComputed: 0, reason: why });
    expect(verdictOf([na('a'), na('b')], []).reason).toBeNull();
  });
});

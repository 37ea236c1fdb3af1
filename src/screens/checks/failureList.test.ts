import { describe, expect, it } from 'vitest';
import type { CheckFailure, FeedCheck } from '@/shared/schemas/checks';
import { chipCounts, chipLabel, DEFAULT_FILTER, filterParams, marginWords, readFilter, summaryWords, toggleCheck, valueAgainstLimit } from './failureList';

const check = (name: FeedCheck['name'], value: number | null, limit: number | null | undefined, unit: string): FeedCheck => ({ name, value, limit, unit, ok: false, note: '' });
const failure = (feed: string, c: FeedCheck, severity: 'error' | 'warning', margin?: number): CheckFailure => ({ feed, from: `${feed}-S`, to: `${feed}-T`, medium: 'off-air', check: c, severity, margin });

const list: CheckFailure[] = [
  failure('F1', check('channel-clash', 0, 8, 'MHz'), 'error'),
  failure('F2', check('field-strength', 48.2, 56, 'dBuV/m'), 'error', -7.8),
  failure('F2', check('horizon', 90, 84.43, 'km'), 'error', -5.57),
  failure('F3', check('bearing-record', 12, 5, 'deg'), 'warning', -7),
];

describe('readFilter and filterParams', () => {
  it('reads severity and a comma list of checks, ignoring unknown values', () => {
    expect(readFilter({ severity: 'error', check: 'horizon,field-strength,nonsense,horizon' })).toEqual({ severity: 'error', checks: ['field-strength', 'horizon'] });
    expect(readFilter({ severity: 'fatal' })).toEqual(DEFAULT_FILTER);
    expect(readFilter({ check: ['clearance', 'horizon'] }).checks).toEqual(['horizon', 'clearance']);
  });

  it('leaves defaults out of the URL and round-trips the rest', () => {
    expect(filterParams(DEFAULT_FILTER)).toEqual({ severity: undefined, check: undefined });
    const f = { severity: 'error' as const, checks: ['horizon' as const, 'channel-clash' as const] };
    expect(filterParams(f)).toEqual({ severity: 'error', check: 'horizon,channel-clash' });
    expect(readFilter(filterParams(f))).toEqual({ severity: 'error', checks: ['horizon', 'channel-clash'] });
  });

  it('toggles a check on and off', () => {
    const on = toggleCheck(DEFAULT_FILTER, 'horizon');
    expect(on.checks).toEqual(['horizon']);
    expect(toggleCheck(on, 'horizon').checks).toEqual([]);
  });
});

describe('summaryWords and chipCounts', () => {
  it('words the server\'s counts with thousands separators', () => {
    expect(summaryWords({ total: 17_512, errors: 17_000, warnings: 512, feeds: 9_001, byCheck: [] })).toBe('17,512 failing checks on 9,001 feeds: 17,000 errors, 512 warnings');
    expect(summaryWords({ total: 1, errors: 1, warnings: 0, feeds: 1, byCheck: [] })).toBe('1 failing check on 1 feed: 1 error, 0 warnings');
    expect(summaryWords({ total: 0, errors: 0, warnings: 0, feeds: 0, byCheck: [] })).toBe('No failing checks');
  });

  it('offers every kind that fails, in the fixed order, and keeps a chosen kind with none at 0', () => {
    const kinds = [
      { name: 'horizon' as const, count: 1200 },
      { name: 'channel-clash' as const, count: 3 },
    ];
    expect(chipCounts(kinds, [])).toEqual([
      { name: 'horizon', count: 1200 },
      { name: 'channel-clash', count: 3 },
    ]);
    expect(chipCounts(kinds, ['bearing-record']).map((k) => [k.name, k.count])).toEqual([
      ['horizon', 1200],
      ['channel-clash', 3],
      ['bearing-record', 0],
    ]);
    expect(chipLabel('horizon', 1200)).toMatch(/\(1,200\)$/);
  });
});

describe('valueAgainstLimit and marginWords', () => {
  it('put value and limit in the check unit and sign the margin', () => {
    expect(valueAgainstLimit(list[1])).toBe('48.2 dBµV/m against 56.0 dBµV/m');
    expect(marginWords(list[1])).toBe('-7.8 dBµV/m');
    expect(valueAgainstLimit(list[0])).toBe('0.0 MHz against 8.0 MHz');
    expect(marginWords(list[0])).toBe('no margin (a yes-or-no check)');
    expect(valueAgainstLimit(failure('F9', check('field-strength', null, 56, 'dBuV/m'), 'error'))).toBe('no value against 56.0 dBµV/m');
  });
});

import { describe, expect, it } from 'vitest';
import type { CheckFailure, FeedCheck } from '@/shared/schemas/checks';
import { countFailures, failureMemo, filterFailures } from './failurePages';

const check = (name: FeedCheck['name']): FeedCheck => ({ name, value: 1, limit: 2, unit: 'km', ok: false, note: '' });
const failure = (feed: string, name: FeedCheck['name'], severity: 'error' | 'warning'): CheckFailure => ({ feed, from: `${feed}-S`, to: `${feed}-T`, medium: 'off-air', check: check(name), severity });

const list: CheckFailure[] = [
  failure('F1', 'channel-clash', 'error'),
  failure('F2', 'field-strength', 'error'),
  failure('F2', 'horizon', 'error'),
  failure('F3', 'bearing-record', 'warning'),
];

describe('filterFailures', () => {
  it('keeps the order and drops warnings when asked for errors only', () => {
    expect(filterFailures(list, { severity: 'error' }).map((f) => f.check.name)).toEqual(['channel-clash', 'field-strength', 'horizon']);
    expect(filterFailures(list, { severity: 'warning' })).toHaveLength(4);
  });

  it('keeps only the chosen kinds of check', () => {
    expect(filterFailures(list, { severity: 'warning', checks: ['bearing-record', 'horizon'] }).map((f) => f.feed)).toEqual(['F2', 'F3']);
  });
});

describe('countFailures', () => {
  it('counts errors, warnings, distinct feeds and failures per check in the fixed order', () => {
    expect(countFailures(list)).toEqual({
      total: 4,
      errors: 3,
      warnings: 1,
      feeds: 3,
      byCheck: [
        { name: 'field-strength', count: 1 },
        { name: 'horizon', count: 1 },
        { name: 'channel-clash', count: 1 },
        { name: 'bearing-record', count: 1 },
      ],
    });
    expect(countFailures([])).toEqual({ total: 0, errors: 0, warnings: 0, feeds: 0, byCheck: [] });
  });
});

describe('failureMemo', () => {
  it('counts the filtered list, and the chips per kind at the severity whatever kinds are chosen', () => {
    const of = failureMemo(list);
    const some = of({ severity: 'error', checks: ['horizon'] });
    expect(some.rows.map((f) => f.feed)).toEqual(['F2']);
    expect(some.counts).toEqual({ total: 1, errors: 1, warnings: 0, feeds: 1, byCheck: [{ name: 'horizon', count: 1 }] });
    expect(some.kinds.map((k) => k.name)).toEqual(['field-strength', 'horizon', 'channel-clash']);
    // the same filter in another order is the same entry
    expect(of({ severity: 'error', checks: ['horizon', 'channel-clash'] })).toBe(of({ severity: 'error', checks: ['channel-clash', 'horizon'] }));
    expect(of({ severity: 'warning' }).counts.total).toBe(4);
  });
});

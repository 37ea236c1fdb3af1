import { describe, expect, it } from 'vitest';
import { lanes } from './lanes';

const w = (code: string, start: string, end: string) => ({ code, start: `2027-03-0${start}T00:00:00Z`, end: `2027-03-0${end}T00:00:00Z` });

describe('timeline lanes', () => {
  it('stacks overlapping windows and lets touching ones share a lane', () => {
    const out = lanes([w('A', '1', '3'), w('B', '2', '4'), w('C', '3', '5'), w('D', '1', '3')]);
    expect(out.map((l) => l.map((x) => x.code))).toEqual([['A', 'C'], ['D'], ['B']]);
  });
});

import { describe, expect, it } from 'vitest';
import { serviceCounts } from './serviceCounts';

describe('serviceCounts', () => {
  it('counts carriages, gaps and unfed per service, sorted by service', () => {
    expect(
      serviceCounts(
        [{ service: 'TV' }, { service: 'FM' }, { service: 'TV' }],
        [{ service: 'TV' }],
        [{ service: 'FM' }, { service: 'X' }],
      ),
    ).toEqual([
      { service: 'FM', carriages: 1, gaps: 0, unfed: 1 },
      { service: 'TV', carriages: 2, gaps: 1, unfed: 0 },
      // An unfed carriage of a service the document lacks still shows up rather than vanishing.
      { service: 'X', carriages: 0, gaps: 0, unfed: 1 },
    ]);
  });

  it('is empty for an empty network', () => {
    expect(serviceCounts([], [], [])).toEqual([]);
  });
});

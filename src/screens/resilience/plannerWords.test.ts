import { describe, expect, it } from 'vitest';
import type { Proposal } from '@/shared/schemas/analysis';
import { pairSentence, proposalDetail, proposalTitle } from './plannerWords';

const base: Proposal = {
  carriage: 'X.TV',
  from: 'A.TV',
  medium: 'off-air',
  removes: [{ kind: 'site', code: 'M' }, { kind: 'feed', code: 'f1' }],
  householdsProtected: 40000,
  distanceKm: 3.58,
  bearingDeg: 89.8,
  fieldStrengthDbuvm: 95.8,
  minimumDbuvm: 53.96,
  warnings: [],
};

describe('planner words', () => {
  it('an off-air proposal says what it removes, whom it protects and the screening figures', () => {
    expect(proposalTitle(base)).toBe('X.TV: new off-air reserve from A.TV');
    const d = proposalDetail(base);
    expect(d).toContain('Removes site M, feed f1; protects 40,000 households.');
    expect(d).toContain('planning minimum');
  });
  it('a satellite proposal says no receiver on the mast', () => {
    const p = { ...base, medium: 'satellite' as const, fieldStrengthDbuvm: null, minimumDbuvm: null };
    expect(proposalTitle(p)).toBe('X.TV: new satellite or line reserve from origin A.TV');
    expect(proposalDetail(p)).toContain('No receiver on the mast');
  });
  it('a pair in one sentence, with names', () => {
    const name = (e: { code: string }) => (e.code === 'S1' ? 'Hill One' : undefined);
    expect(pairSentence(name, [{ kind: 'site', code: 'S1' }, { kind: 'group', code: 'PWR' }], 40000, 3)).toBe('site S1 (Hill One) and group PWR together take 40,000 more households off air than either alone.');
    expect(pairSentence(name, [{ kind: 'site', code: 'S2' }, { kind: 'group', code: 'PWR' }], 0, 1)).toContain('1 more carriage off air');
  });
});

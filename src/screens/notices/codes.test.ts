import { describe, expect, it } from 'vitest';
import { choiceText, parseCodes } from './codes';

describe('notice choices', () => {
  it('reads codes separated by commas, spaces or lines, once each', () => {
    expect(parseCodes(' M1, R1\nR1;H1 ')).toEqual(['M1', 'R1', 'H1']);
    expect(parseCodes('  ')).toEqual([]);
  });
  it('says the choice in words', () => {
    expect(choiceText({ everything: true, services: [], sites: [] })).toBe('Everything');
    expect(choiceText({ everything: false, services: ['TV1'], sites: ['M1', 'R1'] })).toBe('services TV1; sites M1, R1');
    expect(choiceText({ everything: false, services: [], sites: [] })).toBe('Nothing');
  });
});

import { describe, expect, it } from 'vitest';
import { addToFailSet, formatFailSet, parseFailSet, reachUrl, removeFromFailSet, unknownFromDetails } from './failSet';

describe('parseFailSet', () => {
  it('reads nothing from an empty or missing parameter', () => {
    expect(parseFailSet(undefined)).toEqual({ elements: [], bad: [] });
    expect(parseFailSet('')).toEqual({ elements: [], bad: [] });
    expect(parseFailSet(' , ,')).toEqual({ elements: [], bad: [] });
  });

  it('reads kind:code tokens in order and drops repeats', () => {
    const { elements, bad } = parseFailSet('site:M-CORR,feed:F.1,site:M-CORR,group:SAT-TP7');
    expect(bad).toEqual([]);
    expect(elements).toEqual([
      { kind: 'site', code: 'M-CORR' },
      { kind: 'feed', code: 'F.1' },
      { kind: 'group', code: 'SAT-TP7' },
    ]);
  });

  it('accepts a repeated parameter (an array) and an upper-case kind', () => {
    expect(parseFailSet(['SITE:A', 'feed:B']).elements).toEqual([
      { kind: 'site', code: 'A' },
      { kind: 'feed', code: 'B' },
    ]);
  });

  it('names each bad token with its reason and keeps the good ones', () => {
    const { elements, bad } = parseFailSet('site:A,nonsense,mast:B,feed:,feed:has space');
    expect(elements).toEqual([{ kind: 'site', code: 'A' }]);
    expect(bad.map((b) => b.token)).toEqual(['nonsense', 'mast:B', 'feed:', 'feed:has space']);
    expect(bad[0].reason).toMatch(/kind:code/);
    expect(bad[1].reason).toMatch(/"mast" is not site, carriage, feed or group/);
    expect(bad[2].reason).toMatch(/1-64/);
  });

  it('refuses a code longer than 64 characters', () => {
    expect(parseFailSet(`site:${'x'.repeat(65)}`).bad).toHaveLength(1);
    expect(parseFailSet(`site:${'x'.repeat(64)}`).elements).toHaveLength(1);
  });
});

describe('formatFailSet', () => {
  it('sorts by kind (site, feed, group) then code and drops repeats', () => {
    expect(
      formatFailSet([
        { kind: 'group', code: 'G' },
        { kind: 'feed', code: 'B' },
        { kind: 'site', code: 'Z' },
        { kind: 'site', code: 'A' },
        { kind: 'feed', code: 'B' },
      ]),
    ).toBe('site:A,site:Z,feed:B,group:G');
    expect(formatFailSet([])).toBe('');
  });

  it('round-trips: parse(format(set)) gives the set back in canonical order', () => {
    const set = [
      { kind: 'feed' as const, code: 'F_2' },
      { kind: 'site' as const, code: 'S.1' },
    ];
    const text = formatFailSet(set);
    expect(parseFailSet(text).elements).toEqual([set[1], set[0]]);
    expect(formatFailSet(parseFailSet(text).elements)).toBe(text);
  });
});

describe('add and remove', () => {
  it('adds once and removes by kind and code', () => {
    const a = { kind: 'site' as const, code: 'A' };
    const fa = { kind: 'feed' as const, code: 'A' };
    const once = addToFailSet(addToFailSet([], a), a);
    expect(once).toEqual([a]);
    const both = addToFailSet(once, fa);
    expect(removeFromFailSet(both, a)).toEqual([fa]);
  });
});

describe('reachUrl', () => {
  it('builds a readable shareable address', () => {
    expect(reachUrl('http://localhost:8080/', [{ kind: 'site', code: 'M-CORR' }, { kind: 'feed', code: 'X.1' }])).toBe(
      'http://localhost:8080/reach?fail=site:M-CORR,feed:X.1',
    );
    expect(reachUrl('http://h', [])).toBe('http://h/reach');
  });
});

describe('unknownFromDetails', () => {
  it('reads the elements a 404 names and ignores anything else', () => {
    expect(unknownFromDetails({ unknown: [{ kind: 'site', code: 'NOPE' }, { kind: 'x', code: 'Y' }, 3] })).toEqual([{ kind: 'site', code: 'NOPE' }]);
    expect(unknownFromDetails(undefined)).toEqual([]);
    expect(unknownFromDetails({ unknown: 'site:A' })).toEqual([]);
  });
});

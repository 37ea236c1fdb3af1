import { describe, expect, it } from 'vitest';
import { readPersistedSession, SIGNED_OUT, writePersistedSession } from './persisted';
import { queryFromParams, safeNextPath, signInHref } from './nextPath';

const user = { id: 7, email: 'ana@example.test', name: 'Ana', role: 'operator' as const };

describe('readPersistedSession', () => {
  it('reads nothing stored as signed out', () => {
    expect(readPersistedSession(null)).toEqual(SIGNED_OUT);
    expect(readPersistedSession('')).toEqual(SIGNED_OUT);
  });

  it('round-trips what writePersistedSession stored', () => {
    const raw = writePersistedSession({ version: 1, token: 'tok', user });
    expect(readPersistedSession(raw)).toEqual({ version: 1, token: 'tok', user });
  });

  it('reads broken JSON, another version, an unknown role or half a session as signed out', () => {
    expect(readPersistedSession('{not json')).toEqual(SIGNED_OUT);
    expect(readPersistedSession(JSON.stringify({ version: 2, token: 'tok', user }))).toEqual(SIGNED_OUT);
    expect(readPersistedSession(JSON.stringify({ version: 1, token: 'tok', user: { ...user, role: 'owner' } }))).toEqual(SIGNED_OUT);
    expect(readPersistedSession(JSON.stringify({ version: 1, token: 'tok' }))).toEqual(SIGNED_OUT);
    expect(readPersistedSession(JSON.stringify({ version: 1, user }))).toEqual(SIGNED_OUT);
  });

  it('refuses to store a session with an unknown role', () => {
    expect(() => writePersistedSession({ version: 1, token: 't', user: { ...user, role: 'owner' as never } })).toThrow();
  });
});

describe('safeNextPath', () => {
  it('keeps a path on this origin, query included', () => {
    expect(safeNextPath('/reach?failed=S1,S2')).toBe('/reach?failed=S1,S2');
    expect(safeNextPath(['/network', '/other'])).toBe('/network');
  });

  it('falls back to home for anything that could leave the origin or loop', () => {
    for (const bad of [undefined, '', 'https://evil.test/', '//evil.test', '/\\evil.test', '/\t/evil.test', 'reach', '/sign-in', '/sign-in?next=/x', 42]) {
      expect(safeNextPath(bad)).toBe('/');
    }
  });
});

describe('signInHref', () => {
  it('carries the current place as an encoded next parameter', () => {
    expect(signInHref('/reach', '?failed=S1')).toBe('/sign-in?next=%2Freach%3Ffailed%3DS1');
  });
  it('omits next for home', () => {
    expect(signInHref('/')).toBe('/sign-in');
  });
});

describe('queryFromParams', () => {
  it('keeps query params and drops the route\'s own path params', () => {
    expect(queryFromParams({ code: 'HILL-1', tab: 'feeds' }, ['(main)', 'sites', '[code]'])).toBe('?tab=feeds');
    expect(queryFromParams({ rest: ['a', 'b'], q: 'x' }, ['(main)', 'docs', '[...rest]'])).toBe('?q=x');
  });
  it('repeats a param given several times and encodes values', () => {
    expect(queryFromParams({ failed: ['S1', 'S 2'] }, ['(main)', 'reach'])).toBe('?failed=S1&failed=S+2');
  });
  it('is empty when there is no query', () => {
    expect(queryFromParams({}, ['(main)'])).toBe('');
    expect(queryFromParams({ code: 'X' }, ['(main)', 'sites', '[code]'])).toBe('');
  });
});

import { describe, expect, it } from 'vitest';
import { auditApiPath, auditFilterFromParams, fieldChanges, showValue } from './auditView';

describe('audit paging and filter', () => {
  it('reads page and kind from the URL, ignoring what the server would refuse', () => {
    expect(auditFilterFromParams({})).toEqual({ page: 1, kind: undefined });
    expect(auditFilterFromParams({ page: '3', kind: 'feeds' })).toEqual({ page: 3, kind: 'feeds' });
    expect(auditFilterFromParams({ page: '0', kind: 'users' })).toEqual({ page: 1, kind: undefined });
  });

  it('builds the API path', () => {
    expect(auditApiPath({ page: 1 })).toBe('/api/audit?page=1&pageSize=25');
    expect(auditApiPath({ page: 2, kind: 'network' }, 10)).toBe('/api/audit?page=2&pageSize=10&kind=network');
  });
});

describe('fieldChanges', () => {
  it('marks the fields an update changed', () => {
    const before = { code: 'S1', name: 'Old', households: 10, groups: ['G1'], version: 1 };
    const after = { code: 'S1', name: 'New', groups: ['G1'], mastHeightM: 30, version: 2 };
    expect(fieldChanges(before, after)).toEqual([
      { field: 'code', before: 'S1', after: 'S1', changed: false },
      { field: 'name', before: 'Old', after: 'New', changed: true },
      { field: 'households', before: '10', after: '—', changed: true },
      { field: 'groups', before: 'G1', after: 'G1', changed: false },
      { field: 'version', before: '1', after: '2', changed: true },
      { field: 'mastHeightM', before: '—', after: '30', changed: true },
    ]);
  });

  it('shows every field of a created record as new', () => {
    expect(fieldChanges(null, { code: 'F', via: ['A', 'B'] })).toEqual([
      { field: 'code', before: '—', after: 'F', changed: true },
      { field: 'via', before: '—', after: 'A; B', changed: true },
    ]);
  });

  it('puts the fields in the document\'s order when given one', () => {
    const before = { lat: 1, version: 1, code: 'S', extra: 'x', name: 'A' };
    const after = { lat: 2, code: 'S', version: 2, name: 'A' };
    expect(fieldChanges(before, after, ['code', 'name', 'lat', 'version']).map((c) => c.field)).toEqual(['code', 'name', 'lat', 'version', 'extra']);
  });

  it('writes nested values as JSON', () => {
    expect(showValue({ sites: { created: 1 } })).toBe('{"sites":{"created":1}}');
    expect(showValue([])).toBe('—');
    expect(showValue(false)).toBe('false');
  });
});

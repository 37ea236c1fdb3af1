import { describe, expect, it } from 'vitest';
import { defaultListState, filteredListHref, listApiPath, listStateFromParams, pageCount, rangeText, routeParamsFor } from './listQuery';

describe('listStateFromParams', () => {
  it('gives the defaults for no params', () => {
    expect(listStateFromParams('sites', {})).toEqual(defaultListState());
  });

  it('reads search, page, sort, order and a known filter', () => {
    const s = listStateFromParams('sites', { q: 'Corr', page: '3', sort: 'households', order: 'desc', role: 'relay' });
    expect(s).toEqual({ q: 'Corr', page: 3, sort: 'households', order: 'desc', filters: { role: 'relay' } });
  });

  it('drops what the server would refuse: unknown sort, bad page, filter value outside the list, unknown filter', () => {
    const s = listStateFromParams('sites', { sort: 'DROP TABLE', page: '-2', role: 'tower', medium: 'line' });
    expect(s.sort).toBe('code');
    expect(s.page).toBe(1);
    expect(s.filters).toEqual({});
    expect(listStateFromParams('sites', { page: '2.5' }).page).toBe(1);
  });

  it('keeps link-only filters such as a site for feeds', () => {
    expect(listStateFromParams('feeds', { toSite: 'R-ARV', service: 'FMA' }).filters).toEqual({ toSite: 'R-ARV', service: 'FMA' });
  });

  it('takes the first of repeated params', () => {
    expect(listStateFromParams('feeds', { medium: ['line', 'satellite'] }).filters).toEqual({ medium: 'line' });
  });
});

describe('listApiPath', () => {
  it('builds the server query with paging and sort', () => {
    expect(listApiPath('sites', defaultListState())).toBe('/api/sites?page=1&pageSize=25&sort=code&order=asc');
  });

  it('escapes the search text and puts filters in a fixed order', () => {
    const a = listApiPath('feeds', { q: ' M&S 1 ', page: 2, sort: 'medium', order: 'desc', filters: { service: 'FMA', medium: 'off-air' } });
    const b = listApiPath('feeds', { q: ' M&S 1 ', page: 2, sort: 'medium', order: 'desc', filters: { medium: 'off-air', service: 'FMA' } });
    expect(a).toBe('/api/feeds?page=2&pageSize=25&sort=medium&order=desc&q=M%26S%201&medium=off-air&service=FMA');
    expect(b).toBe(a);
  });
});

describe('routeParamsFor', () => {
  it('sets defaults to undefined so they leave the URL', () => {
    expect(routeParamsFor('sites', defaultListState())).toEqual({ q: undefined, page: undefined, sort: undefined, order: undefined, role: undefined, group: undefined });
  });

  it('round-trips through listStateFromParams', () => {
    const state = { q: 'Vale', page: 4, sort: 'toSite', order: 'desc' as const, filters: { role: 'reserve', fromSite: 'M-ORRN' } };
    const params = routeParamsFor('feeds', state);
    expect(listStateFromParams('feeds', params)).toEqual(state);
  });
});

describe('filteredListHref', () => {
  it('links to a filtered list', () => {
    expect(filteredListHref('feeds', { toSite: 'R 1' })).toBe('/feeds?toSite=R%201');
    expect(filteredListHref('carriages', {})).toBe('/carriages');
  });

  it('refuses a filter the kind does not have', () => {
    expect(() => filteredListHref('services', { role: 'main' })).toThrow(/services lists accept the filters/);
  });
});

describe('paging words', () => {
  it('counts pages, at least one', () => {
    expect(pageCount(0, 25)).toBe(1);
    expect(pageCount(25, 25)).toBe(1);
    expect(pageCount(26, 25)).toBe(2);
    expect(() => pageCount(-1, 25)).toThrow(RangeError);
    expect(() => pageCount(10, 0)).toThrow(RangeError);
  });

  it('says which records a page shows', () => {
    expect(rangeText(1, 25, 0)).toBe('0 of 0');
    expect(rangeText(2, 25, 312)).toBe('26-50 of 312');
    expect(rangeText(13, 25, 312)).toBe('301-312 of 312');
    expect(rangeText(1, 25, 1200)).toBe('1-25 of 1,200');
  });
});

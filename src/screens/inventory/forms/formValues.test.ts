import { describe, expect, it } from 'vitest';
import { changesBetween, checkDraft, draftFromEntity, emptyDraft, parseNumber, rootField, splitCodes } from './formValues';

const site = { code: 'R-ARV', name: 'Arven Hill', role: 'relay', lat: -38.5, lon: -29.75, mastHeightM: 40, households: 1200, groups: ['PWR-NORTH', 'TEL-WEST'] };

describe('parseNumber', () => {
  it('reads decimal text and leaves blanks absent', () => {
    expect(parseNumber(' -38.25 ')).toBe(-38.25);
    expect(parseNumber('.5')).toBe(0.5);
    expect(parseNumber('1e3')).toBe(1000);
    expect(parseNumber('')).toBeUndefined();
    expect(parseNumber('   ')).toBeUndefined();
  });

  it('gives NaN for text that is not a whole decimal number', () => {
    for (const t of ['12 m', '1,5', 'abc', '0x10', '--1', 'Infinity']) expect(parseNumber(t)).toBeNaN();
  });
});

describe('splitCodes and rootField', () => {
  it('splits on ";", "," and spaces; drops repeats only for sets', () => {
    expect(splitCodes(' A; B,C  D ;; ')).toEqual(['A', 'B', 'C', 'D']);
    expect(splitCodes('S1; S2; S1')).toEqual(['S1', 'S2', 'S1']);
    expect(splitCodes('S1; S2; S1', true)).toEqual(['S1', 'S2']);
    expect(splitCodes('')).toEqual([]);
  });

  it('finds the field of a list item path', () => {
    expect(rootField('groups[1]')).toBe('groups');
    expect(rootField('via.0')).toBe('via');
    expect(rootField(['lat'])).toBe('lat');
    expect(rootField([])).toBe('');
  });
});

describe('site form', () => {
  it('turns a stored site into text and back into the same site', () => {
    const draft = draftFromEntity('sites', { ...site, version: 3, updatedAt: 'x' });
    expect(draft).toMatchObject({ code: 'R-ARV', lat: '-38.5', groundHeightM: '', groups: 'PWR-NORTH; TEL-WEST' });
    const checked = checkDraft('sites', draft);
    expect(checked).toEqual({ ok: true, entity: site });
  });

  it('says "latitude is between -90 and 90" under the latitude for 95', () => {
    const draft = { ...draftFromEntity('sites', site), lat: '95' };
    expect(checkDraft('sites', draft)).toEqual({ ok: false, errors: { lat: 'latitude is between -90 and 90' } });
  });

  it('names every wrong field of an empty draft, the first message each', () => {
    const r = checkDraft('sites', emptyDraft('sites'));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(Object.keys(r.errors).sort()).toEqual(['code', 'lat', 'lon', 'name', 'role']);
    expect(r.errors.lat).toBe('latitude must be a number');
    expect(r.errors.role).toBe('role is one of origin, main, relay');
  });

  it('says a number field holds text that is not a number, in the shared schema\'s words', () => {
    const r = checkDraft('sites', { ...draftFromEntity('sites', site), mastHeightM: '40 m', households: '-3' });
    expect(r).toEqual({ ok: false, errors: { mastHeightM: 'mast height must be a number', households: 'households cannot be negative' } });
  });

  it('refuses a bad code in the groups list under the groups field', () => {
    const r = checkDraft('sites', { ...draftFromEntity('sites', site), groups: 'PWR-NORTH; bad/code' });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors.groups).toMatch(/a code is 1-64 letters/);
  });
});

describe('feed and carriage forms', () => {
  it('keeps the via order and the yes/no flag', () => {
    const feed = { code: 'F1', from: 'A.FMA', to: 'B.FMA', medium: 'microwave', role: 'main', via: ['H2', 'H1'], bearingDeg: 12.5 };
    const r = checkDraft('feeds', draftFromEntity('feeds', feed));
    expect(r).toEqual({ ok: true, entity: feed });
    const carriage = { code: 'B.FMA', site: 'B', service: 'FMA', frequencyMHz: 95.8, onChannelRepeater: true };
    expect(checkDraft('carriages', draftFromEntity('carriages', carriage))).toEqual({ ok: true, entity: carriage });
  });

  it('leaves an unticked flag out rather than sending false', () => {
    const r = checkDraft('carriages', { ...emptyDraft('carriages'), code: 'C', site: 'S', service: 'V' });
    expect(r).toEqual({ ok: true, entity: { code: 'C', site: 'S', service: 'V' } });
  });

  it('checks the bearing range', () => {
    const r = checkDraft('feeds', { ...emptyDraft('feeds'), code: 'F', from: 'A', to: 'B', medium: 'line', role: 'main', bearingDeg: '361' });
    expect(r).toEqual({ ok: false, errors: { bearingDeg: 'bearing is 0-360°' } });
  });
});

describe('changesBetween', () => {
  it('sends only changed fields, cleared ones as null, never the code', () => {
    const next = { ...site, name: 'Arven Hill Relay', households: undefined, groups: ['TEL-WEST', 'PWR-NORTH'] };
    expect(changesBetween('sites', site, next)).toEqual({ name: 'Arven Hill Relay', households: null });
  });

  it('treats a reordered via list as a change but a reordered group set not', () => {
    const feed = { code: 'F', from: 'A', to: 'B', medium: 'line', role: 'main', via: ['H1', 'H2'], groups: ['G1', 'G2'] };
    expect(changesBetween('feeds', feed, { ...feed, via: ['H2', 'H1'], groups: ['G2', 'G1'] })).toEqual({ via: ['H2', 'H1'] });
  });

  it('sees nothing to change between a stored false flag and an unticked box', () => {
    const c = { code: 'C', site: 'S', service: 'V', onChannelRepeater: false };
    expect(changesBetween('carriages', c, { code: 'C', site: 'S', service: 'V' })).toEqual({});
  });
});

import { describe, expect, it } from 'vitest';
import { elementNamer, elementWords } from './elementNames';

describe('elementNamer', () => {
  const name = elementNamer({
    sites: [{ code: 'S', name: 'Site S', role: 'relay', lat: 0, lon: 0 }],
    services: [],
    groups: [{ code: 'G', name: 'Power' }],
    carriages: [],
    feeds: [{ code: 'F', from: 'A.TV', to: 'B.TV', medium: 'line', role: 'main' }],
  });

  it('names sites and groups and describes feeds by their ends', () => {
    expect(name({ kind: 'site', code: 'S' })).toBe('Site S');
    expect(name({ kind: 'group', code: 'G' })).toBe('Power');
    expect(name({ kind: 'feed', code: 'F' })).toBe('A.TV → B.TV');
    expect(name({ kind: 'site', code: 'G' })).toBeUndefined();
  });

  it('knows nothing without a document', () => {
    expect(elementNamer(undefined)({ kind: 'site', code: 'S' })).toBeUndefined();
    expect(elementWords({ kind: 'feed', code: 'F.1' })).toBe('feed F.1');
  });
});

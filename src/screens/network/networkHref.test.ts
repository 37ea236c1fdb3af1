import { describe, expect, it } from 'vitest';
import { networkHref } from './networkHref';

describe('networkHref', () => {
  it('leaves out what is empty', () => {
    expect(networkHref(null, '')).toBe('/network');
    expect(networkHref('MX1', '')).toBe('/network?service=MX1');
    expect(networkHref(null, 'site:A')).toBe('/network?fail=site:A');
    expect(networkHref('MX1', 'site:A,feed:B')).toBe('/network?service=MX1&fail=site:A,feed:B');
    expect(networkHref('MX1', '', 'map')).toBe('/network?service=MX1');
  });

  it('names the schematic view', () => {
    expect(networkHref('MX1', 'site:A', 'schematic')).toBe('/network?service=MX1&fail=site:A&view=schematic');
  });
});

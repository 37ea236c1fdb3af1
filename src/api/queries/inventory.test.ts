import { describe, expect, it } from 'vitest';
import { isNetworkKey } from './inventory';

describe('isNetworkKey', () => {
  it('takes network answers, plain or as array keys, and leaves account answers alone', () => {
    expect(isNetworkKey('/api/sites?q=a')).toBe(true);
    expect(isNetworkKey(['network-drawing', '/api/network/export'])).toBe(true);
    expect(isNetworkKey(['element-search', '/api/sites', 'hill', 6])).toBe(true);
    expect(isNetworkKey('/api/auth/me')).toBe(false);
    expect(isNetworkKey('/api/users')).toBe(false);
    expect(isNetworkKey(['people', '/api/users'])).toBe(false);
    expect(isNetworkKey(['element-search', 'hill', 6])).toBe(false);
  });
});

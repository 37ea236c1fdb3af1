/**
 * The change notification's payload (server/db/networkChange.ts): it names
 * the codes an edit touched, stays within its size limit, and anything it
 * cannot read names no codes (the receiver rebuilds).
 */
import { describe, expect, it } from 'vitest';
import { ChangeCollector, decodeChange, encodeChange, MAX_PAYLOAD } from '@/server/db/networkChange';

describe('network change payload', () => {
  it('carries the version and the codes of a small change', () => {
    const payload = encodeChange({ version: 12, codes: { sites: ['S1'], feeds: ['F1', 'F2'] } });
    expect(payload.length).toBeLessThanOrEqual(MAX_PAYLOAD);
    expect(decodeChange(payload)).toEqual({ version: 12, codes: { sites: ['S1'], feeds: ['F1', 'F2'] } });
  });

  it('drops the codes of a change too large to name, keeping the version', () => {
    const feeds = Array.from({ length: 500 }, (_, i) => `FEED-${i}`);
    const payload = encodeChange({ version: 13, codes: { feeds } });
    expect(payload.length).toBeLessThanOrEqual(MAX_PAYLOAD);
    expect(decodeChange(payload)).toEqual({ version: 13, codes: null });
  });

  it('reads the bare version of the older form, and nothing from malformed payloads', () => {
    expect(decodeChange('7')).toEqual({ version: 7, codes: null });
    expect(decodeChange('{"v":8,"c":{"people":["x"]}}')).toEqual({ version: 8, codes: null });
    expect(decodeChange('{"v":8,"c":{"sites":[1]}}')).toEqual({ version: 8, codes: null });
    for (const bad of ['', 'x', '{"v":-1}', '{"c":{}}', '[1]', '{"v":1.5}']) expect(decodeChange(bad)).toBeNull();
  });

  it('collects codes per kind from audit entries; an import or other kind leaves the change unnamed', () => {
    const c = new ChangeCollector();
    c.add('sites', 'S1');
    c.add('sites', 'S1');
    c.add('carriages', 'S1.V1');
    expect(c.result()).toEqual({ sites: ['S1'], carriages: ['S1.V1'] });
    c.add('network', null);
    expect(c.result()).toBeNull();
    const d = new ChangeCollector();
    d.markUnnamed();
    expect(d.result()).toBeNull();
  });
});

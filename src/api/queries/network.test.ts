import { describe, expect, it } from 'vitest';
import { attachmentName, exportPath, importPath } from './network';

describe('network transfer paths', () => {
  it('says dry run and replace every time', () => {
    expect(importPath({ dryRun: true, replace: false })).toBe('/api/network/import?dryRun=true&replace=false');
    expect(importPath({ dryRun: false, replace: true })).toBe('/api/network/import?dryRun=false&replace=true');
    expect(exportPath('json')).toBe('/api/network/export');
    expect(exportPath('csv')).toBe('/api/network/export?format=csv');
  });
});

describe('attachmentName', () => {
  it('reads the plain and the quoted filename', () => {
    expect(attachmentName('attachment; filename=network-v2.zip', 'x')).toBe('network-v2.zip');
    expect(attachmentName('attachment; filename="network-v2.json"', 'x')).toBe('network-v2.json');
  });

  it('prefers the RFC 6266 UTF-8 form', () => {
    expect(attachmentName(`attachment; filename="net.json"; filename*=UTF-8''r%C3%A9seau.json`, 'x')).toBe('réseau.json');
  });

  it('falls back when there is no usable name', () => {
    expect(attachmentName(null, 'network.json')).toBe('network.json');
    expect(attachmentName('attachment', 'network.json')).toBe('network.json');
    expect(attachmentName(`attachment; filename*=UTF-8''%E0%A4%A`, 'network.json')).toBe('network.json');
  });
});

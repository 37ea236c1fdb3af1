import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { opensDeferredScreen } from './deferredPaths';

describe('which addresses open a deferred screen', () => {
  it('home, sign-in and the network diagram do not; the deferred screens do', () => {
    for (const p of ['/', '/sign-in', '/network', '/network/']) expect(opensDeferredScreen(p), p).toBe(false);
    for (const p of ['/reach', '/resilience', '/checks', '/carriages/R1.TV', '/sites', '/admin/audit']) expect(opensDeferredScreen(p), p).toBe(true);
  });

  it('agrees with the route files: the ones said not to need the chunk do not use it', () => {
    const app = path.join(__dirname, '..', '..', 'app');
    const routeFile = { '/': '(main)/index.tsx', '/sign-in': 'sign-in.tsx', '/network': '(main)/network.tsx' };
    for (const [p, file] of Object.entries(routeFile)) {
      expect(opensDeferredScreen(p)).toBe(false);
      expect(fs.readFileSync(path.join(app, file), 'utf8'), file).not.toContain('deferredScreen');
    }
    expect(fs.readFileSync(path.join(app, '(main)', 'reach.tsx'), 'utf8')).toContain('deferredScreen');
  });
});

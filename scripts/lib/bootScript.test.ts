import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import vm from 'node:vm';
import { describe, expect, it } from 'vitest';
import { bootPlanFor, bootScriptFor, routeChunks, routePath, withBootScript, writeBootScript } from './bootScript';

// The route table as Metro writes it into the entry script (the shape of an Expo Router export; names invented).
const entry = [
  '__d(function(g,r,i,a,m,e,d){m.exports=r(d[0])},10,[11]);',
  '__d(function(g,r,i,a,m,e,d){const t=Object.defineProperties({},{"./(main)/_layout.tsx":{enumerable:!0,get:()=>r(d[1])(d[0],d.paths)},"./(main)/index.tsx":{enumerable:!0,get:()=>r(d[1])(d[2],d.paths)},"./(main)/network.tsx":{enumerable:!0,get:()=>r(d[1])(d[3],d.paths)},"./(main)/sites/index.tsx":{enumerable:!0,get:()=>r(d[1])(d[4],d.paths)},"./(main)/sites/[code].tsx":{enumerable:!0,get:()=>r(d[1])(d[5],d.paths)},"./_layout.tsx":{enumerable:!0,get:()=>r(d[1])(d[6],d.paths)},"./sign-in.tsx":{enumerable:!0,get:()=>r(d[1])(d[7],d.paths)},"./+not-found.tsx":{enumerable:!0,get:()=>r(d[1])(d[8],d.paths)}});m.exports=t},20,[30,10,31,32,33,34,35,36,37],{"0":30,"1":10,"2":31,"3":32,"4":33,"5":34,"6":35,"7":36,"8":37,"paths":{"30":"/_expo/static/js/web/_layout-aaaa.js","31":"/_expo/static/js/web/index-bbbb.js","32":"/_expo/static/js/web/network-cccc.js","33":"/_expo/static/js/web/index-dddd.js","34":"/_expo/static/js/web/[code]-eeee.js","35":"/_expo/static/js/web/_layout-ffff.js","36":"/_expo/static/js/web/sign-in-1111.js","37":"/_expo/static/js/web/+not-found-2222.js"}});',
  '__d(function(g,r,i,a,m,e,d){},21,[]);',
].join('\n');

describe('the boot script build', () => {
  it("reads each route file's chunk from the entry script's route table", () => {
    const chunks = routeChunks(entry)!;
    expect(chunks.get('./(main)/network.tsx')).toBe('/_expo/static/js/web/network-cccc.js');
    expect(chunks.get('./(main)/sites/index.tsx')).toBe('/_expo/static/js/web/index-dddd.js'); // one of two files named index
    expect(chunks.get('./(main)/index.tsx')).toBe('/_expo/static/js/web/index-bbbb.js');
    expect(chunks.size).toBe(8);
    expect(routeChunks('__d(function(){},1,[]);')).toBeNull(); // another bundler's shape: nothing rather than guesses
    expect(routeChunks(entry.replace(/"paths":\{[^}]*\}/, '"paths":7'))).toBeNull();
  });

  it('maps route files to the addresses they open', () => {
    expect(routePath('./(main)/network.tsx')).toBe('/network');
    expect(routePath('./(main)/index.tsx')).toBe('/');
    expect(routePath('./(main)/sites/index.tsx')).toBe('/sites');
    expect(routePath('./(main)/works/new.tsx')).toBe('/works/new');
    expect(routePath('./sign-in.tsx')).toBe('/sign-in');
    for (const none of ['./_layout.tsx', './(main)/_layout.tsx', './(main)/sites/[code].tsx', './+not-found.tsx', './(main)/[...missing].tsx']) expect(routePath(none)).toBeNull();
  });

  it('plans the layouts for every page and each screen for its address', () => {
    const plan = bootPlanFor(routeChunks(entry), '/_expo/static/js/web/deferred-9999.js');
    expect(plan.always).toEqual(['/_expo/static/js/web/_layout-aaaa.js', '/_expo/static/js/web/_layout-ffff.js']);
    expect(plan.byPath).toEqual({
      '/': ['/_expo/static/js/web/index-bbbb.js'],
      '/network': ['/_expo/static/js/web/network-cccc.js'],
      '/sites': ['/_expo/static/js/web/index-dddd.js'],
      '/sign-in': ['/_expo/static/js/web/sign-in-1111.js'],
    });
    expect(plan.deferred?.chunk).toBe('/_expo/static/js/web/deferred-9999.js');
    expect(plan.deferred?.notFor).toContain('/network');
    expect(plan.drawingPath).toBe('/api/network/drawing');
    expect(bootPlanFor(null, null)).toMatchObject({ always: [], byPath: {}, deferred: null });
  });

  it('bundles a script that runs on its own and carries its plan', () => {
    const plan = bootPlanFor(routeChunks(entry), null);
    const code = bootScriptFor(plan);
    expect(code).not.toMatch(/\brequire\(|\bimport\b/);
    const appended: string[] = [];
    const window = {
      location: { pathname: '/network' },
      localStorage: { getItem: () => null },
      fetch: () => Promise.reject(new Error('not expected')),
      document: { head: { appendChild: (l: { href: string }) => appended.push(l.href) }, createElement: () => ({}) },
    };
    vm.runInNewContext(code, { window });
    expect(appended).toEqual([...plan.always, '/_expo/static/js/web/network-cccc.js']);
  });

  it('loads the script first in the head, once, however often the build runs', () => {
    const html = '<!DOCTYPE html><html><head><title>x</title></head><body><script src="/a.js" defer></script></body></html>';
    const once = withBootScript(html, '/_expo/static/js/web/boot-0123456789abcdef0123456789abcdef.js');
    expect(once).toMatch(/<head>\s*<script src="\/_expo\/static\/js\/web\/boot-0123456789abcdef0123456789abcdef\.js" async><\/script><title>/);
    const twice = withBootScript(once, '/_expo/static/js/web/boot-fedcba9876543210fedcba9876543210.js');
    expect(twice.match(/boot-/g)).toHaveLength(1);
    expect(twice).toContain('boot-fedcba9876543210fedcba9876543210.js');
    expect(() => withBootScript('<html><body></body></html>', '/b.js')).toThrow(/no <head>/);
  });

  it('writes the script beside the chunks and says what it could not find', () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'boot-'));
    const chunkDir = path.join(dir, '_expo', 'static', 'js', 'web');
    fs.mkdirSync(chunkDir, { recursive: true });
    fs.writeFileSync(path.join(dir, 'index.html'), '<html><head></head><body></body></html>');
    fs.writeFileSync(path.join(chunkDir, 'entry-0123456789abcdef0123456789abcdef.js'), entry);
    const r = writeBootScript(dir);
    expect(r.warnings).toEqual(['0 chunks named deferred: it is not preloaded']);
    expect(fs.readFileSync(path.join(dir, 'index.html'), 'utf8')).toContain(r.src);
    expect(fs.existsSync(path.join(dir, ...r.src.split('/').filter(Boolean)))).toBe(true);
    fs.rmSync(dir, { recursive: true, force: true });
  });
});

/**
 * The web export's scripts go out compressed at build time (scripts/lib/precompress.ts,
 * server/http/precompressed.ts): brotli to a browser that accepts br, gzip to
 * one that accepts only gzip, the file itself otherwise, each answer marked
 * `Vary: Accept-Encoding` and decoding to exactly the built file. Requests are
 * made with node's http client, which does not decode bodies, so the bytes
 * checked are the bytes sent.
 */
import fs from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { precompressDir } from '@/scripts/lib/precompress';
import { makeTestApp, type TestApp } from '@/test/helpers/testApp';

const SCRIPT = '/_expo/static/js/web/entry-0123abcd.js';
let dir: string;
let script: Buffer;
let t: TestApp;
let server: http.Server;
let base: string;

interface Answer {
  status: number;
  headers: http.IncomingHttpHeaders;
  body: Buffer;
}

function get(pathname: string, headers: Record<string, string> = {}, method = 'GET'): Promise<Answer> {
  return new Promise((resolve, reject) => {
    const req = http.request(`${base}${pathname}`, { method, headers }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
    });
    req.on('error', reject);
    req.end();
  });
}

beforeAll(async () => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'headwater-web-'));
  // a real minified script of some size, as the export writes them
  script = fs.readFileSync(path.join(__dirname, '..', '..', 'node_modules', 'react-dom', 'cjs', 'react-dom-client.production.js'));
  fs.mkdirSync(path.join(dir, '_expo/static/js/web'), { recursive: true });
  fs.writeFileSync(path.join(dir, SCRIPT), script);
  fs.writeFileSync(path.join(dir, 'sw.js'), script.subarray(0, 20_000));
  fs.writeFileSync(path.join(dir, 'tiny.js'), 'console.log(1);\n');
  fs.writeFileSync(path.join(dir, 'index.html'), '<!DOCTYPE html><title>app</title>');
  precompressDir(dir);
  t = await makeTestApp({ webDir: dir });
  server = t.app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
}, 60_000);

afterAll(async () => {
  if (server) await new Promise((r) => server.close(r));
  await t?.close();
  fs.rmSync(dir, { recursive: true, force: true });
});

const varies = (a: Answer) => String(a.headers.vary ?? '').toLowerCase().split(/\s*,\s*/).includes('accept-encoding');

describe('precompressed web files', () => {
  it('sends brotli to a browser that accepts br, and the bytes decode to the script', async () => {
    const a = await get(SCRIPT, { 'Accept-Encoding': 'gzip, deflate, br, zstd' });
    expect(a.status).toBe(200);
    expect(a.headers['content-encoding']).toBe('br');
    expect(a.headers['content-type']).toMatch(/^(text|application)\/javascript/);
    expect(varies(a)).toBe(true);
    expect(a.body.equals(fs.readFileSync(path.join(dir, `${SCRIPT}.br`)))).toBe(true);
    expect(Number(a.headers['content-length'])).toBe(a.body.length);
    expect(zlib.brotliDecompressSync(a.body).equals(script)).toBe(true);
    // brotli 11 beats what a per-request gzip -6 would send
    expect(a.body.length).toBeLessThan(zlib.gzipSync(script, { level: 6 }).length * 0.9);
  });

  it('sends gzip to a browser that accepts only gzip (or refuses br)', async () => {
    for (const accept of ['gzip', 'br;q=0, gzip', 'gzip;q=1, br;q=0.5']) {
      const a = await get(SCRIPT, { 'Accept-Encoding': accept });
      expect(a.status, accept).toBe(200);
      expect(a.headers['content-encoding'], accept).toBe('gzip');
      expect(varies(a)).toBe(true);
      expect(zlib.gunzipSync(a.body).equals(script), accept).toBe(true);
    }
  });

  it('sends the script itself to a browser that accepts neither', async () => {
    for (const accept of [undefined, 'identity', 'deflate', 'br;q=0, gzip;q=0']) {
      const a = await get(SCRIPT, accept ? { 'Accept-Encoding': accept } : {});
      expect(a.status, accept).toBe(200);
      expect(a.headers['content-encoding'], accept).toBeUndefined();
      expect(varies(a), accept).toBe(true);
      expect(a.body.equals(script), accept).toBe(true);
    }
  });

  it('answers HEAD with the encoded length and no body, and keeps the service worker uncached', async () => {
    const head = await get(SCRIPT, { 'Accept-Encoding': 'br' }, 'HEAD');
    expect(head.status).toBe(200);
    expect(head.headers['content-encoding']).toBe('br');
    expect(Number(head.headers['content-length'])).toBe(fs.statSync(path.join(dir, `${SCRIPT}.br`)).size);
    expect(head.body.length).toBe(0);
    const sw = await get('/sw.js', { 'Accept-Encoding': 'br' });
    expect(sw.headers['content-encoding']).toBe('br');
    expect(sw.headers['cache-control']).toBe('no-cache');
    expect(zlib.brotliDecompressSync(sw.body).equals(script.subarray(0, 20_000))).toBe(true);
    const cached = await get(SCRIPT, { 'Accept-Encoding': 'br' });
    expect(cached.headers['cache-control']).toBe('public, max-age=3600');
  });

  it('leaves a file with no compressed copy to the usual static serving, and never serves from outside the export', async () => {
    expect(fs.existsSync(path.join(dir, 'tiny.js.br'))).toBe(false);
    const tiny = await get('/tiny.js', { 'Accept-Encoding': 'br' });
    expect(tiny.status).toBe(200);
    expect(tiny.body.toString()).toBe('console.log(1);\n');
    fs.writeFileSync(path.join(path.dirname(dir), 'outside.js'), 'secret');
    for (const p of ['/%2e%2e/outside.js', '/..%2foutside.js', '/%E0%A4%A.js']) {
      const a = await get(p, { 'Accept-Encoding': 'br' });
      expect(a.body.toString(), p).not.toContain('secret');
      expect(a.status, p).toBeLessThan(500);
    }
    fs.rmSync(path.join(path.dirname(dir), 'outside.js'));
  });
});

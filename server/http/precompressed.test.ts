/**
 * Choosing the encoding from Accept-Encoding, and the build step that writes
 * the compressed copies (the serving itself: test/api/web-precompressed.test.ts).
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { precompressDir } from '@/scripts/lib/precompress';
import { chooseEncoding } from './precompressed';

describe('chooseEncoding', () => {
  it.each([
    [undefined, 'identity'],
    ['', 'identity'],
    ['gzip, deflate, br, zstd', 'br'],
    ['br', 'br'],
    ['gzip', 'gzip'],
    ['deflate', 'identity'],
    ['identity', 'identity'],
    ['*', 'br'],
    ['*;q=0', 'identity'],
    ['br;q=0, gzip', 'gzip'],
    ['br;q=0, *', 'gzip'],
    ['gzip;q=1, br;q=0.5', 'gzip'],
    ['gzip;q=0.5, br;q=0.9', 'br'],
    ['gzip;q=0.5, br;q=0.5', 'br'],
    ['GZIP;Q=0.3', 'gzip'],
    ['br;q=zero, gzip', 'gzip'],
    [',,;;=', 'identity'],
  ])('%j -> %s', (header, expected) => {
    expect(chooseEncoding(header)).toBe(expected);
  });
});

describe('precompressDir', () => {
  it('writes brotli and gzip copies that decode to the file, skips small files and maps, and drops stale copies', () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'headwater-pack-'));
    try {
      const body = Buffer.from('function add(a,b){return a+b}\n'.repeat(400));
      fs.writeFileSync(path.join(dir, 'a.js'), body);
      fs.writeFileSync(path.join(dir, 'a.js.map'), body);
      fs.writeFileSync(path.join(dir, 'small.js'), 'x=1');
      fs.writeFileSync(path.join(dir, 'gone.js.br'), 'left from an earlier build');
      fs.writeFileSync(path.join(dir, 'gone.js.gz'), 'left from an earlier build');
      const r = precompressDir(dir);
      expect(r.files).toBe(1);
      expect(r.bytes).toBe(body.length);
      expect(zlib.brotliDecompressSync(fs.readFileSync(path.join(dir, 'a.js.br'))).equals(body)).toBe(true);
      expect(zlib.gunzipSync(fs.readFileSync(path.join(dir, 'a.js.gz'))).equals(body)).toBe(true);
      expect(r.brBytes).toBe(fs.statSync(path.join(dir, 'a.js.br')).size);
      expect(fs.readdirSync(dir).sort()).toEqual(['a.js', 'a.js.br', 'a.js.gz', 'a.js.map', 'small.js']);
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
});

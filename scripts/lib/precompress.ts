/**
 * Compresses the web export once, at build time: beside each script, style,
 * font and other text file of dist/web it writes `name.br` (brotli, quality
 * 11) and `name.gz` (gzip, level 9), which server/http/precompressed.ts sends
 * to browsers that accept them. Quality 11 is too slow to run per request
 * (seconds for the framework script) but costs nothing at build time.
 */
import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';

/** Files worth compressing: text and fonts; images are compressed already. */
const COMPRESSIBLE = /\.(js|css|html|json|svg|ttf|otf|txt|map)$/;
/** Below this the headers outweigh what compression saves. */
const MIN_BYTES = 1024;

export function brotli(body: Buffer): Buffer {
  return zlib.brotliCompressSync(body, {
    params: {
      [zlib.constants.BROTLI_PARAM_QUALITY]: 11,
      [zlib.constants.BROTLI_PARAM_MODE]: zlib.constants.BROTLI_MODE_TEXT,
      [zlib.constants.BROTLI_PARAM_SIZE_HINT]: body.length,
    },
  });
}

export const gzip = (body: Buffer): Buffer => zlib.gzipSync(body, { level: 9 });

function walk(dir: string, out: string[] = []): string[] {
  for (const e of fs.readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, e.name);
    if (e.isDirectory()) walk(full, out);
    else out.push(full);
  }
  return out;
}

export interface PrecompressResult {
  files: number;
  bytes: number;
  brBytes: number;
  gzBytes: number;
}

/**
 * Writes `.br` and `.gz` beside every compressible file of `dir` (source maps
 * excluded unless `maps`), and removes copies left from an earlier build whose
 * original is gone or newer. A file is served precompressed only when both
 * copies exist, so one that does not shrink gets neither.
 */
export function precompressDir(dir: string, { maps = false } = {}): PrecompressResult {
  const result: PrecompressResult = { files: 0, bytes: 0, brBytes: 0, gzBytes: 0 };
  const all = walk(dir);
  for (const f of all.filter((f) => f.endsWith('.br') || f.endsWith('.gz'))) {
    const original = f.slice(0, -3);
    if (!fs.existsSync(original) || fs.statSync(original).mtimeMs > fs.statSync(f).mtimeMs) fs.rmSync(f);
  }
  for (const file of all) {
    if (!COMPRESSIBLE.test(file) || (!maps && file.endsWith('.map'))) continue;
    const body = fs.readFileSync(file);
    if (body.length < MIN_BYTES) continue;
    const br = brotli(body);
    const gz = gzip(body);
    if (br.length >= body.length || gz.length >= body.length) continue;
    fs.writeFileSync(`${file}.br`, br);
    fs.writeFileSync(`${file}.gz`, gz);
    result.files += 1;
    result.bytes += body.length;
    result.brBytes += br.length;
    result.gzBytes += gz.length;
  }
  return result;
}

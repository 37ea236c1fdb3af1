/**
 * The exported web app (Expo Router, web.output "single") in dist/web, with
 * its service worker and a brotli and a gzip copy of each text file beside it
 * (precompress.ts). Rebuilt only when a client source is newer than the last
 * export.
 */
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { REPO_ROOT } from './postgres';
import { writeBootScript } from './bootScript';
import { precompressDir } from './precompress';

export const WEB_DIR = path.join(REPO_ROOT, 'dist', 'web');
const STAMP = path.join(WEB_DIR, '.headwater-build');
const SOURCES = ['app', 'src', 'shared', 'fonts', 'assets', 'app.json', 'package.json', 'metro.config.js', 'babel.config.js', 'scripts/lib/bootScript.ts'];

function newestMtime(p: string): number {
  if (!fs.existsSync(p)) return 0;
  const st = fs.statSync(p);
  if (!st.isDirectory()) return st.mtimeMs;
  let newest = st.mtimeMs;
  for (const e of fs.readdirSync(p)) {
    if (e === 'node_modules' || e.startsWith('.')) continue;
    newest = Math.max(newest, newestMtime(path.join(p, e)));
  }
  return newest;
}

export function webBuildIsStale(): boolean {
  if (!fs.existsSync(STAMP) || !fs.existsSync(path.join(WEB_DIR, 'index.html'))) return true;
  const built = fs.statSync(STAMP).mtimeMs;
  return SOURCES.some((s) => newestMtime(path.join(REPO_ROOT, s)) > built);
}

export function ensureWebBuild({ force = false, quiet = false } = {}): { built: boolean; ms: number } {
  if (!force && !webBuildIsStale()) return { built: false, ms: 0 };
  const t0 = Date.now();
  if (!quiet) console.log('Building the web app (expo export, about half a minute)...');
  const r = spawnSync('npx', ['expo', 'export', '--platform', 'web', '--output-dir', 'dist/web', '--clear'], {
    cwd: REPO_ROOT,
    stdio: quiet ? 'pipe' : 'inherit',
    encoding: 'utf8',
    env: { ...process.env, CI: '1', EXPO_NO_TELEMETRY: '1', EXPO_OFFLINE: '1' },
  });
  if (r.status !== 0) {
    throw new Error(`the web export failed (exit ${r.status})${quiet ? `:\n${(r.stderr || r.stdout || '').slice(-4000)}` : ''}`);
  }
  // before the service worker, so the boot script is precached with the rest
  const boot = writeBootScript(WEB_DIR);
  for (const w of boot.warnings) console.warn(`boot script: ${w}`);
  if (!quiet) console.log(`boot script: ${boot.src} (${boot.bytes} bytes)`);
  const sw = spawnSync(process.execPath, [path.join(REPO_ROOT, 'node_modules', 'tsx', 'dist', 'cli.mjs'), path.join(REPO_ROOT, 'scripts', 'build-sw.ts')], {
    cwd: REPO_ROOT,
    stdio: quiet ? 'pipe' : 'inherit',
    encoding: 'utf8',
  });
  if (sw.status !== 0) throw new Error(`the service worker was not written (exit ${sw.status})${quiet ? `:\n${(sw.stderr || sw.stdout || '').slice(-2000)}` : ''}`);
  // after the service worker, so sw.js is compressed too
  const packed = precompressDir(WEB_DIR);
  if (!quiet) console.log(`precompressed ${packed.files} files: ${(packed.bytes / 1e6).toFixed(2)} MB -> ${(packed.brBytes / 1e6).toFixed(2)} MB brotli, ${(packed.gzBytes / 1e6).toFixed(2)} MB gzip`);
  fs.writeFileSync(STAMP, new Date().toISOString() + '\n');
  return { built: true, ms: Date.now() - t0 };
}

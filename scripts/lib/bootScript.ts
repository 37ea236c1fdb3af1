/**
 * Writes the boot script (src/boot/earlyStart.ts) into a web export and
 * loads it from index.html ahead of the app's scripts. The script is bundled
 * with esbuild on its own (Metro makes the app's bundle; this is a few
 * kilobytes that must run before it) together with its plan: the export's
 * layout and route chunks by address, read from the route table in the
 * app's entry script (routeChunks), the stored session's key and the
 * drawing's path. The content security policy allows
 * scripts from the app's own origin only, so it is a file, not inline.
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { buildSync } from 'esbuild';
import { api } from '@/shared/api';
import type { BootPlan } from '@/src/boot/earlyStart';
import { NOT_DEFERRED_PATHS } from '@/src/screens/deferredPaths';
import { SESSION_STORAGE_KEY } from '@/src/session/persisted';
import { REPO_ROOT } from './postgres';

/** Where Metro writes the web chunks, as served. */
export const CHUNK_DIR = '/_expo/static/js/web';

/**
 * The route files' chunks as the app's own script names them: Expo Router's
 * route table in the entry bundle maps each route file ("./(main)/network.tsx")
 * to a dependency slot, and Metro's dependency map of that module gives each
 * slot's module and each module's chunk (`paths`). Null when the entry does
 * not hold a table of that shape (another Metro or Expo version): then the
 * boot script preloads nothing rather than the wrong files.
 */
export function routeChunks(entry: string): Map<string, string> | null {
  const first = entry.indexOf('"./_layout.tsx":');
  if (first < 0) return null;
  const start = entry.lastIndexOf('__d(', first);
  const next = entry.indexOf('\n__d(', first);
  const mod = entry.slice(start, next < 0 ? undefined : next);
  const slots = new Map<string, string>();
  for (const m of mod.matchAll(/"(\.\/[^"]+\.tsx)":\{enumerable:!0,get:\(\)=>\w+\(\w+\[\d+\]\)\(\w+\[(\d+)\],\w+\.paths\)\}/g)) slots.set(m[1], m[2]);
  const depsAt = mod.lastIndexOf('{"0":');
  if (slots.size === 0 || depsAt < 0) return null;
  let deps: Record<string, unknown>;
  try {
    const tail = mod.slice(depsAt);
    deps = JSON.parse(tail.slice(0, tail.lastIndexOf('}') + 1)) as Record<string, unknown>;
  } catch {
    return null;
  }
  const paths = deps.paths as Record<string, string> | undefined;
  if (!paths || typeof paths !== 'object') return null;
  const out = new Map<string, string>();
  for (const [file, slot] of slots) {
    const chunk = paths[String(deps[slot])];
    if (typeof chunk === 'string' && chunk.startsWith(`${CHUNK_DIR}/`)) out.set(file, chunk);
  }
  return out.size > 0 ? out : null;
}

/** The address a route file opens ("./(main)/sites/index.tsx" -> "/sites"); null for layouts and dynamic routes. */
export function routePath(file: string): string | null {
  const parts = file.replace(/^\.\//, '').replace(/\.tsx$/, '').split('/').filter((p) => !/^\(.*\)$/.test(p));
  if (parts.some((p) => p.startsWith('_') || p.startsWith('+') || p.includes('['))) return null;
  if (parts[parts.length - 1] === 'index') parts.pop();
  return `/${parts.join('/')}`;
}

/**
 * The plan for an export whose entry bundle's route table is `chunks`
 * (routeChunks) and whose chunk of the screens loaded on demand
 * (src/screens/deferred.tsx) is `deferred` (served path, or null).
 */
export function bootPlanFor(chunks: ReadonlyMap<string, string> | null, deferred: string | null): BootPlan {
  const byPath: Record<string, string[]> = {};
  const always: string[] = [];
  for (const [file, chunk] of chunks ?? []) {
    if (/(^|\/)_layout\.tsx$/.test(file)) always.push(chunk);
    const at = routePath(file);
    if (at) byPath[at] = [chunk];
  }
  return {
    sessionKey: SESSION_STORAGE_KEY,
    drawingPath: api.networkDrawing,
    always: always.sort(),
    byPath,
    deferred: deferred ? { chunk: deferred, notFor: [...NOT_DEFERRED_PATHS] } : null,
  };
}

function bundle(entry: string, define: Record<string, string> = {}): string {
  const r = buildSync({
    entryPoints: [path.join(REPO_ROOT, 'src', 'boot', entry)],
    bundle: true,
    minify: true,
    format: 'iife',
    target: 'es2019',
    platform: 'browser',
    tsconfig: path.join(REPO_ROOT, 'tsconfig.json'),
    write: false,
    define,
    logLevel: 'silent',
  });
  return r.outputFiles[0].text;
}

/** Bundles the boot script for `plan` (minified, one function call). */
export function bootScriptFor(plan: BootPlan): string {
  return bundle('bootEntry.ts', { __HEADWATER_BOOT_PLAN__: JSON.stringify(plan) });
}

const hashed = (stem: string, code: string) => `${stem}-${crypto.createHash('md5').update(code).digest('hex')}.js`;

/** Writes the boot script into `webDir` and loads it first from index.html; returns its served path. */
export function writeBootScript(webDir: string): { src: string; bytes: number; warnings: string[] } {
  const chunkDir = path.join(webDir, ...CHUNK_DIR.split('/').filter(Boolean));
  const files = fs.readdirSync(chunkDir);
  const warnings: string[] = [];
  const entries = files.filter((f) => /^entry-[0-9a-f]{32}\.js$/.test(f));
  const chunks = entries.length === 1 ? routeChunks(fs.readFileSync(path.join(chunkDir, entries[0]), 'utf8')) : null;
  if (!chunks) warnings.push(`the route table was not found in the entry script (${entries.length} entry files): no chunk is preloaded`);
  // The screens loaded on demand share one chunk, named by Metro after src/screens/deferred.tsx.
  const deferredFiles = files.filter((f) => /^deferred-[0-9a-f]{32}\.js$/.test(f));
  if (deferredFiles.length !== 1) warnings.push(`${deferredFiles.length} chunks named deferred: it is not preloaded`);
  const plan = bootPlanFor(chunks, deferredFiles.length === 1 ? `${CHUNK_DIR}/${deferredFiles[0]}` : null);
  const code = bootScriptFor(plan);
  const name = hashed('boot', code);
  fs.writeFileSync(path.join(chunkDir, name), code);
  const src = `${CHUNK_DIR}/${name}`;
  const indexFile = path.join(webDir, 'index.html');
  const html = fs.readFileSync(indexFile, 'utf8');
  fs.writeFileSync(indexFile, withBootScript(html, src));
  return { src, bytes: Buffer.byteLength(code), warnings };
}

/** `html` loading `src` first thing in its head (async: it does not hold the page's parsing). */
export function withBootScript(html: string, src: string): string {
  const tag = `<script src="${src}" async></script>`;
  const cleaned = html.replace(/<script src="[^"]*\/boot-[0-9a-f]{32}\.js" async><\/script>\s*/g, '');
  const at = cleaned.search(/<head>/i);
  if (at < 0) throw new Error('index.html has no <head>: the boot script cannot be loaded');
  return `${cleaned.slice(0, at + 6)}\n    ${tag}${cleaned.slice(at + 6)}`;
}

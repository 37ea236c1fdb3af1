/**
 * Browser benchmark of the first screen's script: the JavaScript a visitor's
 * browser fetches to show the sign-in screen and then, once signed in, the
 * home screen (target <= 350 kB compressed). Service workers are blocked so
 * every script comes over the network, as on a first visit. A benchmark, not
 * a test.
 *
 * What is counted, per script response (every .js the page fetched):
 * - `sentBytes`: the response body as it came over the wire, in the server's
 *   Content-Encoding (the browser's encoded body size, i.e. the transfer size
 *   less headers). The server sends the build's brotli-11 copy to a browser
 *   that accepts br (server/http/precompressed.ts), so this is what a visitor
 *   actually downloads; an uncompressed answer counts its full size.
 * - `gzip6Bytes`: gzip level 6 of the decoded script, the same whatever the
 *   server does: a check that the figure moved because the script shrank, not
 *   only because it is packed better.
 * `firstScreenScriptKb` is the sum of `sentBytes`, `firstScreenScriptGzip6Kb`
 * the sum of `gzip6Bytes` (both in kB of 1,000 bytes); `counted` says so in
 * the JSON. Until the build was precompressed the headline was the larger of
 * the two sums, which was the gzip one.
 *
 *   npx tsx scripts/bench-browser-bundle.ts [--out FILE]          # own server on the demo network
 *   npx tsx scripts/bench-browser-bundle.ts --as-built [--out FILE]  # the export in dist/web as it is
 *   npx tsx scripts/bench-browser-bundle.ts --base http://127.0.0.1:P [--out FILE]
 *
 * scripts/bench.ts calls measureFirstScreenScript(baseUrl) on its own server.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import type { Page, Response } from 'playwright-core';
import { launch } from '@/test/e2e/browser';
import { loadConfig } from '@/server/config';
import { startServer } from '@/server/server';
import { resolveDatabaseUrl, REPO_ROOT } from './lib/postgres';
import { ensureWebBuild } from './lib/webBuild';
import { DEMO_USERS, loadDemo } from './start';

export const FIRST_SCREEN_TARGET_KB = 350;
const PHONE = { width: 390, height: 844 };

export interface ScriptLoad {
  /** path of the script on the server */
  path: string;
  /** the screen whose loading fetched it first */
  screen: 'sign-in' | 'home';
  rawBytes: number;
  /** body bytes as sent (Content-Encoding of the server) */
  sentBytes: number;
  encoding: string;
  gzip6Bytes: number;
}

export interface FirstScreenScript {
  /** what firstScreenScriptKb counts, in words */
  counted: string;
  /** bytes sent: the encoded bodies as transferred (br from this server) */
  firstScreenScriptKb: number;
  /** gzip -6 of the same scripts, whatever the server sent */
  firstScreenScriptGzip6Kb: number;
  signInScriptKb: number;
  signInScriptGzip6Kb: number;
  /** the encodings the server answered with, and how many scripts each */
  encodings: Record<string, number>;
  targetKb: number;
  ok: boolean;
  scripts: ScriptLoad[];
}

export const COUNTED = 'bytes sent: each script response body as transferred, in the Content-Encoding the server chose (br when the browser accepts it); firstScreenScriptGzip6Kb is gzip -6 of the same scripts';

const kb = (bytes: number) => Math.round(bytes / 100) / 10;

/** Signs in as `user` at `baseUrl` in a fresh browser and sums the scripts fetched on the way to the home screen. */
export async function measureFirstScreenScript(baseUrl: string, user: { email: string; password: string } = DEMO_USERS.find((u) => u.role === 'engineer')!): Promise<FirstScreenScript> {
  const browser = await launch();
  const scripts: ScriptLoad[] = [];
  const pending: Promise<void>[] = [];
  let screen: ScriptLoad['screen'] = 'sign-in';
  try {
    const context = await browser.newContext({ viewport: PHONE, deviceScaleFactor: 1, serviceWorkers: 'block' });
    const page = await context.newPage();
    page.on('response', (r) => {
      if (new URL(r.url()).pathname.endsWith('.js')) pending.push(record(r, screen).then((s) => void scripts.push(s)));
    });
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByLabel('Email').waitFor({ timeout: 30_000 });
    await settle(page);
    screen = 'home';
    await page.getByLabel('Email').fill(user.email);
    await page.getByLabel('Password').fill(user.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((u) => u.pathname === '/', { timeout: 30_000 });
    await page.getByRole('heading').first().waitFor({ timeout: 30_000 });
    await settle(page);
    await Promise.all(pending);
  } finally {
    await browser.close();
  }
  const sent = (which: ScriptLoad[]) => kb(sum(which.map((s) => s.sentBytes)));
  const gzip6 = (which: ScriptLoad[]) => kb(sum(which.map((s) => s.gzip6Bytes)));
  const signIn = scripts.filter((s) => s.screen === 'sign-in');
  const firstScreenScriptKb = sent(scripts);
  const encodings: Record<string, number> = {};
  for (const s of scripts) encodings[s.encoding] = (encodings[s.encoding] ?? 0) + 1;
  return {
    counted: COUNTED,
    firstScreenScriptKb,
    firstScreenScriptGzip6Kb: gzip6(scripts),
    signInScriptKb: sent(signIn),
    signInScriptGzip6Kb: gzip6(signIn),
    encodings,
    targetKb: FIRST_SCREEN_TARGET_KB,
    ok: firstScreenScriptKb <= FIRST_SCREEN_TARGET_KB,
    scripts: scripts.sort((a, b) => b.gzip6Bytes - a.gzip6Bytes),
  };
}

const sum = (xs: number[]) => xs.reduce((a, b) => a + b, 0);

async function record(r: Response, screen: ScriptLoad['screen']): Promise<ScriptLoad> {
  const body = await r.body();
  const sizes = await r.request().sizes();
  return {
    path: new URL(r.url()).pathname,
    screen,
    rawBytes: body.length,
    sentBytes: sizes.responseBodySize,
    encoding: (await r.headerValue('content-encoding')) ?? 'identity',
    gzip6Bytes: zlib.gzipSync(body, { level: 6 }).length,
  };
}

/** Waits until no request has been made for half a second (route chunks load after the first paint). */
async function settle(page: Page): Promise<void> {
  await page.waitForLoadState('networkidle', { timeout: 30_000 }).catch(() => undefined);
  await page.waitForTimeout(500);
}

function arg(name: string): string | undefined {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 ? process.argv[i + 1] : undefined;
}

async function main() {
  const given = arg('base');
  let close = async () => undefined as void;
  let base = given;
  if (!base) {
    if (!process.argv.includes('--as-built')) ensureWebBuild();
    const { url } = await resolveDatabaseUrl('headwater_bench_bundle', { fresh: true });
    await loadDemo(url, () => undefined);
    const running = await startServer(url, loadConfig({ ...process.env, PORT: '0', DEMO: '1', SMTP_URL: undefined, S3_ENDPOINT: undefined, DATA_DIR: path.join(os.tmpdir(), `headwater-bench-bundle-${process.pid}`) }));
    base = running.url.replace('localhost', '127.0.0.1');
    close = () => running.close();
  }
  try {
    const result = await measureFirstScreenScript(base);
    for (const s of result.scripts) console.log(`${s.screen.padEnd(8)} ${String(s.sentBytes).padStart(8)} B sent (${s.encoding}), ${String(s.gzip6Bytes).padStart(8)} B gzip -6  ${s.path}`);
    console.log(`first screen: ${result.firstScreenScriptKb} kB of script sent (sign-in alone ${result.signInScriptKb} kB; target <= ${result.targetKb} kB); as gzip -6: ${result.firstScreenScriptGzip6Kb} kB (sign-in alone ${result.signInScriptGzip6Kb} kB)`);
    const out = arg('out');
    if (out) {
      fs.writeFileSync(out, JSON.stringify({ when: new Date().toISOString(), ...result }, null, 2) + '\n');
      console.log(`Written ${path.relative(REPO_ROOT, path.resolve(out))}`);
    }
  } finally {
    await close();
  }
}

if (require.main === module) {
  main().catch((e) => {
    console.error(e);
    process.exit(1);
  });
}

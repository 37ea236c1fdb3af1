/**
 * Browser benchmark of the long lists on a phone (390 x 844) over a generated
 * network (default 20,000 sites): for each list screen, the time from
 * navigation until the list is on screen and the page answers input again
 * (target <= 1.5 s), and the longest frame while scrolling it (target
 * <= 200 ms, from requestAnimationFrame deltas). A benchmark, not a test:
 * run it once on a quiet machine and keep the result in docs/bench/.
 *
 *   npx tsx scripts/bench-browser-lists.ts [--sites 20000] [--seed 7] [--reuse] [--out FILE]
 *   npx tsx scripts/bench-browser-lists.ts --serve [--port P]   # only load the network and serve it
 *   npx tsx scripts/bench-browser-lists.ts --base http://127.0.0.1:P --out /tmp/x.json   # measure that server
 *
 * --reuse keeps the benchmark database when it already holds a network.
 * Uses Debian's Chromium (/usr/bin/chromium, or CHROMIUM_PATH) through
 * playwright-core and the web export in dist/web (rebuilt when stale).
 */
import fs from 'node:fs';
import path from 'node:path';
import { chromium, type Page } from 'playwright-core';
import { loadConfig } from '@/server/config';
import { openDatabase } from '@/server/db';
import { importNetwork } from '@/server/services/importer';
import { startServer } from '@/server/server';
import { generateNetwork } from './generator';
import { resolveDatabaseUrl, REPO_ROOT } from './lib/postgres';
import { ensureWebBuild } from './lib/webBuild';
import { DEMO_USERS, loadDemo } from './start';

const PHONE = { width: 390, height: 844 };
const TARGET_READY_MS = 1500;
const TARGET_FRAME_MS = 200;

function arg(name: string): string | undefined {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 ? process.argv[i + 1] : undefined;
}
const flag = (name: string) => process.argv.includes(`--${name}`);

async function prepare(sites: number, seed: number, reuse: boolean): Promise<string> {
  const name = `headwater_lists_${sites}_${seed}`;
  const { url } = await resolveDatabaseUrl(name, { fresh: !reuse });
  const db = openDatabase(url);
  try {
    await db.migrate();
    const [rows] = await db.sequelize.query('SELECT count(*)::int AS n FROM sites');
    if ((rows as { n: number }[])[0].n === 0) {
      const t0 = Date.now();
      const report = await importNetwork(db, generateNetwork({ sites, seed }), { actor: { email: 'bench' } });
      if (!report.ok) throw new Error(`the generated network did not import: ${report.errors.slice(0, 3).map((e) => e.message).join('; ')}`);
      console.log(`Imported ${sites} sites in ${((Date.now() - t0) / 1000).toFixed(1)} s`);
    }
  } finally {
    await db.close();
  }
  await loadDemo(url, () => undefined);
  return url;
}

async function apiGet<T>(base: string, token: string, p: string): Promise<T> {
  const r = await fetch(`${base}${p}`, { headers: { authorization: `Bearer ${token}` } });
  if (!r.ok) throw new Error(`GET ${p} answered ${r.status}`);
  return (await r.json()) as T;
}

interface Target {
  name: string;
  path: string;
  /** the scrolling list box to wait for and scroll */
  list: string;
  /** a button to press once the screen is up (e.g. "Show all"), its time counted */
  press?: RegExp;
}

/** Addresses of the heaviest cases: the element whose failure alone takes most off air, and an origin's carriage downstream. */
async function targets(base: string, token: string): Promise<Target[]> {
  const exposure = await apiGet<{ elements: { element: { kind: string; code: string } }[] }>(base, token, '/api/analysis/exposure?limit=1');
  const worst = exposure.elements[0].element;
  const origins = await apiGet<{ items: { code: string }[] }>(base, token, '/api/sites?role=origin&pageSize=5');
  const carriages = await apiGet<{ items: { code: string }[] }>(base, token, `/api/carriages?site=${encodeURIComponent(origins.items[0].code)}&pageSize=5`);
  const originCarriage = carriages.items[0];
  return [
    { name: 'fault reach, all sites', path: `/reach?fail=${worst.kind}:${worst.code}`, list: 'reach-by-site-list', press: /^Show all .* sites$/ },
    { name: 'resilience, all diversity gaps', path: '/resilience', list: 'diversity-list', press: /^Show all .* carriages$/ },
    { name: 'checks', path: '/checks', list: 'failing-checks-list' },
    { name: 'downstream chain of an origin', path: `/carriages/${encodeURIComponent(originCarriage.code)}?direction=down`, list: 'chain-list' },
  ];
}

/** Resolves once the page has run a frame and an idle task: the main thread is free to answer input. */
const responsive = (page: Page) => page.evaluate('new Promise((r) => requestAnimationFrame(() => setTimeout(r, 0)))');

async function measure(page: Page, base: string, t: Target) {
  const t0 = Date.now();
  await page.goto(`${base}${t.path}`);
  if (t.press) {
    const button = page.getByRole('button', { name: t.press }).first();
    await button.waitFor({ timeout: 60_000 });
    await responsive(page);
    const shownAt = Date.now() - t0;
    const t1 = Date.now();
    await button.click();
    await page.getByTestId(t.list).first().waitFor({ timeout: 60_000 });
    await responsive(page);
    var readyMs = shownAt + (Date.now() - t1); // eslint-disable-line no-var
  } else {
    await page.getByTestId(t.list).first().waitFor({ timeout: 60_000 });
    await responsive(page);
    readyMs = Date.now() - t0;
  }
  const rows = await page.getByTestId(t.list).first().evaluate((el) => el.querySelectorAll('[data-testid$="-row"]').length);
  // Scroll the list box by the wheel for about three seconds, recording every frame's gap.
  const box = await page.getByTestId(t.list).first().boundingBox();
  // A string, not a function: tsx would wrap a named function in a helper the page does not have.
  await page.evaluate(`(() => {
    window.__frames = [];
    window.__stop = false;
    let last = performance.now();
    const tick = (now) => {
      window.__frames.push(now - last);
      last = now;
      if (!window.__stop) requestAnimationFrame(tick);
    };
    requestAnimationFrame(tick);
  })()`);
  if (box) await page.mouse.move(box.x + box.width / 2, box.y + Math.min(box.height / 2, 200));
  for (let i = 0; i < 60; i++) {
    await page.mouse.wheel(0, 400);
    await page.waitForTimeout(50);
  }
  const frames = (await page.evaluate('(window.__stop = true, window.__frames.slice(1))')) as number[];
  const rowsAfter = await page.getByTestId(t.list).first().evaluate((el) => el.querySelectorAll('[data-testid$="-row"]').length);
  return { screen: t.name, path: t.path, readyMs, longestFrameMs: Math.round(Math.max(0, ...frames)), frames: frames.length, rowsRendered: Math.max(rows, rowsAfter) };
}

async function main() {
  const sites = Number(arg('sites') ?? 20000);
  const seed = Number(arg('seed') ?? 7);
  // --base URL measures a server already running (started with --serve), skipping the set-up.
  const given = arg('base');
  const url = given ? '' : await prepare(sites, seed, flag('reuse') || flag('serve'));
  if (!flag('serve') && !given) ensureWebBuild();
  const running = given ? null : await startServer(url, loadConfig({ ...process.env, PORT: arg('port') ?? '0', DEMO: '1' }));
  const base = given ?? running!.url.replace('localhost', '127.0.0.1');
  if (flag('serve')) {
    console.log(`Serving ${sites} sites at ${base} (Ctrl+C stops)`);
    return;
  }
  const user = DEMO_USERS.find((u) => u.role === 'engineer')!;
  const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: user.email, password: user.password }) });
  const { token } = (await login.json()) as { token: string };
  const list = await targets(base, token);
  const browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium', headless: true, args: ['--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage'] });
  const results = [];
  try {
    const context = await browser.newContext({ viewport: PHONE, deviceScaleFactor: 1 });
    const page = await context.newPage();
    await page.goto(`${base}/sign-in`);
    await page.getByLabel('Email').fill(user.email);
    await page.getByLabel('Password').fill(user.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'), { timeout: 30_000 });
    for (const t of list) {
      // The first visit warms the server's caches for this network version; the second is what a user meets after that.
      await measure(page, base, t).catch(() => undefined);
      const r = await measure(page, base, t);
      results.push({ ...r, readyOk: r.readyMs <= TARGET_READY_MS, frameOk: r.longestFrameMs <= TARGET_FRAME_MS });
      console.log(`${r.screen}: ready ${r.readyMs} ms, longest frame ${r.longestFrameMs} ms, ${r.rowsRendered} rows rendered`);
    }
  } finally {
    await browser.close();
    await running?.close();
  }
  const out = arg('out') ?? path.join(REPO_ROOT, 'docs', 'bench', `lists-${new Date().toISOString().slice(0, 10)}.json`);
  const record = { when: new Date().toISOString(), sites, seed, viewport: PHONE, targets: { readyMs: TARGET_READY_MS, longestFrameMs: TARGET_FRAME_MS }, results };
  fs.writeFileSync(out, JSON.stringify(record, null, 2) + '\n');
  console.log(`Written ${path.relative(REPO_ROOT, out)}`);
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});

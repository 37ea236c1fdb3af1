/**
 * Debian's Chromium driven by playwright-core (never a downloaded browser).
 * Screenshots go to artifacts/e2e/ (ignored by git).
 */
import fs from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import type { Role } from '@/shared/api';
import { DEMO_USERS } from '@/scripts/start';
import { COPY_LOCATION } from '@/src/offline/location';
import { RECORD_SCRIPT } from '@/src/testHooks';

export const ARTIFACTS = path.resolve(__dirname, '..', '..', 'artifacts', 'e2e');
export const PHONE = { width: 390, height: 844 };
export const WIDE = { width: 1440, height: 900 };
export const SIZES = { phone: PHONE, wide: WIDE } as const;

export const baseUrl = () => {
  const u = process.env.E2E_BASE_URL;
  if (!u) throw new Error('E2E_BASE_URL is not set: run through vitest --project e2e');
  return u;
};

export async function launch(): Promise<Browser> {
  const executablePath = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
  if (!fs.existsSync(executablePath)) throw new Error(`Chromium not found at ${executablePath}: install Debian's "chromium" package (npm test does)`);
  return chromium.launch({
    executablePath,
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-dev-shm-usage'],
  });
}

export interface WatchedPage {
  page: Page;
  /** console errors and uncaught page errors seen so far */
  errors: string[];
  /** requests that left the machine (there must be none) */
  external: string[];
}

export async function openPage(browser: Browser, size: { width: number; height: number }): Promise<WatchedPage> {
  const context = await browser.newContext({ viewport: size, deviceScaleFactor: 1 });
  // The network drawings keep their records for the tests (src/testHooks.ts).
  await context.addInitScript(RECORD_SCRIPT);
  const page = await context.newPage();
  const errors: string[] = [];
  const external: string[] = [];
  page.on('console', (m) => {
    if (m.type() !== 'error') return;
    // a refused request names its address, so a failure says which call it was
    const where = m.location().url;
    errors.push(m.text().startsWith('Failed to load resource') && where ? `${m.text()} ${new URL(where).pathname}${new URL(where).search}` : m.text());
  });
  page.on('pageerror', (e) => errors.push(String(e)));
  page.on('request', (r) => {
    const u = new URL(r.url());
    if (!['127.0.0.1', 'localhost'].includes(u.hostname) && !u.protocol.startsWith('data') && !u.protocol.startsWith('blob')) external.push(r.url());
  });
  return { page, errors, external };
}

export const demoUser = (role: Role) => {
  const u = DEMO_USERS.find((d) => d.role === role);
  if (!u) throw new Error(`no demo user for ${role}`);
  return u;
};

export async function signIn(page: Page, role: Role) {
  const u = demoUser(role);
  await signInWith(page, baseUrl(), u.email, u.password);
}

/** Signs in through the form (also used by the browser benchmarks, which run their own server). */
export async function signInWith(page: Page, base: string, email: string, password: string) {
  await page.goto(`${base}/sign-in`);
  await page.getByLabel('Email').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'), { timeout: 30_000 });
}

/** The offline copy as the page's IndexedDB holds it: its version and site count (null when there is none). */
export function storedCopy(page: Page): Promise<{ networkVersion: number; sites: number } | null> {
  return page.evaluate(
    ({ database, store, key }) =>
      new Promise((resolve, reject) => {
        const open = indexedDB.open(database);
        // Never create the database here: one made before the app's own would lack its store.
        open.onupgradeneeded = () => open.transaction?.abort();
        open.onerror = () => resolve(null);
        open.onsuccess = () => {
          const db = open.result;
          if (!db.objectStoreNames.contains(store)) {
            db.close();
            return resolve(null);
          }
          const get = db.transaction(store).objectStore(store).get(key);
          get.onsuccess = () => {
            // the copy is kept as the export's text (src/offline/copyStore.ts)
            const v = get.result as { networkVersion: number; text?: unknown } | undefined;
            db.close();
            resolve(v ? { networkVersion: v.networkVersion, sites: typeof v.text === 'string' ? (JSON.parse(v.text) as { sites: unknown[] }).sites.length : -1 } : null);
          };
          get.onerror = () => reject(get.error);
        };
      }),
    COPY_LOCATION,
  );
}

/** Waits until the page's service worker controls it (the app shell is cached). */
export async function waitForWorker(page: Page) {
  await page.waitForFunction(() => navigator.serviceWorker?.controller != null, undefined, { timeout: 60_000 });
}

export async function shot(page: Page, name: string) {
  fs.mkdirSync(ARTIFACTS, { recursive: true });
  await page.screenshot({ path: path.join(ARTIFACTS, `${name}.png`), fullPage: false });
}

/** A bearer token for API calls made beside the browser (to compare screen and API). */
export async function apiToken(role: Role): Promise<string> {
  const u = demoUser(role);
  const r = await fetch(`${baseUrl()}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: u.email, password: u.password }) });
  if (!r.ok) throw new Error(`API sign-in as ${role} failed: ${r.status}`);
  return ((await r.json()) as { token: string }).token;
}

export async function apiGet<T>(path: string, role: Role = 'viewer'): Promise<T> {
  const r = await fetch(`${baseUrl()}${path}`, { headers: { authorization: `Bearer ${await apiToken(role)}` } });
  if (!r.ok) throw new Error(`GET ${path} answered ${r.status}`);
  return (await r.json()) as T;
}

export const digits = (s: string | null) => Number((s ?? '').replace(/[^0-9]/g, ''));

/** Keep a measured figure for the closing note (artifacts/e2e/timings.json). */
export function recordTiming(name: string, ms: number) {
  fs.mkdirSync(ARTIFACTS, { recursive: true });
  const file = path.join(ARTIFACTS, 'timings.json');
  const all = fs.existsSync(file) ? JSON.parse(fs.readFileSync(file, 'utf8')) : {};
  all[name] = Math.round(ms);
  fs.writeFileSync(file, JSON.stringify(all, null, 2) + '\n');
  console.log(`[timing] ${name}: ${Math.round(ms)} ms`);
}

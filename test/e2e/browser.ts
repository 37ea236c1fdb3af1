/**
 * Debian's Chromium driven by playwright-core (never a downloaded browser).
 * Screenshots go to artifacts/e2e/ (ignored by git).
 */
import fs from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import type { Role } from '@/shared/api';
import { DEMO_USERS } from '@/scripts/start';
import { RECORD_DRAWINGS_SCRIPT } from '@/src/screens/network/testHooks';

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
  // The network drawings keep their records for the tests (src/screens/network/testHooks.ts).
  await context.addInitScript(RECORD_DRAWINGS_SCRIPT);
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
  await page.goto(`${baseUrl()}/sign-in`);
  await page.getByLabel('Email').fill(u.email);
  await page.getByLabel('Password').fill(u.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'), { timeout: 20_000 });
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

/**
 * Long lists and phone layouts in a real browser:
 * - the resilience exposure ranking as cards on a phone (390 px), each
 *   leading with its households, and as a table on a wide screen (1440 px);
 * - on a generated 2,000-site network, lists of thousands of rows render
 *   only a bounded number of row elements (virtualised), an origin's
 *   downstream tree opens folded by hop with a count per hop and lists a
 *   hop's carriages page by page, and the checks screen pages its failures
 *   with the counts from the server.
 * Structural checks only: the timings are scripts/bench-browser-lists.ts.
 */
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ExposureAnswer } from '@/shared/schemas/analysis';
import { formatCount } from '@/shared/format';
import { loadConfig } from '@/server/config';
import { openDatabase } from '@/server/db';
import { importNetwork } from '@/server/services/importer';
import { startServer, type RunningServer } from '@/server/server';
import { resolveDatabaseUrl } from '@/scripts/lib/postgres';
import { generateNetwork } from '@/scripts/generator';
import { loadDemo } from '@/scripts/start';
import { apiGet, baseUrl, demoUser, launch, openPage, PHONE, shot, signIn, SIZES, WIDE } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => browser?.close());

describe.each(Object.entries(SIZES))('resilience exposure at %s size', (sizeName, size) => {
  it('keeps every figure on screen: cards led by households on a phone, a table on a wide screen', async () => {
    const exposure = await apiGet<ExposureAnswer>('/api/analysis/exposure?limit=100');
    const top = exposure.elements[0];
    expect(top.households).toBeGreaterThan(0);
    const { page, errors } = await openPage(browser, size);
    await signIn(page, 'viewer');
    await page.goto(`${baseUrl()}/resilience`);
    const ranking = page.getByTestId('resilience-exposure');
    if (sizeName === 'phone') {
      const card = ranking.getByTestId('exposure-table-card').first();
      await card.waitFor({ timeout: 30_000 });
      const text = await card.innerText();
      // households first, with thousands separators, then the element and its other figure
      expect(text.trimStart().startsWith(formatCount(top.households))).toBe(true);
      expect(text).toContain('households off air');
      expect(text).toContain(`${top.element.kind} ${top.element.code}`);
      expect(text).toContain('Carriages (off air)');
      // nothing sits off-screen to the right
      const box = await card.boundingBox();
      expect(box!.x + box!.width).toBeLessThanOrEqual(size.width);
      expect(await ranking.getByRole('table').count()).toBe(0);
      // the per-service counts (loaded on request) are cards too
      await page.getByTestId('service-counts-show').click();
      await page.getByTestId('service-counts-card').first().waitFor({ timeout: 30_000 });
    } else {
      const table = ranking.getByRole('table', { name: 'Elements ranked by exposure' });
      await table.waitFor({ timeout: 30_000 });
      expect(await table.getByRole('columnheader').allInnerTexts()).toContain('Households (off air)');
      expect(await table.innerText()).toContain(formatCount(top.households));
      expect(await ranking.getByTestId('exposure-table-card').count()).toBe(0);
    }
    await shot(page, `lists-resilience-${sizeName}`);
    expect(errors).toEqual([]);
    await page.context().close();
  });
});

describe('lists of thousands of rows (2,000 generated sites)', () => {
  let running: RunningServer;
  let base: string;
  beforeAll(async () => {
    const { url } = await resolveDatabaseUrl('headwater_e2e_lists', { fresh: true });
    const db = openDatabase(url);
    await db.migrate();
    const report = await importNetwork(db, generateNetwork({ sites: 2000, seed: 3 }), { actor: { email: 'e2e' } });
    expect(report.errors).toEqual([]);
    await db.close();
    await loadDemo(url, () => undefined);
    running = await startServer(url, loadConfig({ ...process.env, PORT: '0', DEMO: '1' }));
    base = running.url.replace('localhost', '127.0.0.1');
  }, 240_000);
  afterAll(async () => running?.close());

  async function signInHere(page: Page) {
    const u = demoUser('engineer');
    await page.goto(`${base}/sign-in`);
    await page.getByLabel('Email').fill(u.email);
    await page.getByLabel('Password').fill(u.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'), { timeout: 20_000 });
  }

  const rowsIn = (page: Page, testID: string) => page.locator(`[data-testid="${testID}-row"]`).count();

  it('"Show all" on the fault reach renders only a bounded number of rows, before and after a scroll', async () => {
    const { page, errors } = await openPage(browser, PHONE);
    await signInHere(page);
    const reachCalls: string[] = [];
    page.on('request', (r) => {
      if (r.url().includes('/api/analysis/reach')) reachCalls.push(r.url());
    });
    const token = await loginToken(base);
    const exposure = (await (await fetch(`${base}/api/analysis/exposure?limit=1`, { headers: { authorization: `Bearer ${token}` } })).json()) as ExposureAnswer;
    const worst = exposure.elements[0].element;
    await page.goto(`${base}/reach?fail=${worst.kind}:${worst.code}`);
    const lost = page.getByTestId('reach-lost-count');
    await lost.waitFor({ timeout: 30_000 });
    const lostCount = Number(((await lost.textContent()) ?? '').replace(/[^0-9]/g, ''));
    expect(lostCount).toBeGreaterThan(1000);
    await page.getByTestId('reach-carriages').getByRole('button', { name: `Show all ${formatCount(lostCount)} carriages` }).first().click();
    const list = page.getByTestId('reach-lost-list');
    await list.waitFor({ timeout: 30_000 });
    await page.waitForTimeout(500);
    const first = await rowsIn(page, 'reach-lost-list');
    expect(first).toBeGreaterThan(5);
    expect(first).toBeLessThan(120);
    // Scrolling far down brings later rows in and keeps the count bounded.
    await list.evaluate((el) => {
      const scroller = (el.scrollHeight > el.clientHeight ? el : el.querySelector('div')) as HTMLElement;
      scroller.scrollTop = scroller.scrollHeight / 2;
    });
    await page.waitForTimeout(800);
    expect(await rowsIn(page, 'reach-lost-list')).toBeLessThan(160);

    // the answer came brief (counts and first rows), the long list a page at a time from the server
    expect(reachCalls.some((u) => u.includes('first=20'))).toBe(true);
    expect(reachCalls.some((u) => /reach\/carriages\?state=lost&limit=100&offset=0/.test(u))).toBe(true);
    expect(reachCalls.every((u) => /first=20|reach\/(sites|carriages)\?.*limit=100/.test(u))).toBe(true);

    // the By site rows carry households; "Show all" pages them from the server too
    const bySite = page.getByTestId('reach-by-site');
    expect(await bySite.innerText()).toMatch(/\d households?/);
    await bySite.getByRole('button', { name: /^Show all [\d,]+ sites$/ }).click();
    const siteList = page.getByTestId('reach-by-site-list');
    await siteList.waitFor({ timeout: 30_000 });
    expect(await rowsIn(page, 'reach-by-site-list')).toBeLessThan(120);
    expect(await siteList.innerText()).toMatch(/\d households?/);
    expect(reachCalls.some((u) => /reach\/sites\?limit=100&offset=0/.test(u))).toBe(true);
    await shot(page, 'lists-reach-show-all-phone');
    expect(errors).toEqual([]);
    await page.context().close();
  });

  it('an origin\'s downstream tree opens folded by hop with counts, and a hop lists its carriages a page at a time', async () => {
    const { page, errors } = await openPage(browser, PHONE);
    await signInHere(page);
    const token = await loginToken(base);
    const api = async <T,>(p: string) => (await (await fetch(`${base}${p}`, { headers: { authorization: `Bearer ${token}` } })).json()) as T;
    const origin = (await api<{ items: { code: string }[] }>('/api/sites?role=origin&pageSize=1')).items[0].code;
    const carriage = (await api<{ items: { code: string }[] }>(`/api/carriages?site=${origin}&pageSize=1`)).items[0].code;
    const folded = await api<{ levels: number[]; size: number; complete: boolean }>(`/api/carriages/${encodeURIComponent(carriage)}/chain?direction=down&view=levels`);
    expect(folded.complete).toBe(false);
    const requests: string[] = [];
    page.on('request', (r) => {
      if (r.url().includes('/chain')) requests.push(r.url());
    });
    await page.goto(`${base}/carriages/${encodeURIComponent(carriage)}?direction=down`);
    const levels = page.getByTestId('chain-levels');
    await levels.waitFor({ timeout: 60_000 });
    const summary = (await page.getByTestId('chain-summary').innerText()).replace(/,/g, '');
    const total = Number(/: (\d+) carriages/.exec(summary)?.[1]);
    expect(total).toBe(folded.size);
    expect(total).toBeGreaterThan(300);
    // one line per hop with its count, adding up to the whole tree with the carriage itself
    const text = (await levels.innerText()).replace(/,/g, '');
    const counts = [...text.matchAll(/(\d+) carriages? at hop (\d+)/g)].map((m) => Number(m[1]));
    expect(counts).toEqual(folded.levels.slice(1));
    expect(1 + counts.reduce((a, b) => a + b, 0)).toBe(total);
    // the whole tree was never asked for: only the counts and pages of hop 1
    await page.getByTestId('chain-list').first().waitFor({ timeout: 30_000 });
    expect(requests.every((u) => /view=levels|level=\d+&limit=\d+&offset=\d+/.test(u))).toBe(true);
    // the deepest big hop: its first page, a bounded number of rows, and more as the list scrolls
    const deep = folded.levels.reduce((best, n, k) => (k > 0 && n > folded.levels[best] ? k : best), 1);
    expect(folded.levels[deep]).toBeGreaterThan(100);
    // hop 1 opens by itself; another is shown with a press, and hop 1 then hidden so the list in view is the deep one
    if (deep !== 1) await page.getByTestId(`chain-hop-toggle-${deep}`).click();
    const footer = page.getByTestId(`chain-hop-footer-${deep}`);
    await footer.waitFor({ timeout: 30_000 });
    expect((await footer.innerText()).replace(/,/g, '')).toContain(`of ${folded.levels[deep]} at hop ${deep}`);
    expect(await rowsIn(page, 'chain-list')).toBeLessThan(120);
    if (deep !== 1) await page.getByTestId('chain-hop-toggle-1').click();
    // scrolled by the wheel, the list keeps a bounded number of rows; the next page comes by the scroll or the footer's button
    const list = page.getByTestId('chain-list').first();
    const box = (await list.boundingBox())!;
    await page.mouse.move(box.x + box.width / 2, box.y + Math.min(box.height / 2, 200));
    for (let i = 0; i < 20; i++) await page.mouse.wheel(0, 600);
    await page.waitForTimeout(500);
    expect(await rowsIn(page, 'chain-list')).toBeLessThan(160);
    // (the scroll may have asked for it already; else the button does)
    if ((await footer.innerText()).startsWith('Showing 100 ')) await footer.getByRole('button', { name: /Show more|Loading more/ }).click();
    await page.waitForFunction((hop) => !document.querySelector(`[data-testid="chain-hop-footer-${hop}"]`)?.textContent?.startsWith('Showing 100 '), deep, { timeout: 30_000 });
    expect(requests.some((u) => new RegExp(`level=${deep}&limit=100&offset=100`).test(u))).toBe(true);
    expect(await rowsIn(page, 'chain-list')).toBeLessThan(160);
    await shot(page, 'lists-chain-levels-phone');
    expect(errors).toEqual([]);
    await page.context().close();
  });

  it('the checks screen counts the whole list on the server and reads its failures a page at a time', async () => {
    const { page, errors } = await openPage(browser, PHONE);
    await signInHere(page);
    const token = await loginToken(base);
    const whole = (await (await fetch(`${base}/api/checks`, { headers: { authorization: `Bearer ${token}` } })).json()) as { failures: { feed: string; severity: string }[] };
    expect(whole.failures.length).toBeGreaterThan(100);
    const pages: string[] = [];
    page.on('request', (r) => {
      if (r.url().includes('/api/checks')) pages.push(r.url());
    });
    await page.goto(`${base}/checks`);
    const counts = page.getByTestId('failing-checks-counts');
    await counts.waitFor({ timeout: 30_000 });
    const errorsCount = whole.failures.filter((f) => f.severity === 'error').length;
    expect(await counts.innerText()).toContain(`Errors: ${formatCount(errorsCount)}`);
    expect(await counts.innerText()).toContain(`Feeds: ${formatCount(new Set(whole.failures.map((f) => f.feed)).size)}`);
    expect(pages.every((u) => /limit=100&offset=\d+/.test(u))).toBe(true);
    const footer = page.getByTestId('failing-checks-footer');
    await footer.waitFor({ timeout: 30_000 });
    expect(await footer.innerText()).toContain(`Showing 100 of ${formatCount(whole.failures.length)}`);
    expect(await rowsIn(page, 'failing-checks-list')).toBeLessThan(60);
    await page.getByTestId('failing-checks-more').click();
    await page.waitForFunction(() => !document.querySelector('[data-testid="failing-checks-footer"]')?.textContent?.startsWith('Showing 100 '), undefined, { timeout: 30_000 });
    expect(pages.some((u) => u.includes('limit=100&offset=100'))).toBe(true);
    // a chip filters on the server: its count becomes the list's total
    const chip = page.getByRole('checkbox').first();
    const chipCount = Number(/\(([\d,]+)\)/.exec((await chip.getAttribute('aria-label')) ?? '')?.[1].replace(/,/g, ''));
    await chip.click();
    await page.waitForFunction((n) => (document.querySelector('[data-testid="failing-checks"]')?.textContent ?? '').replace(/,/g, '').includes(`${n} failing check`), chipCount, { timeout: 30_000 });
    expect(pages.some((u) => u.includes('check='))).toBe(true);
    await shot(page, 'lists-checks-paged-phone');
    expect(errors).toEqual([]);
    await page.context().close();
  });

  it('at 1440 px the checks table sorts by its column headers, the server ordering every page', async () => {
    const { page, errors } = await openPage(browser, WIDE);
    await signInHere(page);
    const token = await loginToken(base);
    const firstFeeds = async (q: string) =>
      ((await (await fetch(`${base}/api/checks?${q}&limit=3`, { headers: { authorization: `Bearer ${token}` } })).json()) as { failures: { feed: string }[] }).failures.map((f) => f.feed);
    const asked: string[] = [];
    page.on('request', (r) => {
      if (r.url().includes('/api/checks')) asked.push(r.url());
    });
    await page.goto(`${base}/checks`);
    const table = page.getByRole('table', { name: 'Failing checks, worst first' });
    await table.waitFor({ timeout: 30_000 });
    const header = page.getByTestId('failures-table-sort-feed');
    expect(await page.getByTestId('failures-table-sort-value').count()).toBe(0);
    /** The feed codes of the first three body rows, in the order drawn. */
    const shownFeeds = () => page.locator('[data-testid="failures-table-body-row"] [data-testid^="failure-feed-"]').evaluateAll((els) => els.slice(0, 3).map((e) => e.textContent));
    for (const direction of ['asc', 'desc'] as const) {
      await header.click();
      const name = `Failing checks, ${direction === 'asc' ? 'by feed, A to Z' : 'by feed, Z to A'}`;
      await page.getByRole('table', { name }).waitFor({ timeout: 30_000 });
      const want = await firstFeeds(`sort=feed&direction=${direction}`);
      await page.waitForFunction((w) => {
        const got = Array.from(document.querySelectorAll('[data-testid="failures-table-body-row"] [data-testid^="failure-feed-"]')).slice(0, 3).map((e) => e.textContent);
        return JSON.stringify(got) === JSON.stringify(w);
      }, want, { timeout: 30_000 });
      expect(await shownFeeds()).toEqual(want);
      expect(await page.locator('[role="columnheader"][aria-sort]').evaluateAll((els) => els.map((e) => e.getAttribute('aria-sort')))).toContain(direction === 'asc' ? 'ascending' : 'descending');
      expect(asked.some((u) => u.includes(`sort=feed&direction=${direction}&limit=100&offset=0`))).toBe(true);
    }
    // the counts are the same whatever the order
    expect(await page.getByTestId('failing-checks-counts').innerText()).toContain('Errors:');
    await shot(page, 'lists-checks-sorted-wide');
    expect(errors).toEqual([]);
    await page.context().close();
  });
});

async function loginToken(base: string): Promise<string> {
  const u = demoUser('engineer');
  const r = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: u.email, password: u.password }) });
  return ((await r.json()) as { token: string }).token;
}

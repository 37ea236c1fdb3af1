/**
 * The analysis views in a real browser at both sizes: every route renders
 * real data with no console error, the reach screen agrees with the API, and
 * an axe-core scan finds no serious or critical violation.
 */
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { NetworkDocument } from '@/shared/schemas/network';
import type { ReachAnswer } from '@/shared/schemas/analysis';
import { apiGet, apiToken, baseUrl, digits, launch, openPage, recordTiming, shot, signIn, SIZES } from './browser';
import { seriousViolations } from './axe';

let browser: Browser;
let demo: NetworkDocument;
beforeAll(async () => {
  browser = await launch();
  demo = await apiGet<NetworkDocument>('/api/network/export');
});
afterAll(async () => browser?.close());

async function apiReach(failed: { kind: string; code: string }[]): Promise<ReachAnswer> {
  const r = await fetch(`${baseUrl()}/api/analysis/reach`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', authorization: `Bearer ${await apiToken('operator')}` },
    body: JSON.stringify({ failed }),
  });
  return (await r.json()) as ReachAnswer;
}

const relayCarriage = () => {
  const feed = demo.feeds.find((f) => f.medium === 'off-air' && f.role === 'main')!;
  return feed.to;
};

describe.each(Object.entries(SIZES))('views at %s size', (sizeName, size) => {
  it('fault reach for an origin shows the same lost count and households as the API', async () => {
    const origin = demo.sites.find((s) => s.role === 'origin')!;
    const expected = await apiReach([{ kind: 'site', code: origin.code }]);
    const { page, errors } = await openPage(browser, size);
    await signIn(page, 'operator');
    await page.goto(`${baseUrl()}/reach?fail=site:${origin.code}`);
    const lost = page.getByTestId('reach-lost-count');
    await lost.waitFor({ timeout: 20_000 });
    await page.waitForFunction((n) => document.querySelector('[data-testid="reach-lost-count"]')?.textContent?.replace(/[^0-9]/g, '') === String(n), expected.lost.length, { timeout: 10_000 });
    expect(digits(await lost.textContent())).toBe(expected.lost.length);
    expect(digits(await page.getByTestId('reach-households-lost').textContent())).toBe(expected.households.lost);
    expect(digits(await page.getByTestId('reach-fallback-count').textContent())).toBe(expected.fallback.length);
    await shot(page, `reach-origin-${sizeName}`);
    // every site row shows its name and code whole: no text in the list is cut short (clamped or ellipsed)
    const bySite = page.getByTestId('reach-by-site');
    await bySite.locator('a').first().waitFor({ timeout: 10_000 });
    const texts = await bySite.evaluate((list) => {
      // every element that holds words of its own (a title may hold a nested code span)
      const leaves = Array.from(list.querySelectorAll('a div')).filter((el) => Array.from(el.childNodes).some((n) => n.nodeType === 3 && (n.textContent ?? '').trim() !== ''));
      return { leaves: leaves.length, clipped: leaves.filter((el) => el.scrollWidth > el.clientWidth + 1 || el.scrollHeight > el.clientHeight + 1).map((el) => el.textContent) };
    });
    expect(texts.leaves).toBeGreaterThan(0);
    expect(texts.clipped).toEqual([]);
    expect(await seriousViolations(page)).toEqual([]);
    expect(errors).toEqual([]);
    await page.context().close();
  });

  it('updates the reach on screen after a change to the failure set, and measures how fast', async () => {
    const main = demo.sites.find((s) => s.role === 'main')!;
    const { page, errors } = await openPage(browser, size);
    await signIn(page, 'operator');
    await page.goto(`${baseUrl()}/reach`);
    const search = page.getByLabel('Find a site, carriage, feed or group');
    await search.waitFor({ timeout: 20_000 });
    await search.fill(main.code);
    const add = page.getByRole('button', { name: new RegExp(`^Add.*${main.code.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}`) }).first();
    await add.waitFor({ timeout: 10_000 });
    const expected = await apiReach([{ kind: 'site', code: main.code }]);
    const t0 = Date.now();
    await add.click();
    await page.waitForFunction((n) => document.querySelector('[data-testid="reach-lost-count"]')?.textContent?.replace(/[^0-9]/g, '') === String(n), expected.lost.length, { timeout: 10_000, polling: 16 });
    recordTiming(`reach-update-${sizeName}`, Date.now() - t0);
    expect(new URL(page.url()).searchParams.get('fail')).toContain(`site:${main.code}`);
    await shot(page, `reach-main-${sizeName}`);
    expect(errors).toEqual([]);
    await page.context().close();
  });

  it('overlays a failure set on the network diagram, marking the sites that go off air', async () => {
    const origin = demo.sites.find((s) => s.role === 'origin')!;
    const { page, errors } = await openPage(browser, size);
    await signIn(page, 'operator');
    await page.goto(`${baseUrl()}/network?fail=site:${origin.code}`);
    await page.getByTestId('network-diagram').waitFor({ timeout: 20_000 });
    await page.waitForFunction(() => /Failure set: [0-9,]+ sites? off air/.test(document.querySelector('[data-testid="network-summary"]')?.textContent ?? ''), undefined, { timeout: 15_000 });
    const summary = (await page.getByTestId('network-summary').textContent()) ?? '';
    expect(Number(/Failure set: ([0-9,]+)/.exec(summary)![1].replace(/,/g, ''))).toBeGreaterThan(0);
    await shot(page, `network-fail-${sizeName}`);
    expect(errors).toEqual([]);
    await page.context().close();
  });

  it("overlays a site's failure from its card with one reach request (asked for as the link is pressed)", async () => {
    // The request made from the press is the one the screen then uses: no second request. How much
    // sooner it starts is the diagram benchmark's to measure (scripts/bench-browser-diagram.ts).
    const { page, errors } = await openPage(browser, size);
    const reachRequests: string[] = [];
    page.on('request', (r) => {
      if (r.url().includes('/api/analysis/reach')) reachRequests.push(r.postData() ?? '');
    });
    await signIn(page, 'operator');
    await page.goto(`${baseUrl()}/network`);
    await page.getByTestId('network-diagram').waitFor({ timeout: 20_000 });
    await page.getByTestId('network-sites-in-view').getByRole('button').first().click();
    const card = page.getByTestId('network-site-card');
    await card.waitFor({ timeout: 10_000 });
    const code = decodeURIComponent((await card.locator('a[href^="/sites/"]').first().getAttribute('href'))!.slice('/sites/'.length));
    await page.getByTestId('network-site-overlay').click();
    await page.waitForFunction(() => /Failure set: [0-9,]+ sites? off air/.test(document.querySelector('[data-testid="network-summary"]')?.textContent ?? ''), undefined, { timeout: 15_000 });
    expect(decodeURIComponent(page.url())).toContain(`fail=site:${code}`);
    await page.waitForTimeout(500); // a second request would have been sent by now
    expect(reachRequests.map((body) => JSON.parse(body))).toEqual([{ failed: [{ kind: 'site', code }] }]);
    const summary = (await page.getByTestId('network-summary').textContent()) ?? '';
    expect(Number(/Failure set: ([0-9,]+)/.exec(summary)![1].replace(/,/g, ''))).toBeGreaterThan(0);
    expect(errors).toEqual([]);
    await page.context().close();
  });

  it('draws a carriage with its upstream chain, the network diagram and the resilience review', async () => {
    const { page, errors } = await openPage(browser, size);
    await signIn(page, 'engineer');
    const code = relayCarriage();
    const routes: [string, string][] = [
      [`/carriages/${code}`, `chain-${sizeName}`],
      ['/network', `network-${sizeName}`],
      ['/resilience', `resilience-${sizeName}`],
      ['/', `home-attention-${sizeName}`],
    ];
    for (const [route, name] of routes) {
      await page.goto(`${baseUrl()}${route}`);
      await page.waitForLoadState('networkidle');
      if (route.startsWith('/carriages')) await page.getByText(code).first().waitFor({ timeout: 20_000 });
      if (route === '/network') await page.getByTestId('network-diagram').waitFor({ timeout: 20_000 });
      if (route === '/') {
        // the home cards ask for the first few rows and the total: the counts are the whole lists' counts
        const gaps = await apiGet<{ carriages: unknown[] }>('/api/analysis/diversity');
        const unfed = await apiGet<{ carriages: unknown[] }>('/api/analysis/unfed');
        const gapsCard = page.getByTestId('attention-gaps');
        await gapsCard.waitFor({ timeout: 20_000 });
        expect(await gapsCard.innerText()).toContain(`Diversity gaps: ${gaps.carriages.length.toLocaleString('en-GB')}`);
        const unfedCard = page.getByTestId('attention-unfed');
        await unfedCard.waitFor({ timeout: 20_000 });
        expect(await unfedCard.innerText()).toContain(`Unfed carriages: ${unfed.carriages.length.toLocaleString('en-GB')}`);
        expect(gaps.carriages.length).toBeGreaterThan(3);
        expect(await gapsCard.innerText()).toContain(`All ${gaps.carriages.length} carriages with a gap`);
      }
      const body = (await page.locator('body').innerText()).toLowerCase();
      expect(body, route).not.toContain('something went wrong');
      expect(body.length, route).toBeGreaterThan(40);
      await shot(page, name);
      const v = await seriousViolations(page);
      expect(v, `${route}: ${JSON.stringify(v)}`).toEqual([]);
    }
    expect(errors).toEqual([]);
    await page.context().close();
  });
});

/**
 * Fault reach with no connection, in a real browser at both sizes: after one
 * visit online the service worker holds the app shell and IndexedDB holds the
 * network; with the browser offline, a shared reach link still opens, the
 * answer equals the server's, and the screen says it is the offline copy with its
 * version (a change refused in words is tested in src/api/client.test.ts). With the browser online but
 * the server out of reach, the copy answers too, read from the store when the request fails. A stored copy
 * that is corrupt is thrown away and fetched again.
 */
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { NetworkDocument } from '@/shared/schemas/network';
import type { ReachAnswer } from '@/shared/schemas/analysis';
import { COPY_LOCATION } from '@/src/offline/location';
import { QUIET_MS } from '@/src/offline/whenSettled';
import { apiGet, apiToken, baseUrl, digits, launch, openPage, shot, signIn, SIZES, storedCopy, waitForWorker } from './browser';

let browser: Browser;
let demo: NetworkDocument;
let version: number;
beforeAll(async () => {
  browser = await launch();
  demo = await apiGet<NetworkDocument>('/api/network/export');
  version = Number((await apiGet<{ networkVersion: number }>('/api/network/summary')).networkVersion);
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

async function waitForCopy(page: Page) {
  await expect.poll(() => storedCopy(page), { timeout: 60_000, interval: 500 }).toEqual({ networkVersion: version, sites: demo.sites.length });
}

describe.each(Object.entries(SIZES))('offline fault reach at %s size', (sizeName, size) => {
  it('opens a shared reach link with no connection and answers from the stored copy as the server would', async () => {
    const origin = demo.sites.find((s) => s.role === 'origin')!;
    const expected = await apiReach([{ kind: 'site', code: origin.code }]);
    const { page } = await openPage(browser, size);
    await signIn(page, 'operator');
    await page.goto(`${baseUrl()}/reach`);
    await waitForCopy(page);
    await waitForWorker(page);

    await page.context().setOffline(true);
    await page.goto(`${baseUrl()}/reach?fail=site:${origin.code}`);
    const note = page.getByTestId('offline-note');
    await note.waitFor({ timeout: 30_000 });
    expect(await note.textContent()).toMatch(new RegExp(`Offline — network version ${version}, fetched at \\d\\d:\\d\\d`));
    expect(digits(await page.getByTestId('reach-lost-count').textContent())).toBe(expected.lost.length);
    expect(digits(await page.getByTestId('reach-households-lost').textContent())).toBe(expected.households.lost);
    expect(digits(await page.getByTestId('reach-fallback-count').textContent())).toBe(expected.fallback.length);
    // the benchmark's record of the engine built from the copy (src/offline/localEngine.ts)
    const record = await page.evaluate((code) => {
      const h = window.__headwaterOffline;
      return h && { sites: h.sites, networkVersion: h.networkVersion, buildMs: h.buildMs, reachMs: h.timeReach([{ kind: 'site', code }]), offAir: h.offAir([{ kind: 'site', code }]) };
    }, origin.code);
    expect(record).toMatchObject({ sites: demo.sites.length, networkVersion: version });
    expect(record!.buildMs).toBeGreaterThan(0);
    expect(Number.isFinite(record!.reachMs)).toBe(true);
    // the engine the benchmark times is the one that answered on screen: the same failure, the same figures
    expect(record!.offAir).toEqual({ carriages: expected.lost.length, households: expected.households.lost });
    await shot(page, `offline-reach-${sizeName}`);

    await page.context().close();
  });
});

describe('a server that cannot be reached', () => {
  it('is answered from the stored copy, read from the store only when the request fails', async () => {
    const origin = demo.sites.find((s) => s.role === 'origin')!;
    const expected = await apiReach([{ kind: 'site', code: origin.code }]);
    const { page } = await openPage(browser, SIZES.phone);
    await signIn(page, 'operator');
    await page.goto(`${baseUrl()}/reach`);
    await waitForCopy(page);
    // The browser still says it is online; only the API is gone (a server down, a link cut upstream).
    // A fresh page, so the copy has not been read yet: the page reads it on settling, seconds later.
    let refused = 0;
    await page.route('**/api/**', (route) => {
      refused++;
      return route.abort('connectionrefused');
    });
    await page.goto(`${baseUrl()}/reach?fail=site:${origin.code}`);
    // When the note is first seen, on the page's clock, against its load: the page's own reading of the
    // copy waits QUIET_MS after the load, so a note before then came from the failed request's read.
    const { seenAt, loadedAt } = await page.evaluate(
      () =>
        new Promise<{ seenAt: number; loadedAt: number }>((resolve) => {
          const look = () =>
            document.querySelector('[data-testid="offline-note"]')
              ? resolve({ seenAt: performance.now(), loadedAt: (performance.getEntriesByType('navigation')[0] as PerformanceNavigationTiming).loadEventEnd })
              : requestAnimationFrame(look);
          look();
        }),
    );
    expect(seenAt - loadedAt).toBeLessThan(QUIET_MS);
    const note = page.getByTestId('offline-note');
    expect(refused).toBeGreaterThan(0);
    expect(await note.textContent()).toMatch(new RegExp(`Offline — network version ${version}, fetched at \\d\\d:\\d\\d`));
    expect(digits(await page.getByTestId('reach-lost-count').textContent())).toBe(expected.lost.length);
    expect(digits(await page.getByTestId('reach-households-lost').textContent())).toBe(expected.households.lost);
    await page.context().close();
  });
});

describe('a corrupt stored copy', () => {
  it('is discarded and fetched again', async () => {
    const { page } = await openPage(browser, SIZES.phone);
    await signIn(page, 'viewer');
    await page.goto(`${baseUrl()}/reach`);
    await waitForCopy(page);
    await page.evaluate(
      ({ database, store, key }) =>
        new Promise<void>((resolve, reject) => {
          const open = indexedDB.open(database);
          open.onsuccess = () => {
            const tx = open.result.transaction(store, 'readwrite');
            tx.objectStore(store).put({ networkVersion: 'not a number', document: { format: 'something else' } }, key);
            tx.oncomplete = () => resolve();
            tx.onerror = () => reject(tx.error);
          };
        }),
      COPY_LOCATION,
    );
    expect(await storedCopy(page)).toEqual({ networkVersion: 'not a number' as unknown as number, sites: -1 });
    await page.reload();
    await waitForCopy(page);
    await page.context().close();
  });
});

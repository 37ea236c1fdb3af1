/**
 * Sign-in and the signed-in shell in a real browser, for every role, on a
 * phone (390x844: bottom tabs) and a wide screen (1440x900: side navigation).
 */
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROLES } from '@/shared/api';
import { seriousViolations } from './axe';
import { apiGet, baseUrl, demoUser, digits, launch, openPage, shot, signIn, SIZES } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => browser?.close());

interface Summary {
  counts: { sites: number; carriages: number; feeds: number };
}

describe.each(Object.entries(SIZES))('shell at %s size', (sizeName, size) => {
  it.each(ROLES)('signs in as %s, shows the shell and the real counts, signs out', async (role) => {
    const { page, errors, external } = await openPage(browser, size);
    await signIn(page, role);
    const summary = await apiGet<Summary>('/api/network/summary');
    const sites = page.getByTestId('count-sites');
    await sites.waitFor({ timeout: 20_000 });
    expect(digits(await sites.textContent())).toBe(summary.counts.sites);
    expect(digits(await page.getByTestId('count-carriages').textContent())).toBe(summary.counts.carriages);
    expect(digits(await page.getByTestId('count-feeds').textContent())).toBe(summary.counts.feeds);

    if (sizeName === 'phone') {
      await expect(page.getByTestId('tab-bar').isVisible()).resolves.toBe(true);
      expect(await page.getByTestId('side-nav').count()).toBe(0);
    } else {
      await expect(page.getByTestId('side-nav').isVisible()).resolves.toBe(true);
      expect(await page.getByTestId('tab-bar').count()).toBe(0);
    }
    // only admins are offered the people screen
    const people = page.getByTestId(sizeName === 'phone' ? 'more-people' : 'nav-people');
    if (sizeName === 'phone') await page.getByTestId('nav-more').click();
    // routes load on demand: wait for the menu before counting what it offers
    await page.locator(sizeName === 'phone' ? '[data-testid^="more-"]' : '[data-testid="side-nav"]').first().waitFor({ timeout: 20_000 });
    expect(await people.count()).toBe(role === 'admin' ? 1 : 0);
    await shot(page, `shell-${role}-${sizeName}`);

    // the session survives a reload
    await page.reload();
    await page.getByTestId(sizeName === 'phone' ? 'tab-bar' : 'side-nav').waitFor({ timeout: 20_000 });
    expect(new URL(page.url()).pathname).not.toBe('/sign-in');

    if (sizeName === 'phone' && (await page.getByTestId('sign-out').count()) === 0) await page.getByTestId('nav-more').click();
    await page.getByTestId('sign-out').first().click();
    await page.waitForURL((u) => u.pathname.startsWith('/sign-in'), { timeout: 10_000 });
    expect(errors).toEqual([]);
    expect(external).toEqual([]);
    await page.context().close();
  });
});

describe('sign-in guard', () => {
  it('sends a signed-out visitor of a deep link to sign-in, then back to the link', async () => {
    const { page, errors } = await openPage(browser, SIZES.phone);
    await page.goto(`${baseUrl()}/resilience`);
    await page.waitForURL((u) => u.pathname.startsWith('/sign-in'), { timeout: 20_000 });
    const u = demoUser('viewer');
    await page.getByLabel('Email').fill(u.email);
    await page.getByLabel('Password').fill(u.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => url.pathname === '/resilience', { timeout: 20_000 });
    expect(errors).toEqual([]);
    await page.context().close();
  });

  it('shows a clear message for a wrong password and stays on sign-in', async () => {
    const { page } = await openPage(browser, SIZES.wide);
    await page.goto(`${baseUrl()}/sign-in`);
    await page.getByLabel('Email').fill('viewer@headwater.example');
    await page.getByLabel('Password').fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    const msg = page.getByTestId('sign-in-error');
    await msg.waitFor({ timeout: 10_000 });
    expect((await msg.textContent())?.toLowerCase()).toContain('not recognised');
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await page.context().close();
  });
});

describe('a screen still loading', () => {
  it('names its progress indicator and passes the accessibility scan', async () => {
    const { page, errors } = await openPage(browser, SIZES.phone);
    await signIn(page, 'viewer');
    // hold the checks list back, so the loading state stays on screen for the scan
    let release = () => {};
    const held = new Promise<void>((resolve) => (release = resolve));
    await page.route('**/api/checks**', async (route) => {
      await held;
      await route.continue();
    });
    await page.goto(`${baseUrl()}/checks`);
    const loading = page.getByRole('progressbar', { name: 'Loading the failing checks' });
    await loading.waitFor({ timeout: 20_000 });
    expect(await seriousViolations(page)).toEqual([]);
    release();
    await loading.waitFor({ state: 'detached', timeout: 30_000 });
    expect(errors).toEqual([]);
    await page.context().close();
  });
});

/**
 * Keeping the inventory true, in a real browser on a phone: a site created
 * through the form (after the shared schema refused a latitude of 95), and
 * the demo document imported through the upload screen after a dry run.
 * Then every inventory and checks route at both sizes, with an axe-core scan.
 */
import path from 'node:path';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { NetworkDocument } from '@/shared/schemas/network';
import { apiGet, baseUrl, launch, openPage, shot, signIn, SIZES, PHONE } from './browser';
import { seriousViolations } from './axe';

const DEMO_FILE = path.resolve(__dirname, '..', 'fixtures', 'demo-network.json');

let browser: Browser;
let demo: NetworkDocument;
beforeAll(async () => {
  browser = await launch();
  demo = await apiGet<NetworkDocument>('/api/network/export');
});
afterAll(async () => browser?.close());

describe('inventory on a phone', () => {
  it('creates a site through the form, after a validation message for latitude 95', async () => {
    const { page, errors } = await openPage(browser, PHONE);
    await signIn(page, 'engineer');
    await page.goto(`${baseUrl()}/sites`);
    await page.getByRole('button', { name: 'New site' }).or(page.getByRole('link', { name: 'New site' })).first().click();
    await page.getByLabel('Code', { exact: true }).waitFor({ timeout: 20_000 });
    await page.getByLabel('Code', { exact: true }).fill('E2E-RLY-1');
    await page.getByLabel('Name', { exact: true }).fill('Test Hollow relay');
    await page.getByLabel('Latitude').fill('95');
    await page.getByLabel('Longitude').fill('-29.5');
    await page.getByRole('radiogroup', { name: 'Site type' }).getByRole('radio', { name: /relay/i }).click();
    await page.getByRole('button', { name: 'Save site' }).click();
    await page.getByText('latitude is between -90 and 90').first().waitFor({ timeout: 10_000 });
    await shot(page, 'site-form-latitude-phone');
    expect((await apiGet<{ items: unknown[] }>('/api/sites?q=E2E-RLY-1')).items).toHaveLength(0);

    await page.getByLabel('Latitude').fill('-38.9');
    await page.getByRole('button', { name: 'Save site' }).click();
    await page.waitForURL((u) => u.pathname === '/sites/E2E-RLY-1', { timeout: 20_000 });
    const stored = await apiGet<{ site?: { lat: number }; lat?: number }>('/api/sites/E2E-RLY-1');
    expect(stored.site?.lat ?? stored.lat).toBeCloseTo(-38.9, 6);
    await shot(page, 'site-created-phone');
    expect(errors).toEqual([]);
    await page.context().close();
  });

  it('imports the demo document through the upload screen after a dry run', async () => {
    const { page, errors } = await openPage(browser, PHONE);
    await signIn(page, 'engineer');
    await page.goto(`${baseUrl()}/import`);
    const input = page.locator('input[type=file]').first();
    await input.waitFor({ state: 'attached', timeout: 20_000 });
    await input.setInputFiles(DEMO_FILE);
    // the dry run starts as soon as a file is chosen; its report must show before anything is written
    const report = page.getByRole('region', { name: 'Import report' }).or(page.getByLabel('Import report')).first();
    await report.waitFor({ timeout: 30_000 });
    const commit = page.getByRole('button', { name: 'Commit import' });
    await commit.waitFor({ timeout: 30_000 });
    await shot(page, 'import-dry-run-phone');
    const importsBefore = (await apiGet<{ total: number }>('/api/audit?action=import', 'admin')).total;
    await commit.click();
    await page.getByText(/imported|import committed|network version/i).first().waitFor({ timeout: 30_000 });
    await shot(page, 'import-committed-phone');
    // the demo network is already loaded (plus the site made above), so nothing changes but the import is recorded
    const after = await apiGet<NetworkDocument>('/api/network/export');
    for (const s of demo.sites) expect(after.sites.find((x) => x.code === s.code)).toEqual(s);
    // the dry run left no trace; the commit left exactly one import in the audit log
    expect((await apiGet<{ total: number }>('/api/audit?action=import', 'admin')).total).toBe(importsBefore + 1);
    expect(errors).toEqual([]);
    await page.context().close();
  });
});

describe.each(Object.entries(SIZES))('inventory and checks routes at %s size', (sizeName, size) => {
  it('renders every route with real data, no console error and no serious accessibility violation', async () => {
    const { page, errors } = await openPage(browser, size);
    await signIn(page, 'engineer');
    const site = demo.sites.find((s) => s.role === 'relay')!;
    const feed = demo.feeds.find((f) => f.medium === 'off-air')!;
    const routes: [string, string][] = [
      ['/sites', site.code],
      [`/sites/${site.code}`, site.name],
      ['/services', demo.services[0].code],
      ['/groups', demo.groups[0].code],
      ['/carriages', demo.carriages[0].code],
      ['/feeds', demo.feeds[0].code],
      [`/feeds/${feed.code}`, feed.code],
      ['/import', 'Import'],
      ['/checks', 'Failing checks'],
      ['/calculator', 'Channel'],
      ['/admin/users', 'not allowed'],
    ];
    for (const [route, text] of routes) {
      await page.goto(`${baseUrl()}${route}`);
      await page.getByText(text, { exact: false }).first().waitFor({ timeout: 20_000 });
      await page.waitForLoadState('networkidle');
      await shot(page, `route-${route.replace(/[^a-z0-9]+/gi, '_')}-${sizeName}`);
      const v = await seriousViolations(page);
      expect(v, `${route}: ${JSON.stringify(v)}`).toEqual([]);
    }
    expect(errors).toEqual([]);
    await page.context().close();
  });

  it('converts a UHF channel to its centre frequency in the calculator', async () => {
    const { page, errors } = await openPage(browser, size);
    await signIn(page, 'viewer');
    await page.goto(`${baseUrl()}/calculator`);
    const channel = page.getByLabel('Channel').first();
    await channel.waitFor({ timeout: 20_000 });
    await channel.fill('39');
    // 306 + 8 x 39 = 618 MHz (European UHF raster; docs/checks.md, "Channels and frequencies")
    await page.waitForFunction(() => /618/.test(document.querySelector('[data-testid="calc-frequency"]')?.textContent ?? ''), undefined, { timeout: 10_000 });
    expect(await page.getByTestId('calc-frequency').textContent()).toMatch(/centre 618(\.0)? MHz/);
    expect(errors).toEqual([]);
    await page.context().close();
  });
});

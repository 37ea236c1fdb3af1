/**
 * The demo network's diagram in a real browser at both sizes: it draws the
 * invented demo land (and names it), a distance scale that follows the zoom,
 * and the service choices stay inside the screen. Screenshots go to
 * artifacts/e2e/demo-diagram-*.png.
 */
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import path from 'node:path';
import { ARTIFACTS, baseUrl, launch, openPage, shot, signIn, SIZES } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => browser?.close());

/** "20 km" -> 20, "500 m" -> 0.5 */
const scaleKm = (label: string) => {
  const m = /Scale: the bar is ([0-9,.]+) (km|m)/.exec(label);
  if (!m) throw new Error(`no scale in "${label}"`);
  const n = Number(m[1].replace(/,/g, ''));
  return m[2] === 'km' ? n : n / 1000;
};

describe.each(Object.entries(SIZES))('demo diagram at %s size', (sizeName, size) => {
  it('draws the invented land, names it, and shows a distance scale that follows the zoom', async () => {
    const { page, errors } = await openPage(browser, size);
    await signIn(page, 'viewer');
    const drawingAsks: string[] = [];
    page.on('request', (r) => {
      if (new URL(r.url()).pathname === '/api/network/drawing') drawingAsks.push(r.url());
    });
    const boot = page.waitForRequest((r) => /\/boot-[0-9a-f]{32}\.js$/.test(new URL(r.url()).pathname), { timeout: 15_000 });
    await page.goto(`${baseUrl()}/network`);
    await boot;
    const diagram = page.getByTestId('network-diagram');
    await diagram.waitFor({ timeout: 30_000 });
    await page.waitForFunction(() => (window.__headwaterDiagram?.draws.length ?? 0) > 0, undefined, { timeout: 15_000 });
    // The boot script fetched the screen's chunk ahead of the app (a preload link), and sent the one drawing request the app then used.
    expect(drawingAsks).toHaveLength(1);
    const chunk = await page.evaluate(() => (performance.getEntriesByType('resource') as PerformanceResourceTiming[]).find((e) => /\/network-[0-9a-f]{32}\.js$/.test(new URL(e.name).pathname))?.initiatorType ?? null);
    expect(chunk).toBe('link');

    // Land: drawn on the canvas with real outline data (the drawing's record says where), and its credit in words.
    await page.waitForFunction(() => !!window.__headwaterDiagram?.last?.land, undefined, { timeout: 15_000 });
    await expect.poll(() => page.getByTestId('network-land-credit').textContent()).toContain('Invented demo coastline');
    expect((await page.getByTestId('network-land-credit').textContent()) ?? '').not.toContain('Natural Earth');
    // The island fills the middle of the picture, where the sites are, and most of the box one way or the other.
    const box = (await diagram.boundingBox())!;
    const landBox = (await page.evaluate(() => window.__headwaterDiagram!.last!.land))!;
    expect(Math.max(landBox.width / box.width, landBox.height / box.height)).toBeGreaterThan(0.6);
    expect(landBox.x).toBeLessThan(box.width / 2);
    expect(landBox.x + landBox.width).toBeGreaterThan(box.width / 2);

    const scale = page.getByTestId('network-scale');
    await scale.waitFor({ timeout: 10_000 });
    const before = scaleKm((await scale.getAttribute('aria-label')) ?? '');
    expect(before).toBeGreaterThan(1);
    expect(await scale.textContent()).toMatch(/^[0-9,]+ (km|m)$/);
    await shot(page, `demo-diagram-${sizeName}`);
    await diagram.screenshot({ path: path.join(ARTIFACTS, `demo-diagram-box-${sizeName}.png`) });

    for (let i = 0; i < 3; i++) await page.getByTestId('network-zoom-in').click();
    await expect.poll(async () => scaleKm((await scale.getAttribute('aria-label')) ?? ''), { timeout: 10_000 }).toBeLessThan(before / 2);
    await diagram.screenshot({ path: path.join(ARTIFACTS, `demo-diagram-box-zoomed-${sizeName}.png`) });

    // The service choices stay within the screen width: they wrap or scroll inside their row.
    const pageWidth = await page.evaluate(() => document.documentElement.scrollWidth);
    expect(pageWidth).toBeLessThanOrEqual(size.width);
    const last = page.getByTestId('network-service-MX5');
    const row = await page.getByTestId('network-service-all').evaluate((el) => el.closest('[data-testid="network-services"]')?.getBoundingClientRect().right ?? NaN);
    expect(row).toBeLessThanOrEqual(size.width);
    await last.scrollIntoViewIfNeeded();
    const lastBox = (await last.boundingBox())!;
    expect(lastBox.x + lastBox.width).toBeLessThanOrEqual(size.width + 0.5);
    expect(errors).toEqual([]);
  });
});

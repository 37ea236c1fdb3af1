/**
 * A transmitter (carriage) marked failed on the fault reach screen, at both
 * sizes: found by its site's and service's names together, added to the
 * failure set, and what it takes off air matches the API, carriage by
 * carriage count and households; the shareable link carries it.
 */
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { NetworkDocument } from '@/shared/schemas/network';
import type { ReachAnswer } from '@/shared/schemas/analysis';
import { apiGet, apiToken, baseUrl, digits, launch, openPage, shot, signIn, SIZES } from './browser';

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

/** A main station's transmitter that is the source of some main off-air feed: failing it takes more than itself. */
function parentTransmitter() {
  const mains = new Set(demo.sites.filter((s) => s.role === 'main').map((s) => s.code));
  const feed = demo.feeds.find((f) => f.medium === 'off-air' && f.role === 'main' && mains.has(demo.carriages.find((c) => c.code === f.from)!.site))!;
  const carriage = demo.carriages.find((c) => c.code === feed.from)!;
  const site = demo.sites.find((s) => s.code === carriage.site)!;
  const service = demo.services.find((s) => s.code === carriage.service)!;
  return { carriage, site, service };
}

describe.each(Object.entries(SIZES))('a failed carriage at %s size', (sizeName, size) => {
  it('found by site and service, shows what it takes off air', async () => {
    const { carriage, site, service } = parentTransmitter();
    const expected = await apiReach([{ kind: 'carriage', code: carriage.code }]);
    expect(expected.lost).toContain(carriage.code);
    expect(expected.lost.length).toBeGreaterThan(1);
    const { page, errors } = await openPage(browser, size);
    await signIn(page, 'operator');
    await page.goto(`${baseUrl()}/reach`);
    const search = page.getByLabel('Find a site, carriage, feed or group');
    await search.waitFor({ timeout: 20_000 });
    await search.fill(`${site.name} ${service.name}`);
    const add = page.getByRole('button', { name: `Add carriage ${carriage.code}, ${site.name}, ${service.name}` });
    await add.waitFor({ timeout: 10_000 });
    await add.click();
    await page.waitForFunction((n) => document.querySelector('[data-testid="reach-lost-count"]')?.textContent?.replace(/[^0-9]/g, '') === String(n), expected.lost.length, { timeout: 10_000 });
    expect(digits(await page.getByTestId('reach-households-lost').textContent())).toBe(expected.households.lost);
    expect(new URL(page.url()).searchParams.get('fail')).toBe(`carriage:${carriage.code}`);
    // the site itself is not failed: its other services stay on air
    const bySite = await apiReach([{ kind: 'site', code: site.code }]);
    expect(bySite.lost.length).toBeGreaterThan(expected.lost.length);
    await shot(page, `reach-carriage-${sizeName}`);
    expect(errors).toEqual([]);
    await page.context().close();
  });
});

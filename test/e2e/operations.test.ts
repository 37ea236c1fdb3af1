/**
 * Operations in a real browser at 390 px and 1440 px: an incident opened from
 * the fault reach screen in two taps; the clash sentence seen before
 * approving a planned work; the availability table (cards on a phone) and its
 * CSV download.
 */
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '@/shared/api';
import type { NetworkDocument } from '@/shared/schemas/network';
import { apiGet, apiToken, baseUrl, launch, openPage, shot, signIn, SIZES } from './browser';

let browser: Browser;
let doc: NetworkDocument;
beforeAll(async () => {
  browser = await launch();
  doc = await apiGet<NetworkDocument>('/api/network/export');
});
afterAll(async () => browser?.close());

async function apiPost<T>(path: string, body: object, role: Role): Promise<T> {
  const r = await fetch(`${baseUrl()}${path}`, { method: 'POST', headers: { 'content-type': 'application/json', authorization: `Bearer ${await apiToken(role)}` }, body: JSON.stringify(body) });
  if (!r.ok) throw new Error(`POST ${path} answered ${r.status}: ${await r.text()}`);
  return (await r.json()) as T;
}

/** A main and a reserve feed into one carriage that lose something only together (found through the reach API). */
async function clashingFeeds(): Promise<[string, string]> {
  const lost = async (codes: string[]) =>
    (await apiPost<{ lost: string[] }>('/api/analysis/reach', { failed: codes.map((code) => ({ kind: 'feed', code })) }, 'viewer')).lost.length;
  for (const c of doc.carriages) {
    const main = doc.feeds.find((f) => f.to === c.code && f.role === 'main');
    const reserve = doc.feeds.find((f) => f.to === c.code && f.role === 'reserve');
    if (!main || !reserve) continue;
    if ((await lost([main.code, reserve.code])) > (await lost([main.code])) + (await lost([reserve.code]))) return [main.code, reserve.code];
  }
  throw new Error('the demo network has no main and reserve feed pair with a joint loss');
}

describe.each(Object.entries(SIZES))('operations at %s size', (sizeName, size) => {
  it('opens an incident from the fault reach screen in two taps', async () => {
    const { page, errors } = await openPage(browser, size);
    await signIn(page, 'operator');
    const site = doc.sites.find((s) => s.role === 'main')!;
    await page.goto(`${baseUrl()}/reach?fail=site:${site.code}`);
    const first = page.getByRole('button', { name: 'Open an incident for this failure set' });
    await first.waitFor({ timeout: 30_000 });
    await first.click(); // tap 1
    await page.getByRole('button', { name: 'Open the incident' }).click(); // tap 2
    await page.waitForURL((u) => u.pathname.startsWith('/incidents/I-'), { timeout: 20_000 });
    const code = new URL(page.url()).pathname.split('/').pop()!;
    await page.getByText(/Computed at network version \d+/).first().waitFor({ timeout: 20_000 });
    const stored = await apiGet<{ elements: { code: string }[]; open: boolean; steps: unknown[] }>(`/api/incidents/${code}`);
    expect(stored.elements.map((e) => e.code)).toEqual([site.code]);
    expect([stored.open, stored.steps.length]).toEqual([true, 1]);
    await shot(page, `incident-from-reach-${sizeName}`);
    // close it again so the next size starts from the same network state
    await apiPost(`/api/incidents/${code}/updates`, { version: 1, close: true }, 'operator');
    expect(errors).toEqual([]);
    await page.context().close();
  });

  it('shows the clash before approving', async () => {
    const [mainFeed, reserveFeed] = await clashingFeeds();
    const day = sizeName === 'phone' ? '2027-05-03' : '2027-05-10';
    const first = await apiPost<{ code: string }>('/api/works', { title: 'Line card swap', elements: [{ kind: 'feed', code: mainFeed }], start: `${day}T06:00:00Z`, end: `${day}T12:00:00Z`, submit: true }, 'operator');
    await apiPost(`/api/works/${first.code}/approve`, { version: 1 }, 'admin');
    const second = await apiPost<{ code: string }>('/api/works', { title: 'Dish realignment', elements: [{ kind: 'feed', code: reserveFeed }], start: `${day}T10:00:00Z`, end: `${day}T14:00:00Z`, submit: true }, 'operator');
    const { page, errors } = await openPage(browser, size);
    await signIn(page, 'engineer');
    await page.goto(`${baseUrl()}/works/${second.code}`);
    await page.getByRole('button', { name: 'Approve…' }).click();
    const sentence = page.getByTestId(`approve-clash-${first.code}`);
    await sentence.waitFor({ timeout: 20_000 });
    expect(await sentence.textContent()).toMatch(new RegExp(`Approving this puts \\d+ carriages? off air together with ${first.code}`));
    await expect(page.getByText('Work at height and near live antennas', { exact: false }).first().isVisible()).resolves.toBe(true);
    await shot(page, `work-clash-before-approval-${sizeName}`);
    await page.getByRole('button', { name: 'Approve the work' }).click();
    await page.getByText('Approved', { exact: true }).first().waitFor({ timeout: 20_000 });
    expect((await apiGet<{ state: string }>(`/api/works/${second.code}`)).state).toBe('approved');
    expect(errors).toEqual([]);
    await page.context().close();
  });

  it('shows availability worst first and downloads the CSV', async () => {
    const { page, errors } = await openPage(browser, size);
    await signIn(page, 'viewer');
    await page.goto(`${baseUrl()}/availability`);
    const row = sizeName === 'wide' ? page.getByTestId('availability-table-carriage') : page.getByTestId(/^availability-card-/).first();
    await row.waitFor({ timeout: 30_000 });
    const [download] = await Promise.all([page.waitForEvent('download', { timeout: 20_000 }), page.getByRole('button', { name: 'Download CSV' }).click()]);
    expect(download.suggestedFilename()).toMatch(/^availability-.*\.csv$/);
    const text = await (await import('node:fs')).promises.readFile((await download.path())!, 'utf8');
    expect(text.split('\n')[0]).toBe('level,code,site,service,minutes_off_air,minutes_planned,availability_percent');
    expect(text).toMatch(/^carriage,/m);
    await shot(page, `availability-${sizeName}`);
    expect(errors).toEqual([]);
    await page.context().close();
  });
});

/**
 * Editing records without typing codes, at phone and wide sizes: a carriage
 * edited and deleted from its own page (the delete showing what it would
 * take off air first), and a feed whose source carriage is picked from the
 * nearest-first list, not typed, with its code proposed by the form.
 */
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { NetworkDocument } from '@/shared/schemas/network';
import { apiGet, apiToken, baseUrl, launch, openPage, shot, signIn, SIZES } from './browser';

let browser: Browser;
let demo: NetworkDocument;
beforeAll(async () => {
  browser = await launch();
  demo = await apiGet<NetworkDocument>('/api/network/export');
});
afterAll(async () => browser?.close());

async function apiPost(path: string, body: object): Promise<Response> {
  return fetch(`${baseUrl()}${path}`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', authorization: `Bearer ${await apiToken('engineer')}` },
    body: JSON.stringify(body),
  });
}

/** A site and service of the demo with no carriage of that service there yet (a site radiates each service once). */
function freeSlot(skip: number): { site: string; service: string } {
  const service = demo.carriages[0].service;
  const taken = new Set(demo.carriages.filter((c) => c.service === service).map((c) => c.site));
  const free = demo.sites.filter((s) => !taken.has(s.code));
  return { site: free[skip].code, service };
}

describe.each(Object.entries(SIZES))('record editing at %s size', (sizeName, size) => {
  it('edits and deletes a carriage from its own page, seeing what the delete takes off air', async () => {
    const slot = freeSlot(sizeName === 'phone' ? 0 : 1);
    const code = `E2E-EDIT-${sizeName}`;
    expect((await apiPost('/api/carriages', { code, site: slot.site, service: slot.service })).status).toBe(201);

    const { page, errors } = await openPage(browser, size);
    await signIn(page, 'engineer');
    await page.goto(`${baseUrl()}/carriages/${code}`);
    await page.getByRole('button', { name: 'Edit carriage' }).click();
    await page.getByLabel('ERP', { exact: true }).fill('250');
    await page.getByRole('button', { name: 'Save carriage' }).click();
    await page.getByRole('button', { name: 'Edit carriage' }).waitFor({ timeout: 20_000 });
    const edited = await apiGet<{ carriage: { erpW?: number; version: number } }>(`/api/carriages/${code}`);
    expect(edited.carriage.erpW).toBe(250);
    expect(edited.carriage.version).toBe(2);

    await page.getByRole('button', { name: 'Delete carriage', exact: true }).click();
    await page.getByTestId('delete-impact').waitFor({ timeout: 20_000 });
    await shot(page, `carriage-delete-impact-${sizeName}`);
    await page.getByRole('button', { name: `Delete carriage ${code}` }).click();
    await page.waitForURL((u) => u.pathname === '/carriages', { timeout: 20_000 });
    const gone = await fetch(`${baseUrl()}/api/carriages/${code}`, { headers: { authorization: `Bearer ${await apiToken('viewer')}` } });
    expect(gone.status).toBe(404);
    expect(errors.filter((e) => !/404/.test(e))).toEqual([]);
    await page.context().close();
  });

  it('creates a feed whose source carriage is picked from the nearest first, not typed', async () => {
    const slot = freeSlot(sizeName === 'phone' ? 2 : 3);
    const target = `E2E-RX-${sizeName}`;
    expect((await apiPost('/api/carriages', { code: target, site: slot.site, service: slot.service })).status).toBe(201);
    const nearest = (await apiGet<{ items: { carriage: string }[] }>(`/api/carriages/${target}/sources`)).items[0].carriage;

    const { page, errors } = await openPage(browser, size);
    await signIn(page, 'engineer');
    await page.goto(`${baseUrl()}/feeds?new=1`);
    const to = page.getByLabel('Receiving carriage', { exact: true });
    await to.waitFor({ timeout: 20_000 });
    await to.fill(target);
    await page.getByRole('button', { name: new RegExp(`^Pick ${target},`) }).click();
    expect(await to.inputValue()).toBe(target);

    const from = page.getByLabel('Source carriage', { exact: true });
    await from.click();
    const first = page.getByTestId('field-feeds-from-option').first();
    await first.waitFor({ timeout: 20_000 });
    await page.getByText('Nearest first').waitFor();
    expect(await first.getAttribute('aria-label')).toMatch(new RegExp(`^Pick ${nearest.replace(/\./g, '\\.')}, .* km, bearing \\d{3}\\.\\d°`));
    await shot(page, `feed-source-picker-${sizeName}`);
    await first.click();
    expect(await from.inputValue()).toBe(nearest);

    await page.getByRole('radiogroup', { name: 'Medium' }).getByRole('radio', { name: 'line' }).click();
    await page.getByRole('radiogroup', { name: 'Main or reserve' }).getByRole('radio', { name: 'main' }).click();
    expect(await page.getByLabel('Code', { exact: true }).inputValue()).toBe(`${target}.M`);
    await page.getByRole('button', { name: 'Save feed' }).click();
    await page.waitForURL((u) => u.pathname === `/feeds/${target}.M`, { timeout: 20_000 });
    const stored = await apiGet<{ feed: { from: string; to: string; role: string } }>(`/api/feeds/${target}.M`);
    expect(stored.feed).toMatchObject({ from: nearest, to: target, role: 'main' });
    expect(errors).toEqual([]);
    await page.context().close();
  });
});

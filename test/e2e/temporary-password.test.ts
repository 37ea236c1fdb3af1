/**
 * A temporary password set by an admin, in a real browser on a phone and a
 * wide screen: sign in with it, be made to choose a new one, reach the app;
 * the temporary password then no longer signs in.
 */
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiToken, baseUrl, launch, openPage, shot, SIZES } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => browser?.close());

async function api(path: string, method: string, token: string, body: unknown) {
  const r = await fetch(`${baseUrl()}${path}`, { method, headers: { 'content-type': 'application/json', authorization: `Bearer ${token}` }, body: JSON.stringify(body) });
  return { status: r.status, body: (await r.json().catch(() => null)) as { user?: { id: number } } | null };
}

describe.each(Object.entries(SIZES))('temporary password at %s size', (sizeName, size) => {
  it('signs in with it, must choose a new password, then reaches the app', async () => {
    const admin = await apiToken('admin');
    const email = `temp-${sizeName}-${Date.now()}@example.test`;
    const invited = await api('/api/users', 'POST', admin, { email, name: `Temporary ${sizeName}`, role: 'operator', password: 'first-invite-pass-1' });
    expect(invited.status).toBe(201);
    const set = await api(`/api/users/${invited.body!.user!.id}/password`, 'PUT', admin, { password: 'temporary-pass-for-e2e' });
    expect(set.status).toBe(200);

    const { page, errors, external } = await openPage(browser, size);
    await page.goto(`${baseUrl()}/sign-in`);
    await page.getByLabel('Email').fill(email);
    await page.getByLabel('Password').fill('temporary-pass-for-e2e');
    await page.getByRole('button', { name: 'Sign in' }).click();
    const form = page.getByTestId('must-change-password');
    await form.waitFor({ timeout: 20_000 });
    expect(await page.getByRole('heading', { name: 'Choose a new password' }).count()).toBe(1);
    expect(new URL(page.url()).pathname).toBe('/sign-in');

    // the shared rule speaks before anything is sent
    await page.getByLabel('Temporary password').fill('temporary-pass-for-e2e');
    await page.getByLabel('New password', { exact: true }).fill('qwertyuiop');
    await page.getByLabel('New password again').fill('qwertyuiop');
    await page.getByTestId('forced-change-submit').click();
    await page.getByText(/most used passwords/).first().waitFor({ timeout: 5_000 });
    await shot(page, `temporary-password-${sizeName}`);

    await page.getByLabel('New password', { exact: true }).fill('my-own-river-choice');
    await page.getByLabel('New password again').fill('my-own-river-choice');
    await page.getByTestId('forced-change-submit').click();
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'), { timeout: 20_000 });
    await page.getByTestId(sizeName === 'phone' ? 'tab-bar' : 'side-nav').waitFor({ timeout: 20_000 });
    await page.getByTestId('count-sites').waitFor({ timeout: 20_000 });
    await shot(page, `temporary-password-done-${sizeName}`);

    const old = await fetch(`${baseUrl()}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password: 'temporary-pass-for-e2e' }) });
    expect(old.status).toBe(401);
    expect(errors).toEqual([]);
    expect(external).toEqual([]);
    await page.context().close();
  });
});

/**
 * The network diagram with a generated 2,000-site network: it draws, and the
 * time from navigation to a drawn diagram is recorded for the closing note.
 */
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '@/server/config';
import { openDatabase } from '@/server/db';
import { importNetwork } from '@/server/services/importer';
import { startServer, type RunningServer } from '@/server/server';
import { resolveDatabaseUrl } from '@/scripts/lib/postgres';
import { generateNetwork } from '@/scripts/generator';
import { loadDemo } from '@/scripts/start';
import { demoUser, launch, openPage, recordTiming, shot, PHONE, WIDE } from './browser';

let browser: Browser;
let running: RunningServer;
let base: string;

beforeAll(async () => {
  const { url } = await resolveDatabaseUrl('headwater_e2e_2k', { fresh: true });
  const db = openDatabase(url);
  await db.migrate();
  const report = await importNetwork(db, generateNetwork({ sites: 2000, seed: 3 }), { actor: { email: 'e2e' } });
  expect(report.errors).toEqual([]);
  await db.close();
  await loadDemo(url, () => undefined);
  running = await startServer(url, loadConfig({ ...process.env, PORT: '0', DEMO: '1' }));
  base = running.url.replace('localhost', '127.0.0.1');
  browser = await launch();
}, 240_000);

afterAll(async () => {
  await browser?.close();
  await running?.close();
});

describe('network diagram at 2,000 sites', () => {
  it.each([
    ['wide', WIDE],
    ['phone', PHONE],
  ] as const)('draws on a %s screen and stays responsive', async (name, size) => {
    const { page, errors } = await openPage(browser, size);
    const u = demoUser('engineer');
    await page.goto(`${base}/sign-in`);
    await page.getByLabel('Email').fill(u.email);
    await page.getByLabel('Password').fill(u.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'), { timeout: 20_000 });

    const t0 = Date.now();
    await page.goto(`${base}/network`);
    // The diagram batches its shapes into a few paths, so "drawn" means: the summary names the sites in
    // view and the paths hold enough geometry for well over a thousand site shapes.
    await page.waitForFunction(
      () => {
        const svg = document.querySelector('[data-testid="network-diagram"]');
        const summary = document.querySelector('[data-testid="network-summary"]')?.textContent ?? '';
        if (!svg || !/\d/.test(summary)) return false;
        let geometry = 0;
        svg.querySelectorAll('path').forEach((p) => (geometry += (p.getAttribute('d') ?? '').length));
        return geometry > 20_000;
      },
      undefined,
      { timeout: 30_000, polling: 50 },
    );
    recordTiming(`diagram-2000-sites-${name}`, Date.now() - t0);
    await shot(page, `network-2000-${name}`);

    // zooming in by the on-screen control redraws without error
    const before = await page.getByTestId('network-summary').textContent();
    await page.getByRole('button', { name: 'Zoom in' }).first().click();
    await page.waitForFunction((b) => document.querySelector('[data-testid="network-summary"]')?.textContent !== b, before, { timeout: 10_000 });
    expect(errors).toEqual([]);
    await page.context().close();
  });
});

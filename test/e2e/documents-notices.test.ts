/**
 * Documents and notices in a real browser: a photo taken on a site's page
 * (the camera input) shows in its gallery at 390 and 1440 px, beside the
 * record on the wide screen; and after an event the admin's local mailbox
 * shows the mail the server's worker sent through the SMTP stand-in.
 */
import crypto from 'node:crypto';
import sharp from 'sharp';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openDatabase } from '@/server/db';
import { loadConfig } from '@/server/config';
import type { AppContext } from '@/server/context';
import { NoticeQueue } from '@/server/notices/queue';
import { apiGet, apiToken, baseUrl, launch, openPage, shot, signIn, SIZES } from './browser';

const SITE = 'M-CORR';
let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => browser?.close());

describe('site documents', () => {
  for (const [size, viewport] of Object.entries(SIZES)) {
    it(`takes a photo on the site's page and shows it in the gallery (${size})`, async () => {
      const { page, errors } = await openPage(browser, viewport);
      await signIn(page, 'operator');
      await page.goto(`${baseUrl()}/sites/${SITE}`);
      await page.getByTestId('doc-take-photo').waitFor({ timeout: 30_000 });
      const before = (await apiGet<{ items: unknown[] }>(`/api/sites/${SITE}/documents`)).items.length;

      const photo = await sharp({ create: { width: 640, height: 480, channels: 3, background: { r: 30, g: 90, b: 60 } } }).jpeg().toBuffer();
      const name = `mast-${size}.jpg`;
      await page.getByTestId('doc-camera-input').setInputFiles({ name, mimeType: 'image/jpeg', buffer: photo });
      await page.getByTestId('doc-message').getByText(`Added ${name}`).waitFor({ timeout: 30_000 });

      const items = (await apiGet<{ items: Array<{ id: number; name: string; sha256: string }> }>(`/api/sites/${SITE}/documents`)).items;
      expect(items.length).toBe(before + 1);
      const doc = items.find((d) => d.name === name)!;
      expect(doc.sha256).toBe(crypto.createHash('sha256').update(photo).digest('hex'));
      const preview = page.getByTestId(`doc-preview-${doc.id}`);
      await preview.waitFor({ timeout: 20_000 });
      expect(await page.getByTestId('doc-gallery').getByText(name).isVisible()).toBe(true);

      const record = (await page.getByTestId('site-record').boundingBox())!;
      const docs = (await page.getByTestId('documents').boundingBox())!;
      if (size === 'wide') {
        expect(docs.x).toBeGreaterThan(record.x + record.width - 1); // beside the record
        expect(Math.abs(docs.y - record.y)).toBeLessThan(40);
      } else {
        expect(docs.y).toBeGreaterThan(record.y + record.height - 1); // under it on a phone
      }
      await shot(page, `site-documents-${size}`);
      expect(errors).toEqual([]);
      await page.context().close();
    });
  }
});

describe('local mailbox', () => {
  it("shows the admin the mail sent after an event", async () => {
    // the admin chooses everything
    const token = await apiToken('admin');
    const r = await fetch(`${baseUrl()}/api/subscriptions`, { method: 'POST', headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json' }, body: JSON.stringify({ everything: true }) });
    expect(r.status).toBe(200);

    // An event as the operations services emit it, queued in a committed transaction from this
    // process; the server's own worker (another process) sends it.
    const db = openDatabase(process.env.TEST_DATABASE_URL!);
    const config = loadConfig({ ...process.env, SMTP_URL: undefined, JWT_SECRET: crypto.randomBytes(32).toString('hex') });
    const ctx = { config, db, network: { model: null } } as unknown as AppContext;
    const queue = new NoticeQueue(ctx, { baseUrl: baseUrl });
    await queue.start();
    const key = `e2e-${Date.now()}`;
    try {
      await db.sequelize.transaction((t) =>
        queue.enqueue(t, {
          kind: 'incident-opened',
          code: 'INC-E2E',
          title: 'Microwave link down',
          key,
          start: new Date().toISOString(),
          end: null,
          networkVersion: 1,
          reach: { lost: [], fallback: [], households: { lost: 0, fallback: 0 } },
          summary: 'opened from the operations desk',
        }),
      );
    } finally {
      await queue.stop();
      await db.close();
    }

    for (const [size, viewport] of Object.entries(SIZES)) {
      const { page, errors } = await openPage(browser, viewport);
      await signIn(page, 'admin');
      await page.goto(`${baseUrl()}/admin/mailbox`);
      await page.getByText('Fault opened: INC-E2E Microwave link down').first().waitFor({ timeout: 30_000 });
      await page.getByRole('button', { name: /Show the text of Fault opened: INC-E2E/ }).first().click();
      await page.getByText(/Open in Headwater:/).first().waitFor();
      await shot(page, `mailbox-${size}`);
      await page.goto(`${baseUrl()}/admin/notices`);
      await page.getByText('Fault opened: INC-E2E Microwave link down').first().waitFor({ timeout: 20_000 });
      expect(await page.getByText('Sent', { exact: true }).first().isVisible()).toBe(true);
      expect(errors).toEqual([]);
      await page.context().close();
    }
  });
});

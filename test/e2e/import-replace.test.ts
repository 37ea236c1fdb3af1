/**
 * A replace import on a phone and a wide screen: the check names what the
 * replace deletes, per kind, and the import is offered only once the person
 * confirms it; then the deleted records are gone. The network is put back
 * afterwards (a merge of the file exported first).
 */
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { NetworkDocument } from '@/shared/schemas/network';
import { apiGet, apiToken, baseUrl, launch, openPage, shot, signIn, SIZES } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => browser?.close());

/** The network without one relay site: its carriages and every feed that touches them or passes via it go too. */
function withoutSite(doc: NetworkDocument, site: string) {
  const carriages = new Set(doc.carriages.filter((c) => c.site === site).map((c) => c.code));
  const feeds = doc.feeds.filter((f) => !carriages.has(f.from) && !carriages.has(f.to) && !(f.via ?? []).includes(site));
  return {
    doc: { ...doc, sites: doc.sites.filter((s) => s.code !== site), carriages: doc.carriages.filter((c) => !carriages.has(c.code)), feeds },
    carriages: carriages.size,
    feeds: doc.feeds.length - feeds.length,
  };
}

async function mergeBack(doc: NetworkDocument) {
  const r = await fetch(`${baseUrl()}/api/network/import`, {
    method: 'POST',
    headers: { authorization: `Bearer ${await apiToken('engineer')}`, 'content-type': 'application/json' },
    body: JSON.stringify(doc),
  });
  expect(r.status).toBe(200);
}

describe.each(Object.entries(SIZES))('a replace import at %s size', (sizeName, size) => {
  it('names what it deletes and needs a confirmation before the import', async () => {
    const original = await apiGet<NetworkDocument>('/api/network/export');
    // a relay that carries something, so the check has carriages and feeds to name (other test files may add bare sites)
    const carrying = new Set(original.carriages.map((c) => c.site));
    const site = original.sites.filter((s) => s.role === 'relay' && carrying.has(s.code)).sort((a, b) => a.code.localeCompare(b.code))[sizeName === 'phone' ? 0 : 1];
    const cut = withoutSite(original, site.code);
    const { page, errors } = await openPage(browser, size);
    try {
      await signIn(page, 'engineer');
      await page.goto(`${baseUrl()}/import`);
      await page.getByRole('radio', { name: 'Replace the whole network' }).click();
      const input = page.locator('input[type=file]').first();
      await input.waitFor({ state: 'attached', timeout: 20_000 });
      await input.setInputFiles({ name: 'network-without-one-site.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(cut.doc)) });

      const deletions = page.getByTestId('import-deletions');
      await deletions.waitFor({ timeout: 60_000 });
      expect(cut.carriages).toBeGreaterThan(0);
      expect(cut.feeds).toBeGreaterThan(0);
      const total = 1 + cut.carriages + cut.feeds;
      await expect.poll(() => deletions.innerText()).toContain(`This replace deletes ${total} record${total === 1 ? '' : 's'}`);
      const kinds = [`1 site`, `${cut.carriages} carriage${cut.carriages === 1 ? '' : 's'}`, `${cut.feeds} feed${cut.feeds === 1 ? '' : 's'}`];
      for (const k of kinds) expect(await deletions.innerText()).toContain(k);
      const commit = page.getByTestId('import-commit');
      expect(await commit.isDisabled()).toBe(true);
      await shot(page, `import-replace-confirm-${sizeName}`);
      // nothing is deleted by the check
      expect((await apiGet<NetworkDocument>('/api/network/export')).sites.map((s) => s.code)).toContain(site.code);

      await page.getByTestId('import-confirm-deletions').click();
      await expect.poll(() => commit.isDisabled()).toBe(false);
      await commit.click();
      await page.getByTestId('import-done').waitFor({ timeout: 120_000 });
      await shot(page, `import-replace-done-${sizeName}`);
      const after = await apiGet<NetworkDocument>('/api/network/export');
      expect(after.sites.map((s) => s.code)).not.toContain(site.code);
      expect(after.sites).toHaveLength(original.sites.length - 1);
      expect(after.feeds).toHaveLength(original.feeds.length - cut.feeds);
      expect(errors).toEqual([]);
    } finally {
      await page.context().close();
      await mergeBack(original);
    }
  });
});

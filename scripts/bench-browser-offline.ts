/**
 * Browser benchmark of fault reach with no connection (not a test), called by
 * `npm run bench -- --browser`: in Debian's Chromium at phone size, sign in
 * online, let the app store its offline copy of the network (IndexedDB) and
 * the service worker cache the shell, then cut the connection and open a
 * shared reach link. Measured in the page (src/offline/localEngine.ts keeps
 * the records when the page records, src/testHooks.ts):
 *   offlineEngineBuildMs  the engine built from the stored copy (target <= 3 s);
 *   offlineReachP95Ms     one site's fault reach on that engine, p95 over the
 *                         given sites (target <= 200 ms);
 *   offlineReachMultiP95Ms  2 to 5 sites at once, p95;
 *   offlineFirstAnswerMs  from opening the link offline to the answer on
 *                         screen (engine chunk, copy read, build, reach, draw).
 */
import type { Page } from 'playwright-core';
import { launch, signInWith, storedCopy, waitForWorker } from '@/test/e2e/browser';
import { RECORD_SCRIPT } from '@/src/testHooks';
import { percentile, round } from './bench-engine';
import { Prng } from './generator/prng';

export interface OfflineBenchResult {
  viewport: string;
  sites: number;
  networkVersion: number;
  copyStoredMs: number;
  offlineFirstAnswerMs: number;
  offlineEngineBuildMs: number;
  offlineReachP50Ms: number;
  offlineReachP95Ms: number;
  offlineReachMultiP95Ms: number;
  samples: number;
}

const PHONE = { width: 390, height: 844 };

async function timeReach(page: Page, sets: string[][]): Promise<number[]> {
  return page.evaluate(
    (failedSets) => failedSets.map((codes) => window.__headwaterOffline!.timeReach(codes.map((code) => ({ kind: 'site' as const, code })))),
    sets,
  );
}

export async function benchOfflineReach(
  base: string,
  user: { email: string; password: string },
  siteCodes: string[],
  opts: { seed?: number; samples?: number } = {},
): Promise<OfflineBenchResult> {
  const samples = opts.samples ?? 200;
  const rnd = new Prng(opts.seed ?? 7);
  const pick = () => siteCodes[Math.floor(rnd.next() * siteCodes.length)];
  const browser = await launch();
  try {
    const context = await browser.newContext({ viewport: PHONE, deviceScaleFactor: 1 });
    await context.addInitScript(RECORD_SCRIPT);
    const page = await context.newPage();
    await signInWith(page, base, user.email, user.password);
    const t0 = Date.now();
    await page.goto(`${base}/reach`);
    let copy: Awaited<ReturnType<typeof storedCopy>> = null;
    while (!(copy = await storedCopy(page)) || copy.sites !== siteCodes.length) {
      if (Date.now() - t0 > 180_000) throw new Error(`the offline copy was not stored within 3 minutes (have ${JSON.stringify(copy)})`);
      await page.waitForTimeout(250);
    }
    const copyStoredMs = Date.now() - t0;
    await waitForWorker(page);

    await context.setOffline(true);
    const first = pick();
    const t1 = Date.now();
    await page.goto(`${base}/reach?fail=site:${encodeURIComponent(first)}`);
    await page.getByTestId('offline-note').waitFor({ timeout: 120_000 });
    await page.getByTestId('reach-households-lost').waitFor({ timeout: 120_000 });
    const offlineFirstAnswerMs = Date.now() - t1;
    const hook = await page.evaluate(() => {
      const h = window.__headwaterOffline;
      return h ? { buildMs: h.buildMs, sites: h.sites, networkVersion: h.networkVersion } : null;
    });
    if (!hook) throw new Error('the page answered offline but kept no engine record (was the copy engine used?)');
    if (hook.sites !== siteCodes.length) throw new Error(`the offline engine holds ${hook.sites} sites, the network ${siteCodes.length}`);

    await timeReach(page, Array.from({ length: 20 }, () => [pick()])); // warm the JIT as the server benchmark does
    const one = await timeReach(page, Array.from({ length: samples }, () => [pick()]));
    const multi = await timeReach(page, Array.from({ length: samples }, () => Array.from({ length: 2 + Math.floor(rnd.next() * 4) }, pick)));
    await context.close();
    return {
      viewport: `${PHONE.width}x${PHONE.height}`,
      sites: hook.sites,
      networkVersion: hook.networkVersion,
      copyStoredMs,
      offlineFirstAnswerMs,
      offlineEngineBuildMs: round(hook.buildMs),
      offlineReachP50Ms: round(percentile(one, 50)),
      offlineReachP95Ms: round(percentile(one, 95)),
      offlineReachMultiP95Ms: round(percentile(multi, 95)),
      samples,
    };
  } finally {
    await browser.close();
  }
}

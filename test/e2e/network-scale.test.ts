/**
 * The network diagram with a generated 2,000-site network, at 390 and 1440 px:
 * the map draws nearby sites as numbered groups that separate as the view
 * narrows, its labels never overlap, and a failure set marks the sites the
 * server's reach answer takes off air; the schematic view draws a service's
 * tree with the same marks, its folded relays open, and a node opens the
 * site's card over the diagram (a sheet on a phone, a panel when wide).
 * What is drawn is read from the drawings' records (window.__headwaterDiagram,
 * window.__headwaterSchematic) and the schematic's buttons.
 */
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '@/server/config';
import { openDatabase } from '@/server/db';
import { importNetwork } from '@/server/services/importer';
import { startServer, type RunningServer } from '@/server/server';
import type { NetworkDocument } from '@/shared/schemas/network';
import { resolveDatabaseUrl } from '@/scripts/lib/postgres';
import { generateNetwork } from '@/scripts/generator';
import { loadDemo } from '@/scripts/start';
import { buildSchematic, layoutSchematic } from '@/src/screens/network/schematicModel';
import { demoUser, launch, openPage, recordTiming, shot, PHONE, WIDE } from './browser';

let browser: Browser;
let running: RunningServer;
let base: string;
let token: string;
let doc: NetworkDocument;

async function api<T>(path: string, body?: unknown): Promise<T> {
  const r = await fetch(`${base}${path}`, { method: body ? 'POST' : 'GET', headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json' }, body: body ? JSON.stringify(body) : undefined });
  if (!r.ok) throw new Error(`${path} answered ${r.status}`);
  return (await r.json()) as T;
}

/** Sites the server says lose `service` (or any service when null) when `site` fails. */
async function offAir(site: string, service: string | null): Promise<Set<string>> {
  const answer = await api<{ sites: { site: string; lost: string[] }[] }>('/api/analysis/reach', { failed: [{ kind: 'site', code: site }] });
  return new Set(answer.sites.filter((r) => r.lost.some((s) => !service || s === service)).map((r) => r.site));
}

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
  const u = demoUser('engineer');
  const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: u.email, password: u.password }) });
  token = ((await login.json()) as { token: string }).token;
  doc = await api<NetworkDocument>('/api/network/export');
  browser = await launch();
}, 240_000);

afterAll(async () => {
  await browser?.close();
  await running?.close();
});

async function signedIn(size: { width: number; height: number }) {
  const watched = await openPage(browser, size);
  const u = demoUser('engineer');
  await watched.page.goto(`${base}/sign-in`);
  await watched.page.getByLabel('Email').fill(u.email);
  await watched.page.getByLabel('Password').fill(u.password);
  await watched.page.getByRole('button', { name: 'Sign in' }).click();
  await watched.page.waitForURL((url) => !url.pathname.startsWith('/sign-in'), { timeout: 20_000 });
  return watched;
}

const lastDraw = (page: Page) => page.evaluate(() => window.__headwaterDiagram!.last!);

const SIZES = [
  ['wide', WIDE],
  ['phone', PHONE],
] as const;

describe('map at 2,000 sites: level of detail', () => {
  it.each(SIZES)('groups nearby sites, separates them as the view narrows, never overlaps labels, and marks the failure set (%s)', async (name, size) => {
    const { page, errors } = await signedIn(size);
    const t0 = Date.now();
    await page.goto(`${base}/network`);
    await page.waitForFunction(() => !!window.__headwaterDiagram?.last && !window.__headwaterDiagram.last.gesture, undefined, { timeout: 30_000, polling: 50 });
    recordTiming(`diagram-2000-sites-${name}`, Date.now() - t0);
    await shot(page, `network-2000-${name}`);

    const whole = await lastDraw(page);
    // At the whole-network view most sites sit in numbered groups, and the screen says so in words.
    expect(whole.groups).toBeGreaterThan(0);
    expect(whole.sitesInGroups).toBeGreaterThan(doc.sites.length / 2);
    expect(whole.groups + whole.singles).toBeLessThan(doc.sites.length / 2);
    await expect.poll(() => page.getByTestId('network-summary').textContent()).toMatch(/drawn together as [0-9,]+ numbered circles? holding [0-9,]+ sites?/);
    const box = (await page.getByTestId('network-diagram').boundingBox())!;
    const noOverlap = (labels: typeof whole.labels) => {
      for (let i = 0; i < labels.length; i++) {
        const a = labels[i];
        expect(a.x >= 0 && a.y >= 0 && a.x + a.width <= box.width + 0.5 && a.y + a.height <= box.height + 0.5).toBe(true);
        for (let j = i + 1; j < labels.length; j++) {
          const b = labels[j];
          expect(a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height, `${a.text} overlaps ${b.text}`).toBe(false);
        }
      }
    };
    expect(whole.labels.length).toBeGreaterThan(0);
    noOverlap(whole.labels);

    // Zoomed in, a finer level: fewer sites per mark, labels still apart.
    for (let i = 0; i < 4; i++) await page.getByTestId('network-zoom-in').click();
    await page.waitForFunction((l) => (window.__headwaterDiagram?.last?.level ?? 0) > l && !window.__headwaterDiagram!.last!.gesture, whole.level, { timeout: 10_000 });
    const close = await lastDraw(page);
    expect(close.level).toBeGreaterThanOrEqual(whole.level + 2);
    expect(close.singles / Math.max(1, close.groups + close.singles)).toBeGreaterThan(whole.singles / Math.max(1, whole.groups + whole.singles));
    noOverlap(close.labels);

    // A failure set: the marks drawn on lone sites are exactly sites the server takes off air.
    const main = doc.sites.find((s) => s.role === 'main')!;
    const expected = await offAir(main.code, null);
    expect(expected.size).toBeGreaterThan(0);
    await page.goto(`${base}/network?fail=site:${main.code}`);
    await page.waitForFunction(() => (window.__headwaterDiagram?.last?.statuses ?? 0) > 0 && !window.__headwaterDiagram!.last!.gesture, undefined, { timeout: 20_000 });
    const failed = await lastDraw(page);
    expect(failed.statuses).toBeGreaterThanOrEqual(expected.size);
    expect(failed.offMarks).toBeGreaterThan(0);
    for (const m of failed.marked.filter((x) => x.status === 'off-air')) expect(expected.has(m.code), m.code).toBe(true);
    expect(errors).toEqual([]);
    await page.context().close();
  });
});

describe('schematic view at 2,000 sites', () => {
  it.each(SIZES)('draws a service tree from its origins, marks what a failure takes off air, and opens the site over it (%s)', async (name, size) => {
    const { page, errors } = await signedIn(size);
    // A service whose tree shows, near its top, a main station with relays folded under it (some services
    // are carried at origins and main stations only).
    let service = '';
    for (const sv of [...doc.services].sort((a, b) => a.code.localeCompare(b.code))) {
      const rows = layoutSchematic(buildSchematic(doc, sv.code), new Set()).nodes.slice(0, 12);
      if (rows.some((n) => n.data.role === 'main' && n.data.relays.length > 0)) {
        service = sv.code;
        break;
      }
    }
    expect(service).not.toBe('');
    await page.goto(`${base}/network?service=${service}&view=schematic`);
    await page.waitForFunction(() => (window.__headwaterSchematic?.placed.length ?? 0) > 0, undefined, { timeout: 30_000 });
    const plain = await page.evaluate(() => window.__headwaterSchematic!);
    expect(plain.service).toBe(service);
    expect(plain.placed[0].role).toBe('origin');
    expect(plain.placed.every((n) => n.status === 'on-air')).toBe(true);
    // Every placed node is a button named after its site and carriage.
    for (const n of plain.placed.slice(0, 5)) await expect.poll(() => page.getByTestId(`schematic-node-${n.carriage}`).getAttribute('aria-label')).toContain(n.carriage);
    await expect.poll(() => page.getByTestId('network-schematic-summary').textContent()).toMatch(/from the origins down/);

    // Fail a main station that has relays folded under it; the marks follow the server's reach answer.
    const tree = buildSchematic(doc, service);
    const findBranch = (nodes: typeof tree.roots, code: string): (typeof tree.roots)[number] | undefined => {
      for (const n of nodes) {
        if (n.carriage === code) return n;
        const inner = findBranch(n.children, code);
        if (inner) return inner;
      }
      return undefined;
    };
    const branch = plain.placed.find((n) => n.role === 'main' && n.relays > 0)!;
    expect(branch).toBeTruthy();
    const expected = await offAir(branch.site, service);
    expect(expected.has(branch.site)).toBe(true);
    await page.goto(`${base}/network?service=${service}&view=schematic&fail=site:${branch.site}`);
    await page.waitForFunction((c) => window.__headwaterSchematic?.placed.find((n) => n.carriage === c)?.status === 'off-air', branch.carriage, { timeout: 20_000 });
    await page.getByTestId(`schematic-fold-${branch.carriage}`).click();
    await page.waitForFunction((c) => (window.__headwaterSchematic?.placed.filter((n) => n.leaf).length ?? 0) > 0 && window.__headwaterSchematic!.placed.some((n) => n.carriage === c), branch.carriage, { timeout: 10_000 });
    const marked = await page.evaluate(() => window.__headwaterSchematic!);
    for (const n of marked.placed) expect(n.status === 'off-air', `${n.carriage} at ${n.site}`).toBe(expected.has(n.site));
    const opened = marked.placed.find((n) => n.carriage === branch.carriage)!;
    // The folded count of relays off air agrees with the server's answer over the branch's relays.
    const relays = findBranch(tree.roots, branch.carriage)!.relays;
    expect(opened.relays).toBe(relays.length);
    expect(opened.relaysOff).toBe(relays.filter((r) => expected.has(tree.carriageSite.get(r)!.site)).length);
    expect(marked.placed.filter((n) => n.leaf).length).toBeGreaterThan(0);
    // The words say it too, not only the cross.
    expect(await page.getByTestId(`schematic-node-${branch.carriage}`).getAttribute('aria-label')).toContain('off air');
    await shot(page, `network-schematic-${name}`);

    // The page itself never scrolls sideways; the tree scrolls inside its box.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(size.width);

    // A node opens its site's card over the schematic: a sheet on a phone, a side panel when wide.
    await page.getByTestId(`schematic-node-${branch.carriage}`).click();
    const sheet = page.getByTestId(name === 'phone' ? 'network-site-sheet' : 'network-site-panel');
    await sheet.waitFor({ timeout: 10_000 });
    expect(await sheet.getByTestId('network-site-card').textContent()).toContain(branch.site);
    const stage = (await page.getByTestId('network-schematic-scroll').boundingBox())!;
    const over = (await sheet.boundingBox())!;
    // Over the diagram, not below it.
    expect(over.y).toBeLessThan(stage.y + stage.height);
    expect(over.y + over.height).toBeLessThanOrEqual(stage.y + stage.height + 1);
    await shot(page, `network-schematic-sheet-${name}`);
    expect(errors).toEqual([]);
    await page.context().close();
  });
});

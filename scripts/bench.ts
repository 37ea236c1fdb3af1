/**
 * npm run bench: one run over seeded generated networks of 1,000, 5,000 and
 * 20,000 sites. For each size: import into PostgreSQL, rebuild the graphs
 * from PostgreSQL, time the engine (scripts/bench-engine.ts) against the
 * plain typed-array walk and the remove-and-walk baseline on the same graphs,
 * time reach over HTTP on loopback, and record the peak RSS.
 *
 *   npm run bench -- [--sizes 1000,5000,20000] [--seed 7] [--json FILE] [--edits N] [--lean]
 *
 * --edits N: at each size up to 20,000 sites (or every size when given),
 * N edits through one server timed until a second server process answers
 * with them (scripts/bench-edits.ts, `editVisibleP95Ms`; default 60).
 * --lean: skip networkx, the planner and the operations figures at every
 * size; above 20,000 sites they are skipped anyway, as the edits are, so
 * `npm run bench -- --sizes 20000,100000 --browser --json FILE` makes the
 * whole record in one run.
 * --browser: at the largest size up to 20,000 sites, the browser section in
 * Debian's Chromium on the same database: the network diagram at 1440x900
 * and 390x844 (scripts/bench-browser-diagram.ts), fault reach offline
 * (scripts/bench-browser-offline.ts) and the first screen's script
 * (scripts/bench-browser-bundle.ts).
 *
 * The import's event-loop delay (`eventLoopP99Ms`, `eventLoopMaxMs`) is
 * measured with perf_hooks.monitorEventLoopDelay while it runs: how long a
 * request to the same process could have waited.
 *
 * Not part of npm test: targets are measured here, never in a timed test.
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import { monitorEventLoopDelay } from 'node:perf_hooks';
import { loadConfig } from '@/server/config';
import { openDatabase } from '@/server/db';
import { importNetwork } from '@/server/services/importer';
import { loadNetworkDocument } from '@/server/services/networkLoader';
import { buildServedNetwork } from '@/server/services/servedNetwork';
import { startServer } from '@/server/server';
import { ensureUser } from '@/server/services/users';
import { benchEngine, percentile, round, type EngineBenchResult } from './bench-engine';
import { benchOperations, describeOperations, type OperationsBenchResult } from './bench-operations';
import { benchEdits, type EditsBenchResult } from './bench-edits';
import { benchDiagram, BENCH_SIZES, type DiagramBenchResult } from './bench-browser-diagram';
import { benchOfflineReach, type OfflineBenchResult } from './bench-browser-offline';
import { measureFirstScreenScript, type FirstScreenScript } from './bench-browser-bundle';
import { ensureWebBuild } from './lib/webBuild';
import { Prng } from './generator/prng';
import { generateNetwork } from './generator';
import { resolveDatabaseUrl } from './lib/postgres';

function arg(name: string): string | undefined {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 ? process.argv[i + 1] : undefined;
}

const sizes = (arg('sizes') ?? '1000,5000,20000').split(',').map((s) => {
  const n = Number(s);
  if (!Number.isInteger(n) || n < 10) throw new Error(`--sizes: "${s}" is not a whole number of sites >= 10`);
  return n;
});
const seed = Number(arg('seed') ?? 7);
const jsonFile = arg('json');
const leanFor = (sites: number) => process.argv.includes('--lean') || sites > 20000;
const editsArg = arg('edits');
const browserAt = process.argv.includes('--browser') ? Math.max(...sizes.filter((n) => n <= 20000)) : null;
if (browserAt === -Infinity) throw new Error('--browser needs a size of at most 20,000 sites in --sizes');
const editsFor = (sites: number) => (editsArg !== undefined ? Number(editsArg) : sites <= 20000 ? 60 : 0);

interface SizeResult extends EngineBenchResult {
  importMs: number;
  eventLoopP99Ms: number;
  eventLoopMaxMs: number;
  loadFromDbMs: number;
  /** graph build from PostgreSQL: read every row, build graphs and precompute (what a rebuild after a change costs) */
  rebuildFromDbMs: number;
  engineBuildMs: number;
  httpReachP50Ms: number;
  httpReachP95Ms: number;
  rssMb: number;
  /** first single points of failure and exposure of a freshly built model (computed on first use) */
  spofExposureFirstMs: number;
  operations: OperationsBenchResult | null;
  edits: EditsBenchResult | null;
  browser: BrowserResult | null;
}

interface BrowserResult {
  sites: number;
  /** the worse of the two viewports; a returning visitor (the app's service worker in control) */
  diagramFirstDrawMs: number;
  /** the same on the first visit after signing in (before the service worker has taken the page) */
  diagramFirstDrawColdMs: number;
  diagramFrameP95Ms: number;
  overlayMs: number;
  offlineReachP95Ms: number;
  offlineEngineBuildMs: number;
  /** compressed script the sign-in and home screens load, as sent (brotli when the browser accepts it; target <= 350 kB) */
  firstScreenScriptKb: number;
  /** the same scripts at gzip -6, for comparison with servers that send gzip */
  firstScreenScriptGzip6Kb: number;
  diagram: Record<keyof typeof BENCH_SIZES, DiagramBenchResult>;
  offline: OfflineBenchResult;
  script: FirstScreenScript;
}

const peakRssMb = () => Math.round(process.resourceUsage().maxRSS / 1024);

/** A server on the bench database with one signed-up user; `web` serves the web export too. */
async function benchServer<T>(databaseUrl: string, web: boolean, work: (base: string, user: { email: string; password: string }) => Promise<T>): Promise<T> {
  const user = { email: 'bench@headwater.example', password: crypto.randomBytes(12).toString('hex') };
  const config = loadConfig({ ...process.env, PORT: '0', DEMO: '0', ...(web ? {} : { WEB_DIR: '/nonexistent' }), JWT_SECRET: crypto.randomBytes(32).toString('hex') });
  const running = await startServer(databaseUrl, config);
  try {
    await ensureUser(user.email, user.password, 'operator', 'Benchmark');
    return await work(running.url.replace('localhost', '127.0.0.1'), user);
  } finally {
    await running.close();
  }
}

async function browserSection(databaseUrl: string, siteCodes: string[]): Promise<BrowserResult> {
  const built = ensureWebBuild();
  if (built.built) console.log(`  web app built in ${(built.ms / 1000).toFixed(1)} s`);
  return benchServer(databaseUrl, true, async (base, user) => {
    const diagram = {} as Record<keyof typeof BENCH_SIZES, DiagramBenchResult>;
    for (const [name, size] of Object.entries(BENCH_SIZES) as [keyof typeof BENCH_SIZES, { width: number; height: number }][]) {
      diagram[name] = await benchDiagram(base, user, size);
      console.log(`  diagram ${name}: first draw ${diagram[name].diagramFirstDrawMs} ms (first visit ${diagram[name].diagramFirstDrawColdMs} ms), frames p95 ${diagram[name].diagramFrameP95Ms} ms, overlay ${diagram[name].overlayMs} ms`);
    }
    const offline = await benchOfflineReach(base, user, siteCodes, { seed });
    console.log(`  offline: engine built ${offline.offlineEngineBuildMs} ms, reach p95 ${offline.offlineReachP95Ms} ms, first answer ${offline.offlineFirstAnswerMs} ms`);
    const script = await measureFirstScreenScript(base, user);
    console.log(`  first screen script ${script.firstScreenScriptKb} kB as sent (${script.firstScreenScriptGzip6Kb} kB at gzip -6)`);
    const worst = (k: 'diagramFirstDrawMs' | 'diagramFirstDrawColdMs' | 'diagramFrameP95Ms' | 'overlayMs') => Math.max(diagram.wide[k], diagram.phone[k]);
    return {
      sites: siteCodes.length,
      diagramFirstDrawMs: worst('diagramFirstDrawMs'),
      diagramFirstDrawColdMs: worst('diagramFirstDrawColdMs'),
      diagramFrameP95Ms: worst('diagramFrameP95Ms'),
      overlayMs: worst('overlayMs'),
      offlineReachP95Ms: offline.offlineReachP95Ms,
      offlineEngineBuildMs: offline.offlineEngineBuildMs,
      firstScreenScriptKb: script.firstScreenScriptKb,
      firstScreenScriptGzip6Kb: script.firstScreenScriptGzip6Kb,
      diagram,
      offline,
      script,
    };
  });
}

async function httpReach(databaseUrl: string, siteCodes: string[]): Promise<number[]> {
  return benchServer(databaseUrl, false, async (base, user) => {
    const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(user) });
    const { token } = (await login.json()) as { token: string };
    const headers = { 'content-type': 'application/json', authorization: `Bearer ${token}` };
    const times: number[] = [];
    for (let i = 0; i < siteCodes.length + 10; i++) {
      const code = siteCodes[i % siteCodes.length];
      const t0 = performance.now();
      const res = await fetch(`${base}/api/analysis/reach`, { method: 'POST', headers, body: JSON.stringify({ failed: [{ kind: 'site', code }] }) });
      await res.arrayBuffer();
      if (res.status !== 200) throw new Error(`reach over HTTP answered ${res.status}`);
      if (i >= 10) times.push(performance.now() - t0); // the first ten warm up the connection and the JIT
    }
    return times;
  });
}

async function benchSize(sites: number): Promise<SizeResult> {
  console.log(`\n== ${sites.toLocaleString('en')} sites (seed ${seed}) ==`);
  const doc = generateNetwork({ sites, seed });
  const { url } = await resolveDatabaseUrl('headwater_bench', { fresh: true });
  const db = openDatabase(url);
  try {
    await db.migrate();
    const loop = monitorEventLoopDelay({ resolution: 10 });
    loop.enable();
    let t = performance.now();
    const report = await importNetwork(db, doc, { actor: { email: 'bench' } });
    const importMs = performance.now() - t;
    loop.disable();
    const eventLoopP99Ms = round(loop.percentile(99) / 1e6);
    const eventLoopMaxMs = round(loop.max / 1e6);
    if (!report.ok) throw new Error(`generated network did not import: ${report.errors.slice(0, 3).map((e) => e.message).join('; ')}`);
    console.log(`  import ${(importMs / 1000).toFixed(2)} s (event loop delay p99 ${eventLoopP99Ms} ms, longest ${eventLoopMaxMs} ms)`);

    t = performance.now();
    const { document, version } = await loadNetworkDocument(db.sequelize);
    const loadFromDbMs = performance.now() - t;
    const model = buildServedNetwork(document, version);
    const rebuildFromDbMs = performance.now() - t;
    console.log(`  rebuild from PostgreSQL ${(rebuildFromDbMs / 1000).toFixed(2)} s (read ${(loadFromDbMs / 1000).toFixed(2)} s)`);
    t = performance.now();
    model.engine.spof();
    model.engine.exposure();
    const spofExposureFirstMs = performance.now() - t;
    console.log(`  first spof + exposure on it ${spofExposureFirstMs.toFixed(0)} ms`);

    const lean = leanFor(sites);
    const engine = benchEngine(document, { seed, networkx: !lean, planner: !lean });
    console.log(`  engine: reach one p95 ${engine.reachOneP95Ms} ms, multi p95 ${engine.reachMultiP95Ms} ms, spof+exposure ${engine.spofAllMs} ms`);

    const operations = lean ? null : benchOperations(document, { seed });
    if (operations) console.log(describeOperations(operations));

    const rnd = new Prng(seed);
    const codes = Array.from({ length: 200 }, () => document.sites[Math.floor(rnd.next() * document.sites.length)].code);
    const http = await httpReach(url, codes);
    const editCount = editsFor(sites);
    const edits = editCount > 0 ? await benchEdits(url, document, { edits: editCount, seed }) : null;
    const browser = sites === browserAt ? await browserSection(url, document.sites.map((s) => s.code)) : null;
    if (edits) console.log(`  edit visible in a second process: p50 ${edits.editVisibleP50Ms} ms, p95 ${edits.editVisibleP95Ms} ms (edit answered p95 ${edits.editAckP95Ms} ms)`);
    const result: SizeResult = {
      ...engine,
      engineBuildMs: engine.buildMs,
      buildMs: round(rebuildFromDbMs),
      importMs: round(importMs),
      eventLoopP99Ms,
      eventLoopMaxMs,
      loadFromDbMs: round(loadFromDbMs),
      rebuildFromDbMs: round(rebuildFromDbMs),
      httpReachP50Ms: round(percentile(http, 50)),
      httpReachP95Ms: round(percentile(http, 95)),
      rssMb: peakRssMb(),
      spofExposureFirstMs: round(spofExposureFirstMs),
      operations,
      edits,
      browser,
    };
    console.log(`  HTTP reach p95 ${result.httpReachP95Ms} ms; peak RSS so far ${result.rssMb} MB`);
    return result;
  } finally {
    await db.close();
  }
}

function table(results: SizeResult[]) {
  const rows: [string, (r: SizeResult) => string][] = [
    ['sites', (r) => r.sites.toLocaleString('en')],
    ['graph nodes / edges', (r) => `${r.nodes.toLocaleString('en')} / ${r.edges.toLocaleString('en')}`],
    ['import (s)', (r) => (r.importMs / 1000).toFixed(2)],
    ['  event loop delay during it p99 / max (ms)', (r) => `${r.eventLoopP99Ms.toFixed(0)} / ${r.eventLoopMaxMs.toFixed(0)}`],
    ['rebuild from PostgreSQL (ms)', (r) => r.buildMs.toFixed(0)],
    ['engine build alone, from the document (ms)', (r) => r.engineBuildMs.toFixed(0)],
    ['reach one site p50 / p95 (ms)', (r) => `${r.reachOneP50Ms.toFixed(3)} / ${r.reachOneP95Ms.toFixed(3)}`],
    ['reach 2-5 elements p95 (ms)', (r) => r.reachMultiP95Ms.toFixed(2)],
    ['plain walk, same failures, p95 (ms)', (r) => r.walkFloorP95Ms.toFixed(2)],
    ['  ratio reach / walk', (r) => `${r.reachMultiToFloorP95.toFixed(2)}x`],
    ['HTTP reach one site p95 (ms)', (r) => r.httpReachP95Ms.toFixed(2)],
    ['spof + exposure, every element (ms)', (r) => r.spofAllMs.toFixed(0)],
    ['remove-and-walk baseline, est. (ms)', (r) => r.baselineSpofAllMsEstimate.toFixed(0)],
    ['  speed-up over baseline', (r) => `${(r.baselineSpofAllMsEstimate / r.spofAllMs).toFixed(0)}x`],
    ['dominators, ours (ms)', (r) => r.idomMs.toFixed(1)],
    ['dominators, networkx (ms)', (r) => (r.networkxIdomMs === null ? 'n/a' : r.networkxIdomMs.toFixed(0))],
    ['  speed-up over networkx', (r) => (r.networkxIdomMs === null ? 'n/a' : `${(r.networkxIdomMs / r.idomMs).toFixed(0)}x`)],
    ['first spof + exposure after a rebuild (ms)', (r) => r.spofExposureFirstMs.toFixed(0)],
    ['edit visible in a 2nd process p95 (ms)', (r) => (r.edits ? r.edits.editVisibleP95Ms.toFixed(1) : 'n/a')],
    ['clashes, 500 works: whole set (ms)', (r) => (r.operations ? r.operations.wholeSetMs.toFixed(0) : 'n/a')],
    ['clashes of one work p95, cold (ms)', (r) => (r.operations ? r.operations.oneWorkColdP95Ms.toFixed(2) : 'n/a')],
    ['peak RSS (MB)', (r) => String(r.rssMb)],
    ['browser: diagram first draw (ms)', (r) => (r.browser ? r.browser.diagramFirstDrawMs.toFixed(0) : 'n/a')],
    ['browser: diagram first draw, first visit (ms)', (r) => (r.browser ? r.browser.diagramFirstDrawColdMs.toFixed(0) : 'n/a')],
    ['browser: diagram frames p95 (ms)', (r) => (r.browser ? r.browser.diagramFrameP95Ms.toFixed(1) : 'n/a')],
    ['browser: failure overlay (ms)', (r) => (r.browser ? r.browser.overlayMs.toFixed(0) : 'n/a')],
    ['browser: offline engine build (ms)', (r) => (r.browser ? r.browser.offlineEngineBuildMs.toFixed(0) : 'n/a')],
    ['browser: offline reach p95 (ms)', (r) => (r.browser ? r.browser.offlineReachP95Ms.toFixed(2) : 'n/a')],
    ['browser: first screen script (kB as sent, br)', (r) => (r.browser ? r.browser.firstScreenScriptKb.toFixed(1) : 'n/a')],
    ['browser: first screen script (kB at gzip -6)', (r) => (r.browser ? r.browser.firstScreenScriptGzip6Kb.toFixed(1) : 'n/a')],
  ];
  const w0 = Math.max(...rows.map(([k]) => k.length));
  const cols = results.map((r) => rows.map(([, f]) => f(r)));
  const widths = cols.map((c) => Math.max(...c.map((s) => s.length)));
  console.log('\n' + rows.map(([k], i) => `${k.padEnd(w0)}  ${cols.map((c, j) => c[i].padStart(widths[j])).join('  ')}`).join('\n'));
}

(async () => {
  const results: SizeResult[] = [];
  for (const n of sizes) results.push(await benchSize(n));
  table(results);
  if (jsonFile) {
    const out = {
      when: new Date().toISOString(),
      seed,
      node: process.version,
      // other work on the machine stretches every time here: the 1-minute load average at the end, on os.cpus().length cores
      loadAverage: os.loadavg().map((x) => Math.round(x * 10) / 10),
      cores: os.cpus().length,
      entries: results.map((r) => ({
        sites: r.sites,
        nodes: r.nodes,
        edges: r.edges,
        buildMs: r.buildMs,
        engineBuildMs: r.engineBuildMs,
        importMs: r.importMs,
        eventLoopP99Ms: r.eventLoopP99Ms,
        eventLoopMaxMs: r.eventLoopMaxMs,
        reachOneP50Ms: r.reachOneP50Ms,
        reachOneP95Ms: r.reachOneP95Ms,
        reachMultiP95Ms: r.reachMultiP95Ms,
        walkFloorMs: r.walkFloorMs,
        walkFloorP95Ms: r.walkFloorP95Ms,
        spofAllMs: r.spofAllMs,
        baselineSpofAllMsEstimate: r.baselineSpofAllMsEstimate,
        idomMs: r.idomMs,
        networkxIdomMs: r.networkxIdomMs,
        httpReachP95Ms: r.httpReachP95Ms,
        rssMb: r.rssMb,
        rebuildFromDbMs: r.rebuildFromDbMs,
        loadFromDbMs: r.loadFromDbMs,
        spofExposureFirstMs: r.spofExposureFirstMs,
        ...(r.edits ? { editVisibleP95Ms: r.edits.editVisibleP95Ms, edits: r.edits } : {}),
        operations: r.operations,
      })),
      browser: results.find((r) => r.browser)?.browser ?? null,
    };
    fs.writeFileSync(jsonFile, JSON.stringify(out, null, 2) + '\n');
    console.log(`\nwrote ${jsonFile}`);
  }
})().catch((e) => {
  console.error(`bench failed: ${e.stack ?? e}`);
  process.exit(1);
});

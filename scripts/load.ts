/**
 * npm run load: the server under concurrent load, on loopback only, with the
 * 20,000-site generated network (scripts/generator) in a database of its own
 * (headwater_load on the local cluster, made afresh).
 *
 *   npm run load -- [--seconds 60] [--connections 50] [--sites 20000] [--seed 7] [--workers 1,2] [--out docs/bench/load-YYYY-MM-DD]
 *                   [--only reach,chain,search,export,edits] [--profile DIR]
 *
 * Four read scenarios, each `connections` connections for `seconds` seconds
 * (autocannon): fault reach, a carriage chain, a list page with a search, the
 * JSON export (asking for gzip, as browsers do), once per worker count
 * (WORKERS=N server processes on one port). Then 20 editors rename sites while an import of 10,000 changed
 * sites runs. Records requests/s, p50/p99 latency, errors and non-2xx answers
 * in OUT.json and OUT.txt and checks the targets: no errors, no non-2xx
 * (409 "network-busy" during the import is intended), reach p99 <= 50 ms, no
 * acknowledged edit lost. Not part of npm test.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import crypto from 'node:crypto';
import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import readline from 'node:readline';
import autocannon from 'autocannon';
import { openDatabase } from '@/server/db';
import { importNetwork } from '@/server/services/importer';
import { ensureUser } from '@/server/services/users';
import type { NetworkDocument } from '@/shared/schemas/network';
import { generateNetwork } from './generator';
import { Prng } from './generator/prng';
import { REPO_ROOT, resolveDatabaseUrl } from './lib/postgres';
import { stopChild } from './lib/supervisor';
import { editsDuringImport, type EditRunResult } from './load/edits';

function arg(name: string, fallback: string): string {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 && process.argv[i + 1] !== undefined ? process.argv[i + 1] : fallback;
}
function wholeArg(name: string, fallback: number, min: number): number {
  const v = Number(arg(name, String(fallback)));
  if (!Number.isInteger(v) || v < min) throw new Error(`--${name} must be a whole number >= ${min}`);
  return v;
}

const seconds = wholeArg('seconds', 60, 1);
const connections = wholeArg('connections', 50, 1);
const siteCount = wholeArg('sites', 20_000, 100);
const seed = wholeArg('seed', 7, 0);
const day = new Date().toISOString().slice(0, 10);
const out = path.resolve(arg('out', path.join(REPO_ROOT, 'docs', 'bench', `load-${day}`)));
/** --profile DIR: the server writes a V8 CPU profile there when it closes (node --cpu-prof) */
const profileDir = arg('profile', '');
/** --only reach,chain,search,export,edits: a part of the run, for profiling (the recorded run does all) */
const only = new Set(arg('only', 'reach,chain,search,export,edits').split(','));
const EDITORS = 20;
/** --workers 1,2: the read scenarios run once per worker count (WORKERS=N); the edits run with the first */
const workerCounts = arg('workers', '1,2').split(',').map((w) => {
  const n = Number(w);
  if (!Number.isInteger(n) || n < 1 || n > 16) throw new Error('--workers is a list of whole numbers from 1 to 16, e.g. 1,2');
  return n;
});
/** one secret for every server started, so the tokens signed in once stay valid */
const jwtSecret = crypto.randomBytes(32).toString('hex');
const REACH_P99_TARGET_MS = 50;

interface ScenarioResult {
  name: string;
  workers: number;
  connections: number;
  seconds: number;
  requests: number;
  requestsPerSecond: number;
  latencyP50Ms: number;
  latencyP99Ms: number;
  latencyMaxMs: number;
  /** autocannon's count of failed requests, timeouts included */
  errors: number;
  /** of which timeouts (no complete answer within 10 s) */
  timeouts: number;
  non2xx: number;
  statusCodes: Record<string, number>;
  megabytesPerSecond: number;
}

/**
 * The server in a child process on 127.0.0.1 (`workers` processes on one port); resolves with its base URL once all listen.
 * `script` and `args`: another server to start the same way (the bare yardstick).
 */
function startChild(databaseUrl: string, workers: number, script = path.join(__dirname, 'load', 'server.ts'), args: string[] = []): Promise<{ child: ChildProcess; base: string }> {
  const profile = profileDir ? ['--cpu-prof', '--cpu-prof-dir', path.resolve(profileDir)] : [];
  const child = spawn(process.execPath, [...profile, '--import', 'tsx', script, ...args], {
    cwd: REPO_ROOT,
    env: { ...process.env, DATABASE_URL: databaseUrl, JWT_SECRET: jwtSecret, NODE_ENV: 'production', WORKERS: String(workers) },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  return new Promise((resolve, reject) => {
    const lines = readline.createInterface({ input: child.stdout! });
    let listening = 0;
    lines.on('line', (line) => {
      const m = /^LISTENING (http:\/\/127\.0\.0\.1:\d+)/.exec(line);
      if (m && ++listening === workers) resolve({ child, base: m[1] });
    });
    child.on('exit', (code) => reject(new Error(`the server under load exited (${code}) before it listened`)));
  });
}

async function login(base: string, email: string, password: string): Promise<string> {
  const r = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password }) });
  if (r.status !== 200) throw new Error(`sign-in as ${email} answered ${r.status}`);
  return ((await r.json()) as { token: string }).token;
}

/**
 * One autocannon run; `next` gives each request's method, path and body in
 * turn, or is one request sent again and again. For the export (megabytes
 * per answer) the load generator itself is the limit on a 2-core machine: a
 * CPU profile of the server during that scenario showed it 79 % idle while
 * requests timed out in the generator, and a second generator thread only
 * took more CPU from the server. The bare-server yardstick below shows that limit.
 */
type Request = { method: 'GET' | 'POST'; path: string; body?: string };
async function scenario(name: string, workers: number, base: string, token: string, next: (() => Request) | Request, extraHeaders: Record<string, string> = {}): Promise<ScenarioResult> {
  process.stdout.write(`  ${name} (${workers} worker${workers > 1 ? 's' : ''}): ${connections} connections for ${seconds} s ... `);
  const what: Partial<autocannon.Options> =
    typeof next === 'function'
      ? {
          url: base,
          requests: [
            {
              setupRequest: (req) => {
                const r = next();
                return { ...req, method: r.method, path: r.path, body: r.body };
              },
            },
          ],
        }
      : { url: `${base}${next.path}`, method: next.method, body: next.body };
  const result = await autocannon({
    ...what,
    url: what.url ?? base,
    connections,
    duration: seconds,
    timeout: 10,
    headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json', ...extraHeaders },
  });
  const statusCodes: Record<string, number> = {};
  for (const [code, stat] of Object.entries(result.statusCodeStats ?? {})) statusCodes[code] = (stat as { count: number }).count;
  const r: ScenarioResult = {
    name,
    workers,
    connections,
    seconds,
    requests: result.requests.total,
    requestsPerSecond: Math.round(result.requests.average * 10) / 10,
    latencyP50Ms: result.latency.p50,
    latencyP99Ms: result.latency.p99,
    latencyMaxMs: result.latency.max,
    errors: result.errors,
    timeouts: result.timeouts,
    non2xx: result.non2xx,
    statusCodes,
    megabytesPerSecond: Math.round((result.throughput.average / 1e6) * 10) / 10,
  };
  console.log(`${r.requestsPerSecond} req/s, p50 ${r.latencyP50Ms} ms, p99 ${r.latencyP99Ms} ms, errors ${r.errors}, non-2xx ${r.non2xx}`);
  return r;
}

/** The export exactly as sent to a browser (gzip bytes, not unpacked). */
function gzipExport(base: string, token: string): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    http
      .get(`${base}/api/network/export`, { headers: { authorization: `Bearer ${token}`, 'accept-encoding': 'gzip' } }, (res) => {
        const parts: Buffer[] = [];
        res.on('data', (b: Buffer) => parts.push(b));
        res.on('end', () => (res.statusCode === 200 ? resolve(Buffer.concat(parts)) : reject(new Error(`the export answered ${res.statusCode}`))));
      })
      .on('error', reject);
  });
}

/** The export scenario against a bare server sending the same bytes: what the generator itself manages here. */
async function exportYardstick(databaseUrl: string, base: string, token: string): Promise<ScenarioResult> {
  const file = path.join(os.tmpdir(), `headwater-load-export-${process.pid}.json.gz`);
  fs.writeFileSync(file, await gzipExport(base, token));
  const bare = await startChild(databaseUrl, 1, path.join(__dirname, 'load', 'bare-server.ts'), [file]);
  try {
    return await scenario(YARDSTICK, 1, bare.base, token, { method: 'GET', path: '/' }, { 'accept-encoding': 'gzip' });
  } finally {
    await stopChild(bare.child, 15_000);
    fs.rmSync(file, { force: true });
  }
}
const YARDSTICK = 'same bytes, bare server';

function rotate<T>(items: T[]): () => T {
  let i = 0;
  return () => items[i++ % items.length];
}

function readScenarios(doc: NetworkDocument) {
  const rnd = new Prng(seed);
  const pick = <T>(xs: T[], n: number) => Array.from({ length: n }, () => xs[Math.floor(rnd.next() * xs.length)]);
  const mains = doc.sites.filter((s) => s.role === 'main').map((s) => s.code);
  const role = new Map(doc.sites.map((site) => [site.code, site.role]));
  const relayCarriages = doc.carriages.filter((c) => role.get(c.site) === 'relay').map((c) => c.code);
  const words = [...new Set(doc.sites.flatMap((s) => s.name.split(/\s+/)).filter((w) => w.length >= 4))];
  return {
    reach: rotate(pick(mains, 500).map((code) => JSON.stringify({ failed: [{ kind: 'site', code }] }))),
    chain: rotate(pick(relayCarriages, 500).map((code) => `/api/carriages/${encodeURIComponent(code)}/chain?direction=up`)),
    search: rotate(pick(words, 200).map((w, i) => `/api/sites?q=${encodeURIComponent(w.toLowerCase())}&page=${1 + (i % 2)}&pageSize=50`)),
  };
}

function targets(reads: ScenarioResult[], edits: EditRunResult) {
  const reach = reads.filter((r) => r.name === 'fault reach');
  const editNon2xx = Object.entries(edits.edits.byStatus).filter(([s]) => s !== '200' && s !== '409').reduce((n, [, c]) => n + c, 0);
  return {
    noErrors: reads.every((r) => r.errors === 0 && r.timeouts === 0),
    noNon2xx: reads.every((r) => r.non2xx === 0) && editNon2xx === 0 && edits.importStatus === 200,
    reachP99: reach.every((r) => r.latencyP99Ms <= REACH_P99_TARGET_MS),
    noEditLost: edits.lost.length === 0 && edits.refusedButStored.length === 0,
  };
}

function report(meta: Record<string, unknown>, reads: ScenarioResult[], edits: EditRunResult, met: ReturnType<typeof targets>, yardstick?: ScenarioResult): string {
  const lines = [`Load run ${meta.date} (${meta.sites} sites, seed ${meta.seed}; ${meta.cpus} CPUs; Node ${meta.node}; server and load generator on 127.0.0.1)`];
  // other work on the machine takes CPU from the server: the figures are only comparable at a low load average
  lines.push(`Machine load average (1, 5, 15 min): ${String(meta.loadAverageAtStart)} at the start, ${String(meta.loadAverage)} at the end.`, '');
  lines.push(`${'scenario'.padEnd(22)}${'workers'.padStart(8)}${'req/s'.padStart(9)}${'p50 ms'.padStart(9)}${'p99 ms'.padStart(9)}${'max ms'.padStart(9)}${'errors'.padStart(8)}${'non-2xx'.padStart(9)}${'MB/s'.padStart(8)}`);
  for (const r of reads) {
    lines.push(`${r.name.padEnd(22)}${String(r.workers).padStart(8)}${String(r.requestsPerSecond).padStart(9)}${String(r.latencyP50Ms).padStart(9)}${String(r.latencyP99Ms).padStart(9)}${String(r.latencyMaxMs).padStart(9)}${String(r.errors).padStart(8)}${String(r.non2xx).padStart(9)}${String(r.megabytesPerSecond).padStart(8)}`);
  }
  lines.push('', `${reads[0].connections} connections, ${reads[0].seconds} s per scenario; a request with no complete answer within 10 s counts as an error.`, '');
  if (yardstick) {
    lines.push(
      `Yardstick: the export's gzip bytes from a bare node:http server (no Headwater code), same generator and settings:`,
      `  ${yardstick.requestsPerSecond} req/s, p50 ${yardstick.latencyP50Ms} ms, p99 ${yardstick.latencyP99Ms} ms, errors ${yardstick.errors}, ${yardstick.megabytesPerSecond} MB/s.`,
      `  Errors there are the load generator's own limit on this machine, and bound what the export scenario can show.`,
      '',
    );
  }
  const byStatus = Object.entries(edits.edits.byStatus).map(([s, n]) => `${s}: ${n}`).join(', ');
  lines.push(`Edits during an import: ${EDITORS} editors, import of ${meta.importedSites} changed sites answered ${edits.importStatus} after ${edits.importMs} ms.`);
  lines.push(`  ${edits.edits.total} edits (read + PATCH), answers ${byStatus}; p50 ${edits.edits.p50Ms} ms, p99 ${edits.edits.p99Ms} ms.`);
  lines.push(`  acknowledged edits missing from the database: ${edits.lost.length}; refused edits found stored: ${edits.refusedButStored.length}.`);
  lines.push('', 'Targets:');
  lines.push(`  no errors or timeouts ................ ${met.noErrors ? 'met' : 'NOT MET'}`);
  lines.push(`  no non-2xx (except 409 during import)  ${met.noNon2xx ? 'met' : 'NOT MET'}`);
  lines.push(`  fault reach p99 <= ${REACH_P99_TARGET_MS} ms ............ ${met.reachP99 ? 'met' : 'NOT MET'}`);
  lines.push(`  no acknowledged edit lost ............ ${met.noEditLost ? 'met' : 'NOT MET'}`);
  return lines.join('\n') + '\n';
}

async function main() {
  const loadAverageAtStart = (await import('node:os')).loadavg().map((l) => Math.round(l * 10) / 10);
  console.log(`Load run: ${siteCount.toLocaleString('en')} sites, seed ${seed}, ${connections} connections x ${seconds} s per scenario`);
  const doc = generateNetwork({ sites: siteCount, seed });
  const { url } = await resolveDatabaseUrl('headwater_load', { fresh: true });
  const db = openDatabase(url);
  let child: ChildProcess | undefined;
  try {
    await db.migrate();
    const loaded = await importNetwork(db, doc, { actor: { email: 'load-run' } });
    if (!loaded.ok) throw new Error(`the generated network did not import: ${loaded.errors.slice(0, 3).map((e) => e.message).join('; ')}`);
    const password = crypto.randomBytes(12).toString('hex');
    await ensureUser('load-operator@headwater.example', password, 'operator', 'Load operator');
    await ensureUser('load-engineer@headwater.example', password, 'engineer', 'Load engineer');
    const s = readScenarios(doc);
    const reads: ScenarioResult[] = [];
    const plan: [key: string, name: string, next: (() => Request) | Request, headers?: Record<string, string>][] = [
      ['reach', 'fault reach', () => ({ method: 'POST', path: '/api/analysis/reach', body: s.reach() })],
      ['chain', 'carriage chain', () => ({ method: 'GET', path: s.chain() })],
      ['search', 'list page with search', () => ({ method: 'GET', path: s.search() })],
      // a browser asks for gzip, and so does this run
      ['export', 'export (JSON, gzip)', { method: 'GET', path: '/api/network/export' }, { 'accept-encoding': 'gzip' }],
    ];
    let base = '';
    let engineer = '';
    let operator = '';
    // the first worker count last, so that the edits run against it
    for (const workers of [...workerCounts.slice(1), workerCounts[0]]) {
      if (child) await stopChild(child, 15_000);
      const started = await startChild(url, workers);
      child = started.child;
      base = started.base;
      console.log(`server under load at ${base} (${workers} worker${workers > 1 ? 's' : ''})`);
      operator = await login(base, 'load-operator@headwater.example', password);
      engineer = await login(base, 'load-engineer@headwater.example', password);
      for (const [key, name, next, headers] of plan) if (only.has(key)) reads.push(await scenario(name, workers, base, operator, next, headers));
    }
    reads.sort((x, y) => x.workers - y.workers);
    const yardstick = only.has('export') ? await exportYardstick(url, base, operator) : undefined;
    const expected = plan.filter(([key]) => only.has(key)).length * workerCounts.length;

    if (!only.has('edits') || expected < plan.length * workerCounts.length) {
      console.log('a partial run (--only): nothing recorded');
      return;
    }
    // the import renames the first half of the sites; the editors work on the other half
    const half = Math.floor(doc.sites.length / 2);
    const imported = doc.sites.slice(0, half).map((site) => ({ ...site, name: `${site.name} (imported)` }));
    const importBody = JSON.stringify({ format: doc.format, sites: imported, services: [], groups: [], carriages: [], feeds: [] });
    const editSites = doc.sites.slice(half, half + EDITORS * 50).map((site) => site.code);
    console.log(`  ${EDITORS} editors while an import of ${imported.length.toLocaleString('en')} changed sites runs ...`);
    const edits = await editsDuringImport({ base, token: engineer, sites: editSites, workers: EDITORS, importBody, sequelize: db.sequelize, afterMs: 2000 });
    console.log(`  import ${edits.importStatus} in ${edits.importMs} ms; edits ${JSON.stringify(edits.edits.byStatus)}; lost ${edits.lost.length}`);

    const met = targets(reads, edits);
    // the machine's load average says how far the figures can be trusted on a shared machine
    const meta = { date: new Date().toISOString(), loadAverageAtStart, sites: siteCount, seed, importedSites: imported.length, cpus: os.cpus().length, loadAverage: os.loadavg().map((l) => Math.round(l * 10) / 10), node: process.versions.node };
    fs.mkdirSync(path.dirname(out), { recursive: true });
    fs.writeFileSync(`${out}.json`, JSON.stringify({ ...meta, reads, yardstick, edits, targets: met }, null, 2) + '\n');
    const text = report(meta, reads, edits, met, yardstick);
    fs.writeFileSync(`${out}.txt`, text);
    console.log(`\n${text}\nrecorded in ${out}.json and ${out}.txt`);
  } finally {
    if (child) await stopChild(child, 15_000);
    await db.close();
  }
}

main().catch((e) => {
  console.error(`load run failed: ${e.message ?? e}`);
  process.exit(1);
});

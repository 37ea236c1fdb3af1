/**
 * The longest event-loop stall each heavy read causes in a server holding a
 * large network: the server runs in this process with
 * perf_hooks.monitorEventLoopDelay, and each address is asked once in turn
 * (the first ask of an answer does its work; a second shows the kept one).
 * A stall here is time when every other request (fault reach above all) waits.
 *
 *   npx tsx scripts/bench-stalls.ts [--db headwater_bench] [PATH,PATH,...]
 *
 * --db names a database of the local cluster that already holds a network:
 * `headwater_bench` holds the last size `npm run bench` imported (100,000
 * sites after a full run), `headwater_lists_20000_7` the lists benchmark's.
 * Columns: status, time to the whole answer, longest loop delay meanwhile, size.
 */
import { monitorEventLoopDelay } from 'node:perf_hooks';
import { loadConfig } from '@/server/config';
import { startServer } from '@/server/server';
import { resolveDatabaseUrl } from './lib/postgres';
import { DEMO_USERS } from './start';

async function main() {
  const dbAt = process.argv.indexOf('--db');
  const { url } = await resolveDatabaseUrl(dbAt > 0 ? process.argv[dbAt + 1] : 'headwater_bench', { fresh: false });
  const running = await startServer(url, loadConfig({ ...process.env, PORT: '0', DEMO: '1' }));
  const base = running.url.replace('localhost', '127.0.0.1');
  const user = DEMO_USERS.find((u) => u.role === 'admin')!;
  const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: user.email, password: user.password }) });
  const { token } = (await login.json()) as { token: string };
  const h = monitorEventLoopDelay({ resolution: 5 });
  h.enable();
  const probe = async (method: string, p: string, body?: unknown) => {
    h.reset();
    const t0 = performance.now();
    const r = await fetch(`${base}${p}`, { method, headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json' }, body: body === undefined ? undefined : JSON.stringify(body) });
    const buf = await r.arrayBuffer();
    const ms = performance.now() - t0;
    console.log(String(r.status), String(Math.round(ms)).padStart(6), 'ms', String(Math.round(h.max / 1e6)).padStart(5), 'max loop', String(Math.round(buf.byteLength / 1024)).padStart(7), 'KB', method, p);
  };
  const given = process.argv.slice(2).filter((a, i, all) => a !== '--db' && all[i - 1] !== '--db');
  const paths = (given[0] ?? '').split(',').filter(Boolean);
  const all = [
    '/api/network/summary', '/api/network/export', '/api/network/drawing',
    '/api/sites?pageSize=200', '/api/carriages?pageSize=200', '/api/feeds?pageSize=200', '/api/groups', '/api/services?pageSize=200',
    '/api/analysis/spof', '/api/analysis/exposure', '/api/analysis/exposure?format=csv', '/api/analysis/exposure-groups?limit=50', '/api/analysis/exposure-groups?format=csv',
    '/api/analysis/diversity', '/api/analysis/diversity?format=csv', '/api/analysis/unfed?format=csv',
    '/api/analysis/pairs?limit=20&kinds=site,group&sample=4', '/api/analysis/proposals?limit=20',
    '/api/checks', '/api/checks?format=csv', '/api/audit', '/api/works', '/api/incidents',
    '/api/carriages/R00001.MUX1/chain?direction=down', '/api/analysis/carriage-search?q=R0&pageSize=50',
    '/api/reports/availability?from=2026-01-01T00:00:00Z&to=2026-12-01T00:00:00Z', '/api/reports/availability?from=2026-01-01T00:00:00Z&to=2026-12-01T00:00:00Z&format=csv',
  ];
  for (const p of paths.length ? paths : all) await probe('GET', p);
  await running.close();
  process.exit(0);
}
void main();

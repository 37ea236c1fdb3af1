/**
 * How soon an edit shows in another process (`editVisibleP95Ms`): one server
 * in this process takes the edits over HTTP (a feed's role turned between
 * main and reserve, which changes that service's graph), a second server
 * process on the same database answers fault reach; the time runs from the
 * first server's answer to the edit until the second's reach answer carries
 * the edit's network version. Used by scripts/bench.ts.
 */
import { spawn } from 'node:child_process';
import crypto from 'node:crypto';
import net from 'node:net';
import path from 'node:path';
import { loadConfig } from '@/server/config';
import { startServer } from '@/server/server';
import { ensureUser } from '@/server/services/users';
import type { NetworkDocument } from '@/shared/schemas/network';
import { Prng } from './generator/prng';
import { percentile, round } from './bench-engine';

export interface EditsBenchResult {
  edits: number;
  /** request sent to the first server until it answered (its own model updated) */
  editAckP95Ms: number;
  editVisibleP50Ms: number;
  editVisibleP95Ms: number;
  editVisibleMaxMs: number;
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.listen(0, '127.0.0.1', () => {
      const port = (s.address() as net.AddressInfo).port;
      s.close(() => resolve(port));
    });
    s.on('error', reject);
  });
}

async function until<T>(what: string, fn: () => Promise<T | undefined>, timeoutMs: number): Promise<T> {
  const t0 = Date.now();
  for (;;) {
    const v = await fn().catch(() => undefined);
    if (v !== undefined) return v;
    if (Date.now() - t0 > timeoutMs) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

export async function benchEdits(databaseUrl: string, doc: NetworkDocument, opts: { edits: number; seed: number }): Promise<EditsBenchResult> {
  const secret = crypto.randomBytes(32).toString('hex');
  const password = crypto.randomBytes(12).toString('hex');
  const config = loadConfig({ ...process.env, PORT: '0', DEMO: '0', WEB_DIR: '/nonexistent', JWT_SECRET: secret });
  const first = await startServer(databaseUrl, config);
  const port = await freePort();
  const root = path.resolve(__dirname, '..');
  const second = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'server', 'main.ts')], {
    cwd: root,
    env: { ...process.env, DATABASE_URL: databaseUrl, PORT: String(port), JWT_SECRET: secret, DEMO: '0', WEB_DIR: '/nonexistent' },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  try {
    await ensureUser('bench-edits@headwater.example', password, 'engineer', 'Benchmark');
    const a = first.url.replace('localhost', '127.0.0.1');
    const b = `http://127.0.0.1:${port}`;
    await until('the second server', async () => ((await fetch(`${b}/api/health`)).ok ? true : undefined), 300_000);
    const login = await fetch(`${a}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'bench-edits@headwater.example', password }) });
    const { token } = (await login.json()) as { token: string };
    const headers = { 'content-type': 'application/json', authorization: `Bearer ${token}` };
    const rnd = new Prng(opts.seed);
    const ack: number[] = [];
    const visible: number[] = [];
    for (let i = 0; i < opts.edits + 3; i++) {
      const feed = doc.feeds[Math.floor(rnd.next() * doc.feeds.length)].code;
      const current = (await (await fetch(`${a}/api/feeds/${feed}`, { headers })).json()) as { feed: { version: number; role: string } };
      const role = current.feed.role === 'main' ? 'reserve' : 'main';
      const t0 = performance.now();
      // a role flip may make a second main feed into a carriage: meant here, so confirmed (services/inventory/editRules.ts)
      const res = await fetch(`${a}/api/feeds/${feed}?confirm=second-main-feed`, { method: 'PATCH', headers, body: JSON.stringify({ version: current.feed.version, role }) });
      await res.arrayBuffer();
      const t1 = performance.now();
      if (res.status !== 200) throw new Error(`the edit answered ${res.status}`);
      const version = Number(res.headers.get('x-network-version'));
      const body = JSON.stringify({ failed: [{ kind: 'feed', code: feed }] });
      for (;;) {
        const r = await fetch(`${b}/api/analysis/reach`, { method: 'POST', headers, body });
        const answer = (await r.json()) as { networkVersion: number };
        if (r.status === 200 && answer.networkVersion >= version) break;
        if (performance.now() - t1 > 60_000) throw new Error('the edit did not show in the second server within 60 s');
      }
      const t2 = performance.now();
      if (i >= 3) {
        // the first three warm up connections and the JIT
        ack.push(t1 - t0);
        visible.push(t2 - t1);
      }
    }
    return {
      edits: visible.length,
      editAckP95Ms: round(percentile(ack, 95)),
      editVisibleP50Ms: round(percentile(visible, 50)),
      editVisibleP95Ms: round(percentile(visible, 95)),
      editVisibleMaxMs: round(Math.max(...visible)),
    };
  } finally {
    second.kill('SIGTERM');
    await new Promise((r) => (second.exitCode !== null ? r(null) : second.once('exit', r)));
    await first.close();
  }
}

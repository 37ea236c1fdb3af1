/**
 * Two real server processes on one database: a change committed through one
 * reaches the other through LISTEN/NOTIFY within a second (docs/architecture.md,
 * "A rebuild").
 */
import { spawn, type ChildProcess } from 'node:child_process';
import crypto from 'node:crypto';
import net from 'node:net';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, TEST_PASSWORD, emailFor, type TestApp } from '../helpers/testApp';

const ROOT = path.resolve(__dirname, '..', '..');

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

async function waitFor<T>(what: string, fn: () => Promise<T | undefined>, timeoutMs: number, everyMs = 20): Promise<T> {
  const t0 = Date.now();
  for (;;) {
    const v = await fn().catch(() => undefined);
    if (v !== undefined) return v;
    if (Date.now() - t0 > timeoutMs) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, everyMs));
  }
}

let t: TestApp;
const procs: ChildProcess[] = [];
const urls: string[] = [];

beforeAll(async () => {
  t = await makeTestApp();
  await t.reset();
  const secret = crypto.randomBytes(32).toString('hex');
  for (let i = 0; i < 2; i++) {
    const port = await freePort();
    // node itself with tsx as a loader (not the tsx CLI, which relays signals through a second process)
    const p = spawn(process.execPath, ['--import', 'tsx', path.join(ROOT, 'server', 'main.ts')], {
      cwd: ROOT,
      env: { ...process.env, DATABASE_URL: process.env.TEST_DATABASE_URL, PORT: String(port), JWT_SECRET: secret, DEMO: '0', WEB_DIR: '/nonexistent' },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    p.stderr?.on('data', (d) => process.stderr.write(`[server ${i}] ${d}`));
    procs.push(p);
    urls.push(`http://127.0.0.1:${port}`);
  }
  for (const u of urls) {
    await waitFor(`${u} health`, async () => ((await fetch(`${u}/api/health`)).ok ? true : undefined), 30_000, 100);
  }
}, 60_000);

afterAll(async () => {
  for (const p of procs) p.kill('SIGTERM');
  const codes = await Promise.all(procs.map((p) => new Promise<number | null>((r) => (p.exitCode !== null ? r(p.exitCode) : p.once('exit', (code) => r(code))))));
  expect(codes).toEqual([0, 0]);
  await t?.close();
});

describe('two server processes', () => {
  it('exit cleanly on SIGTERM (checked in afterAll) and agree within a second after a change through one of them', async () => {
    const [a, b] = urls;
    const login = await fetch(`${a}/api/auth/login`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: emailFor('engineer'), password: TEST_PASSWORD }),
    });
    const { token } = await login.json();
    const before = (await (await fetch(`${b}/api/health`)).json()).networkVersion;

    const doc = {
      format: 'network/1',
      sites: [
        { code: 'FR-O', name: 'Fresh origin', role: 'origin', lat: -40, lon: -30, households: 100 },
        { code: 'FR-R', name: 'Fresh relay', role: 'relay', lat: -40.1, lon: -30.1, households: 50 },
      ],
      services: [{ code: 'FR-S', name: 'Fresh service', kind: 'fm' }],
      groups: [],
      carriages: [
        { code: 'FR-C1', site: 'FR-O', service: 'FR-S', frequencyMHz: 95 },
        { code: 'FR-C2', site: 'FR-R', service: 'FR-S', frequencyMHz: 99 },
      ],
      feeds: [{ code: 'FR-F', from: 'FR-C1', to: 'FR-C2', medium: 'off-air', role: 'main' }],
    };
    const imported = await fetch(`${a}/api/network/import`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', authorization: `Bearer ${token}` },
      body: JSON.stringify(doc),
    });
    expect(imported.status).toBe(200);
    const committedAt = Date.now();
    const version = (await imported.json()).networkVersion;
    expect(version).toBeGreaterThan(before);

    await waitFor('process B to see the new version', async () => {
      const h = await (await fetch(`${b}/api/health`)).json();
      return h.networkVersion >= version ? true : undefined;
    }, 1000);
    const lagMs = Date.now() - committedAt;
    expect(lagMs).toBeLessThan(1000);

    const r = await fetch(`${b}/api/analysis/reach`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', authorization: `Bearer ${token}` },
      body: JSON.stringify({ failed: [{ kind: 'site', code: 'FR-O' }] }),
    });
    const answer = await r.json();
    expect(answer.networkVersion).toBe(version);
    expect(answer.lost).toEqual(['FR-C1', 'FR-C2']);
    expect(answer.households.lost).toBe(150);
  });
});

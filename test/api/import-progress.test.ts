/**
 * A running import tells how far it is (GET /api/network/import/progress/:id
 * for the import sent with ?progressId=id), and an import whose client goes
 * away (a closed browser) mid-upload or mid-write leaves the database as it
 * was: the same rows, the same network version, no audit entry.
 */
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { generateNetwork } from '@/scripts/generator';
import type { ImportProgress } from '@/shared/schemas/import';
import { ImportProgressBoard } from '@/server/services/import/progress';
import { signToken } from '@/server/auth/tokens';
import { User } from '@/server/db/models/user';
import { smallNetwork } from '../fixtures/small-network';
import { emailFor, makeTestApp, type TestApp } from '../helpers/testApp';

let t: TestApp;
let server: http.Server;
let port: number;
/** A second server process on the same database, as with WORKERS=2: it must answer the poll of an import the first one runs. */
let other: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
  other = await makeTestApp();
  server = http.createServer(t.app);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  port = (server.address() as AddressInfo).port;
});
afterAll(async () => {
  await new Promise((resolve) => server?.close(resolve));
  await t?.close();
  await other?.close();
});
beforeEach(async () => t.reset());

const TABLES = ['sites', 'services', 'risk_groups', 'carriages', 'feeds', 'feed_via_sites', 'feed_groups', 'site_groups', 'audit_log'];

/** Every stored row of the network's tables and the network version, as one comparable value. */
async function snapshot(): Promise<string> {
  const parts: string[] = [];
  for (const table of TABLES) {
    const [rows] = await t.db.sequelize.query(`SELECT count(*)::int AS n, coalesce(sum(hashtext(t::text)), 0)::text AS h FROM ${table} t`);
    parts.push(`${table}:${JSON.stringify(rows)}`);
  }
  const [v] = await t.db.sequelize.query('SELECT version FROM network_state WHERE id = 1');
  return `${parts.join('|')}|version:${JSON.stringify(v)}`;
}

const progressOf = async (id: string) => request(t.app).get(`/api/network/import/progress/${id}`).set(t.auth('engineer'));

/** The poll sent to the other process (its own signing secret; the account is the one the first made). */
async function progressOnOther(id: string) {
  const u = (await User.findOne({ where: { email: emailFor('engineer') } }))!;
  const token = signToken({ sub: String(u.id), email: u.email, role: 'engineer' }, other.config.JWT_SECRET, '10m');
  return request(other.app).get(`/api/network/import/progress/${id}`).set({ Authorization: `Bearer ${token}` });
}

async function storedProgress(id: string) {
  const [rows] = await t.db.sequelize.query('SELECT stage, done, total FROM import_progress WHERE id = $1', { bind: [id] });
  return rows[0];
}

/** Starts a JSON import over a real socket; returns the request, to be aborted. */
function startImport(body: string, query: string): http.ClientRequest {
  const req = http.request({
    host: '127.0.0.1', port, method: 'POST', path: `/api/network/import${query}`,
    headers: { ...t.auth('engineer'), 'content-type': 'application/json', 'content-length': Buffer.byteLength(body) },
  });
  req.on('error', () => undefined);
  req.end(body);
  return req;
}

/** Polls the progress until `when` holds (or the import ends), then returns what it saw last. */
async function waitFor(id: string, when: (p: ImportProgress) => boolean): Promise<ImportProgress> {
  for (let i = 0; i < 6000; i++) {
    const r = await progressOf(id);
    if (r.status === 200 && (when(r.body) || r.body.stage === 'done' || r.body.stage === 'failed')) return r.body;
    await new Promise((resolve) => setTimeout(resolve, 10));
  }
  throw new Error('the import never got there');
}

/** Waits until the import behind `id` has given up, and the next import can run. */
async function waitForFailed(id: string): Promise<void> {
  const seen = await waitFor(id, (p) => p.stage === 'failed');
  expect(seen.stage).toBe('failed');
}

describe('import progress', () => {
  it('reports the stages of an import and answers the same report as before', async () => {
    const r = await request(t.app).post('/api/network/import?progressId=test-progress-1').set(t.auth('engineer')).send(smallNetwork());
    expect(r.status).toBe(200);
    expect(r.body.counts.sites.created).toBe(smallNetwork().sites.length);
    const last = await progressOf('test-progress-1');
    expect(last.status).toBe(200);
    expect(last.body).toEqual({ stage: 'done', done: 1, total: 1 });
    expect(await storedProgress('test-progress-1')).toEqual({ stage: 'done', done: 1, total: 1 });
    // an id not heard of (yet) is pending, so a screen polling from the moment it sends hears no error
    const unknown = await progressOf('never-sent-1');
    expect(unknown.status).toBe(200);
    expect(unknown.body).toEqual({ stage: 'pending', done: 0, total: 0 });
    expect((await progressOf('x')).status).toBe(400);
    expect((await request(t.app).get('/api/network/import/progress/test-progress-1').set(t.auth('viewer'))).status).toBe(403);
  });
});

const big = JSON.stringify(generateNetwork({ sites: 3000, seed: 5 }));

describe('import progress with two server processes', () => {
  it('is heard by the other process while the transaction of the import is still open, and to the end', async () => {
    expect((await progressOnOther('two-procs-1')).body).toEqual({ stage: 'pending', done: 0, total: 0 });
    const req = startImport(big, '?progressId=two-procs-1');
    const answered = new Promise<number>((resolve) => req.on('response', (res) => { res.resume(); resolve(res.statusCode ?? 0); }));
    let seen: ImportProgress | undefined;
    for (let i = 0; i < 6000 && !(seen && seen.stage === 'writing' && seen.done > 0); i++) {
      const r = await progressOnOther('two-procs-1');
      expect(r.status).toBe(200);
      seen = r.body;
      expect(seen!.stage).not.toBe('failed');
      if (seen!.stage === 'done') break;
      await new Promise((resolve) => setTimeout(resolve, 10));
    }
    // rows part written and not yet committed: the progress row is not held by the import's transaction
    expect(seen).toMatchObject({ stage: 'writing' });
    expect(seen!.done).toBeGreaterThan(0);
    expect(seen!.done).toBeLessThan(seen!.total);
    const [sites] = await other.db.sequelize.query('SELECT count(*)::int AS n FROM sites');
    expect(sites).toEqual([{ n: 0 }]);
    expect(await answered).toBe(200);
    const last = await progressOnOther('two-procs-1');
    expect(last.status).toBe(200);
    expect(last.body).toEqual({ stage: 'done', done: 1, total: 1 });
  });

  it('writes the progress of one import at most once per interval within a stage, the latest value last', async () => {
    const board = new ImportProgressBoard({ everyMs: 400 });
    const id = 'throttled-1';
    await board.set(id, { stage: 'writing', done: 0, total: 100 });
    for (let done = 1; done <= 50; done++) void board.set(id, { stage: 'writing', done, total: 100 });
    await board.settle();
    // the first value of the stage went at once; the next fifty wait for the interval
    expect(await storedProgress(id)).toEqual({ stage: 'writing', done: 0, total: 100 });
    await new Promise((resolve) => setTimeout(resolve, 600));
    await board.settle();
    expect(await storedProgress(id)).toEqual({ stage: 'writing', done: 50, total: 100 });
    // a new stage is written at once
    await board.set(id, { stage: 'done', done: 1, total: 1 });
    expect(await storedProgress(id)).toEqual({ stage: 'done', done: 1, total: 1 });
    expect(await board.get(id)).toEqual({ stage: 'done', done: 1, total: 1 });
  });
});

describe('an import whose client goes away', () => {

  it('leaves the database as it was when the client closes mid-write', async () => {
    expect((await request(t.app).post('/api/network/import').set(t.auth('engineer')).send(smallNetwork())).status).toBe(200);
    const before = await snapshot();
    const req = startImport(big, '?progressId=abort-write-1');
    const seen = await waitFor('abort-write-1', (p) => p.stage === 'writing' && p.done > 0);
    expect(seen.stage).toBe('writing');
    expect(seen.done).toBeLessThan(seen.total);
    req.destroy();
    await waitForFailed('abort-write-1');
    expect(await snapshot()).toBe(before);
    // the queue let go of the turn: the next import runs
    expect((await request(t.app).post('/api/network/import').set(t.auth('engineer')).send(smallNetwork())).status).toBe(200);
  });

  it('leaves the database as it was when the client closes while the file is checked', async () => {
    const before = await snapshot();
    const req = startImport(big, '?progressId=abort-check-1');
    const seen = await waitFor('abort-check-1', (p) => p.stage === 'validating');
    expect(seen.stage).toBe('validating');
    req.destroy();
    await waitForFailed('abort-check-1');
    expect(await snapshot()).toBe(before);
  });

  it('writes nothing when the upload itself is cut off', async () => {
    const before = await snapshot();
    const boundary = 'cutoff-boundary';
    const head = `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="sites.csv"\r\nContent-Type: text/csv\r\n\r\ncode,name,role,lat,lon\r\nS1,One,main,-38,-29\r\n`;
    const req = http.request({
      host: '127.0.0.1', port, method: 'POST', path: '/api/network/import?progressId=abort-upload-1',
      headers: { ...t.auth('engineer'), 'content-type': `multipart/form-data; boundary=${boundary}`, 'content-length': 1_000_000 },
    });
    req.on('error', () => undefined);
    req.write(head);
    await waitFor('abort-upload-1', (p) => p.stage === 'reading');
    req.destroy();
    await new Promise((resolve) => setTimeout(resolve, 300));
    expect(await snapshot()).toBe(before);
    expect((await request(t.app).post('/api/network/import').set(t.auth('engineer')).send(smallNetwork())).status).toBe(200);
  });
});

/**
 * An app wired to the test database (see test/setup/database.ts), with one
 * account per role and helpers to reset state between tests.
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, beforeEach, expect } from 'vitest';
import type { NetworkDocument } from '@/shared/schemas/network';
import { loadConfig } from '@/server/config';
import { openDatabase } from '@/server/db';
import { createApp } from '@/server/app';
import type { AppContext } from '@/server/context';
import { NetworkStore, type NetworkStoreOptions } from '@/server/services/networkStore';
import { buildServedNetwork, updateServedNetwork, type ServedNetwork } from '@/server/services/servedNetwork';
import { OperationsEvents } from '@/server/operations/events';
import { User } from '@/server/db/models/user';
import { hashPassword } from '@/server/auth/passwords';
import { signToken } from '@/server/auth/tokens';
import { ROLES, type Role } from '@/shared/api';
import { startStandins } from '@/server/standins';
import { ObjectStore } from '@/server/documents/storage';
import { NoticeQueue } from '@/server/notices/queue';
import { importNetwork } from '@/server/services/importer';

export const TEST_PASSWORD = `pw-${crypto.randomBytes(6).toString('hex')}`;
export const emailFor = (role: Role) => `${role}@test.example`;

/** `build` replaces the model builder (to make a rebuild fail); `store` tunes the network store's timers; `webDir` is the web export served. */
export async function makeTestApp(opts: { build?: typeof buildServedNetwork; store?: NetworkStoreOptions<ServedNetwork>; webDir?: string } = {}) {
  const url = process.env.TEST_DATABASE_URL;
  if (!url) throw new Error('TEST_DATABASE_URL is not set: run API tests through vitest --project api');
  // Stand-ins of SMTP and the object store for this file, with their files in a private temporary folder.
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'headwater-api-'));
  const standins = await startStandins(
    loadConfig({ ...process.env, DATABASE_URL: url, JWT_SECRET: crypto.randomBytes(32).toString('hex'), WEB_DIR: opts.webDir ?? '/nonexistent', SMTP_URL: undefined, S3_ENDPOINT: undefined, DATA_DIR: dataDir }),
  );
  const config = standins.config;
  const db = openDatabase(url);
  const network = new NetworkStore(db.sequelize, url, opts.build ?? buildServedNetwork, { update: updateServedNetwork, ...opts.store });
  const ctx: AppContext = { config, db, network, events: new OperationsEvents(), objects: ObjectStore.fromConfig(config), mailbox: standins.mailbox };
  const notices = new NoticeQueue(ctx, { retryDelaySeconds: 1, pollingSeconds: 0.5, baseUrl: () => 'http://headwater.test' });
  await notices.start();
  ctx.notices = notices;
  const { app, routes } = createApp(ctx);
  const userIds = new Map<Role, number>();
  let passwordHash: string | undefined;

  /** Empty the network, the audit log and the people; make one account per role. */
  async function reset() {
    await db.sequelize.query(
      'TRUNCATE feed_via_sites, feed_groups, site_groups, feeds, carriages, sites, services, risk_groups, audit_log, incident_steps, incidents, planned_works, users, subscriptions, contacts, notices, documents, import_progress RESTART IDENTITY CASCADE',
    );
    passwordHash ??= await hashPassword(TEST_PASSWORD);
    for (const role of ROLES) {
      const u = await User.create({ email: emailFor(role), name: `Test ${role}`, role, passwordHash });
      userIds.set(role, u.id);
    }
    ctx.resetLoginLimits?.();
    // jobs of an earlier test would name notice ids that RESTART IDENTITY hands out again
    await db.sequelize.query(`DELETE FROM pgboss.job WHERE name = 'notice-send'`);
    standins.mailbox?.clear();
    for (const key of (await ctx.objects?.keys()) ?? []) await ctx.objects!.remove(key);
    await network.refresh();
  }

  const tokenFor = (role: Role) => signToken({ sub: String(userIds.get(role)), email: emailFor(role), role }, config.JWT_SECRET, '10m');
  const auth = (role: Role) => ({ Authorization: `Bearer ${tokenFor(role)}` });

  await network.start();
  return {
    app,
    ctx,
    routes,
    db,
    config,
    standins,
    notices,
    reset,
    tokenFor,
    auth,
    close: async () => {
      await notices.stop();
      ctx.objects?.close();
      await network.close();
      await ctx.userChanges?.close();
      await db.close();
      await standins.close();
      fs.rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

export type TestApp = Awaited<ReturnType<typeof makeTestApp>>;

/**
 * The usual frame of an API test file: one app for the file, and before each
 * test a reset, then (optionally) `network()` imported through the API.
 * Returns a getter, since the app exists only once beforeAll has run.
 */
export function useTestApp(opts: { network?: () => NetworkDocument } = {}): () => TestApp {
  let t: TestApp;
  beforeAll(async () => {
    t = await makeTestApp();
  });
  afterAll(async () => t?.close());
  beforeEach(async () => {
    await t.reset();
    if (opts.network) {
      const r = await request(t.app).post('/api/network/import').set(t.auth('engineer')).send(opts.network());
      expect(r.status).toBe(200);
    }
  });
  return () => t;
}

/** An app over `doc`, imported once (for a file whose tests only read): the served model is refreshed before it is returned. */
export async function appWithNetwork(doc: NetworkDocument): Promise<TestApp> {
  const t = await makeTestApp();
  await t.reset();
  const report = await importNetwork(t.db, doc, { actor: { email: 'test' } });
  expect(report.errors).toEqual([]);
  await t.ctx.network.refresh();
  return t;
}

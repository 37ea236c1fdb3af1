/**
 * Vitest global setup for browser tests: the web export (rebuilt when stale),
 * the demo accounts and network in the e2e database, and one real server on
 * a free loopback port. Runs after test/setup/database.ts.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { ensureWebBuild } from '@/scripts/lib/webBuild';
import { loadDemo } from '@/scripts/start';
import { startServer } from '@/server/server';
import { loadConfig } from '@/server/config';
import { startStandins } from '@/server/standins';

export default async function setup() {
  const url = process.env.TEST_DATABASE_URL;
  if (!url) throw new Error('TEST_DATABASE_URL is not set (test/setup/database.ts must run first)');
  const built = ensureWebBuild({ quiet: true });
  if (built.built) console.log(`[e2e] web app built in ${(built.ms / 1000).toFixed(1)} s`);
  await loadDemo(url, () => undefined);
  const config = loadConfig({ ...process.env, PORT: '0', DEMO: '1', SMTP_URL: undefined, S3_ENDPOINT: undefined, DATA_DIR: path.join(os.tmpdir(), `headwater-e2e-${process.pid}`) });
  const standins = await startStandins(config);
  const running = await startServer(url, standins.config, { mailbox: standins.mailbox, notices: { retryDelaySeconds: 1, pollingSeconds: 0.5 } });
  process.env.E2E_BASE_URL = running.url.replace('localhost', '127.0.0.1');
  return async () => {
    await running.close();
    await standins.close();
    fs.rmSync(config.DATA_DIR, { recursive: true, force: true });
  };
}

/**
 * Vitest global setup for browser tests: the web export (rebuilt when stale),
 * the demo accounts and network in the e2e database, and one real server on
 * a free loopback port. Runs after test/setup/database.ts.
 */
import { ensureWebBuild } from '@/scripts/lib/webBuild';
import { loadDemo } from '@/scripts/start';
import { startServer } from '@/server/server';
import { loadConfig } from '@/server/config';

export default async function setup() {
  const url = process.env.TEST_DATABASE_URL;
  if (!url) throw new Error('TEST_DATABASE_URL is not set (test/setup/database.ts must run first)');
  const built = ensureWebBuild({ quiet: true });
  if (built.built) console.log(`[e2e] web app built in ${(built.ms / 1000).toFixed(1)} s`);
  await loadDemo(url, () => undefined);
  const running = await startServer(url, loadConfig({ ...process.env, PORT: '0', DEMO: '1' }));
  process.env.E2E_BASE_URL = running.url.replace('localhost', '127.0.0.1');
  return async () => {
    await running.close();
  };
}

/**
 * The server process that `npm start` supervises (scripts/start.ts): the
 * local mail and object-store stand-ins when no hosted ones are configured,
 * then the API and the web app on one port, DATABASE_URL set by the
 * supervisor. Closes cleanly on SIGTERM and SIGINT.
 *
 * WORKERS=N (N > 1): this process becomes the primary of node's cluster
 * module; it starts the stand-ins once and keeps N server processes running
 * on the shared port (scripts/lib/workers.ts), each with its own network
 * model kept current through PostgreSQL notifications.
 */
import cluster from 'node:cluster';
import { loadConfig } from '@/server/config';
import { startServer, closeOnSignals } from '@/server/server';
import { startStandins } from '@/server/standins';
import { startWorkerPool, workerCount } from './lib/workers';

async function single() {
  const standins = await startStandins(loadConfig());
  const running = await startServer(process.env.DATABASE_URL!, standins.config, { mailbox: standins.mailbox });
  closeOnSignals(running, () => standins.close());
  if (standins.mailbox) console.log(`SMTP stand-in: ${standins.mailbox.url}, mail kept in ${standins.mailbox.folder} (admins: Notices > Mailbox)`);
  if (standins.objectStore) console.log(`Object store stand-in: ${standins.objectStore.url}, files in ${standins.objectStore.folder}`);
  if (running.demoAccounts.disabled.length > 0) console.log(`Disabled demo accounts left from an earlier demo run: ${running.demoAccounts.disabled.join(', ')}`);
  console.log(`\nHeadwater is running at ${running.url}`);
}

/** The primary: stand-ins once, their URLs to every worker, N workers kept running. */
async function primary(count: number) {
  const standins = await startStandins(loadConfig());
  const c = standins.config;
  // one signing secret for all (loadConfig made and stored it once here), so a token from one worker opens the others
  const env: Record<string, string | undefined> = { JWT_SECRET: c.JWT_SECRET, SMTP_URL: c.SMTP_URL, S3_ENDPOINT: c.S3_ENDPOINT, AWS_ACCESS_KEY_ID: c.AWS_ACCESS_KEY_ID, AWS_SECRET_ACCESS_KEY: c.AWS_SECRET_ACCESS_KEY };
  for (const [k, v] of Object.entries(env)) if (v === undefined) delete env[k];
  const pool = startWorkerPool({ count, fork: () => cluster.fork(env) });
  const stop = async (signal: string) => {
    console.log(`\n${signal}: closing ${count} server processes...`);
    await pool.stop();
    await standins.close();
    process.exit(0);
  };
  process.once('SIGTERM', () => void stop('SIGTERM'));
  process.once('SIGINT', () => void stop('SIGINT'));
  if (standins.mailbox) console.log(`SMTP stand-in: ${standins.mailbox.url}, mail kept in ${standins.mailbox.folder}`);
  if (standins.objectStore) console.log(`Object store stand-in: ${standins.objectStore.url}, files in ${standins.objectStore.folder}`);
  await pool.ready;
  console.log(`\nHeadwater is running at http://localhost:${c.PORT} in ${count} server processes (WORKERS=${count})`);
}

/** A worker: one server on the shared port; the primary restarts it if it dies. */
async function worker() {
  const running = await startServer(process.env.DATABASE_URL!, loadConfig(), { mailbox: null });
  closeOnSignals(running);
}

const count = workerCount(process.env.WORKERS);
const run = count <= 1 ? single : cluster.isPrimary ? () => primary(count) : worker;
run().catch((e) => {
  console.error(`the server did not start: ${e.message ?? e}`);
  process.exit(1);
});

/**
 * npm start: PostgreSQL up (fsync on), migrations, demo data into an empty
 * database, the web export when missing or stale, then one server for the API
 * and the web app, in a child process that is started again when it crashes
 * (scripts/lib/supervisor.ts). Ctrl+C or SIGTERM stops both. The local
 * PostgreSQL is left running (npm run stop stops it).
 */
import fs from 'node:fs';
import path from 'node:path';
import { loadConfig } from '@/server/config';
import { openDatabase } from '@/server/db';
import { Subscription } from '@/server/db/models/notices';
import { applyDemoAccounts, DEMO_USERS } from '@/server/services/demoAccounts';
import { importNetwork } from '@/server/services/importer';
import { findUserByEmail } from '@/server/services/users';
import { DURABLE, resolveDatabaseUrl, REPO_ROOT, type ClusterSettings } from './lib/postgres';
import { ensureWebBuild } from './lib/webBuild';
import { supervise } from './lib/supervisor';

export { DEMO_USERS };
/** The local PostgreSQL under npm start keeps fsync on: the inventory must survive a power cut. */
export const START_CLUSTER: ClusterSettings = DURABLE;
export const DEMO_NETWORK = path.join(REPO_ROOT, 'test', 'fixtures', 'demo-network.json');

/** Demo accounts (a changed password is kept) and, into an empty database, the demo network. */
export async function loadDemo(databaseUrl: string, log = console.log) {
  const db = openDatabase(databaseUrl);
  try {
    await db.migrate();
    await applyDemoAccounts(true);
    const [rows] = await db.sequelize.query('SELECT count(*)::int AS n FROM sites');
    if ((rows as { n: number }[])[0].n === 0) {
      // the demo admin hears about everything, so a first incident shows in the local mailbox (once: a later choice stands)
      for (const d of DEMO_USERS.filter((x) => x.role === 'admin')) {
        const u = await findUserByEmail(d.email);
        if (u) await Subscription.findOrCreate({ where: { userId: u.id }, defaults: { userId: u.id, everything: true } });
      }
      const report = await importNetwork(db, JSON.parse(fs.readFileSync(DEMO_NETWORK, 'utf8')), { actor: { email: 'demo-loader' } });
      if (!report.ok) throw new Error(`the demo network did not import: ${report.errors.map((e) => e.message).join('; ')}`);
      log(`Loaded the demo network: ${report.counts.sites.created} sites, ${report.counts.carriages.created} carriages, ${report.counts.feeds.created} feeds.`);
    }
  } finally {
    await db.close();
  }
}

async function main() {
  const t0 = Date.now();
  const config = loadConfig();
  const { url, cluster } = await resolveDatabaseUrl('headwater', { cluster: START_CLUSTER });
  if (cluster) console.log(`PostgreSQL: 127.0.0.1, cluster folder ${cluster.home} (stop it with npm run stop)`);
  if (config.DEMO) await loadDemo(url);
  ensureWebBuild();
  // the server runs as a child: a crash (out of memory, a fault) ends it, not the service
  const server = supervise({
    command: process.execPath,
    args: ['--import', 'tsx', path.join(__dirname, 'serve.ts')],
    env: { ...process.env, DATABASE_URL: url },
    cwd: REPO_ROOT,
  });
  const stop = async (signal: string) => {
    console.log(`\n${signal}: stopping the server...`);
    await server.stop();
    process.exit(0);
  };
  process.once('SIGINT', () => void stop('SIGINT'));
  process.once('SIGTERM', () => void stop('SIGTERM'));

  console.log(`\nStarting the server on port ${config.PORT} (prepared in ${((Date.now() - t0) / 1000).toFixed(1)} s); it is started again if it crashes.`);
  if (config.DEMO) {
    console.log('DEMO=1: the server listens on 127.0.0.1 only, so only this machine can reach it; set DEMO=0 to serve the network.');
    console.log('\nDemo users (local try-out only; a password changed in the app is kept, so the one below may no longer work):');
    for (const u of DEMO_USERS) console.log(`  ${u.role.padEnd(9)} ${u.email.padEnd(30)} ${u.password}`);
  } else {
    console.log('DEMO=0: the server listens on every address; no demo account can sign in (left-over ones are disabled at start).');
  }
  if (config.ADMIN_EMAIL) console.log(`  admin     ${config.ADMIN_EMAIL.padEnd(30)} (password from ADMIN_PASSWORD)`);
  console.log('\nStop with Ctrl+C; the database keeps running until `npm run stop`.');
  console.log(`On a server, run it under systemd so that it also comes back after a reboot: ${SYSTEMD_HINT}`);
}

/** How to run npm start as a service; the README has the whole unit file. */
export const SYSTEMD_HINT =
  'a unit with WorkingDirectory=<this folder>, ExecStart=/usr/bin/npm start, Restart=always, KillSignal=SIGTERM, Environment=DEMO=0 ADMIN_EMAIL=... (README, "Running on a server").';

if (require.main === module) {
  main().catch((e) => {
    console.error(`\nnpm start failed: ${e.message ?? e}`);
    process.exit(1);
  });
}

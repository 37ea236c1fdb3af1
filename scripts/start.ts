/**
 * npm start: PostgreSQL up, migrations, demo data into an empty database,
 * the web export when missing or stale, then one server for the API and the
 * web app. The local PostgreSQL is left running (npm run stop stops it).
 */
import fs from 'node:fs';
import path from 'node:path';
import { loadConfig } from '@/server/config';
import { openDatabase } from '@/server/db';
import { startServer, closeOnSignals } from '@/server/server';
import { applyDemoAccounts, DEMO_USERS } from '@/server/services/demoAccounts';
import { findUserByEmail } from '@/server/services/users';
import { Subscription } from '@/server/db/models/notices';
import { importNetwork } from '@/server/services/importer';
import { resolveDatabaseUrl, REPO_ROOT } from './lib/postgres';
import { ensureWebBuild } from './lib/webBuild';
import { startStandins } from '@/server/standins';

export { DEMO_USERS };
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
  const { url, cluster } = await resolveDatabaseUrl('headwater');
  if (cluster) console.log(`PostgreSQL: 127.0.0.1, cluster folder ${cluster.home} (stop it with npm run stop)`);
  if (config.DEMO) await loadDemo(url);
  ensureWebBuild();
  const standins = await startStandins(config);
  const running = await startServer(url, standins.config, { mailbox: standins.mailbox });
  closeOnSignals(running, () => standins.close());
  if (standins.mailbox) console.log(`SMTP stand-in: ${standins.mailbox.url}, mail kept in ${standins.mailbox.folder} (admins: Notices > Mailbox)`);
  if (standins.objectStore) console.log(`Object store stand-in: ${standins.objectStore.url}, files in ${standins.objectStore.folder}`);

  console.log(`\nHeadwater is running at ${running.url}  (ready in ${((Date.now() - t0) / 1000).toFixed(1)} s)`);
  if (config.DEMO) {
    console.log('DEMO=1: listening on 127.0.0.1 only, so only this machine can reach it; set DEMO=0 to serve the network.');
    console.log('\nDemo users (local try-out only; a password changed in the app is kept, so the one below may no longer work):');
    for (const u of DEMO_USERS) console.log(`  ${u.role.padEnd(9)} ${u.email.padEnd(30)} ${u.password}`);
  } else {
    console.log(`DEMO=0: listening on every address (${running.host}); no demo account can sign in.`);
    if (running.demoAccounts.disabled.length > 0) console.log(`Disabled demo accounts left from an earlier demo run: ${running.demoAccounts.disabled.join(', ')}`);
  }
  if (config.ADMIN_EMAIL) console.log(`  admin     ${config.ADMIN_EMAIL.padEnd(30)} (password from ADMIN_PASSWORD)`);
  console.log('\nStop with Ctrl+C; the database keeps running until `npm run stop`.');
}

if (require.main === module) {
  main().catch((e) => {
    console.error(`\nnpm start failed: ${e.message ?? e}`);
    process.exit(1);
  });
}

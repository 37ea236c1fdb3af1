/**
 * The server process that `npm start` supervises (scripts/start.ts): the
 * local mail and object-store stand-ins when no hosted ones are configured,
 * then the API and the web app on one port, DATABASE_URL set by the
 * supervisor. Closes cleanly on SIGTERM and SIGINT.
 */
import { loadConfig } from '@/server/config';
import { startServer, closeOnSignals } from '@/server/server';
import { startStandins } from '@/server/standins';

async function main() {
  const standins = await startStandins(loadConfig());
  const running = await startServer(process.env.DATABASE_URL!, standins.config, { mailbox: standins.mailbox });
  closeOnSignals(running, () => standins.close());
  if (standins.mailbox) console.log(`SMTP stand-in: ${standins.mailbox.url}, mail kept in ${standins.mailbox.folder} (admins: Notices > Mailbox)`);
  if (standins.objectStore) console.log(`Object store stand-in: ${standins.objectStore.url}, files in ${standins.objectStore.folder}`);
  if (running.demoAccounts.disabled.length > 0) console.log(`Disabled demo accounts left from an earlier demo run: ${running.demoAccounts.disabled.join(', ')}`);
  console.log(`\nHeadwater is running at ${running.url}`);
}

main().catch((e) => {
  console.error(`the server did not start: ${e.message ?? e}`);
  process.exit(1);
});

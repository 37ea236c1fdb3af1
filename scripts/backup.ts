/**
 * npm run backup -- FILE
 * Writes the whole database (network, people, audit log, operations,
 * document metadata) to FILE, in PostgreSQL's custom archive format.
 * The local cluster's database, or DATABASE_URL. See README "Backups".
 */
import { resolveDatabaseUrl } from './lib/postgres';
import { backupDatabase } from './lib/backup';

async function main() {
  const file = process.argv.slice(2).find((a) => !a.startsWith('--'));
  if (!file) throw new Error('usage: npm run backup -- FILE   (for example backups/headwater-2026-01-31.dump)');
  const { url } = await resolveDatabaseUrl('headwater');
  const r = await backupDatabase(url, file);
  console.log(`backup written: ${r.file} (${(r.bytes / 1024).toFixed(0)} KiB in ${(r.ms / 1000).toFixed(1)} s)`);
}

main().catch((e) => {
  console.error(`backup failed: ${e.message ?? e}`);
  process.exit(1);
});

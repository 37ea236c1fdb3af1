/**
 * npm run restore -- FILE [--force] [--database NAME]
 * Brings a backup made by `npm run backup` into an empty database: the local
 * cluster's "headwater" (created when missing), another database of the local
 * cluster with --database, or DATABASE_URL. A database that already holds
 * tables is refused unless --force, which drops everything in it first.
 * Stop the server while restoring; migrations newer than the backup run at
 * the next start.
 */
import { resolveDatabaseUrl } from './lib/postgres';
import { restoreDatabase } from './lib/backup';

async function main() {
  const argv = process.argv.slice(2);
  const force = argv.includes('--force');
  const dbAt = argv.indexOf('--database');
  const database = dbAt >= 0 ? argv[dbAt + 1] : 'headwater';
  const file = argv.find((a, i) => !a.startsWith('--') && (dbAt < 0 || i !== dbAt + 1));
  if (!file || !database) throw new Error('usage: npm run restore -- FILE [--force] [--database NAME]');
  if (dbAt >= 0 && process.env.DATABASE_URL) throw new Error('--database names a database of the local cluster; unset DATABASE_URL to use it');
  const { url } = await resolveDatabaseUrl(database);
  const r = await restoreDatabase(url, file, { force });
  console.log(`restored ${file} into "${database}": ${r.tables} tables in ${(r.ms / 1000).toFixed(1)} s`);
}

main().catch((e) => {
  console.error(`restore failed: ${e.message ?? e}`);
  process.exit(1);
});

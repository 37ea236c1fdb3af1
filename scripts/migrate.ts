/** Run pending migrations against the project's database (or DATABASE_URL). */
import { openDatabase } from '@/server/db';
import { resolveDatabaseUrl } from './lib/postgres';

(async () => {
  const { url } = await resolveDatabaseUrl('headwater');
  const db = openDatabase(url);
  const done = await db.migrate();
  console.log(done.length ? `applied: ${done.join(', ')}` : 'schema is up to date');
  await db.close();
})().catch((e) => {
  console.error(e.message ?? e);
  process.exit(1);
});

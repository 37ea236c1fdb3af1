/**
 * Vitest global setup for API and browser tests: bring up the project's
 * PostgreSQL (installing Debian's package when missing), create a fresh test
 * database, migrate it, and hand its URL to the test workers. A cluster
 * started here runs with fsync off, for speed: test data is thrown away. Stops the
 * cluster afterwards if this run started it.
 */
import { openDatabase } from '@/server/db';
import { FAST_FOR_TESTS, resolveDatabaseUrl, stopCluster } from '@/scripts/lib/postgres';

export default async function setup() {
  const { url, cluster } = await resolveDatabaseUrl(process.env.HEADWATER_TEST_DB ?? 'headwater_test', { fresh: true, cluster: FAST_FOR_TESTS });
  const db = openDatabase(url);
  await db.migrate();
  await db.close();
  process.env.TEST_DATABASE_URL = url;
  return async () => {
    if (cluster?.startedHere && !process.env.HEADWATER_KEEP_PG) stopCluster();
  };
}

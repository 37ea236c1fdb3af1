/**
 * Stopping and starting the test PostgreSQL from inside a test file. The API
 * project runs files one at a time, so a file may take the cluster down, but
 * it must leave it running for the next one even when the test fails: always
 * use `whileDatabaseDown`, which starts it again in a finally.
 */
import { Client } from 'pg';
import { ensureCluster, FAST_FOR_TESTS, stopCluster } from '@/scripts/lib/postgres';

export async function startDatabase(url = process.env.TEST_DATABASE_URL!) {
  await ensureCluster(FAST_FOR_TESTS);
  // pg_ctl -w waits for the server; make sure it takes connections before going on
  for (let i = 0; ; i++) {
    const c = new Client({ connectionString: url, connectionTimeoutMillis: 2000 });
    try {
      await c.connect();
      await c.end();
      return;
    } catch (e) {
      await c.end().catch(() => undefined);
      if (i > 50) throw e;
      await new Promise((r) => setTimeout(r, 200));
    }
  }
}

/** Stop PostgreSQL, run `whileDown`, start it again (always). */
export async function whileDatabaseDown<R>(whileDown: () => Promise<R>): Promise<R> {
  if (!stopCluster()) throw new Error('the test PostgreSQL was not running (or DATABASE_URL points elsewhere): this test needs the local cluster');
  try {
    return await whileDown();
  } finally {
    await startDatabase();
  }
}

export async function waitFor<T>(what: string, fn: () => Promise<T | undefined> | T | undefined, timeoutMs: number, everyMs = 50): Promise<T> {
  const t0 = Date.now();
  for (;;) {
    const v = await Promise.resolve()
      .then(fn)
      .catch(() => undefined);
    if (v !== undefined) return v;
    if (Date.now() - t0 > timeoutMs) throw new Error(`timed out after ${timeoutMs} ms waiting for ${what}`);
    await new Promise((r) => setTimeout(r, everyMs));
  }
}

/**
 * The server under load, in a process of its own so that the load generator
 * does not share its event loop. Listens on 127.0.0.1 only; prints
 * "LISTENING <url>" when ready. DATABASE_URL, JWT_SECRET from the parent.
 * WORKERS=N (N > 1): N server processes on one port, as `WORKERS=N npm start`
 * runs them (scripts/lib/workers.ts); every worker prints its LISTENING line.
 */
import cluster from 'node:cluster';
import { loadConfig } from '@/server/config';
import { startServer, closeOnSignals } from '@/server/server';
import { startWorkerPool, workerCount } from '../lib/workers';

const count = workerCount(process.env.WORKERS);
if (count > 1 && cluster.isPrimary) {
  const pool = startWorkerPool({ count, fork: () => cluster.fork() });
  const stop = async () => {
    await pool.stop();
    process.exit(0);
  };
  process.once('SIGTERM', () => void stop());
  process.once('SIGINT', () => void stop());
} else {
  // port 0: a free port, the same one for every worker of a cluster
  const config = loadConfig({ ...process.env, PORT: '0', DEMO: '0', WEB_DIR: '/nonexistent' });
  startServer(process.env.DATABASE_URL!, config, { host: '127.0.0.1' })
    .then((running) => {
      closeOnSignals(running);
      console.log(`LISTENING ${running.url.replace('localhost', '127.0.0.1')}`);
    })
    .catch((e) => {
      console.error(e);
      process.exit(1);
    });
}

/**
 * The server under load, in a process of its own so that the load generator
 * does not share its event loop. Listens on 127.0.0.1 only; prints
 * "LISTENING <url>" when ready. DATABASE_URL, JWT_SECRET from the parent.
 */
import { loadConfig } from '@/server/config';
import { startServer, closeOnSignals } from '@/server/server';

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

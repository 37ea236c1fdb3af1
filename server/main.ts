/**
 * Process entry for a server behind a load balancer: DATABASE_URL must point
 * at the database (npm start resolves the local one for you).
 */
import { loadConfig } from './config';
import { startServer, closeOnSignals } from './server';

const config = loadConfig();
if (!config.DATABASE_URL) {
  console.error('DATABASE_URL is required here; `npm start` starts a local PostgreSQL and sets it for you.');
  process.exit(1);
}
startServer(config.DATABASE_URL, config)
  .then((running) => {
    console.log(`Headwater API listening on ${running.url}`);
    if (config.DEMO) console.log('DEMO=1: listening on 127.0.0.1 only, with the demo accounts open; set DEMO=0 behind a load balancer.');
    closeOnSignals(running);
  })
  .catch((e) => {
    console.error(e.message ?? e);
    process.exit(1);
  });

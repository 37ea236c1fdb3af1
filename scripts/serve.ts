/**
 * The server process that `npm start` supervises (scripts/start.ts): the API
 * and the web app on one port, DATABASE_URL set by the supervisor. Closes
 * cleanly on SIGTERM and SIGINT.
 */
import { loadConfig } from '@/server/config';
import { startServer, closeOnSignals } from '@/server/server';

const config = loadConfig();
startServer(process.env.DATABASE_URL!, config)
  .then((running) => {
    closeOnSignals(running);
    console.log(`\nHeadwater is running at ${running.url}`);
  })
  .catch((e) => {
    console.error(`the server did not start: ${e.message ?? e}`);
    process.exit(1);
  });

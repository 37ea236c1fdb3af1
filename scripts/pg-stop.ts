/** Stop the project's PostgreSQL if it runs. */
import { clusterHome, stopCluster } from './lib/postgres';

try {
  console.log(stopCluster() ? `PostgreSQL stopped (${clusterHome()})` : 'PostgreSQL was not running');
} catch (e) {
  console.error(String((e as Error).message));
  process.exit(1);
}

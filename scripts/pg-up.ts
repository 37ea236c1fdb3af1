/** Start the project's PostgreSQL (idempotent) and print the database URL's host part. */
import { resolveDatabaseUrl } from './lib/postgres';

resolveDatabaseUrl('headwater')
  .then(({ url }) => console.log(`PostgreSQL ready: ${url.replace(/:[^:@/]*@/, ':***@')}`))
  .catch((e) => {
    console.error(String(e.message ?? e));
    process.exit(1);
  });

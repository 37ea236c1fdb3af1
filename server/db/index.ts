/**
 * The database: one Sequelize instance, every model definer wired together
 * here, and the migrator. The schema changes only through migrations.
 */
import { Sequelize, type Transaction } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import pg from 'pg';
import { defineUser, User } from './models/user';
import { defineInventory } from './models/inventory';
import { defineAudit } from './models/audit';
import { defineOperations } from './models/operations';
import { defineNotices } from './models/notices';
import { defineImportProgress } from './models/importProgress';
import { defineDocuments } from './models/documents';
import { migrations } from './migrations';
import { encodeChange, type CodesByKind } from './networkChange';

// bigint columns (the network version, audit ids) fit comfortably in a JS number.
pg.types.setTypeParser(20, (v: string) => Number(v));

export interface Database {
  sequelize: Sequelize;
  url: string;
  migrate(): Promise<string[]>;
  close(): Promise<void>;
}

/**
 * Time limits for request connections (see server/db/README.md). A request
 * never waits long: not for a database that is down (the connection attempt
 * gives up after `connectTimeoutMs`), not for a lock held by an import
 * (`lockTimeoutMs`), not for a runaway statement (`statementTimeoutMs`).
 * Network writes raise their own statement limit inside their transaction
 * (services/inventory/networkWrite.ts), since an import's statements are large.
 */
export interface DatabaseLimits {
  connectTimeoutMs: number;
  statementTimeoutMs: number;
  lockTimeoutMs: number;
  /** how long a request waits for a free pooled connection */
  acquireTimeoutMs: number;
  poolMax: number;
}

export const DEFAULT_LIMITS: DatabaseLimits = {
  connectTimeoutMs: 2500,
  statementTimeoutMs: 10_000,
  lockTimeoutMs: 3000,
  acquireTimeoutMs: 8000,
  poolMax: 20,
};

/**
 * node-postgres whose clients always have an 'error' listener. Sequelize adds
 * its own only once a new connection's promise has resumed; a server shutting
 * down in that instant ('terminating connection due to administrator
 * command') would otherwise be an uncaught exception that ends the process.
 * The guard marks the connection invalid, so the pool drops it.
 */
class GuardedClient extends pg.Client {
  constructor(config?: string | pg.ClientConfig) {
    super(config);
    this.on('error', () => {
      (this as unknown as { _invalid: boolean })._invalid = true;
    });
  }
}
const guardedPg = Object.assign(Object.create(pg) as typeof pg, { Client: GuardedClient });

function connect(url: string, limits: DatabaseLimits | null) {
  return new Sequelize(url, {
    dialect: 'postgres',
    dialectModule: guardedPg,
    logging: false,
    pool: { max: limits?.poolMax ?? 2, min: 0, idle: 10_000, acquire: limits?.acquireTimeoutMs ?? 60_000 },
    define: { underscored: true },
    dialectOptions: limits
      ? { connectionTimeoutMillis: limits.connectTimeoutMs, statement_timeout: limits.statementTimeoutMs, lock_timeout: limits.lockTimeoutMs, keepAlive: true }
      : {},
  });
}

export function openDatabase(url: string, limits: Partial<DatabaseLimits> = {}): Database {
  const sequelize = connect(url, { ...DEFAULT_LIMITS, ...limits });
  defineUser(sequelize);
  defineInventory(sequelize);
  defineAudit(sequelize);
  defineOperations(sequelize);
  defineNotices(sequelize);
  defineDocuments(sequelize);
  defineImportProgress(sequelize);

  return {
    sequelize,
    url,
    async migrate() {
      // migrations run on connections of their own, without the request time limits:
      // rebuilding an index on a large table may take minutes
      const plain = connect(url, null);
      // one process migrates at a time: several hosts or workers may start together
      const lock = new pg.Client({ connectionString: url });
      try {
        await lock.connect();
        await lock.query('SELECT pg_advisory_lock($1)', [MIGRATION_LOCK]);
        const umzug = new Umzug({
          migrations: migrations.map((m) => ({ name: m.name, up: m.up, down: m.down })),
          context: plain.getQueryInterface(),
          storage: new SequelizeStorage({ sequelize: plain, tableName: 'schema_migrations' }),
          logger: undefined,
        });
        const done = await umzug.up();
        return done.map((m) => m.name);
      } finally {
        // ending the session releases the lock
        await lock.end().catch(() => undefined);
        await plain.close();
      }
    },
    close: () => sequelize.close(),
  };
}

/**
 * Bump the network version inside a transaction and queue the notification.
 * PostgreSQL delivers NOTIFY only when the transaction commits, so other
 * processes never rebuild from a change that was rolled back.
 */
export async function bumpNetworkVersion(sequelize: Sequelize, transaction: Transaction, codes: CodesByKind | null = null): Promise<number> {
  const [rows] = await sequelize.query('UPDATE network_state SET version = version + 1 WHERE id = 1 RETURNING version', { transaction });
  const version = Number((rows as { version: number }[])[0].version);
  // the payload names what changed (networkChange.ts) so other processes update rather than rebuild
  await sequelize.query(`SELECT pg_notify('network_changed', $1)`, { bind: [encodeChange({ version, codes })], transaction });
  return version;
}


/** the advisory lock key held while migrations run (any constant unique in this database) */
const MIGRATION_LOCK = 720_509;

export { User };

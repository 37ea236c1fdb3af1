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
import { defineNotices } from './models/notices';
import { defineDocuments } from './models/documents';
import { migrations } from './migrations';

// bigint columns (the network version, audit ids) fit comfortably in a JS number.
pg.types.setTypeParser(20, (v: string) => Number(v));

export interface Database {
  sequelize: Sequelize;
  url: string;
  migrate(): Promise<string[]>;
  close(): Promise<void>;
}

export function openDatabase(url: string): Database {
  const sequelize = new Sequelize(url, {
    dialect: 'postgres',
    logging: false,
    pool: { max: 10, min: 0, idle: 10_000 },
    define: { underscored: true },
  });
  defineUser(sequelize);
  defineInventory(sequelize);
  defineAudit(sequelize);
  defineNotices(sequelize);
  defineDocuments(sequelize);

  const umzug = new Umzug({
    migrations: migrations.map((m) => ({ name: m.name, up: m.up, down: m.down })),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });

  return {
    sequelize,
    url,
    async migrate() {
      const done = await umzug.up();
      return done.map((m) => m.name);
    },
    close: () => sequelize.close(),
  };
}

/**
 * Bump the network version inside a transaction and queue the notification.
 * PostgreSQL delivers NOTIFY only when the transaction commits, so other
 * processes never rebuild from a change that was rolled back.
 */
export async function bumpNetworkVersion(sequelize: Sequelize, transaction: Transaction): Promise<number> {
  const [rows] = await sequelize.query('UPDATE network_state SET version = version + 1 WHERE id = 1 RETURNING version', { transaction });
  const version = Number((rows as { version: number }[])[0].version);
  await sequelize.query(`SELECT pg_notify('network_changed', $1)`, { bind: [String(version)], transaction });
  return version;
}


export { User };

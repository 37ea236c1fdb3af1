/**
 * Progress of running imports, in the database rather than one process's
 * memory, so that with several server processes the poll that asks how far
 * an import is may reach any of them (server/services/import/progress.ts).
 * One small row per import id, rewritten a few times a second at most and
 * pruned after a few minutes; no foreign keys, so the import's own
 * transaction never locks it.
 */
import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE import_progress (
      id         text PRIMARY KEY CHECK (length(id) BETWEEN 1 AND 64),
      stage      text NOT NULL,
      done       integer NOT NULL DEFAULT 0,
      total      integer NOT NULL DEFAULT 0,
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX import_progress_updated_idx ON import_progress (updated_at);
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('DROP TABLE IF EXISTS import_progress');
};

/**
 * People: a token version per user (every token carries the version it was
 * issued under; signing out or changing the password bumps it, so all older
 * tokens stop working) and a flag for a temporary password that must be
 * changed at the next sign-in.
 */
import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE users
      ADD COLUMN token_version        integer NOT NULL DEFAULT 0 CHECK (token_version >= 0),
      ADD COLUMN must_change_password boolean NOT NULL DEFAULT false;
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`ALTER TABLE users DROP COLUMN IF EXISTS token_version, DROP COLUMN IF EXISTS must_change_password;`);
};

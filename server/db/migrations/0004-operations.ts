/**
 * Operations: planned works, incidents and the frozen steps of each incident.
 * Codes come from their own sequences (W-0001, I-0001), owned by the tables
 * so that a TRUNCATE ... RESTART IDENTITY starts them again. Each incident
 * step keeps the reach computed when it was recorded, with the network
 * version it was computed at: later network edits never change it.
 */
import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE planned_works (
      id                 serial PRIMARY KEY,
      code               text NOT NULL UNIQUE,
      title              text NOT NULL CHECK (length(title) BETWEEN 1 AND 200),
      elements           jsonb NOT NULL,
      start_at           timestamptz NOT NULL,
      end_at             timestamptz NOT NULL,
      notes              text NOT NULL DEFAULT '',
      state              text NOT NULL CHECK (state IN ('draft','requested','approved','in-progress','done','cancelled')),
      requested_by       integer REFERENCES users(id) ON DELETE SET NULL,
      requested_by_email text,
      approved_by        integer REFERENCES users(id) ON DELETE SET NULL,
      approved_by_email  text,
      version            integer NOT NULL DEFAULT 1,
      created_at         timestamptz NOT NULL DEFAULT now(),
      updated_at         timestamptz NOT NULL DEFAULT now(),
      CHECK (end_at > start_at)
    );
    CREATE INDEX planned_works_window_idx ON planned_works (start_at, end_at);
    CREATE SEQUENCE planned_work_codes OWNED BY planned_works.code;

    CREATE TABLE incidents (
      id                serial PRIMARY KEY,
      code              text NOT NULL UNIQUE,
      title             text NOT NULL CHECK (length(title) BETWEEN 1 AND 200),
      elements          jsonb NOT NULL,
      started_at        timestamptz NOT NULL,
      ended_at          timestamptz,
      household_minutes bigint,
      carriage_minutes  jsonb,
      opened_by         integer REFERENCES users(id) ON DELETE SET NULL,
      opened_by_email   text,
      version           integer NOT NULL DEFAULT 1,
      created_at        timestamptz NOT NULL DEFAULT now(),
      updated_at        timestamptz NOT NULL DEFAULT now(),
      CHECK (ended_at IS NULL OR ended_at >= started_at)
    );
    CREATE INDEX incidents_period_idx ON incidents (started_at, ended_at);
    CREATE SEQUENCE incident_codes OWNED BY incidents.code;

    CREATE TABLE incident_steps (
      id              serial PRIMARY KEY,
      incident_id     integer NOT NULL REFERENCES incidents(id) ON DELETE CASCADE,
      idx             integer NOT NULL,
      at              timestamptz NOT NULL,
      note            text NOT NULL DEFAULT '',
      added           jsonb NOT NULL DEFAULT '[]',
      restored        jsonb NOT NULL DEFAULT '[]',
      elements        jsonb NOT NULL,
      network_version bigint NOT NULL,
      reach           jsonb NOT NULL,
      by_user_id      integer REFERENCES users(id) ON DELETE SET NULL,
      by_email        text,
      UNIQUE (incident_id, idx)
    );
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`DROP TABLE IF EXISTS incident_steps, incidents, planned_works CASCADE;`);
};

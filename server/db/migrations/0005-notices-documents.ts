/**
 * Notices by e-mail and documents in object storage: who wants to be told
 * (signed-in people's subscriptions, outside contacts), each notice with its
 * sending state (one row per event and address: the idempotency key), and
 * document metadata (the bytes live in the object store). The job queue
 * keeps its own tables in the pgboss schema, created by pg-boss itself.
 */
import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

const CODES = `text[] NOT NULL DEFAULT '{}'`;

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE subscriptions (
      id         serial PRIMARY KEY,
      user_id    integer NOT NULL UNIQUE REFERENCES users (id) ON DELETE CASCADE,
      everything boolean NOT NULL DEFAULT false,
      services   ${CODES},
      sites      ${CODES},
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );

    CREATE TABLE contacts (
      id           serial PRIMARY KEY,
      name         text NOT NULL CHECK (length(name) BETWEEN 1 AND 200),
      email        text NOT NULL CHECK (length(email) BETWEEN 3 AND 320),
      organisation text NOT NULL DEFAULT '',
      everything   boolean NOT NULL DEFAULT false,
      services     ${CODES},
      sites        ${CODES},
      created_at   timestamptz NOT NULL DEFAULT now(),
      updated_at   timestamptz NOT NULL DEFAULT now()
    );
    CREATE UNIQUE INDEX contacts_email_key ON contacts (lower(email));

    CREATE TABLE notices (
      id         bigserial PRIMARY KEY,
      event_key  text NOT NULL,
      event_kind text NOT NULL,
      event_code text NOT NULL,
      address    text NOT NULL,
      subject    text NOT NULL,
      text_body  text NOT NULL,
      html_body  text NOT NULL,
      status     text NOT NULL DEFAULT 'waiting' CHECK (status IN ('waiting','sent','failed')),
      attempts   integer NOT NULL DEFAULT 0,
      last_error text,
      message_id text,
      created_at timestamptz NOT NULL DEFAULT now(),
      sent_at    timestamptz
    );
    CREATE UNIQUE INDEX notices_event_address_key ON notices (event_key, lower(address));
    CREATE INDEX notices_created_idx ON notices (created_at DESC);

    CREATE TABLE documents (
      id          bigserial PRIMARY KEY,
      owner_kind  text NOT NULL,
      owner_code  text NOT NULL,
      name        text NOT NULL CHECK (length(name) BETWEEN 1 AND 255),
      type        text NOT NULL,
      size        bigint NOT NULL CHECK (size >= 0),
      sha256      text NOT NULL CHECK (sha256 ~ '^[0-9a-f]{64}$'),
      object_key  text NOT NULL UNIQUE,
      preview_key text,
      created_by  text NOT NULL DEFAULT '',
      created_at  timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX documents_owner_idx ON documents (owner_kind, owner_code);
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('DROP TABLE IF EXISTS documents, notices, contacts, subscriptions');
};

/**
 * The first schema: people, the network inventory, its version and the audit log.
 * Constraints live in the database too, so a bad row cannot slip past a bug in
 * the API: unique codes, foreign keys, ranges, non-negative figures, one
 * carriage per (site, service).
 */
import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

const CODE = `~ '^[A-Za-z0-9._-]{1,64}$'`;

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE users (
      id            serial PRIMARY KEY,
      email         text NOT NULL,
      name          text NOT NULL DEFAULT '',
      role          text NOT NULL CHECK (role IN ('admin','engineer','operator','viewer')),
      password_hash text NOT NULL,
      disabled      boolean NOT NULL DEFAULT false,
      created_at    timestamptz NOT NULL DEFAULT now(),
      updated_at    timestamptz NOT NULL DEFAULT now()
    );
    CREATE UNIQUE INDEX users_email_key ON users (lower(email));

    CREATE TABLE network_state (
      id      smallint PRIMARY KEY DEFAULT 1 CHECK (id = 1),
      version bigint NOT NULL DEFAULT 1
    );
    INSERT INTO network_state (id, version) VALUES (1, 1);

    CREATE TABLE sites (
      id              serial PRIMARY KEY,
      code            text NOT NULL UNIQUE CHECK (code ${CODE}),
      name            text NOT NULL CHECK (length(name) BETWEEN 1 AND 200),
      role            text NOT NULL CHECK (role IN ('origin','main','relay')),
      lat             double precision NOT NULL CHECK (lat BETWEEN -90 AND 90),
      lon             double precision NOT NULL CHECK (lon BETWEEN -180 AND 180),
      ground_height_m double precision CHECK (ground_height_m >= 0),
      mast_height_m   double precision CHECK (mast_height_m >= 0),
      households      integer CHECK (households >= 0),
      version         integer NOT NULL DEFAULT 1,
      created_at      timestamptz NOT NULL DEFAULT now(),
      updated_at      timestamptz NOT NULL DEFAULT now()
    );

    CREATE TABLE services (
      id         serial PRIMARY KEY,
      code       text NOT NULL UNIQUE CHECK (code ${CODE}),
      name       text NOT NULL CHECK (length(name) BETWEEN 1 AND 200),
      kind       text NOT NULL CHECK (kind IN ('dtt','fm','dab','am','other')),
      version    integer NOT NULL DEFAULT 1,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );

    CREATE TABLE risk_groups (
      id         serial PRIMARY KEY,
      code       text NOT NULL UNIQUE CHECK (code ${CODE}),
      name       text NOT NULL CHECK (length(name) BETWEEN 1 AND 200),
      note       text,
      version    integer NOT NULL DEFAULT 1,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );

    CREATE TABLE carriages (
      id                  serial PRIMARY KEY,
      code                text NOT NULL UNIQUE CHECK (code ${CODE}),
      site_id             integer NOT NULL REFERENCES sites(id) ON DELETE RESTRICT,
      service_id          integer NOT NULL REFERENCES services(id) ON DELETE RESTRICT,
      frequency_mhz       double precision CHECK (frequency_mhz > 0),
      channel             text,
      erp_w               double precision CHECK (erp_w >= 0),
      polarisation        text CHECK (polarisation IN ('H','V','M','C')),
      antenna_height_m    double precision CHECK (antenna_height_m >= 0),
      on_channel_repeater boolean,
      version             integer NOT NULL DEFAULT 1,
      created_at          timestamptz NOT NULL DEFAULT now(),
      updated_at          timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT carriages_site_service_key UNIQUE (site_id, service_id)
    );
    CREATE INDEX carriages_service_idx ON carriages (service_id);

    CREATE TABLE feeds (
      id                serial PRIMARY KEY,
      code              text NOT NULL UNIQUE CHECK (code ${CODE}),
      from_carriage_id  integer NOT NULL REFERENCES carriages(id) ON DELETE RESTRICT,
      to_carriage_id    integer NOT NULL REFERENCES carriages(id) ON DELETE RESTRICT,
      medium            text NOT NULL CHECK (medium IN ('off-air','satellite','line','microwave')),
      role              text NOT NULL CHECK (role IN ('main','reserve')),
      rx_frequency_mhz  double precision CHECK (rx_frequency_mhz > 0),
      rx_channel        text,
      rx_antenna        text,
      bearing_deg       double precision CHECK (bearing_deg BETWEEN 0 AND 360),
      version           integer NOT NULL DEFAULT 1,
      created_at        timestamptz NOT NULL DEFAULT now(),
      updated_at        timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT feeds_not_to_itself CHECK (from_carriage_id <> to_carriage_id)
    );
    CREATE INDEX feeds_from_idx ON feeds (from_carriage_id);
    CREATE INDEX feeds_to_idx ON feeds (to_carriage_id);

    CREATE TABLE feed_via_sites (
      feed_id  integer NOT NULL REFERENCES feeds(id) ON DELETE CASCADE,
      position integer NOT NULL CHECK (position >= 0),
      site_id  integer NOT NULL REFERENCES sites(id) ON DELETE RESTRICT,
      PRIMARY KEY (feed_id, position)
    );
    CREATE INDEX feed_via_sites_site_idx ON feed_via_sites (site_id);

    CREATE TABLE feed_groups (
      feed_id  integer NOT NULL REFERENCES feeds(id) ON DELETE CASCADE,
      group_id integer NOT NULL REFERENCES risk_groups(id) ON DELETE RESTRICT,
      PRIMARY KEY (feed_id, group_id)
    );
    CREATE INDEX feed_groups_group_idx ON feed_groups (group_id);

    CREATE TABLE site_groups (
      site_id  integer NOT NULL REFERENCES sites(id) ON DELETE CASCADE,
      group_id integer NOT NULL REFERENCES risk_groups(id) ON DELETE RESTRICT,
      PRIMARY KEY (site_id, group_id)
    );
    CREATE INDEX site_groups_group_idx ON site_groups (group_id);

    CREATE TABLE audit_log (
      id              bigserial PRIMARY KEY,
      at              timestamptz NOT NULL DEFAULT now(),
      user_id         integer REFERENCES users(id) ON DELETE SET NULL,
      user_email      text,
      action          text NOT NULL,
      entity_kind     text NOT NULL,
      entity_code     text,
      before          jsonb,
      after           jsonb,
      network_version bigint
    );
    CREATE INDEX audit_log_at_idx ON audit_log (at DESC);
    CREATE INDEX audit_log_entity_idx ON audit_log (entity_kind, entity_code);
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TABLE IF EXISTS audit_log, site_groups, feed_groups, feed_via_sites, feeds, carriages,
      risk_groups, services, sites, network_state, users CASCADE;
  `);
};

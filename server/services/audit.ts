/**
 * The audit log: who changed what in the network, when, with the entity
 * before and after, and the network version the change produced. Rows are
 * written in the same transaction as the change, so a rolled-back change
 * leaves no trace and a committed one always has its record.
 */
import type { Sequelize, Transaction } from 'sequelize';
import type { EntityKind } from '@/shared/schemas/network';
import { inBatches } from './inventory/tables';

export interface Actor {
  userId?: number;
  email?: string;
}

/** What was done to people: see recordPeopleAudit. */
export const PEOPLE_ACTIONS = [
  'invite',
  'role-change',
  'disable',
  'enable',
  'password-change',
  'password-set',
  'sign-in',
  'sign-in-failed',
  'sign-out',
] as const;
export type PeopleAction = (typeof PEOPLE_ACTIONS)[number];
export type AuditAction = 'create' | 'update' | 'delete' | 'import' | PeopleAction;
/** An entity kind, 'network' for an import of a whole document, 'people' for accounts and sign-ins, or a planned work or incident (server/operations). */
export type AuditKind = EntityKind | 'network' | 'people' | 'works' | 'incidents';
export const AUDIT_KINDS: readonly AuditKind[] = ['sites', 'services', 'groups', 'carriages', 'feeds', 'network', 'people', 'works', 'incidents'];
export const AUDIT_ACTIONS: readonly AuditAction[] = ['create', 'update', 'delete', 'import', ...PEOPLE_ACTIONS];

export interface AuditEntry {
  action: AuditAction;
  entityKind: AuditKind;
  entityCode?: string | null;
  before?: unknown;
  after?: unknown;
}

const json = (value: unknown) => (value === undefined || value === null ? null : JSON.stringify(value));

export async function recordAudit(
  sequelize: Sequelize,
  transaction: Transaction,
  actor: Actor,
  networkVersion: number | null,
  entries: readonly AuditEntry[],
): Promise<void> {
  await inBatches(entries, async (batch) => {
    await sequelize.query(
      `INSERT INTO audit_log (user_id, user_email, action, entity_kind, entity_code, before, after, network_version)
       SELECT $1::int4, $2::text, u.action, u.kind, u.code, u.before::jsonb, u.after::jsonb, $3::int8
       FROM unnest($4::text[], $5::text[], $6::text[], $7::text[], $8::text[]) AS u(action, kind, code, before, after)`,
      {
        bind: [
          actor.userId ?? null,
          actor.email ?? null,
          networkVersion,
          batch.map((e) => e.action),
          batch.map((e) => e.entityKind),
          batch.map((e) => e.entityCode ?? null),
          batch.map((e) => json(e.before)),
          batch.map((e) => json(e.after)),
        ],
        transaction,
      },
    );
  });
}

export interface AuditQuery {
  page: number;
  pageSize: number;
  kind?: AuditKind;
  code?: string;
  action?: AuditAction;
}

export interface AuditItem {
  id: number;
  at: string;
  userEmail: string | null;
  action: AuditAction;
  entityKind: AuditKind;
  entityCode: string | null;
  before: unknown;
  after: unknown;
  networkVersion: number | null;
}

/** Newest first. */
export async function listAudit(sequelize: Sequelize, q: AuditQuery): Promise<{ items: AuditItem[]; total: number; page: number; pageSize: number }> {
  const where: string[] = [];
  const bind: unknown[] = [];
  const add = (sql: string, value: unknown) => {
    bind.push(value);
    where.push(sql.replace('?', `$${bind.length}`));
  };
  if (q.kind) add('entity_kind = ?', q.kind);
  if (q.code) add('entity_code = ?', q.code);
  if (q.action) add('action = ?', q.action);
  const filter = where.length ? `WHERE ${where.join(' AND ')}` : '';
  const [countRows] = await sequelize.query(`SELECT count(*)::int AS n FROM audit_log ${filter}`, { bind });
  const [rows] = await sequelize.query(
    `SELECT id, at, user_email AS "userEmail", action, entity_kind AS "entityKind", entity_code AS "entityCode",
            before, after, network_version AS "networkVersion"
     FROM audit_log ${filter} ORDER BY id DESC LIMIT $${bind.length + 1} OFFSET $${bind.length + 2}`,
    { bind: [...bind, q.pageSize, (q.page - 1) * q.pageSize] },
  );
  const items = (rows as Array<AuditItem & { at: Date }>).map((r) => ({ ...r, at: new Date(r.at).toISOString() }));
  return { items, total: (countRows as { n: number }[])[0].n, page: q.page, pageSize: q.pageSize };
}

export interface PeopleEntry {
  action: PeopleAction;
  /** the e-mail of the account concerned (for a failed sign-in: the e-mail tried, cut to 320 characters) */
  email: string;
  before?: unknown;
  after?: unknown;
}

/**
 * An event about people: invitations, role changes, disables, passwords and
 * sign-ins. Never a password or a hash: callers pass only what is shown.
 * With a transaction it commits with the change; without one (sign-ins) it
 * stands alone. No network version: people are not part of the network.
 */
export async function recordPeopleAudit(sequelize: Sequelize, actor: Actor, entry: PeopleEntry, transaction?: Transaction): Promise<void> {
  await sequelize.query(
    `INSERT INTO audit_log (user_id, user_email, action, entity_kind, entity_code, before, after, network_version)
     VALUES ($1::int4, $2::text, $3::text, 'people', $4::text, $5::jsonb, $6::jsonb, NULL)`,
    {
      bind: [actor.userId ?? null, actor.email ?? null, entry.action, entry.email.slice(0, 320), json(entry.before), json(entry.after)],
      ...(transaction ? { transaction } : {}),
    },
  );
}

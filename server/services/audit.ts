/**
 * The audit log: who changed what in the network, when, with the entity
 * before and after, and the network version the change produced. Rows are
 * written in the same transaction as the change, so a rolled-back change
 * leaves no trace and a committed one always has its record.
 */
import type { Sequelize, Transaction } from 'sequelize';
import type { EntityKind } from '@/shared/schemas/network';
import { columnOf, tableOf } from '../db/columns';
import { AuditRow } from '../db/models/audit';
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

/** The columns recordAudit writes, in its SELECT's order; names from the model. */
const WRITTEN = ['userId', 'userEmail', 'action', 'entityKind', 'entityCode', 'before', 'after', 'networkVersion'];

/** Many entries at once (an import's or a cascade's), set-based; one person's event goes through the model (recordPeopleAudit). */
export async function recordAudit(
  sequelize: Sequelize,
  transaction: Transaction,
  actor: Actor,
  networkVersion: number | null,
  entries: readonly AuditEntry[],
): Promise<void> {
  await inBatches(entries, async (batch) => {
    await sequelize.query(
      `INSERT INTO ${tableOf(AuditRow)} (${WRITTEN.map((a) => columnOf(AuditRow, a)).join(', ')})
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
export async function listAudit(_sequelize: Sequelize, q: AuditQuery): Promise<{ items: AuditItem[]; total: number; page: number; pageSize: number }> {
  const where: Record<string, string> = {};
  if (q.kind) where.entityKind = q.kind;
  if (q.code) where.entityCode = q.code;
  if (q.action) where.action = q.action;
  const { rows, count } = await AuditRow.findAndCountAll({
    where,
    attributes: ['id', 'at', 'userEmail', 'action', 'entityKind', 'entityCode', 'before', 'after', 'networkVersion'],
    order: [['id', 'DESC']],
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
    raw: true,
  });
  const items = (rows as unknown as Array<AuditItem & { at: Date }>).map((r) => ({ ...r, id: Number(r.id), at: new Date(r.at).toISOString() }));
  return { items, total: count, page: q.page, pageSize: q.pageSize };
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
export async function recordPeopleAudit(_sequelize: Sequelize, actor: Actor, entry: PeopleEntry, transaction?: Transaction): Promise<void> {
  await AuditRow.create(
    {
      userId: actor.userId ?? null,
      userEmail: actor.email ?? null,
      action: entry.action,
      entityKind: 'people',
      entityCode: entry.email.slice(0, 320),
      before: entry.before ?? null,
      after: entry.after ?? null,
      networkVersion: null,
    },
    transaction ? { transaction } : {},
  );
}

/**
 * Set-based writers for the inventory tables, for the importer (one record
 * at a time goes through the models: records.ts). Raw SQL rather than
 * Sequelize model instances, with the column lists taken from the models: an
 * import of a 20,000-site network is a few hundred thousand rows, and one
 * INSERT ... SELECT FROM unnest(array per column) per few thousand rows
 * costs milliseconds where an instance per row costs minutes. Arrays bind as
 * one parameter per column, so no batch ever nears PostgreSQL's limit of
 * 65,535 bind parameters. References travel as codes and are joined to ids
 * in SQL (codes are unique-indexed), so no id map is held in memory.
 * Every writer yields to the event loop between batches so the server keeps
 * answering other requests during a long import.
 */
import type { Sequelize, Transaction } from 'sequelize';
import type { EntityKind } from '@/shared/schemas/network';
import { BOOKKEEPING, columnOf, tableOf } from '../../db/columns';
import { FeedGroupRow, FeedRow, FeedViaSiteRow, RiskGroupRow, SiteGroupRow, SiteRow } from '../../db/models/inventory';
import { MODELS, REFERENCES } from './records';
import type { Fields } from './shape';

export interface Tx {
  sequelize: Sequelize;
  transaction: Transaction;
}

export const BATCH_ROWS = 4000;

export const yieldToEventLoop = () => new Promise<void>((resolve) => setImmediate(resolve));

export async function inBatches<T>(items: readonly T[], run: (batch: readonly T[]) => Promise<void>): Promise<void> {
  for (let i = 0; i < items.length; i += BATCH_ROWS) {
    await run(items.slice(i, i + BATCH_ROWS));
    await yieldToEventLoop();
  }
}

type PgType = 'text' | 'float8' | 'int4' | 'bool';
interface Column {
  column: string;
  field: string;
  type: PgType;
  /** the column holds the id of the row of this table whose code is the field's value */
  ref?: string;
}

export const TABLE: Record<EntityKind, string> = {
  sites: 'sites',
  services: 'services',
  groups: 'risk_groups',
  carriages: 'carriages',
  feeds: 'feeds',
};

/** The PostgreSQL array element type the writers bind each kind of model attribute as. */
const PG_TYPES: Record<string, PgType> = { TEXT: 'text', 'DOUBLE PRECISION': 'float8', INTEGER: 'int4', BOOLEAN: 'bool' };

/**
 * A kind's columns, from its model (server/db/models/inventory.ts): every
 * document attribute, references by the code the document carries.
 */
export function writtenColumns(kind: EntityKind): Column[] {
  const references = REFERENCES[kind] ?? [];
  return Object.entries(MODELS[kind].getAttributes())
    .filter(([name]) => !BOOKKEEPING.includes(name))
    .map(([name, a]) => {
      const ref = references.find((r) => r.attribute === name);
      const column = a.field ?? name;
      if (ref) return { column, field: ref.field, type: 'text', ref: tableOf(ref.model) };
      const type = PG_TYPES[(a.type as { key: string }).key];
      if (!type) throw new Error(`${kind}.${name}: no array type for ${(a.type as { key: string }).key}`);
      return { column, field: name, type };
    });
}

function writeSql(kind: EntityKind, mode: 'insert' | 'upsert'): string {
  const table = TABLE[kind];
  const cols = writtenColumns(kind);
  const input = cols.map((c, i) => `$${i + 1}::${c.type}[]`).join(', ');
  const names = cols.map((c) => c.column);
  const select = cols.map((c, i) => (c.ref ? `r${i}.id` : `u.${c.column}`)).join(', ');
  const joins = cols.map((c, i) => (c.ref ? ` JOIN ${c.ref} r${i} ON r${i}.code = u.${c.column}` : '')).join('');
  const updates = names.filter((n) => n !== 'code').map((n) => `${n} = EXCLUDED.${n}`).join(', ');
  // New rows go in with a plain INSERT: ON CONFLICT's speculative insertion costs more per row.
  // Otherwise the caller sends only rows it found created or changed (a change to a site's groups or
  // a feed's via-sites is a change to that entity too, which a column comparison here could not
  // see), so every conflicting row is updated and its optimistic-lock version moves on.
  const onConflict = mode === 'upsert' ? ` ON CONFLICT (code) DO UPDATE SET ${updates}, version = ${table}.version + 1, updated_at = now()` : '';
  return `INSERT INTO ${table} (${names.join(', ')})
    SELECT ${select} FROM unnest(${input}) AS u(${names.join(', ')})${joins}${onConflict}
    RETURNING id, code, version`;
}

/** Each kind's statements and columns, built once the models are defined (on first use). */
const written = new Map<EntityKind, { insert: string; upsert: string; columns: Column[] }>();
function statements(kind: EntityKind) {
  let found = written.get(kind);
  if (!found) written.set(kind, (found = { insert: writeSql(kind, 'insert'), upsert: writeSql(kind, 'upsert'), columns: writtenColumns(kind) }));
  return found;
}

export interface WrittenRow {
  id: number;
  code: string;
  version: number;
}

/** Insert new entities and overwrite changed ones, by code (`created`: all are new). Returns id, code and new version of each. */
export async function upsertEntities(tx: Tx, kind: EntityKind, entities: readonly Fields[], created = false): Promise<WrittenRow[]> {
  const { columns, ...sql } = statements(kind);
  const written: WrittenRow[] = [];
  await inBatches(entities, async (batch) => {
    const bind = columns.map((c) => batch.map((e) => (e[c.field] === undefined ? null : e[c.field])));
    const [rows] = await tx.sequelize.query(sql[created ? 'insert' : 'upsert'], { bind, transaction: tx.transaction });
    const got = rows as WrittenRow[];
    // The joins drop a row whose reference does not resolve; validation should have made that impossible.
    if (got.length !== batch.length) throw new Error(`${kind}: wrote ${got.length} of ${batch.length} rows; a reference did not resolve`);
    written.push(...got);
  });
  return written;
}

/** Deletes by code; dependent join rows go with them (ON DELETE CASCADE). Returns how many went. */
export async function deleteByCodes(tx: Tx, kind: EntityKind, codes: readonly string[]): Promise<number> {
  let deleted = 0;
  await inBatches(codes, async (batch) => {
    const [rows] = await tx.sequelize.query(`DELETE FROM ${TABLE[kind]} WHERE code = ANY($1::text[]) RETURNING id`, {
      bind: [batch],
      transaction: tx.transaction,
    });
    deleted += (rows as unknown[]).length;
  });
  return deleted;
}

/** Replaces the group memberships of these sites or feeds with the lists they carry (`created`: they have none yet). */
export async function replaceGroupMemberships(tx: Tx, kind: 'sites' | 'feeds', entities: readonly Fields[], created = false): Promise<void> {
  // table and column names come from the link models, the schema's one description
  const [link, ownerModel, ownerAttribute] = kind === 'sites' ? [SiteGroupRow, SiteRow, 'siteId'] : [FeedGroupRow, FeedRow, 'feedId'];
  const join = tableOf(link);
  const owner = columnOf(link, ownerAttribute);
  const group = columnOf(link, 'groupId');
  const ownerTable = tableOf(ownerModel);
  const groupTable = tableOf(RiskGroupRow);
  await inBatches(entities, async (batch) => {
    if (!created) {
      await tx.sequelize.query(`DELETE FROM ${join} WHERE ${owner} IN (SELECT id FROM ${ownerTable} WHERE code = ANY($1::text[]))`, {
        bind: [batch.map((e) => e.code as string)],
        transaction: tx.transaction,
      });
    }
    const owners: string[] = [];
    const groups: string[] = [];
    for (const e of batch) {
      for (const g of new Set((e.groups as string[] | undefined) ?? [])) {
        owners.push(e.code as string);
        groups.push(g);
      }
    }
    if (owners.length === 0) return;
    const [rows] = await tx.sequelize.query(
      `INSERT INTO ${join} (${owner}, ${group})
       SELECT o.id, g.id FROM unnest($1::text[], $2::text[]) AS u(owner, grp)
       JOIN ${ownerTable} o ON o.code = u.owner JOIN ${groupTable} g ON g.code = u.grp
       RETURNING ${group}`,
      { bind: [owners, groups], transaction: tx.transaction },
    );
    if ((rows as unknown[]).length !== owners.length) throw new Error(`${join}: a group reference did not resolve`);
  });
}

/** Replaces the via-site lists of these feeds, keeping their order as positions 0, 1, ... (`created`: they have none yet). */
export async function replaceViaSites(tx: Tx, feeds: readonly Fields[], created = false): Promise<void> {
  const [via, feedsTable, sitesTable] = [tableOf(FeedViaSiteRow), tableOf(FeedRow), tableOf(SiteRow)];
  const [feedColumn, positionColumn, siteColumn] = ['feedId', 'position', 'siteId'].map((a) => columnOf(FeedViaSiteRow, a));
  await inBatches(feeds, async (batch) => {
    if (!created) {
      await tx.sequelize.query(`DELETE FROM ${via} WHERE ${feedColumn} IN (SELECT id FROM ${feedsTable} WHERE code = ANY($1::text[]))`, {
        bind: [batch.map((f) => f.code as string)],
        transaction: tx.transaction,
      });
    }
    const owners: string[] = [];
    const positions: number[] = [];
    const sites: string[] = [];
    for (const f of batch) {
      ((f.via as string[] | undefined) ?? []).forEach((site, position) => {
        owners.push(f.code as string);
        positions.push(position);
        sites.push(site);
      });
    }
    if (owners.length === 0) return;
    const [rows] = await tx.sequelize.query(
      `INSERT INTO ${via} (${feedColumn}, ${positionColumn}, ${siteColumn})
       SELECT f.id, u.position, s.id FROM unnest($1::text[], $2::int4[], $3::text[]) AS u(feed, position, site)
       JOIN ${feedsTable} f ON f.code = u.feed JOIN ${sitesTable} s ON s.code = u.site
       RETURNING ${feedColumn}`,
      { bind: [owners, positions, sites], transaction: tx.transaction },
    );
    if ((rows as unknown[]).length !== owners.length) throw new Error(`${via}: a via-site reference did not resolve`);
  });
}

/**
 * Writes entities of one kind with their join rows (site groups; feed
 * via-sites and groups). `created`: none of them is stored yet, so there are
 * no old join rows to clear.
 */
export async function writeEntities(tx: Tx, kind: EntityKind, entities: readonly Fields[], opts: { created?: boolean } = {}): Promise<WrittenRow[]> {
  if (entities.length === 0) return [];
  const written = await upsertEntities(tx, kind, entities, opts.created);
  if (kind === 'sites' || kind === 'feeds') await replaceGroupMemberships(tx, kind, entities, opts.created);
  if (kind === 'feeds') await replaceViaSites(tx, entities, opts.created);
  return written;
}

/**
 * Refreshes the planner's statistics of these tables. After thousands of rows
 * land in a table that was small, the planner still plans for the small one
 * (a nested loop over a sequential scan for every code joined in the writers
 * above) and each batch slows down a hundredfold; the next reads of the
 * whole network suffer the same. ANALYZE samples a bounded number of rows,
 * so it costs tens of milliseconds, and inside a transaction it counts the
 * rows that transaction inserted (PostgreSQL source, analyze.c,
 * acquire_sample_rows: own INSERT_IN_PROGRESS tuples are sampled as live;
 * checked here: reltuples is right before COMMIT).
 */
export async function analyze(tx: Tx, tables: readonly string[]): Promise<void> {
  await tx.sequelize.query(`ANALYZE ${tables.join(', ')}`, { transaction: tx.transaction });
}

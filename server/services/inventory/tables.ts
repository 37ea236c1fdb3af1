/**
 * Set-based writers for the inventory tables, shared by the importer and the
 * single-entity edits. Raw SQL rather than Sequelize model instances: an
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
import { columnOf, tableOf } from '../../db/columns';
import { FeedGroupRow, FeedRow, FeedViaSiteRow, RiskGroupRow, SiteGroupRow, SiteRow } from '../../db/models/inventory';
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
  ref?: 'sites' | 'services' | 'carriages';
}

export const TABLE: Record<EntityKind, string> = {
  sites: 'sites',
  services: 'services',
  groups: 'risk_groups',
  carriages: 'carriages',
  feeds: 'feeds',
};

const text = (column: string, field = column): Column => ({ column, field, type: 'text' });
const float = (column: string, field: string): Column => ({ column, field, type: 'float8' });

const COLUMNS: Record<EntityKind, Column[]> = {
  sites: [
    text('code'), text('name'), text('role'), float('lat', 'lat'), float('lon', 'lon'),
    float('ground_height_m', 'groundHeightM'), float('mast_height_m', 'mastHeightM'), { column: 'households', field: 'households', type: 'int4' },
  ],
  services: [text('code'), text('name'), text('kind')],
  groups: [text('code'), text('name'), text('note')],
  carriages: [
    text('code'), { column: 'site_id', field: 'site', type: 'text', ref: 'sites' }, { column: 'service_id', field: 'service', type: 'text', ref: 'services' },
    float('frequency_mhz', 'frequencyMHz'), text('channel'), float('erp_w', 'erpW'), text('polarisation'),
    float('antenna_height_m', 'antennaHeightM'), { column: 'on_channel_repeater', field: 'onChannelRepeater', type: 'bool' },
  ],
  feeds: [
    text('code'), { column: 'from_carriage_id', field: 'from', type: 'text', ref: 'carriages' }, { column: 'to_carriage_id', field: 'to', type: 'text', ref: 'carriages' },
    text('medium'), text('role'), float('rx_frequency_mhz', 'rxFrequencyMHz'), text('rx_channel', 'rxChannel'),
    text('rx_antenna', 'rxAntenna'), float('bearing_deg', 'bearingDeg'),
  ],
};

function writeSql(kind: EntityKind, mode: 'insert' | 'upsert'): string {
  const table = TABLE[kind];
  const cols = COLUMNS[kind];
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

const SQL = Object.fromEntries(
  (Object.keys(COLUMNS) as EntityKind[]).map((k) => [k, { insert: writeSql(k, 'insert'), upsert: writeSql(k, 'upsert') }]),
) as Record<EntityKind, { insert: string; upsert: string }>;

export interface WrittenRow {
  id: number;
  code: string;
  version: number;
}

/** Insert new entities and overwrite changed ones, by code (`created`: all are new). Returns id, code and new version of each. */
export async function upsertEntities(tx: Tx, kind: EntityKind, entities: readonly Fields[], created = false): Promise<WrittenRow[]> {
  const sql = SQL[kind][created ? 'insert' : 'upsert'];
  const written: WrittenRow[] = [];
  await inBatches(entities, async (batch) => {
    const bind = COLUMNS[kind].map((c) => batch.map((e) => (e[c.field] === undefined ? null : e[c.field])));
    const [rows] = await tx.sequelize.query(sql, { bind, transaction: tx.transaction });
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

/**
 * Writes the entities an import creates through PostgreSQL COPY
 * (pg-copy-streams), inside the import's transaction. Measured against the
 * multi-row INSERT ... SELECT FROM unnest(...) of inventory/tables.ts on the
 * same generated networks (docs/bench/import-2026-12-05.json): COPY cut
 * the feeds (with their via-site and group rows) by 40 to 47 % and was no
 * slower for the rest, so creations take this path; updates of stored entities keep the
 * multi-row upsert, which COPY cannot do.
 *
 * Each kind is copied into a temporary staging table (dropped at the end of
 * the transaction, and with it on rollback) whose references are codes; one
 * statement joins them to ids in SQL for all the rows (so no id map is held
 * here), then one INSERT ... SELECT per slice writes them. The tables' checks,
 * unique keys and NOT NULL test every row; the per-row foreign-key triggers
 * are left out where the role may (rowTriggers.ts), since every id came
 * from a join against the referred table in this transaction. The
 * rows are streamed with back-pressure, a turn of the event loop whenever
 * one is due, and the client's abort checked between pieces: an aborted
 * COPY is failed on the server (CopyFail) and the transaction rolls back.
 * Column lists come from the models' attributes and associations
 * (server/db/models/inventory.ts).
 */
import type { Client } from 'pg';
import { from as copyFrom, type CopyStreamQuery } from 'pg-copy-streams';
import type { EntityKind } from '@/shared/schemas/network';
import { columnOf, tableOf } from '../../db/columns';
import { CarriageRow, FeedGroupRow, FeedRow, FeedViaSiteRow, RiskGroupRow, ServiceRow, SiteGroupRow, SiteRow } from '../../db/models/inventory';
import { Turns, nextTurn } from '../../interchange/turns';
import { FIELDS, type Fields } from '../inventory/shape';
import type { Tx } from '../inventory/tables';
import { withoutRowTriggers } from './rowTriggers';

/** Rows moved from the staging table into the real one per statement (progress and cancellation between them). */
const INSERT_SLICE = 25_000;
/** Memory for the hash of referred codes when resolving references (the import's transaction only; about 30 MB at 350,000 carriages). */
const RESOLVE_WORK_MEM = '64MB';
/** Characters of COPY text handed to the stream at once. */
const CHUNK_CHARS = 256 * 1024;

type Model = typeof SiteRow;
const MODEL: Record<EntityKind, Model> = { sites: SiteRow, services: ServiceRow, groups: RiskGroupRow, carriages: CarriageRow, feeds: FeedRow };
const PG_TYPE: Record<string, string> = { TEXT: 'text', 'DOUBLE PRECISION': 'float8', INTEGER: 'int4', BOOLEAN: 'bool' };
/** Document fields that are lists, written as rows of a link table. */
const LIST_FIELDS = new Set(['groups', 'via']);

interface Column {
  field: string;
  column: string;
  /** the staging column's type: a reference is staged as the code it names */
  type: string;
  /** a reference: the table whose row has the field's code */
  ref?: string;
}

/** The columns of a kind: document fields that are neither lists nor references take their column and type from the model; references from its belongsTo associations. */
function columnsOf(kind: EntityKind): Column[] {
  const model = MODEL[kind];
  const attributes = model.getAttributes() as Record<string, { type: { key?: string } }>;
  const associations = model.associations as Record<string, { associationType: string; foreignKey: string; target: Model } | undefined>;
  return FIELDS[kind]
    .filter((field) => !LIST_FIELDS.has(field))
    .map((field) => {
      const association = associations[field];
      if (association?.associationType === 'BelongsTo') {
        return { field, column: columnOf(model, association.foreignKey), type: 'text', ref: tableOf(association.target) };
      }
      const type = PG_TYPE[attributes[field]?.type.key ?? ''];
      if (!type) throw new Error(`${kind}.${field}: no column type for COPY`);
      return { field, column: columnOf(model, field), type };
    });
}

/** One value in COPY's text format: \N for absent, backslash escapes for the characters that end a field or a row. */
function copyValue(value: unknown): string {
  if (value === undefined || value === null) return '\\N';
  if (typeof value === 'boolean') return value ? 't' : 'f';
  const text = String(value);
  return /[\\\t\n\r]/.test(text) ? text.replace(/[\\\t\n\r]/g, (c) => (c === '\\' ? '\\\\' : c === '\t' ? '\\t' : c === '\n' ? '\\n' : '\\r')) : text;
}

/** The connection of the import's transaction: COPY needs the driver's client itself (Sequelize keeps it on the transaction). */
export function clientOf(tx: Tx): Client {
  const client = (tx.transaction as unknown as { connection?: Client }).connection;
  if (!client) throw new Error('the transaction has no connection');
  return client;
}

interface CopyOptions {
  signal?: AbortSignal;
  turns: Turns;
}

/** Streams rows into `COPY table (columns) FROM STDIN`; returns how many the server took. */
async function copyRows(client: Client, table: string, columns: readonly string[], rows: Iterable<string>, opts: CopyOptions): Promise<number> {
  const stream: CopyStreamQuery = client.query(copyFrom(`COPY ${table} (${columns.join(', ')}) FROM STDIN`));
  const done = new Promise<void>((resolve, reject) => {
    stream.on('finish', resolve);
    stream.on('error', reject);
  });
  // the promise is awaited below; until then a failure must not count as unhandled
  done.catch(() => {});
  try {
    let chunk = '';
    for (const row of rows) {
      chunk += row;
      if (chunk.length < CHUNK_CHARS && !opts.turns.due()) continue;
      // a server that refuses a row ends the stream with an error and never drains: stop waiting then
      if (!stream.write(chunk)) await Promise.race([new Promise<void>((resolve) => stream.once('drain', resolve)), done]);
      chunk = '';
      await nextTurn();
      opts.signal?.throwIfAborted();
    }
    stream.end(chunk);
  } catch (err) {
    stream.destroy(err instanceof Error ? err : new Error(String(err)));
    // The server's own refusal (a value its column cannot hold), when it came first, is the cause to report,
    // not the write that then ran into the ended stream.
    throw await done.then(
      () => err,
      (first: unknown) => first,
    );
  }
  await done;
  return stream.rowCount;
}

function* entityRows(entities: readonly Fields[], columns: readonly Column[]): Generator<string> {
  for (let n = 0; n < entities.length; n++) {
    const e = entities[n];
    let line = String(n);
    for (const c of columns) line += `\t${copyValue(e[c.field])}`;
    yield `${line}\n`;
  }
}

function* listRows(entities: readonly Fields[], field: 'groups' | 'via'): Generator<string> {
  for (const e of entities) {
    const list = (e[field] as string[] | undefined) ?? [];
    // groups are a set (canonical form has no repeats); via keeps its order as positions
    for (let position = 0; position < list.length; position++) yield `${copyValue(e.code)}\t${position}\t${copyValue(list[position])}\n`;
  }
}

/**
 * Creates these entities (none of them stored yet) with their link rows.
 * `step` hears each slice written. Throws if a reference does not resolve
 * (validation makes that impossible) or the database refuses a row.
 */
export async function copyCreated(tx: Tx, kind: EntityKind, entities: readonly Fields[], opts: { signal?: AbortSignal; step: (n: number) => void }): Promise<void> {
  if (entities.length === 0) return;
  const client = clientOf(tx);
  const turns = new Turns();
  const columns = columnsOf(kind);
  const table = tableOf(MODEL[kind]);
  const stage = `import_stage_${kind}`;
  // a second call for the same kind in one transaction starts from an empty stage
  await client.query(`DROP TABLE IF EXISTS ${stage}`);
  await client.query(`CREATE TEMP TABLE ${stage} (n int4, ${columns.map((c) => `${c.column} ${c.type}`).join(', ')}) ON COMMIT DROP`);
  const copied = await copyRows(client, stage, ['n', ...columns.map((c) => c.column)], entityRows(entities, columns), { signal: opts.signal, turns });
  if (copied !== entities.length) throw new Error(`${kind}: copied ${copied} of ${entities.length} rows`);
  const from = await resolveReferences(client, stage, columns, entities.length, kind);
  // each slice below picks its rows by n; with no statistics the planner takes a slice for a small share and reads it through the index, as wanted
  await client.query(`CREATE INDEX ON ${from} (n)`);

  const list = columns.map((c) => c.column).join(', ');
  // every id below came from an inner join in this transaction: no per-row foreign-key check needed (rowTriggers.ts)
  await withoutRowTriggers(client, async () => {
    for (let lo = 0; lo < entities.length; lo += INSERT_SLICE) {
      const hi = Math.min(entities.length, lo + INSERT_SLICE);
      const result = await client.query(`INSERT INTO ${table} (${list}) SELECT ${list} FROM ${from} WHERE n >= $1 AND n < $2`, [lo, hi]);
      if (result.rowCount !== hi - lo) throw new Error(`${kind}: wrote ${result.rowCount} of ${hi - lo} rows`);
      opts.step(hi - lo);
      opts.signal?.throwIfAborted();
    }
  });

  const lists = kind === 'feeds' ? (['groups', 'via'] as const) : kind === 'sites' ? (['groups'] as const) : [];
  if (!entities.some((e) => lists.some((field) => ((e[field] as unknown[] | undefined)?.length ?? 0) > 0))) return;
  // the owners just arrived: without fresh statistics the link joins below are planned for an empty table (once for both lists)
  await client.query(`ANALYZE ${table}`);
  for (const field of lists) await copyLinks(client, kind as 'sites' | 'feeds', entities, field, { signal: opts.signal, turns });
}

/**
 * A staging table whose references (codes) are turned into ids, in one
 * statement for all the rows: a join per slice would read and hash the
 * whole referred table once per slice (a national network's 400,000 feeds
 * would hash its 350,000 carriages twice for each of 17 slices). The hash
 * of the referred codes is held in memory, not spilled to disk in batches.
 * Answers the table to insert from (the stage itself when nothing refers).
 */
async function resolveReferences(client: Client, stage: string, columns: readonly Column[], count: number, kind: EntityKind): Promise<string> {
  if (!columns.some((c) => c.ref)) return stage;
  const resolved = `${stage}_ids`;
  await client.query(`DROP TABLE IF EXISTS ${resolved}`);
  await client.query(`SET LOCAL work_mem = '${RESOLVE_WORK_MEM}'`);
  const select = columns.map((c, i) => (c.ref ? `r${i}.id AS ${c.column}` : `s.${c.column}`)).join(', ');
  const joins = columns.map((c, i) => (c.ref ? ` JOIN ${c.ref} r${i} ON r${i}.code = s.${c.column}` : '')).join('');
  const result = await client.query(`CREATE TEMP TABLE ${resolved} ON COMMIT DROP AS SELECT s.n, ${select} FROM ${stage} s${joins}`);
  // the joins drop a row whose reference does not resolve
  if (result.rowCount !== count) throw new Error(`${kind}: resolved ${result.rowCount} of ${count} rows; a reference did not resolve`);
  return resolved;
}

/** The link rows of a list field: site and feed groups, feed via-sites (with their positions). */
async function copyLinks(client: Client, kind: 'sites' | 'feeds', entities: readonly Fields[], field: 'groups' | 'via', opts: CopyOptions): Promise<void> {
  const [link, ownerModel, ownerAttribute, targetModel, targetAttribute] =
    field === 'via'
      ? [FeedViaSiteRow, FeedRow, 'feedId', SiteRow, 'siteId']
      : kind === 'sites'
        ? [SiteGroupRow, SiteRow, 'siteId', RiskGroupRow, 'groupId']
        : [FeedGroupRow, FeedRow, 'feedId', RiskGroupRow, 'groupId'];
  const stage = `import_stage_${kind}_${field}`;
  await client.query(`DROP TABLE IF EXISTS ${stage}`);
  await client.query(`CREATE TEMP TABLE ${stage} (owner text, position int4, target text) ON COMMIT DROP`);
  const copied = await copyRows(client, stage, ['owner', 'position', 'target'], listRows(entities, field), opts);
  if (copied === 0) return;
  // the owner table was analyzed by copyCreated
  await client.query(`ANALYZE ${stage}`);
  const columns = [columnOf(link, ownerAttribute), ...(field === 'via' ? [columnOf(link, 'position')] : []), columnOf(link, targetAttribute)];
  await withoutRowTriggers(client, async () => {
    const result = await client.query(
      `INSERT INTO ${tableOf(link)} (${columns.join(', ')})
       SELECT o.id, ${field === 'via' ? 's.position, ' : ''}t.id FROM ${stage} s
       JOIN ${tableOf(ownerModel)} o ON o.code = s.owner JOIN ${tableOf(targetModel)} t ON t.code = s.target`,
    );
    if (result.rowCount !== copied) throw new Error(`${tableOf(link)}: wrote ${result.rowCount} of ${copied} rows; a reference did not resolve`);
  });
}

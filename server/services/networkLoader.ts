/**
 * Reads the network out of PostgreSQL in the document's shape: the whole of
 * it (`loadNetworkDocument`, for a rebuild and the export) or only the
 * entities an edit named (`loadEntities`, for the update after an edit,
 * docs/architecture.md "An edit"). Both run the same set-based queries, the
 * second with `WHERE code = ANY(...)`, so an entity reads the same either way.
 * Column lists come from the models' attribute descriptions
 * (server/db/models/inventory.ts).
 *
 * A 100,000-site network is about a million rows, and reading them is bound
 * by this process's CPU, not the database's. So the rows are streamed from
 * the driver as arrays (no per-row object with column names) and each one
 * becomes its document entity at once, with only the fields that are set:
 * the driver does not hold a table's rows until its query ends, and no
 * intermediate copy of an entity is made. Link rows (a site's or feed's
 * groups, a feed's via-sites) are read before their owners, so an entity is
 * built whole in one go. Values are parsed by the connection's own type
 * parsers, the same as any other query's.
 *
 * Everything is ordered by code in plain code-point order (COLLATE "C"),
 * the order the engine and an edit's document patch (documentPatch.ts) use.
 */
import { Query as PgQuery, type Client, type QueryArrayConfig } from 'pg';
import type { Sequelize, Transaction } from 'sequelize';
import type { CodesByKind } from '../db/networkChange';
import { WRITE_STATEMENT_TIMEOUT_MS } from './inventory/networkWrite';
import { selectList, selectedFields } from '../db/columns';
import { CARRIAGE_ATTRIBUTES, FEED_ATTRIBUTES, GROUP_ATTRIBUTES, SERVICE_ATTRIBUTES, SITE_ATTRIBUTES } from '../db/models/inventory';
import { NETWORK_FORMAT, type EntityKind, type NetworkDocument, type Site, type Carriage, type Feed, type Service, type Group } from '@/shared/schemas/network';

type Row = unknown[];
/** Runs `sql` (with `codes` as $1 when given), handing each row to `onRow` as it arrives. */
type Query = (sql: string, codes: string[] | undefined, onRow: (row: Row) => void) => Promise<void>;

function streamRows(client: Client, sql: string, values: unknown[] | undefined, onRow: (row: Row) => void): Promise<void> {
  return new Promise((resolve, reject) => {
    // a row the callback could not take fails the read once the query is over (the connection stays usable)
    let failure: unknown = null;
    const config: QueryArrayConfig = { text: sql, values, rowMode: 'array' };
    const query = new PgQuery(config);
    query.on('row', (row: Row) => {
      if (failure === null) {
        try {
          onRow(row);
        } catch (e) {
          failure = e;
        }
      }
    });
    query.on('error', reject);
    query.on('end', () => (failure === null ? resolve() : reject(failure)));
    client.query(query);
  });
}

/** The entity of a row: the fields from `from` on that are not null, named by `fields`, in their order. */
function entityOf(row: Row, fields: readonly string[], from: number): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (let i = from; i < fields.length; i++) {
    const v = row[i];
    if (v !== null) out[fields[i]] = v;
  }
  return out;
}

/** `AND <column> = ANY($1)` when only some codes are wanted. */
const only = (column: string, codes?: string[]) => (codes ? `AND ${column} = ANY($1::text[])` : '');

/** Codes listed per owner id, from rows (owner id, code) in list order. */
async function listsBy(q: Query, sql: string, codes?: string[]): Promise<Map<number, string[]>> {
  const lists = new Map<number, string[]>();
  await q(sql, codes, (row) => {
    const id = row[0] as number;
    const list = lists.get(id);
    if (list) list.push(row[1] as string);
    else lists.set(id, [row[1] as string]);
  });
  return lists;
}

const SITE_FIELDS = ['id', ...selectedFields(SITE_ATTRIBUTES)];
const SERVICE_FIELDS = selectedFields(SERVICE_ATTRIBUTES);
const GROUP_FIELDS = selectedFields(GROUP_ATTRIBUTES);
const CARRIAGE_REST = ['code', 'siteId', 'serviceId'];
const CARRIAGE_FIELDS = ['code', 'site', 'service', ...selectedFields(CARRIAGE_ATTRIBUTES, CARRIAGE_REST)];
const FEED_REST = ['code', 'fromCarriageId', 'toCarriageId'];
const FEED_FIELDS = ['id', 'code', 'from', 'to', ...selectedFields(FEED_ATTRIBUTES, FEED_REST)];

async function readSites(q: Query, codes?: string[]): Promise<Site[]> {
  const groups = await listsBy(
    q,
    `SELECT s.id, g.code FROM site_groups sg JOIN sites s ON s.id = sg.site_id JOIN risk_groups g ON g.id = sg.group_id
     WHERE true ${only('s.code', codes)} ORDER BY g.code COLLATE "C"`,
    codes,
  );
  const sites: Site[] = [];
  await q(`SELECT s.id, ${selectList(SITE_ATTRIBUTES, 's')} FROM sites s WHERE true ${only('s.code', codes)} ORDER BY s.code COLLATE "C"`, codes, (row) => {
    const site = entityOf(row, SITE_FIELDS, 1);
    const list = groups.get(row[0] as number);
    if (list) site.groups = list;
    sites.push(site as unknown as Site);
  });
  return sites;
}

async function readPlain<T>(q: Query, sql: string, fields: readonly string[], codes?: string[]): Promise<T[]> {
  const out: T[] = [];
  await q(sql, codes, (row) => out.push(entityOf(row, fields, 0) as T));
  return out;
}

const readServices = (q: Query, codes?: string[]) =>
  readPlain<Service>(q, `SELECT ${selectList(SERVICE_ATTRIBUTES, 'v')} FROM services v WHERE true ${only('v.code', codes)} ORDER BY v.code COLLATE "C"`, SERVICE_FIELDS, codes);

const readGroups = (q: Query, codes?: string[]) =>
  readPlain<Group>(q, `SELECT ${selectList(GROUP_ATTRIBUTES, 'g')} FROM risk_groups g WHERE true ${only('g.code', codes)} ORDER BY g.code COLLATE "C"`, GROUP_FIELDS, codes);

const readCarriages = (q: Query, codes?: string[]) =>
  readPlain<Carriage>(
    q,
    `SELECT c.code, s.code AS site, v.code AS service, ${selectList(CARRIAGE_ATTRIBUTES, 'c', CARRIAGE_REST)}
     FROM carriages c JOIN sites s ON s.id = c.site_id JOIN services v ON v.id = c.service_id
     WHERE true ${only('c.code', codes)} ORDER BY c.code COLLATE "C"`,
    CARRIAGE_FIELDS,
    codes,
  );

async function readFeeds(q: Query, codes?: string[]): Promise<Feed[]> {
  const via = await listsBy(
    q,
    `SELECT v.feed_id AS feed, s.code FROM feed_via_sites v JOIN sites s ON s.id = v.site_id JOIN feeds f ON f.id = v.feed_id
     WHERE true ${only('f.code', codes)} ORDER BY v.feed_id, v.position`,
    codes,
  );
  const groups = await listsBy(
    q,
    `SELECT fg.feed_id AS feed, g.code FROM feed_groups fg JOIN risk_groups g ON g.id = fg.group_id JOIN feeds f ON f.id = fg.feed_id
     WHERE true ${only('f.code', codes)} ORDER BY g.code COLLATE "C"`,
    codes,
  );
  const feeds: Feed[] = [];
  await q(
    `SELECT f.id, f.code, a.code AS "from", b.code AS "to", ${selectList(FEED_ATTRIBUTES, 'f', FEED_REST)}
     FROM feeds f JOIN carriages a ON a.id = f.from_carriage_id JOIN carriages b ON b.id = f.to_carriage_id
     WHERE true ${only('f.code', codes)} ORDER BY f.code COLLATE "C"`,
    codes,
    (row) => {
      const feed = entityOf(row, FEED_FIELDS, 1);
      const id = row[0] as number;
      const hops = via.get(id);
      if (hops) feed.via = hops;
      const list = groups.get(id);
      if (list) feed.groups = list;
      feeds.push(feed as unknown as Feed);
    },
  );
  return feeds;
}

/** The driver's connection under a Sequelize transaction (Sequelize keeps it on the transaction). */
function clientOf(transaction: Transaction): Client {
  const client = (transaction as unknown as { connection?: Client }).connection;
  if (!client) throw new Error('the transaction has no connection');
  return client;
}

/**
 * A read of the whole network is background work (a rebuild, an export), not
 * a request's short statement: its largest query streams some 400,000 rows
 * at the pace this process builds entities, so it runs under the same
 * statement limit as a network write.
 */
const WHOLE_READ_STATEMENT_TIMEOUT_MS = WRITE_STATEMENT_TIMEOUT_MS;

/** Runs `read` on one snapshot: REPEATABLE READ makes all its reads see the same committed state. */
async function inSnapshot<R>(
  sequelize: Sequelize,
  transaction: Transaction | undefined,
  read: (q: Query) => Promise<R>,
  opts: { whole?: boolean } = {},
): Promise<{ result: R; version: number }> {
  const run = async (t: Transaction) => {
    const client = clientOf(t);
    const q: Query = (sql, codes, onRow) => streamRows(client, sql, codes ? [codes] : undefined, onRow);
    // inside a caller's transaction its own limit stands
    if (opts.whole && !transaction) await q(`SET LOCAL statement_timeout = ${WHOLE_READ_STATEMENT_TIMEOUT_MS}`, undefined, () => {});
    let version = 0;
    await q('SELECT version FROM network_state WHERE id = 1', undefined, (row) => (version = Number(row[0])));
    return { result: await read(q), version };
  };
  if (transaction) return run(transaction);
  return sequelize.transaction({ isolationLevel: 'REPEATABLE READ' as Transaction.ISOLATION_LEVELS, readOnly: true } as never, (t) => run(t));
}

export async function loadNetworkDocument(sequelize: Sequelize, transaction?: Transaction): Promise<{ document: NetworkDocument; version: number }> {
  const { result, version } = await inSnapshot(sequelize, transaction, async (q) => ({
    format: NETWORK_FORMAT,
    sites: await readSites(q),
    services: await readServices(q),
    groups: await readGroups(q),
    carriages: await readCarriages(q),
    feeds: await readFeeds(q),
  }), { whole: true });
  return { document: result as NetworkDocument, version };
}

export type { CodesByKind };
/** Entities per kind as they are now: a code asked for and not found was deleted. */
export type EntitiesByKind = Partial<{ sites: Site[]; services: Service[]; groups: Group[]; carriages: Carriage[]; feeds: Feed[] }>;

/** The named entities as they stand, with the version of the snapshot they were read in. */
export async function loadEntities(sequelize: Sequelize, codes: CodesByKind): Promise<{ entities: EntitiesByKind; version: number }> {
  const { result, version } = await inSnapshot(sequelize, undefined, async (q) => {
    const out: EntitiesByKind = {};
    const want = (kind: EntityKind) => (codes[kind] && codes[kind].length > 0 ? codes[kind] : null);
    if (want('sites')) out.sites = await readSites(q, want('sites')!);
    if (want('services')) out.services = await readServices(q, want('services')!);
    if (want('groups')) out.groups = await readGroups(q, want('groups')!);
    if (want('carriages')) out.carriages = await readCarriages(q, want('carriages')!);
    if (want('feeds')) out.feeds = await readFeeds(q, want('feeds')!);
    return out;
  });
  return { entities: result, version };
}

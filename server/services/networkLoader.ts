/**
 * Reads the network out of PostgreSQL in the document's shape: the whole of
 * it (`loadNetworkDocument`, for a rebuild and the export) or only the
 * entities an edit named (`loadEntities`, for the update after an edit,
 * docs/architecture.md "An edit"). Both run the same set-based queries, the
 * second with `WHERE code = ANY(...)`, so an entity reads the same either way.
 * Column lists come from the models' attribute descriptions
 * (server/db/models/inventory.ts). Raw SQL rather than Sequelize instances: a 20,000-site network is several
 * hundred thousand rows, and model instances would cost seconds and hundreds
 * of megabytes for nothing.
 *
 * Everything is ordered by code in plain code-point order (COLLATE "C"),
 * the order the engine and an edit's document patch (documentPatch.ts) use.
 */
import type { Sequelize, Transaction } from 'sequelize';
import type { CodesByKind } from '../db/networkChange';
import { selectList } from '../db/columns';
import { CARRIAGE_ATTRIBUTES, FEED_ATTRIBUTES, GROUP_ATTRIBUTES, SERVICE_ATTRIBUTES, SITE_ATTRIBUTES } from '../db/models/inventory';
import { NETWORK_FORMAT, type EntityKind, type NetworkDocument, type Site, type Carriage, type Feed, type Service, type Group } from '@/shared/schemas/network';

type Row = Record<string, unknown>;
type Query = (sql: string, codes?: string[]) => Promise<Row[]>;

/** Drop null fields so the document carries only what is set (round trip). */
function clean<T extends object>(o: Row): T {
  const out: Row = {};
  for (const [k, v] of Object.entries(o)) if (v !== null && v !== undefined) out[k] = v;
  return out as T;
}

/** `AND <column> = ANY($1)` when only some codes are wanted. */
const only = (column: string, codes?: string[]) => (codes ? `AND ${column} = ANY($1::text[])` : '');

const listBy = (rows: Row[], key: string) => {
  const m = new Map<number, string[]>();
  for (const row of rows) {
    const id = Number(row[key]);
    let l = m.get(id);
    if (!l) m.set(id, (l = []));
    l.push(String(row.code));
  }
  return m;
};

async function readSites(q: Query, codes?: string[]): Promise<Site[]> {
  const rows = await q(
    `SELECT s.id, ${selectList(SITE_ATTRIBUTES, 's')} FROM sites s WHERE true ${only('s.code', codes)} ORDER BY s.code COLLATE "C"`,
    codes,
  );
  const groups = listBy(
    await q(
      `SELECT s.id AS site, g.code FROM site_groups sg JOIN sites s ON s.id = sg.site_id JOIN risk_groups g ON g.id = sg.group_id
       WHERE true ${only('s.code', codes)} ORDER BY g.code COLLATE "C"`,
      codes,
    ),
    'site',
  );
  return rows.map(({ id, ...s }) => clean<Site>({ ...s, groups: groups.get(Number(id)) }));
}

async function readServices(q: Query, codes?: string[]): Promise<Service[]> {
  return (await q(`SELECT ${selectList(SERVICE_ATTRIBUTES, 'v')} FROM services v WHERE true ${only('v.code', codes)} ORDER BY v.code COLLATE "C"`, codes)).map((s) => clean<Service>(s));
}

async function readGroups(q: Query, codes?: string[]): Promise<Group[]> {
  return (await q(`SELECT ${selectList(GROUP_ATTRIBUTES, 'g')} FROM risk_groups g WHERE true ${only('g.code', codes)} ORDER BY g.code COLLATE "C"`, codes)).map((g) => clean<Group>(g));
}

async function readCarriages(q: Query, codes?: string[]): Promise<Carriage[]> {
  const rows = await q(
    `SELECT c.code, s.code AS site, v.code AS service, ${selectList(CARRIAGE_ATTRIBUTES, 'c', ['code', 'siteId', 'serviceId'])}
     FROM carriages c JOIN sites s ON s.id = c.site_id JOIN services v ON v.id = c.service_id
     WHERE true ${only('c.code', codes)} ORDER BY c.code COLLATE "C"`,
    codes,
  );
  return rows.map((c) => clean<Carriage>(c));
}

async function readFeeds(q: Query, codes?: string[]): Promise<Feed[]> {
  const rows = await q(
    `SELECT f.id, f.code, a.code AS "from", b.code AS "to", ${selectList(FEED_ATTRIBUTES, 'f', ['code', 'fromCarriageId', 'toCarriageId'])}
     FROM feeds f JOIN carriages a ON a.id = f.from_carriage_id JOIN carriages b ON b.id = f.to_carriage_id
     WHERE true ${only('f.code', codes)} ORDER BY f.code COLLATE "C"`,
    codes,
  );
  const via = listBy(
    await q(
      `SELECT v.feed_id AS feed, s.code FROM feed_via_sites v JOIN sites s ON s.id = v.site_id JOIN feeds f ON f.id = v.feed_id
       WHERE true ${only('f.code', codes)} ORDER BY v.feed_id, v.position`,
      codes,
    ),
    'feed',
  );
  const groups = listBy(
    await q(
      `SELECT fg.feed_id AS feed, g.code FROM feed_groups fg JOIN risk_groups g ON g.id = fg.group_id JOIN feeds f ON f.id = fg.feed_id
       WHERE true ${only('f.code', codes)} ORDER BY g.code COLLATE "C"`,
      codes,
    ),
    'feed',
  );
  return rows.map(({ id, ...f }) => clean<Feed>({ ...f, via: via.get(Number(id)), groups: groups.get(Number(id)) }));
}

/** Runs `read` on one snapshot: REPEATABLE READ makes all its reads see the same committed state. */
async function inSnapshot<R>(sequelize: Sequelize, transaction: Transaction | undefined, read: (q: Query) => Promise<R>): Promise<{ result: R; version: number }> {
  const run = async (t?: Transaction) => {
    const q: Query = async (sql, codes) => (await sequelize.query(sql, { transaction: t, bind: codes ? [codes] : undefined }))[0] as Row[];
    const [versionRow] = await q('SELECT version FROM network_state WHERE id = 1');
    return { result: await read(q), version: Number(versionRow.version) };
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
  }));
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

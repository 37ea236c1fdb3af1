/**
 * One record at a time, through the Sequelize models
 * (server/db/models/inventory.ts): reading a record by code with what its
 * page shows, and creating, changing and deleting one inside a network
 * write. References travel as codes outside and as ids in the rows, joined
 * by the models' associations; a site's and a feed's groups and a feed's
 * via-sites live in the link models. Answers are in the document shape plus
 * version and last change (shape.ts). Lists, searches and the importer stay
 * set-based (read.ts, tables.ts).
 */
import { Op, OptimisticLockError, type Includeable, type Model, type ModelStatic, type WhereOptions } from 'sequelize';
import type { EntityKind } from '@/shared/schemas/network';
import { BOOKKEEPING } from '../../db/columns';
import { CarriageRow, FeedGroupRow, FeedRow, FeedViaSiteRow, RiskGroupRow, ServiceRow, SiteGroupRow, SiteRow } from '../../db/models/inventory';
import { conflict } from '../../http/errors';
import { NOUN, storedEntity, type Fields } from './shape';
import type { Tx } from './tables';

type Row = Model & { id: number; version: number; updatedAt: Date };
type RowModel = ModelStatic<Model>;

export const MODELS: Record<EntityKind, RowModel> = { sites: SiteRow, services: ServiceRow, groups: RiskGroupRow, carriages: CarriageRow, feeds: FeedRow };

interface Reference {
  /** the model attribute holding the id */
  attribute: string;
  /** the document field holding the code, which is also the association's name */
  field: string;
  model: RowModel;
}

/** A record's references to others, by the model attribute and the document field. */
export const REFERENCES: Partial<Record<EntityKind, Reference[]>> = {
  carriages: [
    { attribute: 'siteId', field: 'site', model: SiteRow },
    { attribute: 'serviceId', field: 'service', model: ServiceRow },
  ],
  feeds: [
    { attribute: 'fromCarriageId', field: 'from', model: CarriageRow },
    { attribute: 'toCarriageId', field: 'to', model: CarriageRow },
  ],
};

export interface Found {
  id: number;
  entity: Fields;
  /** the row's own columns as read (attribute names) */
  columns: Record<string, unknown>;
}

/** Which records: conditions on their own attributes, and on the records a reference names (a carriage's site, a feed's from and to). */
export interface Scope {
  where?: WhereOptions;
  referred?: Record<string, WhereOptions>;
}

const codeOnly = ['code'];
type Coded = { code: string };

/**
 * A site's or feed's groups and a feed's via-sites, from the link models for
 * all the records at once: joined into the records' own query they would
 * multiply its rows, and building nested instances of them costs more than
 * the reading (a site's page lists hundreds of feeds).
 */
async function linkLists(tx: Partial<Tx>, kind: EntityKind, ids: number[]): Promise<{ groups: Map<number, string[]>; via: Map<number, string[]> }> {
  const groups = new Map<number, string[]>();
  const via = new Map<number, string[]>();
  const add = (map: Map<number, string[]>, id: number, code: string) => {
    const list = map.get(id);
    if (list) list.push(code);
    else map.set(id, [code]);
  };
  if (ids.length === 0 || (kind !== 'sites' && kind !== 'feeds')) return { groups, via };
  const [link, owner] = kind === 'sites' ? [SiteGroupRow, 'siteId'] : [FeedGroupRow, 'feedId'];
  const memberships = await link.findAll({ where: { [owner]: ids }, attributes: [owner], include: [{ model: RiskGroupRow, as: 'group', attributes: codeOnly }], raw: true, transaction: tx.transaction });
  for (const m of memberships as unknown as Array<Record<string, number & string>>) add(groups, m[owner], m['group.code']);
  if (kind === 'feeds') {
    const hops = await FeedViaSiteRow.findAll({
      where: { feedId: ids },
      attributes: ['feedId'],
      include: [{ model: SiteRow, as: 'site', attributes: codeOnly }],
      order: [['feedId', 'ASC'], ['position', 'ASC']],
      raw: true,
      transaction: tx.transaction,
    });
    for (const h of hops as unknown as Array<{ feedId: number; 'site.code': string }>) add(via, h.feedId, h['site.code']);
  }
  return { groups, via };
}

/** The records of one kind in scope, ordered by code, in the API's shape. */
export async function readRecords(tx: Partial<Tx>, kind: EntityKind, scope: Scope): Promise<Found[]> {
  const references = REFERENCES[kind] ?? [];
  const include: Includeable[] = references.map((r) => {
    const where = scope.referred?.[r.field];
    return { model: r.model, as: r.field, attributes: codeOnly, required: true, ...(where ? { where } : {}) };
  });
  const rows = (await MODELS[kind].findAll({ where: scope.where, include, order: [['code', 'ASC']], raw: true, nest: true, transaction: tx.transaction })) as unknown as Array<Record<string, unknown>>;
  const links = await linkLists(tx, kind, rows.map((r) => r.id as number));
  return rows.map((columns) => {
    const id = columns.id as number;
    const document: Fields = { ...columns, groups: links.groups.get(id), via: links.via.get(id) };
    for (const r of references) document[r.field] = (columns[r.field] as Coded).code;
    return { id, columns, entity: storedEntity(kind, document) };
  });
}

export async function readRecord(tx: Partial<Tx>, kind: EntityKind, code: string): Promise<Found | undefined> {
  return (await readRecords(tx, kind, { where: { code } }))[0];
}

/** The model instance of a record read, to change or delete it. */
function instanceOf(kind: EntityKind, found: Found): Row {
  const own: Record<string, unknown> = {};
  for (const name of Object.keys(MODELS[kind].getAttributes())) own[name] = found.columns[name];
  return MODELS[kind].build(own, { isNewRecord: false, raw: true }) as Row;
}

/** The id of the record of `model` with this code (the cross-entity rules have made sure it exists). */
async function idsOf(tx: Tx, model: RowModel, codes: readonly string[]): Promise<number[]> {
  if (codes.length === 0) return [];
  const rows = (await model.findAll({ where: { code: [...new Set(codes)] }, attributes: ['id', 'code'], transaction: tx.transaction })) as Array<Model & { id: number; code: string }>;
  const byCode = new Map(rows.map((r) => [r.code, r.id]));
  return codes.map((code) => {
    const id = byCode.get(code);
    if (id === undefined) throw new Error(`${model.name}: the reference ${code} did not resolve`);
    return id;
  });
}

/** The model's own columns from a document entity: references as ids, an absent field as null (a change clears it). */
async function columnValues(tx: Tx, kind: EntityKind, entity: Fields): Promise<Record<string, unknown>> {
  const values: Record<string, unknown> = {};
  const references = REFERENCES[kind] ?? [];
  for (const name of Object.keys(MODELS[kind].getAttributes())) {
    if (BOOKKEEPING.includes(name)) continue;
    const ref = references.find((r) => r.attribute === name);
    values[name] = ref ? (await idsOf(tx, ref.model, [entity[ref.field] as string]))[0] : (entity[name] ?? null);
  }
  return values;
}

/** A canonical entity's list (groups as a sorted set, via in path order); none when absent. */
const list = (entity: Fields | undefined, field: string): string[] => (entity?.[field] as string[] | undefined) ?? [];

/** Replaces the record's link rows where its lists changed (`before`: the stored entity; none on a create). */
async function writeLinks(tx: Tx, kind: EntityKind, id: number, entity: Fields, before?: Fields): Promise<void> {
  const t = { transaction: tx.transaction };
  const changed = (field: string) => JSON.stringify(list(entity, field)) !== JSON.stringify(list(before, field));
  if ((kind === 'sites' || kind === 'feeds') && changed('groups')) {
    const [link, owner] = kind === 'sites' ? [SiteGroupRow, 'siteId'] : [FeedGroupRow, 'feedId'];
    if (before) await link.destroy({ where: { [owner]: id }, ...t });
    const groups = await idsOf(tx, RiskGroupRow, list(entity, 'groups'));
    await link.bulkCreate(groups.map((groupId) => ({ [owner]: id, groupId })), t);
  }
  if (kind === 'feeds' && changed('via')) {
    if (before) await FeedViaSiteRow.destroy({ where: { feedId: id }, ...t });
    const sites = await idsOf(tx, SiteRow, list(entity, 'via'));
    await FeedViaSiteRow.bulkCreate(sites.map((siteId, position) => ({ feedId: id, position, siteId })), t);
  }
}

const answer = (kind: EntityKind, entity: Fields, row: Row) => storedEntity(kind, { ...entity, version: row.version, updatedAt: row.updatedAt });

/** Creates one record (validated, rules checked) with its link rows; answers it as a read would. */
export async function createRecord(tx: Tx, kind: EntityKind, entity: Fields): Promise<Fields> {
  const row = (await MODELS[kind].create(await columnValues(tx, kind, entity), { transaction: tx.transaction })) as Row;
  await writeLinks(tx, kind, row.id, entity);
  return answer(kind, entity, row);
}

const changedMeanwhile = async (tx: Tx, kind: EntityKind, found: Found) => {
  const now = (await MODELS[kind].findByPk(found.id, { attributes: ['version'], transaction: tx.transaction })) as Row | null;
  return conflict(`${NOUN[kind]} ${found.entity.code as string} was changed by someone else meanwhile; reload and try again`, { currentVersion: now?.version ?? null });
};

/**
 * Writes the changed record over the stored one. The model's optimistic lock
 * updates only the version that was read and moves it on by one; the network
 * lock already serialises writers, so a miss means a writer went around it.
 */
export async function updateRecord(tx: Tx, kind: EntityKind, found: Found, next: Fields, before: Fields): Promise<Fields> {
  const row = instanceOf(kind, found);
  row.set(await columnValues(tx, kind, next));
  // a change to the link lists only is a change of the record too: its version and last change move on
  row.changed('updatedAt', true);
  try {
    await row.save({ transaction: tx.transaction });
  } catch (err) {
    if (err instanceof OptimisticLockError) throw await changedMeanwhile(tx, kind, found);
    throw err;
  }
  await writeLinks(tx, kind, found.id, next, before);
  return answer(kind, next, row);
}

/** Deletes one record at the version it was read; its link rows go with it (ON DELETE CASCADE). */
export async function deleteRecord(tx: Tx, kind: EntityKind, found: Found): Promise<void> {
  const gone = await instanceOf(kind, found).destroy({ transaction: tx.transaction });
  if (typeof gone === 'number' && gone < 1) throw await changedMeanwhile(tx, kind, found);
}

/** Deletes the records found, at once (a cascade's dependents). */
export async function deleteRecords(tx: Tx, kind: EntityKind, found: readonly Found[]): Promise<void> {
  if (found.length > 0) await MODELS[kind].destroy({ where: { id: { [Op.in]: found.map((f) => f.id) } }, transaction: tx.transaction });
}

/**
 * Takes sites or feeds out of one group: their link rows go, and each
 * member's version and last change move on. Answers the new versions.
 */
export async function leaveGroupRecords(tx: Tx, kind: 'sites' | 'feeds', groupId: number, members: readonly Found[]): Promise<Map<number, number>> {
  const [link, owner] = kind === 'sites' ? [SiteGroupRow, 'siteId'] : [FeedGroupRow, 'feedId'];
  const ids = members.map((m) => m.id);
  await link.destroy({ where: { groupId, [owner]: ids }, transaction: tx.transaction });
  // increment() moves the optimistic-lock version on by itself, and stamps the last change
  await MODELS[kind].increment({}, { where: { id: ids }, transaction: tx.transaction });
  return new Map(members.map((m) => [m.id, (m.entity.version as number) + 1]));
}

/** The ids of the sites or feeds in one group, from the link models. */
export async function groupMemberIds(tx: Partial<Tx>, kind: 'sites' | 'feeds', groupId: number): Promise<number[]> {
  const [link, owner] = kind === 'sites' ? [SiteGroupRow, 'siteId'] : [FeedGroupRow, 'feedId'];
  const rows = await link.findAll({ where: { groupId }, attributes: [owner], transaction: tx.transaction, raw: true });
  return rows.map((r) => (r as unknown as Record<string, number>)[owner]);
}

/** The ids of the feeds routed through a site as a hop. */
export async function feedsViaSite(tx: Partial<Tx>, siteId: number): Promise<number[]> {
  const rows = await FeedViaSiteRow.findAll({ where: { siteId }, attributes: ['feedId'], transaction: tx.transaction, raw: true });
  return [...new Set(rows.map((r) => (r as unknown as { feedId: number }).feedId))];
}

/**
 * The import's cross-entity rules (docs/format.md), applied
 * to one entity about to be created or changed, against the stored network:
 * references must exist, a feed joins two different carriages of one
 * service and no via-site is one of its ends, a site radiates each service
 * once; and a carriage that moves must not break the feeds it has. The
 * messages read like the import's ("feed F12: source carriage C99 does not
 * exist"). The stored network is read through the Sequelize models and
 * their associations (server/db/models/inventory.ts), as records.ts reads
 * one record: one query per question, never one per row.
 */
import { Op, type Includeable } from 'sequelize';
import type { EntityKind } from '@/shared/schemas/network';
import { CarriageRow, FeedRow, FeedViaSiteRow, ServiceRow, SiteRow } from '../../db/models/inventory';
import { duplicateCarriage, feedRules, movedCarriageRules, REFERENCE_LABEL, unknownReference, type CrossIssue } from '../../interchange/crossRules';
import { MODELS } from './records';
import { NOUN, type Fields } from './shape';
import type { Tx } from './tables';

export interface RuleIssue {
  field: string;
  rule: string;
  message: string;
}

export interface RuleFindings {
  /** 422: the entity refers to what does not exist, or breaks a rule between entities */
  unprocessable: RuleIssue[];
  /** 409: the entity clashes with another stored one */
  conflicts: RuleIssue[];
}

interface CarriageEnds {
  code: string;
  site: string;
  service: string;
}

type Coded = { code: string };
/** A carriage as read with its site and service (raw, nested by association name). */
type CarriageRead = Coded & { site: Coded; service: Coded };

const codeOnly = ['code'];

/** A carriage's site and service codes, joined in through the carriage model's associations. */
const siteAndService = (where: { site?: string; service?: string } = {}, attributes: string[] = codeOnly): Includeable[] => [
  { model: SiteRow, as: 'site', attributes, required: true, ...(where.site !== undefined ? { where: { code: where.site } } : {}) },
  { model: ServiceRow, as: 'service', attributes, required: true, ...(where.service !== undefined ? { where: { code: where.service } } : {}) },
];

const endsOf = (c: CarriageRead): CarriageEnds => ({ code: c.code, site: c.site.code, service: c.service.code });

async function existing(tx: Tx, kind: EntityKind, codes: string[]): Promise<Set<string>> {
  if (codes.length === 0) return new Set();
  const rows = (await MODELS[kind].findAll({ where: { code: codes }, attributes: codeOnly, raw: true, transaction: tx.transaction })) as unknown as Coded[];
  return new Set(rows.map((r) => r.code));
}

async function carriageEnds(tx: Tx, codes: string[]): Promise<Map<string, CarriageEnds>> {
  const rows = (await CarriageRow.findAll({ where: { code: codes }, attributes: codeOnly, include: siteAndService(), raw: true, nest: true, transaction: tx.transaction })) as unknown as CarriageRead[];
  return new Map(rows.map((r) => [r.code, endsOf(r)]));
}

/** Another carriage of the same service on the same site, if one is stored. */
async function sameServiceOnSite(tx: Tx, code: string, site: string, service: string): Promise<string | undefined> {
  const other = (await CarriageRow.findOne({
    where: { code: { [Op.ne]: code } },
    attributes: codeOnly,
    include: siteAndService({ site, service }, []),
    order: [['code', 'ASC']],
    raw: true,
    transaction: tx.transaction,
  })) as unknown as Coded | null;
  return other?.code;
}

export async function checkRules(tx: Tx, kind: EntityKind, entity: Fields, previous?: Fields): Promise<RuleFindings> {
  const found: RuleFindings = { unprocessable: [], conflicts: [] };
  const code = entity.code as string;
  const subject = `${NOUN[kind]} ${code}`;
  const refuse = (issue: CrossIssue) => found.unprocessable.push({ field: issue.field, rule: issue.rule, message: `${subject}: ${issue.detail}` });

  const checkList = async (field: 'groups' | 'via', target: EntityKind) => {
    const list = (entity[field] as string[] | undefined) ?? [];
    const known = await existing(tx, target, list);
    list.forEach((ref, i) => {
      if (!known.has(ref)) refuse(unknownReference(`${field}[${i}]`, REFERENCE_LABEL[field], ref));
    });
  };

  if (kind === 'sites') await checkList('groups', 'groups');

  if (kind === 'carriages') {
    const site = entity.site as string;
    const service = entity.service as string;
    if (!(await existing(tx, 'sites', [site])).has(site)) refuse(unknownReference('site', REFERENCE_LABEL.site, site));
    if (!(await existing(tx, 'services', [service])).has(service)) refuse(unknownReference('service', REFERENCE_LABEL.service, service));
    const other = await sameServiceOnSite(tx, code, site, service);
    if (other) {
      const issue = duplicateCarriage(site, service, other);
      found.conflicts.push({ field: issue.field, rule: issue.rule, message: `${subject}: ${issue.detail}` });
    }
    if (previous && (previous.site !== site || previous.service !== service)) await checkFeedsOfMovedCarriage(tx, code, site, service, refuse);
  }

  if (kind === 'feeds') {
    const from = entity.from as string;
    const to = entity.to as string;
    const ends = await carriageEnds(tx, [from, to]);
    const source = ends.get(from);
    const target = ends.get(to);
    if (!source) refuse(unknownReference('from', REFERENCE_LABEL.from, from));
    if (!target) refuse(unknownReference('to', REFERENCE_LABEL.to, to));
    await checkList('via', 'sites');
    for (const issue of feedRules(entity as { from: string; to: string; via?: string[] }, source, target)) refuse(issue);
    await checkList('groups', 'groups');
  }
  return found;
}

/**
 * A carriage moving to another site or service takes its feeds along: each
 * must still hold. One read: the carriage's feeds with both ends' sites and
 * services and the via-sites in path order, one row per hop, folded by feed.
 */
async function checkFeedsOfMovedCarriage(tx: Tx, code: string, site: string, service: string, refuse: (issue: CrossIssue) => void): Promise<void> {
  const end = (as: 'from' | 'to'): Includeable => ({ model: CarriageRow, as, attributes: codeOnly, required: true, include: siteAndService() });
  const rows = (await FeedRow.findAll({
    where: { [Op.or]: [{ '$from.code$': code }, { '$to.code$': code }] },
    attributes: ['id', 'code'],
    include: [end('from'), end('to'), { model: FeedViaSiteRow, as: 'viaSites', attributes: ['position'], required: false, include: [{ model: SiteRow, as: 'site', attributes: codeOnly }] }],
    order: [['code', 'ASC'], [{ model: FeedViaSiteRow, as: 'viaSites' }, 'position', 'ASC']],
    raw: true,
    nest: true,
    transaction: tx.transaction,
  })) as unknown as Array<Coded & { id: number; from: CarriageRead; to: CarriageRead; viaSites: { site: { code: string | null } } }>;
  const feeds = new Map<number, { code: string; other: CarriageEnds; via: string[] }>();
  for (const r of rows) {
    let feed = feeds.get(r.id);
    if (!feed) {
      feed = { code: r.code, other: endsOf(r.from.code === code ? r.to : r.from), via: [] };
      feeds.set(r.id, feed);
    }
    if (r.viaSites.site.code !== null) feed.via.push(r.viaSites.site.code);
  }
  for (const feed of feeds.values()) {
    for (const issue of movedCarriageRules({ code, site, service }, { code: feed.code, via: feed.via }, feed.other)) refuse(issue);
  }
}

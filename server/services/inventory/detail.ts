/**
 * One entity with what an engineer looks at next (GET /api/<kind>/:code):
 *   site     -> { site, carriages, feedsIn, feedsOut, feedsVia }
 *               feedsIn: feeds into a carriage at the site; feedsOut: feeds
 *               out of one; feedsVia: feeds routed through it as a hop
 *   service  -> { service, counts: { carriages, feeds } }
 *   group    -> { group, members: { sites: [code], feeds: [code] } }
 *   carriage -> { carriage, site, service, feedsIn, feedsOut }
 *   feed     -> { feed, source: { carriage, site }, target: { carriage, site }, via: [site] }
 * Every entity is in the list shape (document fields, version, updatedAt).
 */
import type { EntityKind } from '@/shared/schemas/network';
import { CarriageRow, FeedRow, RiskGroupRow, SiteRow } from '../../db/models/inventory';
import { notFound } from '../../http/errors';
import { feedsViaSite, readRecord, readRecords, type Scope } from './records';
import { NOUN, type Fields } from './shape';

const none = {};
const entities = async (kind: EntityKind, scope: Scope) => (await readRecords(none, kind, scope)).map((f) => f.entity);
const one = async (kind: EntityKind, code: string) => (await readRecord(none, kind, code))?.entity;

/** The codes of the sites or feeds in one shared-risk group, read through the membership models. */
async function memberCodes(members: typeof SiteRow | typeof FeedRow, group: string): Promise<string[]> {
  const rows = await members.findAll({
    attributes: ['code'],
    include: [{ model: RiskGroupRow, as: 'groups', where: { code: group }, attributes: [], through: { attributes: [] } }],
    order: [['code', 'ASC']],
    raw: true,
  });
  return rows.map((r) => (r as unknown as { code: string }).code);
}

export async function entityDetail(kind: EntityKind, code: string): Promise<Record<string, unknown>> {
  const found = await readRecord(none, kind, code);
  if (!found) throw notFound(`no ${NOUN[kind]} with code ${code}`, { code });
  const { entity, id } = found;
  switch (kind) {
    case 'sites':
      return {
        site: entity,
        carriages: await entities('carriages', { where: { siteId: id } }),
        feedsIn: await entities('feeds', { referred: { to: { siteId: id } } }),
        feedsOut: await entities('feeds', { referred: { from: { siteId: id } } }),
        feedsVia: await entities('feeds', { where: { id: await feedsViaSite(none, id) } }),
      };
    case 'services':
      return {
        service: entity,
        counts: {
          carriages: await CarriageRow.count({ where: { serviceId: id } }),
          // a feed joins two carriages of one service: its source's service is the feed's
          feeds: await FeedRow.count({ include: [{ model: CarriageRow, as: 'from', where: { serviceId: id }, attributes: [] }] }),
        },
      };
    case 'groups':
      return {
        group: entity,
        members: { sites: await memberCodes(SiteRow, code), feeds: await memberCodes(FeedRow, code) },
      };
    case 'carriages':
      return {
        carriage: entity,
        site: await one('sites', entity.site as string),
        service: await one('services', entity.service as string),
        feedsIn: await entities('feeds', { where: { toCarriageId: id } }),
        feedsOut: await entities('feeds', { where: { fromCarriageId: id } }),
      };
    case 'feeds':
      return { feed: entity, source: await end(entity.from as string), target: await end(entity.to as string), via: await viaSites(entity) };
  }
}

async function end(carriage: string) {
  const c = await one('carriages', carriage);
  return { carriage: c, site: c ? await one('sites', c.site as string) : undefined };
}

async function viaSites(feed: Fields) {
  const via = (feed.via as string[] | undefined) ?? [];
  if (via.length === 0) return [];
  const byCode = new Map((await entities('sites', { where: { code: via } })).map((s) => [s.code, s]));
  return via.map((code) => byCode.get(code)).filter((s) => s !== undefined);
}

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
import type { Sequelize } from 'sequelize';
import type { EntityKind } from '@/shared/schemas/network';
import { FeedRow, RiskGroupRow, SiteRow } from '../../db/models/inventory';
import { notFound } from '../../http/errors';
import { countWhere, findByCode, findWhere } from './read';
import { NOUN, type Fields } from './shape';

const entities = async (sequelize: Sequelize, kind: EntityKind, condition: string, bind: unknown[]) =>
  (await findWhere(sequelize, kind, condition, bind)).map((f) => f.entity);

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

export async function entityDetail(sequelize: Sequelize, kind: EntityKind, code: string): Promise<Record<string, unknown>> {
  const found = await findByCode(sequelize, kind, code);
  if (!found) throw notFound(`no ${NOUN[kind]} with code ${code}`, { code });
  const entity = found.entity;
  switch (kind) {
    case 'sites':
      return {
        site: entity,
        carriages: await entities(sequelize, 'carriages', 'si.code = $1', [code]),
        feedsIn: await entities(sequelize, 'feeds', 'sb.code = $1', [code]),
        feedsOut: await entities(sequelize, 'feeds', 'sa.code = $1', [code]),
        feedsVia: await entities(sequelize, 'feeds', 'EXISTS (SELECT 1 FROM feed_via_sites v JOIN sites s ON s.id = v.site_id WHERE v.feed_id = e.id AND s.code = $1)', [code]),
      };
    case 'services':
      return {
        service: entity,
        counts: { carriages: await countWhere(sequelize, 'carriages', 'sv.code = $1', [code]), feeds: await countWhere(sequelize, 'feeds', 'sv.code = $1', [code]) },
      };
    case 'groups':
      return {
        group: entity,
        members: { sites: await memberCodes(SiteRow, code), feeds: await memberCodes(FeedRow, code) },
      };
    case 'carriages':
      return {
        carriage: entity,
        site: (await findByCode(sequelize, 'sites', entity.site as string))?.entity,
        service: (await findByCode(sequelize, 'services', entity.service as string))?.entity,
        feedsIn: await entities(sequelize, 'feeds', 'b.code = $1', [code]),
        feedsOut: await entities(sequelize, 'feeds', 'a.code = $1', [code]),
      };
    case 'feeds':
      return { feed: entity, source: await end(sequelize, entity.from as string), target: await end(sequelize, entity.to as string), via: await viaSites(sequelize, entity) };
  }
}

async function end(sequelize: Sequelize, carriage: string) {
  const c = (await findByCode(sequelize, 'carriages', carriage))?.entity;
  return { carriage: c, site: c ? (await findByCode(sequelize, 'sites', c.site as string))?.entity : undefined };
}

async function viaSites(sequelize: Sequelize, feed: Fields) {
  const via = (feed.via as string[] | undefined) ?? [];
  if (via.length === 0) return [];
  const byCode = new Map((await entities(sequelize, 'sites', 'e.code = ANY($1::text[])', [via])).map((s) => [s.code, s]));
  return via.map((code) => byCode.get(code)).filter((s) => s !== undefined);
}

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
import { notFound } from '../../http/errors';
import { countWhere, findByCode, findWhere } from './read';
import { NOUN, type Fields } from './shape';

const entities = async (sequelize: Sequelize, kind: EntityKind, condition: string, bind: unknown[]) =>
  (await findWhere(sequelize, kind, condition, bind)).map((f) => f.entity);

async function codes(sequelize: Sequelize, sql: string, code: string): Promise<string[]> {
  const [rows] = await sequelize.query(sql, { bind: [code] });
  return (rows as { code: string }[]).map((r) => r.code);
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
        members: {
          sites: await codes(sequelize, 'SELECT s.code FROM site_groups sg JOIN sites s ON s.id = sg.site_id JOIN risk_groups g ON g.id = sg.group_id WHERE g.code = $1 ORDER BY s.code', code),
          feeds: await codes(sequelize, 'SELECT f.code FROM feed_groups fg JOIN feeds f ON f.id = fg.feed_id JOIN risk_groups g ON g.id = fg.group_id WHERE g.code = $1 ORDER BY f.code', code),
        },
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

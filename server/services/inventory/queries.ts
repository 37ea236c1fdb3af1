/**
 * How each kind is read: one SELECT giving the document shape (codes, not
 * ids; the entity's own columns from its model, server/db/models/inventory.ts;
 * group and via lists as arrays) plus version and last change, and the
 * whitelists a list request may sort, search and filter by. Only names from
 * these tables ever reach SQL text; every value a client sends is a bind
 * parameter.
 */
import type { EntityKind } from '@/shared/schemas/network';
import { MEDIA, FEED_ROLES, SITE_ROLES } from '@/shared/schemas/network';
import { selectList, sortList } from '../../db/columns';
import { CARRIAGE_ATTRIBUTES, FEED_ATTRIBUTES, GROUP_ATTRIBUTES, SERVICE_ATTRIBUTES, SITE_ATTRIBUTES } from '../../db/models/inventory';

export interface Filter {
  /** SQL with `?` where the bound value goes */
  sql: string;
  /** allowed values, when the filter is an enum */
  values?: readonly string[];
}

export interface KindQuery {
  /** the select list: document fields, id, version and updatedAt */
  columns: string;
  /** the main table, aliased `e`, with the joins the columns, sorts and filters use */
  from: string;
  sorts: Record<string, string>;
  /** expressions a text search looks in */
  search: string[];
  filters: Record<string, Filter>;
}

const siteGroups = `ARRAY(SELECT g.code FROM site_groups sg JOIN risk_groups g ON g.id = sg.group_id WHERE sg.site_id = e.id ORDER BY g.code)`;
const feedGroups = `ARRAY(SELECT g.code FROM feed_groups fg JOIN risk_groups g ON g.id = fg.group_id WHERE fg.feed_id = e.id ORDER BY g.code)`;
const feedVia = `ARRAY(SELECT s.code FROM feed_via_sites v JOIN sites s ON s.id = v.site_id WHERE v.feed_id = e.id ORDER BY v.position)`;
const stamp = `e.version, e.updated_at AS "updatedAt"`;

export const QUERIES: Record<EntityKind, KindQuery> = {
  sites: {
    columns: `e.id, ${selectList(SITE_ATTRIBUTES, 'e')}, ${siteGroups} AS groups, ${stamp}`,
    from: 'sites e',
    sorts: sortList(SITE_ATTRIBUTES, 'e'),
    search: ['e.code', 'e.name'],
    filters: {
      role: { sql: 'e.role = ?', values: SITE_ROLES },
      group: { sql: 'EXISTS (SELECT 1 FROM site_groups sg JOIN risk_groups g ON g.id = sg.group_id WHERE sg.site_id = e.id AND g.code = ?)' },
    },
  },
  services: {
    columns: `e.id, ${selectList(SERVICE_ATTRIBUTES, 'e')}, ${stamp}`,
    from: 'services e',
    sorts: sortList(SERVICE_ATTRIBUTES, 'e'),
    search: ['e.code', 'e.name'],
    filters: {},
  },
  groups: {
    columns: `e.id, ${selectList(GROUP_ATTRIBUTES, 'e')}, ${stamp}`,
    from: 'risk_groups e',
    sorts: sortList(GROUP_ATTRIBUTES, 'e'),
    search: ['e.code', 'e.name'],
    filters: {},
  },
  carriages: {
    columns: `e.id, e.code, si.code AS site, sv.code AS service, ${selectList(CARRIAGE_ATTRIBUTES, 'e', ['code', 'siteId', 'serviceId'])}, ${stamp}`,
    from: 'carriages e JOIN sites si ON si.id = e.site_id JOIN services sv ON sv.id = e.service_id',
    // the references sort by the code they show
    sorts: { ...sortList(CARRIAGE_ATTRIBUTES, 'e', ['siteId', 'serviceId']), site: 'si.code', service: 'sv.code' },
    search: ['e.code', 'si.code', 'sv.code'],
    filters: {
      service: { sql: 'sv.code = ?' },
      site: { sql: 'si.code = ?' },
    },
  },
  feeds: {
    columns: `e.id, e.code, a.code AS "from", b.code AS "to", ${selectList(FEED_ATTRIBUTES, 'e', ['code', 'fromCarriageId', 'toCarriageId'])},
              ${feedVia} AS via, ${feedGroups} AS groups, ${stamp}`,
    from: `feeds e JOIN carriages a ON a.id = e.from_carriage_id JOIN carriages b ON b.id = e.to_carriage_id
             JOIN sites sa ON sa.id = a.site_id JOIN sites sb ON sb.id = b.site_id JOIN services sv ON sv.id = a.service_id`,
    sorts: {
      ...sortList(FEED_ATTRIBUTES, 'e', ['fromCarriageId', 'toCarriageId']),
      from: 'a.code', to: 'b.code', service: 'sv.code', fromSite: 'sa.code', toSite: 'sb.code',
    },
    search: ['e.code', 'a.code', 'b.code', 'sa.code', 'sb.code', 'sv.code'],
    filters: {
      medium: { sql: 'e.medium = ?', values: MEDIA },
      role: { sql: 'e.role = ?', values: FEED_ROLES },
      service: { sql: 'sv.code = ?' },
      fromSite: { sql: 'sa.code = ?' },
      toSite: { sql: 'sb.code = ?' },
      group: { sql: 'EXISTS (SELECT 1 FROM feed_groups fg JOIN risk_groups g ON g.id = fg.group_id WHERE fg.feed_id = e.id AND g.code = ?)' },
    },
  },
};

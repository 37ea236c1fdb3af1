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
import {
  CARRIAGE_ATTRIBUTES, FEED_ATTRIBUTES, FEED_GROUP_ATTRIBUTES, FEED_VIA_ATTRIBUTES, GROUP_ATTRIBUTES, SERVICE_ATTRIBUTES, SITE_ATTRIBUTES, SITE_GROUP_ATTRIBUTES, TABLES,
} from '../../db/models/inventory';

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

/** An attribute's column, by the model's description. */
const col = <A extends object>(attributes: A, name: keyof A & string) => (attributes[name] as { field?: string }).field ?? name;
const T = TABLES;
const [sgSite, sgGroup] = [col(SITE_GROUP_ATTRIBUTES, 'siteId'), col(SITE_GROUP_ATTRIBUTES, 'groupId')];
const [fgFeed, fgGroup] = [col(FEED_GROUP_ATTRIBUTES, 'feedId'), col(FEED_GROUP_ATTRIBUTES, 'groupId')];
const [vFeed, vSite, vPosition] = [col(FEED_VIA_ATTRIBUTES, 'feedId'), col(FEED_VIA_ATTRIBUTES, 'siteId'), col(FEED_VIA_ATTRIBUTES, 'position')];
const inSiteGroups = `FROM ${T.siteGroups} sg JOIN ${T.groups} g ON g.id = sg.${sgGroup} WHERE sg.${sgSite} = e.id`;
const inFeedGroups = `FROM ${T.feedGroups} fg JOIN ${T.groups} g ON g.id = fg.${fgGroup} WHERE fg.${fgFeed} = e.id`;
const siteGroups = `ARRAY(SELECT g.code ${inSiteGroups} ORDER BY g.code)`;
const feedGroups = `ARRAY(SELECT g.code ${inFeedGroups} ORDER BY g.code)`;
const feedVia = `ARRAY(SELECT s.code FROM ${T.feedVia} v JOIN ${T.sites} s ON s.id = v.${vSite} WHERE v.${vFeed} = e.id ORDER BY v.${vPosition})`;
const [cSite, cService] = [col(CARRIAGE_ATTRIBUTES, 'siteId'), col(CARRIAGE_ATTRIBUTES, 'serviceId')];
const [fFrom, fTo] = [col(FEED_ATTRIBUTES, 'fromCarriageId'), col(FEED_ATTRIBUTES, 'toCarriageId')];
const stamp = `e.version, e.${col(SITE_ATTRIBUTES, 'updatedAt')} AS "updatedAt"`;

export const QUERIES: Record<EntityKind, KindQuery> = {
  sites: {
    columns: `e.id, ${selectList(SITE_ATTRIBUTES, 'e')}, ${siteGroups} AS groups, ${stamp}`,
    from: `${T.sites} e`,
    sorts: sortList(SITE_ATTRIBUTES, 'e'),
    search: ['e.code', 'e.name'],
    filters: {
      role: { sql: `e.${col(SITE_ATTRIBUTES, 'role')} = ?`, values: SITE_ROLES },
      group: { sql: `EXISTS (SELECT 1 ${inSiteGroups} AND g.code = ?)` },
    },
  },
  services: {
    columns: `e.id, ${selectList(SERVICE_ATTRIBUTES, 'e')}, ${stamp}`,
    from: `${T.services} e`,
    sorts: sortList(SERVICE_ATTRIBUTES, 'e'),
    search: ['e.code', 'e.name'],
    filters: {},
  },
  groups: {
    columns: `e.id, ${selectList(GROUP_ATTRIBUTES, 'e')}, ${stamp}`,
    from: `${T.groups} e`,
    sorts: sortList(GROUP_ATTRIBUTES, 'e'),
    search: ['e.code', 'e.name'],
    filters: {},
  },
  carriages: {
    columns: `e.id, e.code, si.code AS site, sv.code AS service, ${selectList(CARRIAGE_ATTRIBUTES, 'e', ['code', 'siteId', 'serviceId'])}, ${stamp}`,
    from: `${T.carriages} e JOIN ${T.sites} si ON si.id = e.${cSite} JOIN ${T.services} sv ON sv.id = e.${cService}`,
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
    from: `${T.feeds} e JOIN ${T.carriages} a ON a.id = e.${fFrom} JOIN ${T.carriages} b ON b.id = e.${fTo}
             JOIN ${T.sites} sa ON sa.id = a.${cSite} JOIN ${T.sites} sb ON sb.id = b.${cSite} JOIN ${T.services} sv ON sv.id = a.${cService}`,
    sorts: {
      ...sortList(FEED_ATTRIBUTES, 'e', ['fromCarriageId', 'toCarriageId']),
      from: 'a.code', to: 'b.code', service: 'sv.code', fromSite: 'sa.code', toSite: 'sb.code',
    },
    search: ['e.code', 'a.code', 'b.code', 'sa.code', 'sb.code', 'sv.code'],
    filters: {
      medium: { sql: `e.${col(FEED_ATTRIBUTES, 'medium')} = ?`, values: MEDIA },
      role: { sql: `e.${col(FEED_ATTRIBUTES, 'role')} = ?`, values: FEED_ROLES },
      service: { sql: 'sv.code = ?' },
      fromSite: { sql: 'sa.code = ?' },
      toSite: { sql: 'sb.code = ?' },
      group: { sql: `EXISTS (SELECT 1 ${inFeedGroups} AND g.code = ?)` },
    },
  },
};

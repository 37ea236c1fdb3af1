/**
 * What the inventory screens need to know about each kind of record: the
 * words for it, where its screens live, which sorts and filters its list
 * offers. The sort and filter names are the server's whitelist
 * (GET /api/<kind>, server/routes/inventory.ts); anything else is a 400.
 */
import { countOf as countWords } from '@/shared/format';
import type { Href } from 'expo-router';
import { FEED_ROLES, MEDIA, SITE_ROLES, type EntityKind } from '@/shared/schemas/network';
import { FEED_ROLE_WORDS, SITE_TYPE_WORDS } from '@/shared/words';

export interface KindWords {
  /** "site" */
  one: string;
  /** "sites" */
  many: string;
  /** "Sites", the list's title */
  title: string;
}

export const WORDS: Record<EntityKind, KindWords> = {
  sites: { one: 'site', many: 'sites', title: 'Sites' },
  services: { one: 'service', many: 'services', title: 'Services' },
  groups: { one: 'group', many: 'groups', title: 'Groups' },
  carriages: { one: 'carriage', many: 'carriages', title: 'Carriages' },
  feeds: { one: 'feed', many: 'feeds', title: 'Feeds' },
};

/** "1 site", "3 sites" */
export function countOf(kind: EntityKind, n: number): string {
  return countWords(n, WORDS[kind].one, WORDS[kind].many);
}

/** The route of a kind's list and of one record (codes are URL-escaped). */
export const listHref = (kind: EntityKind): Href => `/${kind}`;
export const detailHref = (kind: EntityKind, code: string): Href => `/${kind}/${encodeURIComponent(code)}`;

export interface SortOption {
  value: string;
  label: string;
}

const sort = (value: string, label: string): SortOption => ({ value, label });
const BY_CODE = sort('code', 'Code');
const BY_NAME = sort('name', 'Name');
const BY_CHANGE = sort('updatedAt', 'Last changed');

/** The sorts a list offers, the most useful first; each is in the server's whitelist. */
export const SORTS: Record<EntityKind, readonly SortOption[]> = {
  sites: [BY_CODE, BY_NAME, sort('role', 'Site type'), sort('households', 'Households'), BY_CHANGE],
  services: [BY_CODE, BY_NAME, sort('kind', 'Kind'), BY_CHANGE],
  groups: [BY_CODE, BY_NAME, BY_CHANGE],
  carriages: [BY_CODE, sort('site', 'Site'), sort('service', 'Service'), sort('frequencyMHz', 'Frequency'), sort('erpW', 'ERP')],
  feeds: [BY_CODE, sort('toSite', 'Receiving site'), sort('fromSite', 'Source site'), sort('medium', 'Medium'), sort('role', 'Main or reserve')],
};

export interface FilterSpec {
  /** the query-string name the server knows */
  name: string;
  label: string;
  /** fixed values; absent for a filter by a service code (chosen from the services) */
  values?: readonly string[];
  /** the words shown for each value, where the stored code is not a word ("main" -> "main station") */
  valueLabels?: Readonly<Record<string, string>>;
}

export const FILTERS: Record<EntityKind, readonly FilterSpec[]> = {
  sites: [{ name: 'role', label: 'Site type', values: SITE_ROLES, valueLabels: SITE_TYPE_WORDS }],
  services: [],
  groups: [],
  carriages: [{ name: 'service', label: 'Service' }],
  feeds: [
    { name: 'medium', label: 'Medium', values: MEDIA },
    { name: 'role', label: 'Main or reserve', values: FEED_ROLES, valueLabels: FEED_ROLE_WORDS },
    { name: 'service', label: 'Service' },
  ],
};

/** Filters the list accepts from a link but does not offer as controls (a site's feeds, a group's members). */
export const LINK_FILTERS: Record<EntityKind, readonly string[]> = {
  sites: ['group'],
  services: [],
  groups: [],
  carriages: ['site'],
  feeds: ['fromSite', 'toSite', 'group'],
};

/** The placeholder of a list's search box: what the server searches in. */
export const SEARCH_HINT: Record<EntityKind, string> = {
  sites: 'Code or name',
  services: 'Code or name',
  groups: 'Code or name',
  carriages: 'Carriage, site or service code',
  feeds: 'Feed, carriage, site or service code',
};

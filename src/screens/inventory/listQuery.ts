/**
 * A list's state (search text, sort, page, filters) lives in the page's
 * query string, so a filtered list can be shared and the back button
 * restores it. These functions turn route params into that state, the state
 * into the API path (GET /api/<kind>, server/routes/inventory.ts) and back
 * into route params. Values the server would refuse (an unknown sort, a
 * filter value outside its list) are dropped here rather than sent.
 */
import { formatCount } from '@/shared/format';
import type { Href } from 'expo-router';
import { api } from '@/shared/api';
import type { EntityKind } from '@/shared/schemas/network';
import { FILTERS, LINK_FILTERS, SORTS } from './kinds';

export const LIST_PAGE_SIZE = 25;

export interface ListState {
  q: string;
  page: number;
  sort: string;
  order: 'asc' | 'desc';
  /** filter name -> value; only names the kind knows */
  filters: Record<string, string>;
}

export type RouteParams = Record<string, string | string[] | undefined>;

const first = (v: string | string[] | undefined): string | undefined => (Array.isArray(v) ? v[0] : v);

/** Filter names a kind's list accepts (controls and link-only ones). */
export function filterNames(kind: EntityKind): string[] {
  return [...FILTERS[kind].map((f) => f.name), ...LINK_FILTERS[kind]];
}

export function defaultListState(): ListState {
  return { q: '', page: 1, sort: 'code', order: 'asc', filters: {} };
}

export function listStateFromParams(kind: EntityKind, params: RouteParams): ListState {
  const state = defaultListState();
  state.q = (first(params.q) ?? '').slice(0, 200);
  const page = Number(first(params.page));
  if (Number.isInteger(page) && page >= 1) state.page = page;
  const sort = first(params.sort);
  if (sort && SORTS[kind].some((s) => s.value === sort)) state.sort = sort;
  if (first(params.order) === 'desc') state.order = 'desc';
  for (const name of filterNames(kind)) {
    const value = first(params[name])?.trim();
    if (!value) continue;
    const spec = FILTERS[kind].find((f) => f.name === name);
    if (spec?.values && !spec.values.includes(value)) continue;
    state.filters[name] = value.slice(0, 64);
  }
  return state;
}

function queryString(pairs: Array<[string, string]>): string {
  return pairs.map(([k, v]) => `${encodeURIComponent(k)}=${encodeURIComponent(v)}`).join('&');
}

/** The API path of one page of the list; filters in a fixed order so equal states share an SWR key. */
export function listApiPath(kind: EntityKind, state: ListState, pageSize = LIST_PAGE_SIZE): string {
  const pairs: Array<[string, string]> = [
    ['page', String(state.page)],
    ['pageSize', String(pageSize)],
    ['sort', state.sort],
    ['order', state.order],
  ];
  const q = state.q.trim();
  if (q) pairs.push(['q', q]);
  for (const name of filterNames(kind)) {
    const value = state.filters[name];
    if (value) pairs.push([name, value]);
  }
  return `${api.list(kind)}?${queryString(pairs)}`;
}

/**
 * Route params for a state: every known key is present, set to undefined
 * when it has its default, so expo-router's setParams removes it from the URL.
 */
export function routeParamsFor(kind: EntityKind, state: ListState): Record<string, string | undefined> {
  const defaults = defaultListState();
  const out: Record<string, string | undefined> = {
    q: state.q.trim() || undefined,
    page: state.page !== defaults.page ? String(state.page) : undefined,
    sort: state.sort !== defaults.sort ? state.sort : undefined,
    order: state.order !== defaults.order ? state.order : undefined,
  };
  for (const name of filterNames(kind)) out[name] = state.filters[name] || undefined;
  return out;
}

/** A link to a list already filtered, e.g. a site's feeds: `/feeds?toSite=S1`. */
export function filteredListHref(kind: EntityKind, filters: Record<string, string>): Href {
  const known = filterNames(kind);
  const unknown = Object.keys(filters).filter((k) => !known.includes(k));
  if (unknown.length) throw new Error(`filteredListHref: ${kind} lists accept the filters ${known.join(', ')}; got ${unknown.join(', ')}`);
  const pairs = Object.entries(filters).filter(([, v]) => v);
  return pairs.length ? `/${kind}?${queryString(pairs)}` : `/${kind}`;
}

/** Page count for a total (at least 1, so "page 1 of 1" reads right for an empty list). */
export function pageCount(total: number, pageSize: number): number {
  if (!Number.isFinite(total) || total < 0) throw new RangeError(`pageCount: total must be >= 0, got ${total}`);
  if (!Number.isInteger(pageSize) || pageSize < 1) throw new RangeError(`pageCount: pageSize must be a whole number >= 1, got ${pageSize}`);
  return Math.max(1, Math.ceil(total / pageSize));
}

/** "26-50 of 312" */
export function rangeText(page: number, pageSize: number, total: number): string {
  if (total === 0) return '0 of 0';
  const from = Math.min((page - 1) * pageSize + 1, total);
  const to = Math.min(page * pageSize, total);
  return `${formatCount(from)}-${formatCount(to)} of ${formatCount(total)}`;
}

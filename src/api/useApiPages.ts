import { useCallback, useMemo } from 'react';
import useSWRInfinite from 'swr/infinite';
import type { ZodType } from 'zod';
import { useSend } from './ApiProvider';
import { parseAnswer, type ApiError } from './client';
import { freshness, type FreshnessTier } from './freshness';

/** Pages of a list that answers `?limit&offset` with `total` (shared/schemas/paging.ts). */
export interface PagedAnswer {
  total?: number;
  offset?: number;
}

/** The address of page `index` of `pageSize` rows, or null once the previous page was the last (or to wait). */
export function pageKey<A extends PagedAnswer>(path: string | null, pageSize: number, index: number, previous: A | null, rowsOf: (a: A) => readonly unknown[]): string | null {
  if (!path) return null;
  if (previous && (rowsOf(previous).length < pageSize || (previous.offset ?? 0) + pageSize >= (previous.total ?? 0))) return null;
  return `${path}${path.includes('?') ? '&' : '?'}limit=${pageSize}&offset=${index * pageSize}`;
}

export interface ApiPages<A, R> {
  /** the first page's answer (counts and totals), undefined until it arrives */
  first: A | undefined;
  /** the rows of every page received, in order */
  rows: R[];
  total: number;
  /** more rows wait on the server */
  more: boolean;
  loadingMore: boolean;
  /** asks for the next page (nothing while one is on its way or when none is left) */
  loadMore: () => void;
  error: ApiError | undefined;
  retry: () => void;
}

/** A list asked for with a body (POST), such as the pages of a fault reach: `key` tells bodies apart in the cache. */
export interface PostedQuery {
  body: unknown;
  key: string;
}

/**
 * A long server-paged list read page after page as the person scrolls: the
 * building block for lists that can hold thousands of rows (failing checks,
 * a level of a chain). `path` is the list's address with its filters (null
 * waits); every page is checked against `schema`. All loaded pages revalidate
 * together, so rows from two network versions are never shown side by side.
 */
export function useApiPages<A extends PagedAnswer, R>(path: string | null, schema: ZodType<A>, rowsOf: (a: A) => readonly R[], pageSize: number, tier: FreshnessTier, post?: PostedQuery): ApiPages<A, R> {
  const send = useSend();
  const { data, error, size, setSize, isValidating, mutate } = useSWRInfinite<A, ApiError>(
    (index, previous: A | null) => {
      const key = pageKey(path, pageSize, index, previous, rowsOf);
      return key && post ? [key, post.key] : key;
    },
    async (key: string | [string, string]) => {
      const url = typeof key === 'string' ? key : key[0];
      return parseAnswer(schema, url, await send(url, post ? { method: 'POST', body: post.body } : undefined));
    },
    { ...freshness[tier], revalidateAll: true, revalidateFirstPage: true },
  );
  const rows = useMemo(() => (data ?? []).flatMap((p) => rowsOf(p) as R[]), [data, rowsOf]);
  const first = data?.[0];
  const total = first?.total ?? rows.length;
  const loadingMore = size > 0 && isValidating && (data?.length ?? 0) < size;
  const more = rows.length < total;
  const loadMore = useCallback(() => {
    if (more && !loadingMore) void setSize((s) => s + 1);
  }, [more, loadingMore, setSize]);
  const retry = useCallback(() => void mutate(), [mutate]);
  return { first, rows, total, more, loadingMore, loadMore, error, retry };
}

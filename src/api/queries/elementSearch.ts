/**
 * Finds elements (sites, feeds, shared-risk groups) whose code or name holds
 * some text, for marking them failed: the three list endpoints asked at once
 * (GET /api/sites|feeds|groups?q=...&pageSize=N), answers merged in that order.
 */
import useSWR from 'swr';
import { api } from '@/shared/api';
import type { Element } from '@/shared/schemas/analysis';
import { useSend } from '../ApiProvider';
import { parseAnswer, type ApiError } from '../client';
import { freshness } from '../freshness';
import { codeNamePageSchema, type CodeNamePage } from '../schemas';

export interface ElementHit extends Element {
  /** A site's or group's name; for a feed, "from -> to". */
  label: string;
}

export interface ElementSearchResult {
  hits: ElementHit[];
  /** How many matched per kind, beyond those shown. */
  totals: Record<Element['kind'], number>;
}

const KINDS = [
  { kind: 'site', list: 'sites' },
  { kind: 'feed', list: 'feeds' },
  { kind: 'group', list: 'groups' },
] as const;

export const elementSearchKey = (q: string, pageSize: number) => ['element-search', api.list('sites'), q, pageSize] as const;

export const searchPath = (list: string, q: string, pageSize: number) =>
  `${api.list(list)}?q=${encodeURIComponent(q)}&pageSize=${pageSize}`;

function hitsOf(kind: Element['kind'], page: CodeNamePage): ElementHit[] {
  return page.items.map((item) => ({
    kind,
    code: item.code,
    label: item.name ?? (item.from && item.to ? `${item.from} → ${item.to}` : ''),
  }));
}

/** Waits for at least one non-blank character; `q` is trimmed. */
export function useElementSearch(q: string, pageSize = 6) {
  const send = useSend();
  const text = q.trim();
  return useSWR<ElementSearchResult, ApiError>(
    text ? elementSearchKey(text, pageSize) : null,
    async () => {
      const pages = await Promise.all(
        KINDS.map(async ({ list }) => {
          const path = searchPath(list, text, pageSize);
          return parseAnswer(codeNamePageSchema, path, await send(path));
        }),
      );
      return {
        hits: KINDS.flatMap(({ kind }, i) => hitsOf(kind, pages[i])),
        totals: { site: pages[0].total, carriage: 0, feed: pages[1].total, group: pages[2].total },
      };
    },
    { ...freshness.network, keepPreviousData: true },
  );
}

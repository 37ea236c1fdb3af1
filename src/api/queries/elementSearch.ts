/**
 * Finds elements (sites, carriages, feeds, shared-risk groups) whose code or
 * name holds some text, for marking them failed: the three list endpoints
 * (GET /api/sites|feeds|groups?q=...&pageSize=N) and the carriage search
 * (GET /api/analysis/carriage-search, by code or by site and service words
 * together) asked at once, answers merged site, carriage, feed, group.
 */
import { localElementSearch } from '@/src/offline/localSearch';
import { useCopyFallback } from '@/src/offline/useCopyFallback';
import { api } from '@/shared/api';
import type { Element } from '@/shared/schemas/analysis';
import { useSend } from '../ApiProvider';
import { parseAnswer } from '../client';
import { freshness } from '../freshness';
import { carriageSearchSchema, codeNamePageSchema, type CodeNamePage } from '../schemas';
import { carriageHits, type ElementHit, type ElementSearchResult } from './elementHits';

export type { ElementHit, ElementSearchResult } from './elementHits';

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
  // With no connection the stored copy of the network answers instead (src/offline).
  return useCopyFallback<ElementSearchResult>(
    text ? elementSearchKey(text, pageSize) : null,
    async () => {
      const carriagePath = api.carriageSearch(text, pageSize);
      const [pages, carriages] = await Promise.all([
        Promise.all(
          KINDS.map(async ({ list }) => {
            const path = searchPath(list, text, pageSize);
            return parseAnswer(codeNamePageSchema, path, await send(path));
          }),
        ),
        send(carriagePath).then((r) => parseAnswer(carriageSearchSchema, carriagePath, r)),
      ]);
      const [sites, ...others] = KINDS.map(({ kind }, i) => hitsOf(kind, pages[i]));
      return {
        hits: [...sites, ...carriageHits(carriages), ...others.flat()],
        totals: { site: pages[0].total, carriage: carriages.total, feed: pages[1].total, group: pages[2].total },
      };
    },
    (copy) => localElementSearch(copy, text, pageSize),
    { ...freshness.network, keepPreviousData: true },
  );
}

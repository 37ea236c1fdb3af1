/**
 * The analysis answers (docs/api.md): fault reach for a failure
 * set, exposure ranking, diversity gaps, unfed carriages and a carriage's
 * chain. All are computed by the server from its in-memory graphs and change
 * only with the network version, except reach, which a fault desk watches.
 */
import { useMemo } from 'react';
import { api } from '@/shared/api';
import type { Element } from '@/shared/schemas/analysis';
import { useSend, useSendRaw } from '../ApiProvider';
import { askReach, takeReachAhead } from './reachAhead';
import { parseAnswer } from '../client';
import { localReach } from '@/src/offline/localEngine';
import { useCopyFallback } from '@/src/offline/useCopyFallback';
import { freshness } from '../freshness';
import { briefReachAnswerSchema, chainAnswerSchema, chainLevelsAnswerSchema, chainPageAnswerSchema, type ChainPageReply, diversityAnswerSchema, exposureAnswerSchema, exposureGroupsAnswerSchema, reachAnswerSchema, reachCarriagesPageSchema, type ReachCarriagesReply, reachSitesPageSchema, type ReachSitesReply, unfedAnswerSchema } from '../schemas';
import { attachmentName, type DownloadedFile } from './network';
import type { z } from 'zod';

type DiversityReply = z.infer<typeof diversityAnswerSchema>;
import { useApiPages } from '../useApiPages';
import { useApiQuery } from '../useApiQuery';

export type ReachResult = z.infer<typeof reachAnswerSchema>;

export const analysisKeys = {
  /** The failure set in canonical form (see src/screens/reach/failSet.ts) keys the answer. */
  reach: (failSet: string) => [api.reach, failSet] as const,
  exposure: (limit?: number) => api.exposure(limit),
  /** The ranking with its elements' names (?with=names), for screens that label them without loading the whole network. */
  namedExposure: (limit?: number) => `${api.exposure(limit)}${limit ? '&' : '?'}with=names`,
  diversity: () => api.diversity,
  unfed: () => api.unfed,
  chain: (code: string, direction: 'up' | 'down') => api.chain(code, direction),
  chainLevels: (code: string, direction: 'up' | 'down') => `${api.chain(code, direction)}&view=levels`,
  /** without its page: useApiPages adds limit and offset */
  chainLevel: (code: string, direction: 'up' | 'down', depth: number) => `${api.chain(code, direction)}&level=${depth}`,
};

/** A reach answer; `offlineCopy` is set when it was computed in the browser from the offline copy (src/offline). */
export type ReachShown = ReachResult & { offlineCopy?: { fetchedAt: string } };

/**
 * POST /api/analysis/reach for `failed` (nothing is asked for an empty set).
 * `failSet` is the canonical text of the same set, so equal sets share one answer.
 * With no connection (the browser says so, or the server cannot be reached)
 * and an offline copy stored, the same engine answers in the browser.
 */
export function useReach(failed: readonly Element[], failSet: string) {
  const send = useSend();
  return useCopyFallback<ReachShown>(
    failed.length === 0 ? null : analysisKeys.reach(failSet),
    // with=sites: names and households of the sites listed, without loading the whole network.
    async () => parseAnswer(reachAnswerSchema, api.reach, await (takeReachAhead(failSet) ?? askReach(send, failed))),
    async (copy) => ({ ...(await localReach(copy, failed)), offlineCopy: { fetchedAt: copy.fetchedAt } }),
    { ...freshness.incident, keepPreviousData: true },
  );
}

/** Rows of each long list in the reach screen's first answer ("Show all" pages the rest). */
export const REACH_FIRST = 20;
/** Rows per page of a reach list as it scrolls. */
export const REACH_PAGE = 100;

/** The reach screen's answer: full when worked out from the offline copy, brief (first rows and `counts`) from the server. */
export type BriefReachShown = ReachShown & { counts?: { sites: number; lost: number; fallback: number } };

/**
 * Like useReach, but the server sends the counts and only the first
 * REACH_FIRST rows of each long list (?first=): at 20,000 sites one fault
 * lists thousands of sites, too much for a phone to parse before drawing.
 */
export function useBriefReach(failed: readonly Element[], failSet: string) {
  const send = useSend();
  return useCopyFallback<BriefReachShown>(
    failed.length === 0 ? null : [...analysisKeys.reach(failSet), 'brief'],
    async () => parseAnswer(briefReachAnswerSchema, api.reach, await send(`${api.reach}?with=sites&first=${REACH_FIRST}`, { method: 'POST', body: { failed } })),
    async (copy) => ({ ...(await localReach(copy, failed)), offlineCopy: { fetchedAt: copy.fetchedAt } }),
    { ...freshness.incident, keepPreviousData: true },
  );
}

const reachSiteRows = (a: ReachSitesReply) => a.sites;
const reachCarriageRows = (a: ReachCarriagesReply) => a.carriages;

/** The sites a failure set touches, in the fault desk's order, a page at a time (`enabled` false waits). */
export function useReachSitePages(failed: readonly Element[], failSet: string, enabled: boolean) {
  return useApiPages(enabled ? api.reachSites : null, reachSitesPageSchema, reachSiteRows, REACH_PAGE, 'incident', { body: { failed }, key: failSet });
}

/** The carriages a failure set takes off air or onto a reserve, a page at a time (`enabled` false waits). */
export function useReachCarriagePages(failed: readonly Element[], failSet: string, state: 'lost' | 'fallback', enabled: boolean) {
  return useApiPages(enabled ? api.reachCarriages(state) : null, reachCarriagesPageSchema, reachCarriageRows, REACH_PAGE, 'incident', { body: { failed }, key: failSet });
}

export function useExposure(limit?: number) {
  return useApiQuery(analysisKeys.exposure(limit), exposureAnswerSchema, 'network');
}

/** The exposure ranking with elements that take off the same carriages in one row; kinds comma-separated. */
export function useExposureGroups(limit: number, kinds: string) {
  return useApiQuery(api.exposureGroups({ limit, kinds }), exposureGroupsAnswerSchema, 'network');
}

/** A list of the analysis API as a CSV file, through the same client as every download (token, errors, 401). */
export function useCsvDownload() {
  const sendRaw = useSendRaw();
  return useMemo(
    () =>
      async (path: string, fallbackName: string): Promise<DownloadedFile> => {
        const res = await sendRaw(path, { accept: 'text/csv' });
        return { name: attachmentName(res.headers.get('Content-Disposition'), fallbackName), blob: await res.blob() };
      },
    [sendRaw],
  );
}

export function useNamedExposure(limit?: number) {
  return useApiQuery(analysisKeys.namedExposure(limit), exposureAnswerSchema, 'network');
}

/**
 * Diversity gaps: the first `limit` (with the total), or all of them when
 * `limit` is undefined; `enabled` false waits. A 20,000-site network has
 * thousands (3 MB), so screens ask for the whole list only when shown.
 */
export function useDiversity(limit?: number, enabled = true) {
  return useApiQuery(enabled ? `${analysisKeys.diversity()}${limit ? `?limit=${limit}` : ''}` : null, diversityAnswerSchema, 'network');
}

const gapRows = (a: DiversityReply) => a.carriages;

/** Diversity gaps a page at a time (REACH_PAGE rows) as their list scrolls; `enabled` false waits. */
export function useDiversityPages(enabled: boolean) {
  return useApiPages(enabled ? analysisKeys.diversity() : null, diversityAnswerSchema, gapRows, REACH_PAGE, 'network');
}

/** Unfed carriages: all of them, or the first `limit` with the total (a summary card). */
export function useUnfed(limit?: number) {
  return useApiQuery(`${analysisKeys.unfed()}${limit ? `?limit=${limit}` : ''}`, unfedAnswerSchema, 'network');
}

export function useChain(code: string | null, direction: 'up' | 'down') {
  return useApiQuery(code ? analysisKeys.chain(code, direction) : null, chainAnswerSchema, 'network');
}

/** The chain folded by hop: the count at each hop, and the whole tree only when it is small (null code waits). */
export function useChainLevels(code: string | null, direction: 'up' | 'down') {
  return useApiQuery(code ? analysisKeys.chainLevels(code, direction) : null, chainLevelsAnswerSchema, 'network');
}

/** Carriages per page of one hop; a phone shows six or seven at once. */
export const CHAIN_PAGE = 100;
const chainRowsOf = (a: ChainPageReply) => a.rows;

/** The carriages `depth` hops away, a page at a time as their list scrolls (null depth waits). */
export function useChainLevelRows(code: string, direction: 'up' | 'down', depth: number | null) {
  return useApiPages(depth === null ? null : analysisKeys.chainLevel(code, direction, depth), chainPageAnswerSchema, chainRowsOf, CHAIN_PAGE, 'network');
}

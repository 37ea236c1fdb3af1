/**
 * The analysis answers (docs/api.md): fault reach for a failure
 * set, exposure ranking, diversity gaps, unfed carriages and a carriage's
 * chain. All are computed by the server from its in-memory graphs and change
 * only with the network version, except reach, which a fault desk watches.
 */
import useSWR from 'swr';
import { api } from '@/shared/api';
import type { Element } from '@/shared/schemas/analysis';
import { useSend } from '../ApiProvider';
import { parseAnswer, type ApiError } from '../client';
import { freshness } from '../freshness';
import { chainAnswerSchema, diversityAnswerSchema, exposureAnswerSchema, reachAnswerSchema, unfedAnswerSchema } from '../schemas';
import type { z } from 'zod';
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
};

/**
 * POST /api/analysis/reach for `failed` (nothing is asked for an empty set).
 * `failSet` is the canonical text of the same set, so equal sets share one answer.
 */
export function useReach(failed: readonly Element[], failSet: string) {
  const send = useSend();
  return useSWR<ReachResult, ApiError>(
    failed.length > 0 ? analysisKeys.reach(failSet) : null,
    // with=sites: names and households of the sites listed, without loading the whole network.
    async () => parseAnswer(reachAnswerSchema, api.reach, await send(`${api.reach}?with=sites`, { method: 'POST', body: { failed } })),
    { ...freshness.incident, keepPreviousData: true },
  );
}

export function useExposure(limit?: number) {
  return useApiQuery(analysisKeys.exposure(limit), exposureAnswerSchema, 'network');
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

export function useUnfed() {
  return useApiQuery(analysisKeys.unfed(), unfedAnswerSchema, 'network');
}

export function useChain(code: string | null, direction: 'up' | 'down') {
  return useApiQuery(code ? analysisKeys.chain(code, direction) : null, chainAnswerSchema, 'network');
}

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
import { chainAnswerSchema, diversityAnswerSchema, exposureAnswerSchema, exposureGroupsAnswerSchema, reachAnswerSchema, unfedAnswerSchema } from '../schemas';
import { useMemo } from 'react';
import { useSession } from '@/src/session/SessionProvider';
import { ApiError as ClientError } from '../client';
import { attachmentName, type DownloadedFile } from './network';
import type { z } from 'zod';
import { useApiQuery } from '../useApiQuery';

export type ReachResult = z.infer<typeof reachAnswerSchema>;

export const analysisKeys = {
  /** The failure set in canonical form (see src/screens/reach/failSet.ts) keys the answer. */
  reach: (failSet: string) => [api.reach, failSet] as const,
  exposure: (limit?: number) => api.exposure(limit),
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
    async () => parseAnswer(reachAnswerSchema, api.reach, await send(api.reach, { method: 'POST', body: { failed } })),
    { ...freshness.incident, keepPreviousData: true },
  );
}

export function useExposure(limit?: number) {
  return useApiQuery(analysisKeys.exposure(limit), exposureAnswerSchema, 'network');
}

/** The exposure ranking with elements that take off the same carriages in one row; kinds comma-separated. */
export function useExposureGroups(limit: number, kinds: string) {
  return useApiQuery(api.exposureGroups({ limit, kinds }), exposureGroupsAnswerSchema, 'network');
}

/** A list of the analysis API as a CSV file (the bearer token rides along, so a plain link would not do). */
export function useCsvDownload() {
  const { tokenRef } = useSession();
  return useMemo(
    () =>
      async (path: string, fallbackName: string): Promise<DownloadedFile> => {
        const token = tokenRef.current;
        let res: Response;
        try {
          res = await fetch(path, { headers: { Accept: 'text/csv', ...(token ? { Authorization: `Bearer ${token}` } : {}) } });
        } catch {
          throw new ClientError(0, 'network', 'Could not reach the Headwater server. Check the connection and try again.');
        }
        if (!res.ok) throw new ClientError(res.status, `http_${res.status}`, `The server answered ${res.status}.`);
        return { name: attachmentName(res.headers.get('Content-Disposition'), fallbackName), blob: await res.blob() };
      },
    [tokenRef],
  );
}

export function useDiversity() {
  return useApiQuery(analysisKeys.diversity(), diversityAnswerSchema, 'network');
}

export function useUnfed() {
  return useApiQuery(analysisKeys.unfed(), unfedAnswerSchema, 'network');
}

export function useChain(code: string | null, direction: 'up' | 'down') {
  return useApiQuery(code ? analysisKeys.chain(code, direction) : null, chainAnswerSchema, 'network');
}

import { useMemo } from 'react';
import useSWR, { useSWRConfig, type SWRResponse } from 'swr';
import type { ZodType } from 'zod';
import { useSend } from './ApiProvider';
import { parseAnswer, type ApiError } from './client';
import { freshness, type FreshnessTier } from './freshness';

/**
 * The building block of every per-resource hook in ./queries: a GET of `key`
 * (an API path from shared/api.ts, or null to wait), checked against `schema`,
 * kept fresh by the tier's timings.
 */
export function useApiQuery<T>(key: string | null, schema: ZodType<T>, tier: FreshnessTier): SWRResponse<T, ApiError> {
  const send = useSend();
  return useSWR<T, ApiError>(key, async (path: string) => parseAnswer(schema, path, await send(path)), freshness[tier]);
}

/**
 * The writing side for resources whose writes answer with one record (planned
 * works, incidents): send, check the answer against `schema`, then refresh
 * every cached read that `stale` picks, so lists and timelines follow.
 */
export function useRecordWrites<T>(schema: ZodType<T>, stale: (key: unknown) => boolean) {
  const send = useSend();
  const { mutate } = useSWRConfig();
  return useMemo(
    () => ({
      write: async (path: string, method: 'POST' | 'PATCH', body: unknown): Promise<T> => {
        const answer = parseAnswer(schema, path, await send(path, { method, body }));
        await mutate(stale);
        return answer;
      },
      remove: async (path: string): Promise<void> => {
        await send(path, { method: 'DELETE' });
        await mutate(stale);
      },
    }),
    [send, mutate, schema, stale],
  );
}

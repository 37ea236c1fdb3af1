import useSWR, { type SWRResponse } from 'swr';
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

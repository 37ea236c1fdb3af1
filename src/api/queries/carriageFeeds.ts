/**
 * One carriage with its site, service and feeds (GET /api/carriages/:code),
 * as the chain screen reads it. Keyed apart from the inventory's detail of
 * the same path, which is parsed into a fuller shape: SWR shares one cache
 * entry per key, so two shapes under one key would overwrite each other.
 */
import useSWR from 'swr';
import { api } from '@/shared/api';
import { useSend } from '../ApiProvider';
import { parseAnswer, type ApiError } from '../client';
import { freshness } from '../freshness';
import { carriageFeedsSchema, type CarriageFeeds } from '../schemas';

export const carriageFeedsKey = (code: string) => ['carriage-feeds', api.entity('carriages', code)] as const;

export function useCarriageFeeds(code: string | null) {
  const send = useSend();
  return useSWR<CarriageFeeds, ApiError>(
    code ? carriageFeedsKey(code) : null,
    async ([, path]: readonly [string, string]) => parseAnswer(carriageFeedsSchema, path, await send(path)),
    freshness.network,
  );
}

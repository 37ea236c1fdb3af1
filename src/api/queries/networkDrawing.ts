/**
 * The whole network as the diagram and the resilience names need it
 * (GET /api/network/export): sites with positions, services, groups,
 * carriages and feeds. Keyed apart from any other reader of the export
 * path, since this parse keeps only the fields drawn (one cache entry per key).
 */
import useSWR from 'swr';
import { api } from '@/shared/api';
import { useSend } from '../ApiProvider';
import { parseAnswer, type ApiError } from '../client';
import { freshness } from '../freshness';
import { networkDrawingSchema, type NetworkDrawing } from '../schemas';

export const networkDrawingKey = () => ['network-drawing', api.exportNetwork] as const;

export function useNetworkDrawing(enabled = true) {
  const send = useSend();
  return useSWR<NetworkDrawing, ApiError>(
    enabled ? networkDrawingKey() : null,
    async ([, path]: readonly [string, string]) => parseAnswer(networkDrawingSchema, path, await send(path)),
    freshness.network,
  );
}

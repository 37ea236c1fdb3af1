/**
 * The whole network as the resilience names need it (GET /api/network/export):
 * sites with positions, services, groups, carriages and feeds. Keyed apart
 * from any other reader of the export path, since this parse keeps only the
 * fields drawn (one cache entry per key).
 *
 * The network diagram reads the same rows from the diagram's own columns
 * (GET /api/network/drawing, shared/schemas/drawing.ts, `useDiagramDrawing`):
 * a fraction of the export's bytes and parse time before its first frame.
 */
import { useState } from 'react';
import useSWR from 'swr';
import { api } from '@/shared/api';
import { useSend } from '../ApiProvider';
import { useSession } from '@/src/session/SessionProvider';
import { ApiError, parseAnswer } from '../client';
import { freshness } from '../freshness';
import { networkDrawingSchema, type NetworkDrawing } from '../schemas';
import type { DrawingDocument } from '@/shared/schemas/drawing';
import { peekEarlyDrawing, readDrawing, takeEarlyDrawing } from './drawingEarly';

export const networkDrawingKey = () => ['network-drawing', api.exportNetwork] as const;

export function useNetworkDrawing(enabled = true) {
  const send = useSend();
  return useSWR<NetworkDrawing, ApiError>(
    enabled ? networkDrawingKey() : null,
    async ([, path]: readonly [string, string]) => parseAnswer(networkDrawingSchema, path, await send(path)),
    freshness.network,
  );
}

export const diagramDrawingKey = () => ['network-diagram', api.networkDrawing] as const;

/**
 * The diagram's columns, checked (checkDrawing) so the diagram's model can
 * follow every position in them without a check of its own; the rows are
 * made only where they are needed (the schematic: expandDrawing). Taken from
 * the request sent as the page opened, already checked, when there is one
 * (./drawingEarly.ts).
 */
export function useDiagramDrawing() {
  const send = useSend();
  const { tokenRef } = useSession();
  // The early answer, when it is in already, is the first render's data: the same object the fetcher
  // then takes, so SWR finds nothing new. Read once, so the data stays while the fetcher runs.
  const [early] = useState(() => peekEarlyDrawing(tokenRef.current));
  return useSWR<DrawingDocument, ApiError>(
    diagramDrawingKey(),
    async ([, path]: readonly [string, string]) => {
      const taken = await takeEarlyDrawing(tokenRef.current);
      return taken ?? readDrawing(path, await send(path));
    },
    early ? { ...freshness.network, fallbackData: early } : freshness.network,
  );
}

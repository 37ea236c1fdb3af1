/**
 * What record pages and forms ask besides the record (server/routes/recordTools.ts):
 * the delete preview (what it would take off air), a record's own change
 * history (engineers and admins), and the carriages a feed could come from,
 * nearest first. Answers as in shared/schemas/editing.ts.
 */
import { z } from 'zod';
import { api } from '@/shared/api';
import type { DeleteImpact, HistoryAnswer, SourcesAnswer } from '@/shared/schemas/editing';
import type { EntityKind } from '@/shared/schemas/network';
import { useApiQuery } from '../useApiQuery';

const impactSchema: z.ZodType<DeleteImpact> = z.object({
  networkVersion: z.number(),
  kind: z.string(),
  code: z.string(),
  offAir: z.object({ carriages: z.number(), households: z.number(), sites: z.number(), shown: z.array(z.string()) }),
  fallback: z.object({ carriages: z.number() }),
  byService: z.array(z.object({ service: z.string(), lost: z.number() })),
  basis: z.string(),
});

const historySchema: z.ZodType<HistoryAnswer> = z.object({
  items: z.array(
    z.object({
      id: z.number(),
      at: z.string(),
      userEmail: z.string().nullable(),
      action: z.string(),
      networkVersion: z.number().nullable(),
      changes: z.array(z.object({ field: z.string(), before: z.unknown().optional(), after: z.unknown().optional() })),
    }),
  ),
  total: z.number(),
  page: z.number(),
  pageSize: z.number(),
});

const sourcesSchema: z.ZodType<SourcesAnswer> = z.object({
  networkVersion: z.number(),
  carriage: z.string(),
  site: z.string(),
  service: z.string(),
  items: z.array(z.object({ carriage: z.string(), site: z.string(), siteName: z.string(), distanceKm: z.number(), bearingDeg: z.number() })),
  total: z.number(),
});

/** What deleting the record would take off air; null waits (asked only once someone starts a delete). */
export function useDeleteImpact(kind: EntityKind, code: string | null) {
  return useApiQuery(code ? api.deleteImpact(kind, code) : null, impactSchema, 'network');
}

/** One page of a record's own history, newest first; null waits (people who cannot edit never ask). */
export function useRecordHistory(kind: EntityKind, code: string | null, page: number) {
  return useApiQuery(code ? api.history(kind, code, page) : null, historySchema, 'network');
}

/** Carriages of the same service that could feed `carriage`, nearest first; null waits. */
export function useSourceCarriages(carriage: string | null, q: string) {
  return useApiQuery(carriage ? api.sources(carriage, q.trim()) : null, sourcesSchema, 'network');
}

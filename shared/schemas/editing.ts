/**
 * What the record pages ask beyond the record itself (server/routes/recordTools.ts):
 * what deleting a record would take off air, a record's own change history,
 * and the source carriages a feed could come from, nearest first.
 */
import { z } from 'zod';

/** GET /api/<kind>/:code/impact */
export interface DeleteImpact {
  networkVersion: number;
  kind: string;
  code: string;
  /** carriages that would have no programme once the record and what depends on it are gone */
  offAir: { carriages: number; households: number; sites: number; shown: string[] };
  /** carriages that would keep programme only through a reserve feed, and do not today */
  fallback: { carriages: number };
  byService: { service: string; lost: number }[];
  /** how the figure was reached, in a sentence */
  basis: string;
}

export const historyQuerySchema = z.strictObject({
  page: z.coerce.number({ error: 'page must be a number' }).int('page is a whole number').min(1, 'page is at least 1').max(1_000_000).default(1),
  pageSize: z.coerce.number({ error: 'pageSize must be a number' }).int('pageSize is a whole number').min(1, 'pageSize is at least 1').max(100, 'pageSize is at most 100').default(20),
});

/** GET /api/<kind>/:code/history: the audit rows of one record, newest first. */
export interface HistoryAnswer {
  items: {
    id: number;
    at: string;
    userEmail: string | null;
    action: string;
    networkVersion: number | null;
    /** the fields that changed: before and after (absent = not set) */
    changes: { field: string; before?: unknown; after?: unknown }[];
  }[];
  total: number;
  page: number;
  pageSize: number;
}

export const MAX_SOURCES = 100;
export const sourcesQuerySchema = z.strictObject({
  q: z.string().max(200, 'q is at most 200 characters').optional(),
  limit: z.coerce.number({ error: 'limit must be a number' }).int('limit is a whole number').min(1, 'limit is at least 1').max(MAX_SOURCES, `limit is at most ${MAX_SOURCES}`).default(20),
});

/** GET /api/carriages/:code/sources: carriages of the same service that could feed it, nearest first. */
export interface SourcesAnswer {
  networkVersion: number;
  carriage: string;
  site: string;
  service: string;
  items: { carriage: string; site: string; siteName: string; distanceKm: number; bearingDeg: number }[];
  /** how many carriages matched before the limit */
  total: number;
}

/**
 * Paging of the long analysis and checks lists (`?limit=N&offset=M`). Without
 * `limit` a list answers whole, as it always has; every answer says `total`,
 * the length of the whole list, so a client can page and show counts.
 */
import { z } from 'zod';

/** The most rows one page may ask for. */
export const MAX_PAGE = 5000;

export const pageQueryShape = {
  limit: z.coerce
    .number({ error: 'limit must be a number' })
    .int('limit is a whole number')
    .min(1, 'limit is at least 1')
    .max(MAX_PAGE, `limit is at most ${MAX_PAGE}`)
    .optional(),
  offset: z.coerce.number({ error: 'offset must be a number' }).int('offset is a whole number').min(0, 'offset is at least 0').max(100_000_000, 'offset is too large').optional(),
};

export const pageQuerySchema = z.strictObject(pageQueryShape);
export type PageQuery = z.infer<typeof pageQuerySchema>;

export interface Paged {
  /** rows in the whole list */
  total: number;
  /** the first row of this page in the whole list (0 when not paged) */
  offset: number;
}

/** The page of `rows` a query asks for, with the total. */
export function pageRows<T>(rows: readonly T[], q: PageQuery): { rows: T[]; total: number; offset: number } {
  const offset = q.offset ?? 0;
  const end = q.limit === undefined ? rows.length : offset + q.limit;
  return { rows: rows.slice(offset, end), total: rows.length, offset };
}

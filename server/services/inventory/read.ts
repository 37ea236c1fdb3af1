/**
 * Reading the inventory: paged, sorted, searched and filtered lists, set-based
 * for speed (one record at a time is read through the models: records.ts). Answers are in the document shape plus version and last
 * change (shape.ts).
 */
import { z } from 'zod';
import type { Sequelize } from 'sequelize';
import type { EntityKind } from '@/shared/schemas/network';
import { QUERIES } from './queries';
import { storedEntity, type Fields } from './shape';

export const MAX_PAGE_SIZE = 200;
export const DEFAULT_PAGE_SIZE = 50;

export interface ListQuery {
  page: number;
  pageSize: number;
  sort: string;
  order: 'asc' | 'desc';
  q?: string;
  filters: Record<string, string>;
}

const positiveInt = (what: string, max?: number) => {
  let n = z.coerce.number({ error: `${what} must be a whole number` }).int(`${what} must be a whole number`).min(1, `${what} is at least 1`);
  if (max !== undefined) n = n.max(max, `${what} is at most ${max}`);
  return n;
};

/** The query string a list accepts for this kind; anything else is a 400 naming it. */
export function listQuerySchema(kind: EntityKind) {
  const spec = QUERIES[kind];
  const sorts = Object.keys(spec.sorts) as [string, ...string[]];
  const filterShape: Record<string, z.ZodType<string | undefined>> = {};
  for (const [name, filter] of Object.entries(spec.filters)) {
    filterShape[name] = filter.values
      ? z.enum(filter.values as [string, ...string[]], { error: `${name} is one of ${filter.values.join(', ')}` }).optional()
      : z.string({ error: `${name} is one code` }).min(1).max(64).optional();
  }
  return z
    .strictObject({
      page: positiveInt('page').default(1),
      pageSize: positiveInt('pageSize', MAX_PAGE_SIZE).default(DEFAULT_PAGE_SIZE),
      sort: z.enum(sorts, { error: `sort is one of ${sorts.join(', ')}` }).default('code'),
      order: z.enum(['asc', 'desc'], { error: 'order is asc or desc' }).default('asc'),
      q: z.string({ error: 'q is one search text' }).max(200).optional(),
      ...filterShape,
    })
    .transform(({ page, pageSize, sort, order, q, ...rest }): ListQuery => {
      const filters: Record<string, string> = {};
      for (const [k, v] of Object.entries(rest)) if (typeof v === 'string') filters[k] = v;
      return { page, pageSize, sort, order, q: q?.trim() || undefined, filters };
    });
}

const escapeLike = (text: string) => text.replace(/[\\%_]/g, (c) => `\\${c}`);

export async function listEntities(sequelize: Sequelize, kind: EntityKind, query: ListQuery) {
  const spec = QUERIES[kind];
  const where: string[] = [];
  const bind: unknown[] = [];
  const param = (value: unknown) => {
    bind.push(value);
    return `$${bind.length}`;
  };
  if (query.q) {
    const p = param(`%${escapeLike(query.q)}%`);
    where.push(`(${spec.search.map((expr) => `${expr} ILIKE ${p}`).join(' OR ')})`);
  }
  for (const [name, value] of Object.entries(query.filters)) {
    const filter = spec.filters[name];
    if (filter) where.push(filter.sql.replace('?', param(value)));
  }
  const filter = where.length ? ` WHERE ${where.join(' AND ')}` : '';
  const [countRows] = await sequelize.query(`SELECT count(*)::int AS n FROM ${spec.from}${filter}`, { bind });
  const direction = query.order === 'desc' ? 'DESC' : 'ASC';
  const order = `${spec.sorts[query.sort]} ${direction} NULLS LAST, e.code ASC`;
  const [rows] = await sequelize.query(
    `SELECT ${spec.columns} FROM ${spec.from}${filter} ORDER BY ${order} LIMIT ${param(query.pageSize)} OFFSET ${param((query.page - 1) * query.pageSize)}`,
    { bind },
  );
  return {
    items: (rows as Fields[]).map((r) => storedEntity(kind, r)),
    total: (countRows as { n: number }[])[0].n,
    page: query.page,
    pageSize: query.pageSize,
  };
}

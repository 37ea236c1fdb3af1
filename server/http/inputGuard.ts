/**
 * One check of every request's text before any handler sees it, so that no
 * route has to remember it: route parameters, the query string and the JSON
 * body may not hold text PostgreSQL cannot store (a NUL, a lone surrogate:
 * shared/text.ts), a `:code` parameter must be a valid code (not
 * `__proto__`, `constructor` or `prototype` either), and a body may not nest
 * deeper than any API body does. Each refusal is a 400 naming the field.
 * The walk is iterative, so a deeply nested body cannot exhaust the stack.
 */
import type { RequestHandler } from 'express';
import { codeSchema } from '@/shared/schemas/network';
import { clip } from '@/shared/clip';
import { isStorableText, RESERVED_KEYS, UNSTORABLE_TEXT_MESSAGE } from '@/shared/text';
import { badRequest } from './errors';

/** No API body nests deeper than a few levels; a network document is four. */
export const MAX_BODY_DEPTH = 32;

const pathOf = (parent: string, key: string | number) =>
  typeof key === 'number' ? `${parent}[${key}]` : parent === '' ? clip(key) : `${parent}.${clip(key)}`;

/** The first problem in a parsed value, as [field, message], or undefined. */
export function findUnsafeText(value: unknown, root: string, opts: { rejectReservedKeys?: boolean } = {}): [string, string] | undefined {
  const stack: Array<[unknown, string, number]> = [[value, root, 0]];
  while (stack.length > 0) {
    const [v, path, depth] = stack.pop()!;
    if (typeof v === 'string') {
      if (!isStorableText(v)) return [path || '(body)', UNSTORABLE_TEXT_MESSAGE];
      continue;
    }
    if (v === null || typeof v !== 'object') continue;
    if (depth >= MAX_BODY_DEPTH) return [path || '(body)', `nests deeper than ${MAX_BODY_DEPTH} levels`];
    if (Array.isArray(v)) {
      for (let i = v.length - 1; i >= 0; i--) stack.push([v[i], pathOf(path, i), depth + 1]);
      continue;
    }
    for (const key of Object.keys(v)) {
      const at = pathOf(path, key);
      if (!isStorableText(key)) return [at, `the field name ${UNSTORABLE_TEXT_MESSAGE}`];
      if (opts.rejectReservedKeys && RESERVED_KEYS.has(key)) return [at, 'is not a field name any request uses'];
      stack.push([(v as Record<string, unknown>)[key], at, depth + 1]);
    }
  }
  return undefined;
}

export const inputGuard: RequestHandler = (req, _res, next) => {
  for (const [name, value] of Object.entries(req.params ?? {})) {
    if (typeof value !== 'string') continue;
    if (!isStorableText(value)) return next(badRequest(`${name}: ${UNSTORABLE_TEXT_MESSAGE}`, [{ field: name, message: UNSTORABLE_TEXT_MESSAGE }]));
    if (name === 'code') {
      const r = codeSchema.safeParse(value);
      if (!r.success) {
        const message = r.error.issues[0].message;
        return next(badRequest(`code: ${message} (got "${clip(value)}")`, [{ field: 'code', message }]));
      }
    }
  }
  const checks: Array<[unknown, string]> = [[req.query, 'query']];
  if (req.body !== undefined) checks.push([req.body, '']);
  for (const [value, root] of checks) {
    const found = findUnsafeText(value, root, { rejectReservedKeys: true });
    if (found) {
      const [field, message] = found;
      return next(badRequest(`${field}: ${message}`, [{ field, message }]));
    }
  }
  next();
};

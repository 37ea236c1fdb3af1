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

/** A value still to look at: its field path is kept as a link to its parent and made into text only for a refusal. */
interface Pending {
  v: unknown;
  up: Pending | null;
  key: string | number;
  depth: number;
}

function pathText(p: Pending | null, root: string): string {
  const keys: Array<string | number> = [];
  for (let at = p; at !== null && at.up !== null; at = at.up) keys.push(at.key);
  let path = root;
  for (let i = keys.length - 1; i >= 0; i--) path = pathOf(path, keys[i]);
  return path;
}

/**
 * A walk over a parsed value looking for the first problem, in steps: a
 * national network's body is millions of values (seconds of work), so the
 * guard walks it a slice at a time and gives other requests their turn.
 * Paths are not built while walking, only for the value refused.
 */
export class UnsafeTextWalk {
  private readonly stack: Pending[];
  private found: [string, string] | undefined;

  constructor(
    value: unknown,
    private readonly root: string,
    private readonly opts: { rejectReservedKeys?: boolean } = {},
  ) {
    this.stack = [{ v: value, up: null, key: '', depth: 0 }];
  }

  private field(p: Pending): string {
    return pathText(p, this.root) || '(body)';
  }

  /** Walks until done or `deadlineMs` (performance.now()) has passed; true when done (`problem` then holds the answer). */
  step(deadlineMs: number): boolean {
    const { stack, opts } = this;
    let n = 0;
    while (stack.length > 0 && this.found === undefined) {
      if ((++n & 1023) === 0 && performance.now() >= deadlineMs) return false;
      const p = stack.pop()!;
      const v = p.v;
      if (typeof v === 'string') {
        if (!isStorableText(v)) this.found = [this.field(p), UNSTORABLE_TEXT_MESSAGE];
        continue;
      }
      if (v === null || typeof v !== 'object') continue;
      if (p.depth >= MAX_BODY_DEPTH) {
        this.found = [this.field(p), `nests deeper than ${MAX_BODY_DEPTH} levels`];
        continue;
      }
      const depth = p.depth + 1;
      if (Array.isArray(v)) {
        for (let i = v.length - 1; i >= 0; i--) {
          const item: unknown = v[i];
          // Numbers, booleans and null need no look.
          if (item === null || (typeof item !== 'object' && typeof item !== 'string')) continue;
          stack.push({ v: item, up: p, key: i, depth });
        }
        continue;
      }
      for (const key of Object.keys(v)) {
        const at: Pending = { v: (v as Record<string, unknown>)[key], up: p, key, depth };
        if (!isStorableText(key)) {
          this.found = [this.field(at), `the field name ${UNSTORABLE_TEXT_MESSAGE}`];
          break;
        }
        if (opts.rejectReservedKeys && RESERVED_KEYS.has(key)) {
          this.found = [this.field(at), 'is not a field name any request uses'];
          break;
        }
        if (at.v === null || (typeof at.v !== 'object' && typeof at.v !== 'string')) continue;
        stack.push(at);
      }
    }
    return true;
  }

  get problem(): [string, string] | undefined {
    return this.found;
  }
}

/** The first problem in a parsed value, as [field, message], or undefined (in one piece: for values of API size). */
export function findUnsafeText(value: unknown, root: string, opts: { rejectReservedKeys?: boolean } = {}): [string, string] | undefined {
  const walk = new UnsafeTextWalk(value, root, opts);
  walk.step(Number.POSITIVE_INFINITY);
  return walk.problem;
}

/** The longest slice of the body's walk before other requests get a turn, ms */
const GUARD_TURN_MS = 12;

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
  const query = findUnsafeText(req.query, 'query', { rejectReservedKeys: true });
  if (query) return next(badRequest(`${query[0]}: ${query[1]}`, [{ field: query[0], message: query[1] }]));
  if (req.body === undefined) return next();
  const walk = new UnsafeTextWalk(req.body, '', { rejectReservedKeys: true });
  const finish = () => {
    const found = walk.problem;
    if (!found) return next();
    const [field, message] = found;
    next(badRequest(`${field}: ${message}`, [{ field, message }]));
  };
  // A body of API size is walked at once; a network's worth of body in slices, other requests answered between them.
  if (walk.step(performance.now() + GUARD_TURN_MS)) return finish();
  const more = () => {
    if (walk.step(performance.now() + GUARD_TURN_MS)) finish();
    else setImmediate(more);
  };
  setImmediate(more);
};

/**
 * One error shape for every answer: { error: { code, message, details? } }.
 * Services throw ApiError; anything else is logged and answered as a 500
 * without internals. Client input never reaches that branch: parsers and
 * validators turn it into a 4xx first.
 */
import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError, type ZodType } from 'zod';
import { clip } from '@/shared/clip';
import { databaseRefusal, refusalError } from '../services/inventory/dbErrors';
import { databaseTrouble } from './databaseTrouble';

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
  }
}

export const badRequest = (message: string, details?: unknown) => new ApiError(400, 'bad-request', message, details);
export const notFound = (message: string, details?: unknown) => new ApiError(404, 'not-found', message, details);
export const conflict = (message: string, details?: unknown) => new ApiError(409, 'conflict', message, details);
export const unprocessable = (message: string, details?: unknown) => new ApiError(422, 'invalid', message, details);

/** Each issue's field and message; both cut short, as a field name may be a key someone sent. */
/** Each issue by field; an issue about the whole of it (an unknown key, say) is named by what was read: "(body)", "(query)". */
export function zodDetails(err: ZodError, what = 'body') {
  return err.issues.slice(0, 100).map((i) => ({ field: clip(i.path.map(String).join('.')) || `(${what})`, message: clip(i.message, 200) }));
}

/** A request body that is a JSON object; none, a list or a bare value is a 400 saying what to send (`expected`). */
export function objectBody(body: unknown, expected = 'a JSON object'): Record<string, unknown> {
  if (body === undefined || body === null || typeof body !== 'object' || Array.isArray(body)) throw badRequest(`body: send ${expected}`);
  return body as Record<string, unknown>;
}

/** Parse with a zod schema; a failure is a 400 naming each field. */
export function parseOr400<T>(schema: ZodType<T>, value: unknown, what = 'body'): T {
  const r = schema.safeParse(value);
  if (r.success) return r.data;
  const details = zodDetails(r.error, what);
  const first = details[0];
  throw badRequest(first.field === `(${what})` ? `${what}: ${first.message}` : `${what}: ${first.field}: ${first.message}`, details);
}

export const notFoundHandler: RequestHandler = (req, _res, next) => {
  next(new ApiError(404, 'no-such-route', `no such route: ${req.method} ${req.path}`));
};

export const errorHandler: ErrorRequestHandler = (err, _req, res, _next) => {
  if (err instanceof ApiError) {
    res.status(err.status).json({ error: { code: err.code, message: err.message, ...(err.details !== undefined ? { details: err.details } : {}) } });
    return;
  }
  if (err instanceof ZodError) {
    res.status(400).json({ error: { code: 'bad-request', message: 'the request is not valid', details: zodDetails(err) } });
    return;
  }
  // body-parser and multer errors carry a status and a type or code
  const status = typeof err?.status === 'number' ? err.status : typeof err?.statusCode === 'number' ? err.statusCode : 0;
  if (err?.type === 'entity.parse.failed') {
    res.status(400).json({ error: { code: 'malformed-json', message: 'the body is not valid JSON' } });
    return;
  }
  if (err?.type === 'entity.too.large' || err?.code === 'LIMIT_FILE_SIZE') {
    res.status(413).json({ error: { code: 'too-large', message: 'the body or file is larger than the server accepts' } });
    return;
  }
  if (typeof err?.code === 'string' && err.code.startsWith('LIMIT_')) {
    res.status(400).json({ error: { code: 'bad-upload', message: `upload refused: ${err.message}` } });
    return;
  }
  const trouble = databaseTrouble(err);
  if (trouble) {
    res.set('Retry-After', String(trouble.retryAfterS));
    res.status(trouble.status).json({ error: { code: trouble.code, message: trouble.message } });
    return;
  }
  // A refusal by the database's constraints is about the input: said in the API's words (dbErrors.ts), never PostgreSQL's.
  const refusal = databaseRefusal(err);
  if (refusal) {
    const e = refusalError(refusal);
    res.status(e.status).json({ error: { code: e.code, message: e.message, ...(e.details ? { details: e.details } : {}) } });
    return;
  }
  if (status >= 400 && status < 500) {
    // only a message its maker marked as safe to show (http-errors' expose), and short
    const message = err.expose === true && typeof err.message === 'string' ? clip(err.message, 200) : 'the request cannot be read';
    res.status(status).json({ error: { code: 'bad-request', message } });
    return;
  }
  console.error('[error]', err);
  res.status(500).json({ error: { code: 'internal', message: 'something went wrong on the server; it has been logged' } });
};

/**
 * The one way the client talks to the Headwater API. Same origin, so paths are
 * relative ("/api/..."). Every failure becomes an `ApiError` carrying the
 * server's `{ error: { code, message, details? } }` (shared/api.ts, ApiErrorBody)
 * or, when there is no such body, a code and message of our own.
 */
import type { ZodType } from 'zod';
import { browserOffline } from '@/src/offline/online';

export class ApiError extends Error {
  /** HTTP status; 0 when the server could not be reached at all. */
  readonly status: number;
  /** The server's error code, or one of ours: `network`, `bad-response`, `http-<status>`. */
  readonly code: string;
  readonly details?: unknown;

  constructor(status: number, code: string, message: string, details?: unknown) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.details = details;
  }
}

export function isApiError(e: unknown): e is ApiError {
  return e instanceof ApiError;
}

export interface RequestOptions {
  method?: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  /** Sent as JSON. */
  body?: unknown;
  /** Bearer token; omitted for sign-in. */
  token?: string | null;
  signal?: AbortSignal;
}

function errorFromBody(status: number, statusText: string, body: unknown): ApiError {
  if (body && typeof body === 'object' && 'error' in body) {
    const err = (body as { error: unknown }).error;
    if (err && typeof err === 'object') {
      const { code, message, details } = err as Record<string, unknown>;
      if (typeof code === 'string' && typeof message === 'string') {
        return new ApiError(status, code, message, details);
      }
    }
  }
  const reason = statusText ? ` ${statusText}` : '';
  return new ApiError(status, `http-${status}`, `The server answered ${status}${reason}.`);
}

async function readJson(res: Response): Promise<{ ok: true; value: unknown } | { ok: false }> {
  const text = await res.text();
  if (text.trim() === '') return { ok: true, value: undefined };
  try {
    return { ok: true, value: JSON.parse(text) as unknown };
  } catch {
    return { ok: false };
  }
}

export interface RawRequestOptions extends Omit<RequestOptions, 'body'> {
  /** Sent as it is: a FormData upload, or JSON text with `contentType`. */
  body?: BodyInit;
  contentType?: string;
  /** The Accept header; JSON unless said otherwise (a zip download). */
  accept?: string;
  /** Statuses that are answers rather than errors, such as an import's 422 report. */
  answers?: readonly number[];
}

/**
 * Sends one request and resolves with the Response itself, for answers that
 * are files or uploads that are not JSON. Fails as `request` does: an ApiError
 * read from the error body, or code "network" when the server cannot be reached.
 */
export async function requestRaw(path: string, options: RawRequestOptions = {}): Promise<Response> {
  if (!path.startsWith('/')) {
    throw new ApiError(0, 'bad-request', `API paths start with "/", got ${JSON.stringify(path)}`);
  }
  const method = options.method ?? 'GET';
  // With no connection a change is refused here, in words, rather than left to fail somewhere in the network stack.
  if (method !== 'GET' && browserOffline()) {
    throw new ApiError(0, 'offline', 'No connection: nothing was changed. Changes can be made again once the connection returns.');
  }
  const headers: Record<string, string> = { Accept: options.accept ?? 'application/json' };
  if (options.contentType) headers['Content-Type'] = options.contentType;
  if (options.token) headers.Authorization = `Bearer ${options.token}`;

  let res: Response;
  try {
    res = await fetch(path, { method, headers, body: options.body, signal: options.signal });
  } catch (e) {
    if (e instanceof Error && e.name === 'AbortError') throw e;
    throw new ApiError(0, 'network', 'Could not reach the Headwater server. Check the connection and try again.');
  }
  if (!res.ok && !options.answers?.includes(res.status)) {
    const parsed = await readJson(res);
    throw errorFromBody(res.status, res.statusText, parsed.ok ? parsed.value : undefined);
  }
  return res;
}

/** Sends one request and resolves with the parsed JSON body (undefined for an empty body). */
export async function request(path: string, options: RequestOptions = {}): Promise<unknown> {
  const { body, ...rest } = options;
  const res = await requestRaw(path, {
    ...rest,
    body: body === undefined ? undefined : JSON.stringify(body),
    contentType: body === undefined ? undefined : 'application/json',
  });
  return jsonOf(path, res);
}

/** The JSON body of an answer to `path` (undefined for an empty body); an ApiError when it is not JSON. */
export async function jsonOf(path: string, res: Response): Promise<unknown> {
  const parsed = await readJson(res);
  if (!parsed.ok) throw new ApiError(res.status, 'bad-response', `The server's answer to ${path} was not JSON.`);
  return parsed.value;
}

/** Checks an answer against the shape the client expects, so a contract drift fails loudly and by name. */
export function parseAnswer<T>(schema: ZodType<T>, path: string, value: unknown): T {
  const result = schema.safeParse(value);
  if (result.success) return result.data;
  const first = result.error.issues[0];
  const where = first && first.path.length ? ` at ${first.path.join('.')}` : '';
  throw new ApiError(200, 'bad-response', `The server's answer to ${path} was not understood${where}: ${first?.message ?? 'unexpected shape'}.`);
}

import { isApiError } from './client';

/**
 * Whether SWR should retry a failed read. An unreachable server, a timeout,
 * a rate limit or a server error may pass; any other client error (bad
 * request, not allowed, not found, an answer we could not read) will not
 * change by asking again; nor will a read aborted because its session ended.
 */
export function retryable(error: unknown): boolean {
  // aborted because its session ended: nobody is waiting for it any more
  if (error instanceof Error && error.name === 'AbortError') return false;
  if (!isApiError(error)) return true;
  if (error.code === 'bad-response') return false;
  if (error.status === 408 || error.status === 429) return true;
  return error.status === 0 || error.status >= 500;
}

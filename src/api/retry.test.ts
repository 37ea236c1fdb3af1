import { describe, expect, it } from 'vitest';
import { ApiError } from './client';
import { retryable } from './retry';

describe('retryable', () => {
  it('retries an unreachable server, a timeout, a rate limit and server errors', () => {
    for (const status of [0, 408, 429, 500, 502, 503]) {
      expect(retryable(new ApiError(status, 'x', 'x'))).toBe(true);
    }
  });
  it('does not retry other client errors or an answer that could not be read', () => {
    for (const status of [400, 401, 403, 404, 409, 422]) {
      expect(retryable(new ApiError(status, 'x', 'x'))).toBe(false);
    }
    expect(retryable(new ApiError(200, 'bad-response', 'x'))).toBe(false);
  });
  it('retries errors that are not from the API client (a thrown TypeError, say)', () => {
    expect(retryable(new TypeError('x'))).toBe(true);
  });
  it('does not retry a read aborted because its session ended', () => {
    const aborted = new AbortController();
    aborted.abort();
    expect(retryable(aborted.signal.reason)).toBe(false);
    expect(retryable(new DOMException('stopped', 'AbortError'))).toBe(false);
  });
});

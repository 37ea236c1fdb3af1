import { afterEach, describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { ApiError, parseAnswer, request, requestRaw } from './client';

function answer(status: number, body: string, statusText = '') {
  return vi.fn(async (_url: string, _init?: RequestInit) => new Response(body, { status, statusText }));
}

afterEach(() => vi.unstubAllGlobals());

describe('request', () => {
  it('refuses a path that is not relative to the API origin', async () => {
    await expect(request('api/x')).rejects.toThrow(/API paths start with "\/"/);
  });

  it('sends the bearer token and a JSON body, and parses the JSON answer', async () => {
    const fetchMock = answer(200, '{"token":"t","user":{"id":1}}');
    vi.stubGlobal('fetch', fetchMock);
    const value = await request('/api/auth/login', { method: 'POST', body: { email: 'a@b.test' }, token: 'abc' });
    expect(value).toEqual({ token: 't', user: { id: 1 } });
    const [url, init] = fetchMock.mock.calls[0];
    expect(url).toBe('/api/auth/login');
    expect(init?.method).toBe('POST');
    expect(init?.body).toBe('{"email":"a@b.test"}');
    expect((init?.headers as Record<string, string>).Authorization).toBe('Bearer abc');
    expect((init?.headers as Record<string, string>)['Content-Type']).toBe('application/json');
  });

  it('sends no Authorization header without a token', async () => {
    const fetchMock = answer(200, '{}');
    vi.stubGlobal('fetch', fetchMock);
    await request('/api/health');
    expect((fetchMock.mock.calls[0][1]?.headers as Record<string, string>).Authorization).toBeUndefined();
  });

  it('turns the server error body into an ApiError with status, code, message and details', async () => {
    vi.stubGlobal('fetch', answer(401, '{"error":{"code":"bad-credentials","message":"no","details":{"n":1}}}'));
    const err = await request('/api/auth/login').catch((e: unknown) => e);
    expect(err).toBeInstanceOf(ApiError);
    expect(err).toMatchObject({ status: 401, code: 'bad-credentials', message: 'no', details: { n: 1 } });
  });

  it('names the status when the error body is not the agreed shape', async () => {
    vi.stubGlobal('fetch', answer(502, '<html>proxy</html>', 'Bad Gateway'));
    await expect(request('/api/network/summary')).rejects.toMatchObject({
      status: 502,
      code: 'http-502',
      message: 'The server answered 502 Bad Gateway.',
    });
  });

  it('reports an unreachable server as status 0, code network', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))));
    await expect(request('/api/auth/me')).rejects.toMatchObject({ status: 0, code: 'network' });
  });

  it('reports a 200 answer that is not JSON as bad-response', async () => {
    vi.stubGlobal('fetch', answer(200, 'not json'));
    await expect(request('/api/auth/me')).rejects.toMatchObject({ code: 'bad-response' });
  });

  it('resolves an empty 2xx body as undefined', async () => {
    vi.stubGlobal('fetch', answer(200, ''));
    await expect(request('/api/users/1', { method: 'PATCH', body: {} })).resolves.toBeUndefined();
  });
});

describe('parseAnswer', () => {
  const schema = z.object({ counts: z.object({ sites: z.number() }) });
  it('returns the parsed value when the shape matches', () => {
    expect(parseAnswer(schema, '/x', { counts: { sites: 3 } })).toEqual({ counts: { sites: 3 } });
  });
  it('names the path and the field that did not match', () => {
    expect(() => parseAnswer(schema, '/api/network/summary', { counts: { sites: 'three' } })).toThrow(
      /answer to \/api\/network\/summary was not understood at counts\.sites/,
    );
  });
});

describe('requestRaw (uploads and downloads)', () => {
  it('sends a form as it is, with the token, and reads a listed status as an answer', async () => {
    const fetchMock = answer(422, '{"ok":false,"errors":[{"message":"x"}]}');
    vi.stubGlobal('fetch', fetchMock);
    const form = new FormData();
    form.append('file', new Blob(['code,name,kind\n']), 'services.csv');
    const res = await requestRaw('/api/network/import?dryRun=true', { method: 'POST', body: form, token: 'abc', answers: [422] });
    expect(res.status).toBe(422);
    expect(await res.json()).toEqual({ ok: false, errors: [{ message: 'x' }] });
    const [, init] = fetchMock.mock.calls[0];
    expect(init?.body).toBe(form);
    const headers = init?.headers as Record<string, string>;
    expect(headers.Authorization).toBe('Bearer abc');
    // the browser sets the multipart boundary itself
    expect(headers['Content-Type']).toBeUndefined();
  });

  it('fails on other statuses with the error the body names, like request', async () => {
    vi.stubGlobal('fetch', answer(401, '{"error":{"code":"unauthenticated","message":"sign in first"}}'));
    const err = await requestRaw('/api/network/export', { accept: 'application/zip' }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(ApiError);
    expect(err).toMatchObject({ status: 401, code: 'unauthenticated', message: 'sign in first' });
  });

  it('says the server cannot be reached when fetch itself fails', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))));
    await expect(requestRaw('/api/network/export')).rejects.toMatchObject({ status: 0, code: 'network' });
  });
});

describe('with no connection', () => {
  it('refuses a change before sending it, in words, and still lets a read try', async () => {
    const fetchMock = answer(200, '{}');
    vi.stubGlobal('fetch', fetchMock);
    vi.stubGlobal('navigator', { onLine: false });
    const refused = await request('/api/sites', { method: 'POST', body: { code: 'S1' } }).catch((e: unknown) => e);
    expect(refused).toBeInstanceOf(ApiError);
    expect((refused as ApiError).code).toBe('offline');
    expect((refused as ApiError).message).toMatch(/No connection: nothing was changed/);
    expect(fetchMock).not.toHaveBeenCalled();
    await request('/api/network/summary');
    expect(fetchMock).toHaveBeenCalledTimes(1);
  });

  it('sends changes as usual when the browser says it is online', async () => {
    const fetchMock = answer(200, '{}');
    vi.stubGlobal('fetch', fetchMock);
    vi.stubGlobal('navigator', { onLine: true });
    await request('/api/sites', { method: 'POST', body: { code: 'S1' } });
    expect(fetchMock).toHaveBeenCalledTimes(1);
  });
});

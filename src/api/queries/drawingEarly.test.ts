import { afterEach, describe, expect, it, vi } from 'vitest';
import { api } from '@/shared/api';
import { writePersistedSession, SESSION_STORAGE_KEY } from '@/src/session/persisted';
import { opensNetworkDiagram, startDrawingEarly, takeEarlyDrawing } from './drawingEarly';

const user = { id: 1, email: 'ada@headwater.example', name: 'Ada', role: 'engineer' as const };
const storageWith = (token: string | null) => ({
  getItem: (key: string) => (key === SESSION_STORAGE_KEY && token ? writePersistedSession({ version: 1, token, user }) : null),
});

afterEach(async () => {
  await takeEarlyDrawing('drain'); // nothing left over for the next test
  vi.unstubAllGlobals();
});

describe('the drawing asked for as the page opens', () => {
  it('is sent only on the network screen address', () => {
    expect(opensNetworkDiagram('/network')).toBe(true);
    expect(opensNetworkDiagram('/network/')).toBe(true);
    expect(opensNetworkDiagram('/')).toBe(false);
    expect(opensNetworkDiagram('/network-x')).toBe(false);
    expect(opensNetworkDiagram('/reach')).toBe(false);
  });

  it('is sent with the stored token, and taken once by the same session', async () => {
    const fetchMock = vi.fn(async () => new Response('{"networkVersion":3}', { status: 200 }));
    vi.stubGlobal('fetch', fetchMock);
    expect(startDrawingEarly(storageWith('tok-1'))).toBe(true);
    expect(fetchMock).toHaveBeenCalledTimes(1);
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe(api.networkDrawing);
    expect((init.headers as Record<string, string>).Authorization).toBe('Bearer tok-1');
    const res = await takeEarlyDrawing('tok-1');
    expect(await res?.json()).toEqual({ networkVersion: 3 });
    expect(await takeEarlyDrawing('tok-1')).toBeNull();
  });

  it('is not sent without a stored session, nor when storage refuses', () => {
    const fetchMock = vi.fn();
    vi.stubGlobal('fetch', fetchMock);
    expect(startDrawingEarly(storageWith(null))).toBe(false);
    expect(startDrawingEarly({ getItem: () => '{"version":1,"token":"t"}' })).toBe(false); // a token without its user
    expect(
      startDrawingEarly({
        getItem: () => {
          throw new Error('denied');
        },
      }),
    ).toBe(false);
    expect(startDrawingEarly(undefined)).toBe(false);
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('is not given to another session, nor when it failed (the usual request then reports)', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => new Response('{}', { status: 200 })));
    startDrawingEarly(storageWith('tok-1'));
    expect(await takeEarlyDrawing('tok-2')).toBeNull();
    expect(await takeEarlyDrawing('tok-1')).toBeNull(); // dropped when another session looked

    vi.stubGlobal('fetch', vi.fn(async () => new Response('{"error":{"code":"unauthorised","message":"no"}}', { status: 401 })));
    startDrawingEarly(storageWith('tok-1'));
    expect(await takeEarlyDrawing('tok-1')).toBeNull();

    vi.stubGlobal('fetch', vi.fn(async () => Promise.reject(new TypeError('offline'))));
    startDrawingEarly(storageWith('tok-1'));
    expect(await takeEarlyDrawing('tok-1')).toBeNull();
    expect(await takeEarlyDrawing(null)).toBeNull();
  });
});

import { afterEach, describe, expect, it, vi } from 'vitest';
import { api } from '@/shared/api';
import { drawingOf } from '@/shared/schemas/drawing';
import { smallNetwork } from '@/test/fixtures/small-network';
import { writePersistedSession, SESSION_STORAGE_KEY } from '@/src/session/persisted';
import { opensNetworkDiagram, peekEarlyDrawing, readDrawing, startDrawingEarly, takeEarlyDrawing } from './drawingEarly';

const user = { id: 1, email: 'ada@headwater.example', name: 'Ada', role: 'engineer' as const };
const storageWith = (token: string | null) => ({
  getItem: (key: string) => (key === SESSION_STORAGE_KEY && token ? writePersistedSession({ version: 1, token, user }) : null),
});
const columns = drawingOf(smallNetwork(), 3);
const answer = (body: unknown, status = 200) => async () => new Response(JSON.stringify(body), { status });

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

  it('is sent with the stored token, checked, and taken once by the same session', async () => {
    const fetchMock = vi.fn(answer(columns));
    vi.stubGlobal('fetch', fetchMock);
    expect(startDrawingEarly(storageWith('tok-1'))).toBe(true);
    expect(fetchMock).toHaveBeenCalledTimes(1);
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe(api.networkDrawing);
    expect((init.headers as Record<string, string>).Authorization).toBe('Bearer tok-1');
    expect(await takeEarlyDrawing('tok-1')).toEqual(columns);
    expect(await takeEarlyDrawing('tok-1')).toBeNull();
  });

  it("takes over the boot script's request rather than sending another", async () => {
    const fetchMock = vi.fn();
    vi.stubGlobal('fetch', fetchMock);
    const page = { __headwaterEarlyDrawing: { token: 'tok-9', answer: Promise.resolve({ value: JSON.parse(JSON.stringify(columns)) as unknown }) } };
    expect(startDrawingEarly(storageWith('tok-9'), page)).toBe(true);
    expect(fetchMock).not.toHaveBeenCalled();
    expect(page.__headwaterEarlyDrawing).toBeUndefined(); // taken once
    expect(await takeEarlyDrawing('tok-9')).toEqual(columns);
  });

  it('can be looked at once it is in and checked, by the same session only, until it is taken', async () => {
    let arrive: (r: Response) => void = () => undefined;
    vi.stubGlobal('fetch', vi.fn(() => new Promise<Response>((resolve) => (arrive = resolve))));
    startDrawingEarly(storageWith('tok-3'));
    expect(peekEarlyDrawing('tok-3')).toBeUndefined(); // not in yet
    arrive(new Response(JSON.stringify(columns), { status: 200 }));
    await vi.waitFor(() => expect(peekEarlyDrawing('tok-3')).toEqual(columns));
    expect(peekEarlyDrawing('tok-4')).toBeUndefined();
    expect(peekEarlyDrawing(null)).toBeUndefined();
    const seen = peekEarlyDrawing('tok-3');
    expect(await takeEarlyDrawing('tok-3')).toBe(seen); // the same object: SWR finds nothing new
    expect(peekEarlyDrawing('tok-3')).toBeUndefined();
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

  it('is not given to another session, nor when it failed or does not check out (the usual request then reports)', async () => {
    vi.stubGlobal('fetch', vi.fn(answer(columns)));
    startDrawingEarly(storageWith('tok-1'));
    expect(await takeEarlyDrawing('tok-2')).toBeNull();
    expect(await takeEarlyDrawing('tok-1')).toBeNull(); // dropped when another session looked

    vi.stubGlobal('fetch', vi.fn(answer({ error: { code: 'unauthorised', message: 'no' } }, 401)));
    startDrawingEarly(storageWith('tok-1'));
    expect(await takeEarlyDrawing('tok-1')).toBeNull();

    vi.stubGlobal('fetch', vi.fn(answer({ networkVersion: 3 }))); // not the drawing's shape
    startDrawingEarly(storageWith('tok-1'));
    expect(await takeEarlyDrawing('tok-1')).toBeNull();

    vi.stubGlobal('fetch', vi.fn(answer({ ...columns, feeds: { ...columns.feeds, from: columns.feeds.from.map(() => 99_999) } }))); // positions past the table
    startDrawingEarly(storageWith('tok-1'));
    expect(await takeEarlyDrawing('tok-1')).toBeNull();

    vi.stubGlobal('fetch', vi.fn(async () => Promise.reject(new TypeError('offline'))));
    startDrawingEarly(storageWith('tok-1'));
    expect(await takeEarlyDrawing('tok-1')).toBeNull();
    expect(await takeEarlyDrawing(null)).toBeNull();
  });
});

describe('readDrawing', () => {
  it('passes a good answer and names what is wrong in a bad one', () => {
    expect(readDrawing('/api/network/drawing', JSON.parse(JSON.stringify(columns)))).toEqual(columns);
    expect(() => readDrawing('/api/network/drawing', { ...columns, sites: { ...columns.sites, lat: ['north'] } })).toThrow(/answer to \/api\/network\/drawing was not understood at sites\.lat/);
    expect(() => readDrawing('/api/network/drawing', { ...columns, carriages: { ...columns.carriages, site: columns.carriages.site.map(() => 10_000) } })).toThrow(/carriages\.site points to entry 10000/);
  });
});

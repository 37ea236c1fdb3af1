import { describe, expect, it, vi } from 'vitest';
import { chunksFor, earlyStart, openedPath, storedToken, type BootPlan, type BootWindow } from './earlyStart';

const plan: BootPlan = {
  sessionKey: 'session.key',
  drawingPath: '/api/network/drawing',
  always: ['/c/_layout-a.js', '/c/_layout-b.js'],
  byPath: { '/network': ['/c/network-1.js'], '/': ['/c/index-2.js'], '/reach': ['/c/reach-3.js'] },
  deferred: { chunk: '/c/deferred-4.js', notFor: ['/', '/sign-in', '/network'] },
};
const session = (token: string) => JSON.stringify({ version: 1, token, user: { id: 1, email: 'a@headwater.example', name: 'A', role: 'viewer' } });

function page(pathname: string, stored: string | null | (() => string | null)) {
  const links: { rel: string; as: string; href: string }[] = [];
  const fetchMock = vi.fn(async () => new Response('{"networkVersion":1}', { status: 200 }));
  const win = {
    location: { pathname },
    localStorage: { getItem: (key: string) => (key !== 'session.key' ? null : typeof stored === 'function' ? stored() : stored) },
    fetch: fetchMock,
    document: {
      head: { appendChild: (l: { rel: string; as: string; href: string }) => links.push(l) },
      createElement: () => ({ rel: '', as: '', href: '' }),
    },
  } as unknown as BootWindow;
  return { win, links, fetchMock };
}

describe('the boot script', () => {
  it('reads the opened path and the stored token as the app does', () => {
    expect(openedPath('/network/')).toBe('/network');
    expect(openedPath('/')).toBe('/');
    expect(openedPath('//')).toBe('/');
    expect(storedToken(session('tok'))).toBe('tok');
    for (const bad of [null, '', 'not json', 'null', '{"version":2,"token":"t","user":{}}', '{"version":1,"token":"","user":{}}', '{"version":1,"token":"t"}', '{"version":1,"token":7,"user":{}}']) expect(storedToken(bad)).toBeNull();
  });

  it('preloads the layouts, the screen and the on-demand chunk where that screen needs it', () => {
    expect(chunksFor(plan, '/network')).toEqual(['/c/_layout-a.js', '/c/_layout-b.js', '/c/network-1.js']);
    expect(chunksFor(plan, '/reach')).toEqual(['/c/_layout-a.js', '/c/_layout-b.js', '/c/reach-3.js', '/c/deferred-4.js']);
    expect(chunksFor(plan, '/sites/S1')).toEqual(['/c/_layout-a.js', '/c/_layout-b.js', '/c/deferred-4.js']);
    expect(chunksFor({ ...plan, deferred: null }, '/sign-in')).toEqual(['/c/_layout-a.js', '/c/_layout-b.js']);
    const { win, links } = page('/reach', null);
    earlyStart(win, plan);
    expect(links.map((l) => [l.rel, l.as, l.href])).toEqual(chunksFor(plan, '/reach').map((href) => ['preload', 'script', href]));
  });

  it('sends for the drawing on the network screen only, with the stored token, and leaves the parsed answer for the app', async () => {
    const open = page('/network/', session('tok-5'));
    earlyStart(open.win, plan);
    expect(open.fetchMock).toHaveBeenCalledTimes(1);
    const [url, init] = open.fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe('/api/network/drawing');
    expect((init.headers as Record<string, string>).Authorization).toBe('Bearer tok-5');
    expect(open.win.__headwaterEarlyDrawing?.token).toBe('tok-5');
    expect(await open.win.__headwaterEarlyDrawing?.answer).toEqual({ value: { networkVersion: 1 } });

    for (const [path, stored] of [['/reach', session('tok-5')], ['/network', null], ['/network', '{"version":1}']] as const) {
      const other = page(path, stored);
      earlyStart(other.win, plan);
      expect(other.fetchMock).not.toHaveBeenCalled();
      expect(other.win.__headwaterEarlyDrawing).toBeUndefined();
    }
    const refused = page('/network', () => {
      throw new Error('storage denied');
    });
    earlyStart(refused.win, plan);
    expect(refused.fetchMock).not.toHaveBeenCalled();
  });

  it('holds nothing for an answer that is not a 200 JSON answer', async () => {
    for (const res of [new Response('{}', { status: 401 }), new Response('<html>', { status: 200 })]) {
      const open = page('/network', session('tok'));
      open.fetchMock.mockImplementation(async () => res);
      earlyStart(open.win, plan);
      expect(await open.win.__headwaterEarlyDrawing?.answer).toBeNull();
    }
    const offline = page('/network', session('tok'));
    offline.fetchMock.mockImplementation(async () => Promise.reject(new TypeError('offline')));
    earlyStart(offline.win, plan);
    expect(await offline.win.__headwaterEarlyDrawing?.answer).toBeNull();
  });
});

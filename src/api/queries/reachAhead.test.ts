/**
 * The overlay's reach asked for ahead of its screen: sent once per failure
 * set, taken once by the screen's read, dropped when left too long.
 */
import { describe, expect, it, vi } from 'vitest';
import { AHEAD_MS, askReachAhead, takeReachAhead } from './reachAhead';

const site = (code: string) => ({ kind: 'site' as const, code });

describe('a reach asked for ahead', () => {
  it('is sent at once, once per set, and taken once', async () => {
    const send = vi.fn(async (path: string, init?: { body?: unknown }) => ({ path, body: init?.body }));
    askReachAhead(send as never, 'site:A1', 1_000);
    askReachAhead(send as never, 'site:A1', 1_100); // a second press: no second request
    expect(send).toHaveBeenCalledTimes(1);
    expect(send.mock.calls[0][0]).toBe('/api/analysis/reach?with=sites');
    expect(send.mock.calls[0][1]).toMatchObject({ method: 'POST', body: { failed: [site('A1')] } });
    expect(await takeReachAhead('site:A1', 1_200)).toEqual({ path: '/api/analysis/reach?with=sites', body: { failed: [site('A1')] } });
    expect(takeReachAhead('site:A1', 1_300)).toBeUndefined(); // taken already: the screen asks itself
    expect(takeReachAhead('site:B2', 1_300)).toBeUndefined();
  });

  it('is not asked for an empty set', () => {
    const send = vi.fn();
    askReachAhead(send as never, '', 0);
    expect(send).not.toHaveBeenCalled();
    expect(takeReachAhead('', 0)).toBeUndefined();
  });

  it('left untaken too long is dropped, and the next press asks again', () => {
    const send = vi.fn(async () => ({}));
    askReachAhead(send as never, 'site:C3', 0);
    expect(takeReachAhead('site:C3', AHEAD_MS + 1)).toBeUndefined();
    askReachAhead(send as never, 'site:C3', 0);
    askReachAhead(send as never, 'site:C3', AHEAD_MS + 1); // the old one is dropped first
    expect(send).toHaveBeenCalledTimes(3);
  });

  it('keeps a failed request from being reported before it is taken, and hands the failure over', async () => {
    const send = vi.fn(async () => {
      throw new Error('no connection');
    });
    askReachAhead(send as never, 'site:D4', 0);
    await new Promise((r) => setTimeout(r, 0)); // no unhandled rejection meanwhile
    await expect(takeReachAhead('site:D4', 1)).rejects.toThrow('no connection');
  });
});

/**
 * The offline pieces that run without a browser: search on the stored copy,
 * and fault reach from it through the same engine the server runs (compared
 * with the brute-force rules of test/helpers/bruteforce.ts, which know nothing
 * of the engine).
 */
import { describe, expect, it } from 'vitest';
import { ApiError } from '@/src/api/client';
import { BruteForce } from '@/test/helpers/bruteforce';
import { smallRandomNetwork } from '@/test/helpers/random-network';
import { copyOfDocument, copyOverText, UnreadableCopyError, type OfflineCopy } from './copy';
import { engineFor, localReach } from './localEngine';
import { localElementSearch } from './localSearch';
import { offlineLine } from './offlineLine';

function copyOf(seed: number): OfflineCopy {
  return copyOfDocument(smallRandomNetwork({ seed, sites: 12, services: 2, groups: 2, feeds: 20, originChance: 0.25, carriageChance: 0.8 }), 7, '2026-12-04T08:05:00.000Z');
}

describe('fault reach from the offline copy', () => {
  it('answers as the brute-force rules do for random failure sets', async () => {
    for (let seed = 1; seed <= 20; seed++) {
      const copy = copyOf(seed);
      const site = copy.document.sites[seed % copy.document.sites.length];
      const failed = [{ kind: 'site' as const, code: site.code }];
      const { networkVersion, ...answer } = await localReach(copy, failed);
      expect(networkVersion).toBe(7);
      expect(answer).toEqual(new BruteForce(copy.document).reach(failed));
    }
  });

  it('names unknown elements as the server does (404 with the list)', async () => {
    const err = await localReach(copyOf(3), [{ kind: 'site', code: 'NO-SUCH-SITE' }]).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(ApiError);
    expect((err as ApiError).status).toBe(404);
    expect((err as ApiError).details).toEqual({ unknown: [{ kind: 'site', code: 'NO-SUCH-SITE' }] });
  });

  it('builds the engine once per copy', async () => {
    const copy = copyOf(4);
    expect(engineFor(copy)).toBe(engineFor(copy));
    const next = { ...copy, fetchedAt: '2026-12-04T09:00:00.000Z' };
    expect(engineFor(next)).not.toBe(engineFor(copy));
  });
});

describe('search on the offline copy', () => {
  it('finds sites, feeds and groups by code or name, case-insensitively, with totals', () => {
    const copy = copyOf(5);
    const site = copy.document.sites[0];
    const r = localElementSearch(copy, site.code.toLowerCase(), 6);
    expect(r.hits.some((h) => h.kind === 'site' && h.code === site.code)).toBe(true);
    expect(r.totals.site).toBe(copy.document.sites.filter((s) => s.code.toLowerCase().includes(site.code.toLowerCase()) || s.name.toLowerCase().includes(site.code.toLowerCase())).length);
    expect(localElementSearch(copy, 'zzz-nothing-like-this', 6)).toEqual({ hits: [], totals: { site: 0, carriage: 0, feed: 0, group: 0 } });
  });

  it("finds a carriage by its site and service names together, as the server's carriage search does", () => {
    const copy = copyOf(6);
    const c = copy.document.carriages[0];
    const siteName = copy.document.sites.find((s) => s.code === c.site)!.name;
    const serviceName = copy.document.services.find((s) => s.code === c.service)!.name;
    const r = localElementSearch(copy, `${siteName} ${serviceName}`, 50);
    expect(r.hits.filter((h) => h.kind === 'carriage').map((h) => h.code)).toContain(c.code);
    // the whole text is in no single field: only a word-by-word search finds it
    expect([c.code, siteName, serviceName].some((v) => v.toLowerCase().includes(`${siteName} ${serviceName}`.toLowerCase()))).toBe(false);
  });

  it('finds a feed by the code of a site at either end, as the feed list does, in code order', () => {
    const copy = copyOf(7);
    const f = copy.document.feeds[0];
    const fromSite = copy.document.carriages.find((c) => c.code === f.from)!.site;
    const r = localElementSearch(copy, fromSite, 200);
    const feeds = r.hits.filter((h) => h.kind === 'feed').map((h) => h.code);
    expect(feeds).toContain(f.code);
    expect(feeds).toEqual([...feeds].sort());
  });
});

describe('the offline line', () => {
  it('says offline, the version and the time it was fetched', () => {
    const fetched = new Date();
    fetched.setHours(8, 5, 0, 0);
    expect(offlineLine(12, fetched.toISOString())).toBe('Offline — network version 12, fetched at 08:05');
  });
});

describe('the stored copy', () => {
  it('is kept as text and read into a document only when first used', () => {
    const document = smallRandomNetwork({ seed: 3, sites: 8, services: 2, groups: 1, feeds: 10, originChance: 0.3, carriageChance: 0.8 });
    const copy = copyOverText({ networkVersion: 4, fetchedAt: '2026-12-04T08:05:00.000Z', text: JSON.stringify(document) });
    expect(copy.text).toBe(JSON.stringify(document));
    expect(copy.document).toEqual(document);
    expect(copy.document).toBe(copy.document); // read once
  });

  it('says a text that is not a network document is unreadable, only when it is used', () => {
    const broken = copyOverText({ networkVersion: 4, fetchedAt: '2026-12-04T08:05:00.000Z', text: '{"format":"network/1","sites":[{"code":' });
    expect(broken.networkVersion).toBe(4);
    expect(() => broken.document).toThrow(UnreadableCopyError);
    let deleted = 0;
    const wrong = copyOverText({ networkVersion: 4, fetchedAt: '2026-12-04T08:05:00.000Z', text: '{"format":"something else"}' }, () => deleted++);
    expect(() => wrong.document).toThrow(/could not be read/);
    expect(deleted).toBe(1);
  });
});

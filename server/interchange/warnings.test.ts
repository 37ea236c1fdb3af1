/**
 * Import warnings (docs/format.md): a feed loop with no
 * origin upstream, a carriage with no feed at a non-origin site, a relay with
 * no reserve feed. The import goes ahead: the document is still returned.
 */
import { describe, expect, it } from 'vitest';
import type { Feed, NetworkDocument } from '@/shared/schemas/network';
import { validateDocument } from './validate';
import { smallNetwork } from '@/test/fixtures/small-network';

const withFeeds = (change: (feeds: Feed[]) => Feed[]): NetworkDocument => {
  const doc = smallNetwork();
  doc.feeds = change(doc.feeds);
  return doc;
};

describe('warning no-feed', () => {
  it('warns about a relay carriage with no feed, and keeps the document', () => {
    const result = validateDocument(withFeeds((f) => f.filter((x) => x.to !== 'R2.TV1')));
    expect(result.errors).toEqual([]);
    expect(result.document).not.toBeNull();
    expect(result.warnings).toEqual([
      expect.objectContaining({ kind: 'sites', code: 'R2', rule: 'no-reserve' }),
      {
        kind: 'carriages', index: 5, code: 'R2.TV1', rule: 'no-feed',
        message: 'carriage R2.TV1: no feed comes into it, so it has no programme (site R2 is a relay, not an origin)',
      },
    ]);
  });

  it('does not warn about origin carriages, which need no feed', () => {
    const { warnings } = validateDocument(smallNetwork());
    expect(warnings.filter((w) => w.code?.startsWith('O1'))).toEqual([]);
  });

  it('warns about a main carriage with no feed too', () => {
    const { warnings } = validateDocument(withFeeds((f) => f.filter((x) => x.to !== 'M1.FM1')));
    expect(warnings).toEqual([expect.objectContaining({ code: 'M1.FM1', rule: 'no-feed', message: expect.stringContaining('site M1 is a main') })]);
  });
});

describe('warning no-reserve', () => {
  it('warns about a relay none of whose carriages has a reserve feed', () => {
    const { warnings } = validateDocument(withFeeds((f) => f.filter((x) => x.code !== 'R1.TV1.R')));
    expect(warnings).toEqual([
      {
        kind: 'sites', index: 2, code: 'R1', rule: 'no-reserve',
        message: 'site R1: no reserve feed comes into any of its 1 carriage, so one failure upstream takes this relay off air',
      },
    ]);
  });

  it('does not warn about a main without reserve, nor a relay site with no carriage (a hop)', () => {
    const { warnings } = validateDocument(withFeeds((f) => f.filter((x) => x.code !== 'M1.TV1.R')));
    expect(warnings).toEqual([]);
  });
});

describe('warning loop-without-origin', () => {
  it('warns once per loop that no origin feeds, naming its carriages and those starved below it', () => {
    const doc = smallNetwork();
    doc.sites.push({ code: 'R3', name: 'Relay Three', role: 'relay', lat: -38, lon: -29 }, { code: 'R4', name: 'Relay Four', role: 'relay', lat: -38, lon: -29.2 });
    doc.carriages.push({ code: 'R3.TV1', site: 'R3', service: 'TV1' }, { code: 'R4.TV1', site: 'R4', service: 'TV1' });
    // R1 and R2 now feed only each other; R3 hangs below them, R4 below R3.
    doc.feeds = doc.feeds.filter((f) => f.code !== 'R1.TV1.M' && f.code !== 'R2.TV1.M' && f.code !== 'R2.TV1.R');
    doc.feeds.push(
      { code: 'R2.TV1.L', from: 'R1.TV1', to: 'R2.TV1', medium: 'off-air', role: 'main' },
      { code: 'R3.TV1.M', from: 'R2.TV1', to: 'R3.TV1', medium: 'off-air', role: 'main' },
      { code: 'R4.TV1.M', from: 'R3.TV1', to: 'R4.TV1', medium: 'off-air', role: 'reserve' },
    );
    const { errors, warnings, document } = validateDocument(doc);
    expect(errors).toEqual([]);
    expect(document).not.toBeNull();
    const loops = warnings.filter((w) => w.rule === 'loop-without-origin');
    expect(loops).toEqual([
      {
        kind: 'carriages', index: 4, code: 'R1.TV1', rule: 'loop-without-origin',
        message: 'carriage R1.TV1: carriages R1.TV1, R2.TV1 feed each other in a loop with no origin upstream: they have no programme, nor do 2 carriages downstream of it',
      },
    ]);
  });

  it('does not warn about a loop that an origin feeds (reserves backing each other up)', () => {
    const doc = smallNetwork();
    doc.feeds.push({ code: 'R2.TV1.R1', from: 'R1.TV1', to: 'R2.TV1', medium: 'off-air', role: 'reserve' });
    const { warnings } = validateDocument(doc);
    expect(warnings).toEqual([]);
  });

  it('finds each of several loops, including one of three carriages', () => {
    const doc: NetworkDocument = { format: 'network/1', sites: [], services: [{ code: 'S', name: 'S', kind: 'dtt' }], groups: [], carriages: [], feeds: [] };
    for (let i = 1; i <= 5; i++) {
      doc.sites.push({ code: `R${i}`, name: `R${i}`, role: 'relay', lat: 0, lon: i / 10 });
      doc.carriages.push({ code: `C${i}`, site: `R${i}`, service: 'S' });
    }
    const link = (from: number, to: number) => doc.feeds.push({ code: `F${from}${to}`, from: `C${from}`, to: `C${to}`, medium: 'off-air', role: 'main' });
    link(1, 2); link(2, 3); link(3, 1); // loop of three
    link(4, 5); link(5, 4); // loop of two
    const loops = validateDocument(doc).warnings.filter((w) => w.rule === 'loop-without-origin');
    expect(loops.map((w) => w.code)).toEqual(['C1', 'C4']);
    expect(loops[0].message).toContain('carriages C1, C2, C3 feed each other');
  });
});

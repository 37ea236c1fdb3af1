import { describe, expect, it } from 'vitest';
import { generateNetwork } from '@/scripts/generator';
import { turnPacer as pacer } from '../interchange/turns';
import { carriageIndexReady, searchCarriages, type CarriageSource } from './carriageSearch';
import { countTurns } from '@/test/helpers/turnCounter';

const source = (sites: number, seed: number, reorder = false): CarriageSource => {
  const document = generateNetwork({ sites, seed });
  if (reorder) document.carriages.reverse();
  return { document, sites: new Map(document.sites.map((s) => [s.code, s])), services: new Map(document.services.map((s) => [s.code, s])) } as CarriageSource;
};

describe('carriage search index', () => {
  it('built in turns, answers as the index built at once, in code order even when the document is not', async () => {
    for (const reorder of [false, true]) {
      const a = source(400, 3, reorder);
      const b = source(400, 3, reorder);
      await carriageIndexReady(a, pacer());
      for (const q of ['R0', 'mux1', 'R00012', 'nothing-like-this']) {
        const got = searchCarriages(a, q, 1_000);
        expect(got).toEqual(searchCarriages(b, q, 1_000));
        const codes = got.items.map((i) => i.code);
        const rest = codes.filter((c) => c.toLowerCase() !== q.toLowerCase());
        expect(rest).toEqual([...rest].sort());
      }
    }
  });

  it('gives other work turns while it builds, and searches meanwhile share one build', async () => {
    const m = source(10_000, 5);
    const code = m.document.carriages[123].code;
    const counter = countTurns();
    const first = carriageIndexReady(m, pacer());
    expect(carriageIndexReady(m, pacer())).toBe(first);
    await first;
    const turns = counter.stop();
    // some 40,000 carriages take longer than one 12 ms turn to index on any machine this runs on
    expect(turns).toBeGreaterThan(0);
    expect(searchCarriages(m, code, 5).items[0].code).toBe(code);
  });
});

import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { stringify } from 'csv-stringify/sync';
import { csvInTurns } from './analysisCsv';
import { countTurns } from '@/test/helpers/turnCounter';

const cell = fc.oneof(fc.string(), fc.integer(), fc.double({ noNaN: true, noDefaultInfinity: true }), fc.constantFrom('a,b', 'say "x"', 'two\nlines', '', ' =1+1'));

describe('CSV written in turns', () => {
  it('is the text of one csv-stringify of all the rows, across batch edges (fast-check)', async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(fc.array(cell, { minLength: 1, maxLength: 5 }), { maxLength: 1_300 }), async (rows) => {
        expect(await csvInTurns(rows)).toBe(stringify(rows));
      }),
      { numRuns: 60 },
    );
  });

  it('gives other work turns on a long file', async () => {
    const rows = Array.from({ length: 400_000 }, (_, i) => [i, `S${i}`, i % 9 === 0 ? 'with "quotes", and commas' : 'plain']);
    const counter = countTurns();
    const text = await csvInTurns(rows);
    const turns = counter.stop();
    expect(turns).toBeGreaterThan(2);
    expect(text).toBe(stringify(rows));
  });
});

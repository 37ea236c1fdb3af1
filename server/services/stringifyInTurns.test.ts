import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { stringifyInTurns } from './stringifyInTurns';

describe('JSON text made in turns', () => {
  it('is byte for byte JSON.stringify, for any value (fast-check)', async () => {
    await fc.assert(
      fc.asyncProperty(fc.oneof(fc.dictionary(fc.string(), fc.oneof(fc.jsonValue(), fc.array(fc.jsonValue()))), fc.jsonValue()), async (value) => {
        expect((await stringifyInTurns(value)).toString('utf8')).toBe(JSON.stringify(value));
      }),
      { numRuns: 300 },
    );
  });

  it('leaves out what JSON leaves out, and writes null for it in arrays', async () => {
    const value = { a: undefined, b: () => 1, c: [undefined, () => 2, 3], d: { e: undefined }, f: new Date(0), g: 'é😀' };
    expect((await stringifyInTurns(value)).toString('utf8')).toBe(JSON.stringify(value));
    expect((await stringifyInTurns([1, 2])).toString('utf8')).toBe('[1,2]');
    expect((await stringifyInTurns({})).toString('utf8')).toBe('{}');
  });

  it('gives other work turns on a large answer, and keeps its bytes exact across chunks', async () => {
    const feeds = Array.from({ length: 300_000 }, (_, i) => ({ code: `F${i}`, from: `A${i}`, to: `B${i}`, note: i % 7 === 0 ? 'ĉ "quoted" \\ text' : undefined }));
    const value = { format: 'network/1', baseVersion: 4, sites: [], feeds };
    let pauses = 0;
    const out = await stringifyInTurns(value, async () => {
      pauses++;
      await new Promise((r) => setImmediate(r));
    });
    expect(out.equals(Buffer.from(JSON.stringify(value)))).toBe(true);
    expect(pauses).toBeGreaterThan(0);
  });
});

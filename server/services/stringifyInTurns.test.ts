import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { stringifyChunksInTurns, stringifyInTurns } from './stringifyInTurns';

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
    const nested = { top: { a: undefined, list: [undefined, 1], when: new Date(0), boxed: new String('s'), n: new Number(2), bare: Object.assign(Object.create(null), { x: [1, { y: 2 }] }), deeper: { z: { w: [] } } } };
    expect((await stringifyInTurns(nested)).toString('utf8')).toBe(JSON.stringify(nested));
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

  it("pauses inside columns one level down too (the diagram's drawing)", async () => {
    const n = 400_000;
    const value = { networkVersion: 3, sites: { code: Array.from({ length: n }, (_, i) => `S${i}`), lat: Array.from({ length: n }, (_, i) => (i % 180) - 90.5) } };
    let pauses = 0;
    const chunks = await stringifyChunksInTurns(value, async () => {
      pauses++;
      await new Promise((r) => setImmediate(r));
    });
    expect(Buffer.concat(chunks).equals(Buffer.from(JSON.stringify(value)))).toBe(true);
    expect(chunks.length).toBeGreaterThan(1);
    expect(pauses).toBeGreaterThan(0);
  });
});

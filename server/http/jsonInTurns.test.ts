import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parseJsonInTurns } from './jsonInTurns';
import { MAX_BODY_DEPTH, findUnsafeText, UnsafeTextWalk } from './inputGuard';

const streamed = (text: string, pause: () => Promise<void> = async () => {}) => parseJsonInTurns(Buffer.from(text, 'utf8'), pause, 0);

describe('a large JSON body parsed in turns', () => {
  it('gives what JSON.parse gives, for any object or array (fast-check)', async () => {
    await fc.assert(
      fc.asyncProperty(fc.oneof(fc.dictionary(fc.string({ unit: 'grapheme' }), fc.jsonValue()), fc.array(fc.jsonValue())), async (value) => {
        const text = JSON.stringify(value);
        expect(await streamed(text)).toEqual(JSON.parse(text));
      }),
      { numRuns: 300 },
    );
  });

  it('reads characters of several bytes that fall across slices, and keeps "__proto__" as an own field as JSON.parse does', async () => {
    const text = JSON.stringify({ names: Array.from({ length: 30_000 }, (_, i) => `é😀 ${i}`) });
    expect(await streamed(text)).toEqual(JSON.parse(text));
    const tricky = '{"__proto__":{"polluted":true},"a":1}';
    const v = (await streamed(tricky)) as Record<string, unknown>;
    expect(Object.keys(v)).toEqual(['__proto__', 'a']);
    expect(Object.getPrototypeOf(v)).toBe(Object.prototype);
    expect((v as { polluted?: boolean }).polluted).toBeUndefined();
    // and the guard then refuses that field name, as for a body JSON.parse read
    expect(findUnsafeText(v, '', { rejectReservedKeys: true })).toEqual(['__proto__', 'is not a field name any request uses']);
  });

  it('pauses between slices of a large body (a turn for other requests), and not for a small one', async () => {
    const text = JSON.stringify({ feeds: Array.from({ length: 200_000 }, (_, i) => ({ code: `F${i}`, from: `A${i}`, to: `B${i}`, role: 'main' })) });
    let pauses = 0;
    const out = await parseJsonInTurns(Buffer.from(text), async () => {
      pauses++;
      await new Promise((r) => setImmediate(r));
    }, 1 << 20);
    expect((out as { feeds: unknown[] }).feeds).toHaveLength(200_000);
    expect(pauses).toBeGreaterThan(0);
    let small = 0;
    await parseJsonInTurns(Buffer.from('{"a":[1,2,3]}'), async () => void small++);
    expect(small).toBe(0);
  });

  it.each([
    ['trailing text', '{"a":1} x'],
    ['two values', '{"a":1}{"b":2}'],
    ['an unfinished object', '{"a":1'],
    ['a trailing comma', '[1,2,]'],
    ['a leading zero', '{"a":01}'],
    ['a control character in a string', '{"a":"\u0001"}'],
    ['a bare word', '{"a":nul}'],
  ])('refuses %s as malformed, as JSON.parse does', async (_what, text) => {
    expect(() => JSON.parse(text)).toThrow();
    await expect(streamed(text)).rejects.toMatchObject({ type: 'entity.parse.failed', status: 400 });
  });

  it('takes only an object or an array at the top, and an empty body as an empty object (as express.json does)', async () => {
    await expect(streamed('"text"')).rejects.toMatchObject({ status: 400, message: expect.stringContaining('object or an array') });
    await expect(streamed('12')).rejects.toMatchObject({ status: 400 });
    expect(await streamed('  \n')).toEqual({});
  });

  it(`refuses nesting past ${MAX_BODY_DEPTH} levels while reading, before the parser's stack grows`, async () => {
    const deep = '['.repeat(5_000_000);
    await expect(streamed(deep)).rejects.toMatchObject({ status: 400, message: expect.stringContaining(`deeper than ${MAX_BODY_DEPTH}`) });
    const ok = '['.repeat(MAX_BODY_DEPTH) + ']'.repeat(MAX_BODY_DEPTH);
    expect(await streamed(ok)).toEqual(JSON.parse(ok));
  });
});

describe('the input guard walked in slices', () => {
  it('finds the same first problem and path whether walked at once or a few values at a time', () => {
    const body = { document: { sites: [{ code: 'A', name: 'ok' }, { code: 'B', name: 'bad \u0000 text' }], feeds: [{ code: 'F1', note: 'x' }] } };
    expect(findUnsafeText(body, '')).toEqual(['document.sites[1].name', expect.stringContaining('NUL')]);
    const walk = new UnsafeTextWalk(body, '');
    while (!walk.step(0));
    expect(walk.problem).toEqual(findUnsafeText(body, ''));
    // a body of many values takes several steps when each step has a deadline already past
    const many = new UnsafeTextWalk({ rows: Array.from({ length: 10_000 }, (_, i) => ({ code: `C${i}` })) }, '');
    let manySteps = 1;
    while (!many.step(0)) manySteps++;
    expect(manySteps).toBeGreaterThan(5);
    expect(many.problem).toBeUndefined();
  });

  it('names a refused field name with its path', () => {
    expect(findUnsafeText({ a: [{ ['b\u0000']: 1 }] }, 'body')).toEqual(['body.a[0].b\u0000', expect.stringContaining('field name')]);
    expect(findUnsafeText({ a: { constructor: 1 } }, '', { rejectReservedKeys: true })).toEqual(['a.constructor', 'is not a field name any request uses']);
    expect(findUnsafeText([[['x']]], '', {})).toBeUndefined();
  });
});

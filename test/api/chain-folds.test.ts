/**
 * The chain served folded (GET /api/carriages/:code/chain with view=levels,
 * level=K, under=CODE): on a generated network big enough that an origin's
 * downstream tree does not come whole, the level counts add up to the whole
 * tree of the unfolded answer, level and branch pages put together are that
 * tree's nodes in its order, bad asks are a 400 and the unfolded answer is
 * unchanged.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ChainNode, ChainRow } from '@/shared/schemas/analysis';
import { generateNetwork } from '@/scripts/generator';
import { appWithNetwork, type TestApp } from '../helpers/testApp';

const net = generateNetwork({ sites: 400, seed: 11 });
let t: TestApp;
beforeAll(async () => {
  t = await appWithNetwork(net);
});
afterAll(async () => t?.close());

const get = (p: string) => request(t.app).get(p).set(t.auth('viewer'));
const chainOf = (code: string, q: string) => get(`/api/carriages/${encodeURIComponent(code)}/chain?${q}`);

/** The unfolded tree walked here breadth first, each node as a row is expected to look. */
function rowsByLevel(root: ChainNode): ChainRow[][] {
  const count = (n: ChainNode): number => n.children.reduce((s, c) => s + 1 + count(c), 0);
  const out: ChainRow[][] = [];
  let level: [ChainNode, string | undefined][] = [[root, undefined]];
  for (let depth = 0; level.length; depth++) {
    out.push(
      level.map(([n, parent]) => {
        const { children, ...rest } = n;
        return { ...rest, depth, ...(parent === undefined ? {} : { parent }), childCount: children.length, below: count(n) };
      }),
    );
    level = level.flatMap(([n]) => n.children.map((c): [ChainNode, string] => [c, n.carriage]));
  }
  return out;
}

/** The origin carriage whose downstream tree is largest. */
async function biggestOrigin() {
  const origins = new Set(net.sites.filter((s) => s.role === 'origin').map((s) => s.code));
  let best: { code: string; root: ChainNode; size: number } | null = null;
  for (const c of net.carriages.filter((c) => origins.has(c.site))) {
    const r = await chainOf(c.code, 'direction=down');
    expect(r.status).toBe(200);
    const size = rowsByLevel(r.body.root).flat().length;
    if (!best || size > best.size) best = { code: c.code, root: r.body.root, size };
  }
  return best!;
}

async function pages(base: string, size: number) {
  const rows: ChainRow[] = [];
  for (let offset = 0; ; offset += size) {
    const r = await get(`${base}&limit=${size}&offset=${offset}`);
    expect(r.status).toBe(200);
    expect(r.body.offset).toBe(offset);
    rows.push(...r.body.rows);
    if (offset + size >= r.body.total) return { rows, total: r.body.total as number };
  }
}

describe('an origin\'s downstream chain, folded', () => {
  it('opens with the count at each level, adding up to the whole tree, and without the tree itself', async () => {
    const { code, root, size } = await biggestOrigin();
    expect(size).toBeGreaterThan(150);
    const expected = rowsByLevel(root).map((l) => l.length);
    const r = await chainOf(code, 'direction=down&view=levels');
    expect(r.status).toBe(200);
    expect(r.body.levels).toEqual(expected);
    expect(r.body.levels.reduce((a: number, b: number) => a + b, 0)).toBe(size);
    expect(r.body.size).toBe(size);
    expect(r.body.complete).toBe(false);
    expect(r.body.root).toEqual({ ...root, children: [] });
    // the first answer is small: a fraction of the whole one
    const whole = await chainOf(code, 'direction=down');
    expect(JSON.stringify(r.body).length * 20).toBeLessThan(JSON.stringify(whole.body).length);
  });

  it('pages of one level, put together, are that level of the whole tree in its order', async () => {
    const { code, root } = await biggestOrigin();
    const expected = rowsByLevel(root);
    for (let k = 1; k < expected.length; k++) {
      const got = await pages(`/api/carriages/${encodeURIComponent(code)}/chain?direction=down&level=${k}`, 7);
      expect(got.total, `level ${k}`).toBe(expected[k].length);
      expect(got.rows, `level ${k}`).toEqual(expected[k]);
    }
    const past = await chainOf(code, `direction=down&level=${expected.length}&limit=5`);
    expect(past.status).toBe(200);
    expect(past.body).toMatchObject({ rows: [], total: 0, offset: 0, level: expected.length });
  });

  it('a branch page holds the carriages hanging directly from one carriage', async () => {
    const { code, root } = await biggestOrigin();
    const levels = rowsByLevel(root);
    const branch = levels[1].find((r) => r.childCount > 1)!;
    expect(branch).toBeDefined();
    const got = await pages(`/api/carriages/${encodeURIComponent(code)}/chain?direction=down&under=${encodeURIComponent(branch.carriage)}`, 2);
    expect(got.total).toBe(branch.childCount);
    expect(got.rows).toEqual(levels[2].filter((r) => r.parent === branch.carriage));
    const missing = await chainOf(code, 'direction=down&under=NOT-IN-IT&limit=5');
    expect(missing.status).toBe(404);
    expect(missing.body.error.message).toContain('NOT-IN-IT is not in the downstream chain');
  });

  it('answers a small tree whole, and leaves the unfolded answers as they were', async () => {
    const relay = net.carriages.find((c) => net.sites.find((s) => s.code === c.site)?.role === 'relay')!;
    const up = await chainOf(relay.code, 'direction=up');
    expect(up.status).toBe(200);
    expect(Object.keys(up.body).sort()).toEqual(['direction', 'networkVersion', 'root']);
    const folded = await chainOf(relay.code, 'direction=up&view=levels');
    expect(folded.body.complete).toBe(true);
    expect(folded.body.root).toEqual(up.body.root);
    expect(folded.body.levels).toEqual(rowsByLevel(up.body.root).map((l) => l.length));
  });

  it.each([
    ['direction=down&level=-1', 'level is at least 0'],
    ['direction=down&level=two', 'level must be a number'],
    ['direction=down&view=tree', 'view is levels'],
    ['direction=down&level=1&under=X', 'ask for one of view, level or under'],
    ['direction=down&view=levels&limit=5', 'limit and offset page a level'],
    ['direction=down&limit=5', 'limit and offset page a level'],
    ['direction=down&level=1&limit=0', 'limit is at least 1'],
    ['direction=down&under=a&under=b', 'under is one carriage code'],
  ])('refuses ?%s with a 400 naming the fault', async (q, words) => {
    const code = net.carriages[0].code;
    const r = await chainOf(code, q);
    expect(r.status).toBe(400);
    expect(r.body.error.message).toContain(words);
  });

  it.each([
    ['direction=down&levle=2', 'levle is not known here'],
    ['direction=down&view=levels&pageSize=5&sort=x', 'pageSize, sort are not known here'],
    ['direction=down&Direction=up', 'Direction is not known here'],
  ])('refuses the unknown field in ?%s rather than ignoring it', async (q, words) => {
    const r = await chainOf(net.carriages[0].code, q);
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('bad-request');
    expect(r.body.error.message).toContain(words);
    expect(r.body.error.message).toContain('the chain takes direction, view, level, under, limit, offset');
  });

  it('an unknown carriage is a 404 folded too', async () => {
    expect((await chainOf('NO-SUCH', 'direction=down&view=levels')).status).toBe(404);
    expect((await chainOf('NO-SUCH', 'direction=down&level=1&limit=5')).status).toBe(404);
  });
});

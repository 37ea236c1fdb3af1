/**
 * Hostile input on the inventory routes and the record tools (impact,
 * history, sources): huge codes, NUL bytes, arrays and objects where a
 * query takes one value, numbers that are not whole or not finite, a confirm
 * the server does not know. Each is a 4xx with a message naming what is
 * wrong, and nothing is written.
 */
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { smallNetwork } from '../fixtures/small-network';
import { useTestApp } from '../helpers/testApp';

const app = useTestApp({ network: smallNetwork });
const as = (method: 'get' | 'post' | 'patch' | 'delete', url: string) => request(app().app)[method](url).set(app().auth('engineer'));
const rows = async (sql: string) => (await app().db.sequelize.query(sql))[0];
const feedRows = () => rows(`SELECT code, role, version FROM feeds ORDER BY code`);
const second = { code: 'M1.TV1.M2', from: 'O1.TV1', to: 'M1.TV1', medium: 'microwave', role: 'main' };

/** A 4xx with an error message: never a 500, never an empty body. */
function refused(r: request.Response, status?: number) {
  expect(r.status, JSON.stringify(r.body)).toBeGreaterThanOrEqual(400);
  expect(r.status, JSON.stringify(r.body)).toBeLessThan(500);
  if (status) expect(r.status).toBe(status);
  expect(typeof r.body.error?.message).toBe('string');
}

describe('codes in the URL', () => {
  // 10,000 characters fit in the request line Node accepts, so they reach the routes.
  const huge = 'A'.repeat(10_000);
  it.each([
    ['get', `/api/sites/${huge}`],
    ['get', `/api/sites/${huge}/impact`],
    ['get', `/api/sites/${huge}/history`],
    ['get', `/api/carriages/${huge}/sources`],
    ['patch', `/api/sites/${huge}`],
    ['delete', `/api/sites/${huge}?version=1`],
  ] as const)('a 10,000-character code: %s %#', async (method, url) => {
    const r = await as(method, url).send(method === 'patch' ? { version: 1, name: 'X' } : undefined);
    refused(r);
    expect(await rows(`SELECT name, version FROM sites WHERE code = 'M1'`)).toEqual([{ name: expect.any(String), version: 1 }]);
  });

  it('a 100,000-character code is refused by the HTTP server before any route', async () => {
    const r = await as('get', `/api/sites/${'A'.repeat(100_000)}/history`);
    expect([414, 431]).toContain(r.status);
  });

  it.each([
    ['get', '/api/carriages/R1.TV1%00/impact'],
    ['get', '/api/carriages/R1.TV1%00/history'],
    ['get', '/api/carriages/R1.TV1%00/sources'],
    ['delete', '/api/carriages/R1.TV1%00?version=1'],
  ] as const)('a NUL in the code: %s %s', async (method, url) => {
    refused(await as(method, url));
    expect(await rows(`SELECT count(*)::int AS n FROM carriages WHERE code = 'R1.TV1'`)).toEqual([{ n: 1 }]);
  });
});

describe('query strings', () => {
  it.each([
    ['confirm given twice', '/api/feeds?confirm=second-main-feed&confirm=second-main-feed'],
    ['confirm as an array', '/api/feeds?confirm[]=second-main-feed'],
    ['confirm as an object', '/api/feeds?confirm[a]=second-main-feed'],
    ['confirm garbage', '/api/feeds?confirm=%00%ff'],
    ['confirm empty', '/api/feeds?confirm='],
    ['confirm in another case', '/api/feeds?confirm=SECOND-MAIN-FEED'],
  ])('a second main feed with %s is a 400 and is not stored', async (_what, url) => {
    const r = await as('post', url).send(second);
    refused(r, 400);
    expect(r.body.error.message).toMatch(/confirm/);
    expect(await rows(`SELECT code FROM feeds WHERE code = 'M1.TV1.M2'`)).toEqual([]);
  });

  it('confirm in the body is an unknown field, not a confirmation', async () => {
    const r = await as('post', '/api/feeds').send({ ...second, confirm: 'second-main-feed' });
    refused(r, 400);
    expect(JSON.stringify(r.body.error)).toMatch(/confirm/);
    expect(await rows(`SELECT code FROM feeds WHERE code = 'M1.TV1.M2'`)).toEqual([]);
  });

  it.each([
    'page=0',
    'page=-1',
    'page=1.5',
    'page=1e400',
    'page=Infinity',
    'page=NaN',
    'page=abc',
    'page[]=1',
    'page=1&page=2',
    'pageSize=0',
    'pageSize=101',
    'pageSize=1e9',
    'pageSize[a]=1',
    'sort=code',
    '__proto__=1',
  ])('history with %s is a 400 naming the parameter', async (query) => {
    const r = await as('get', `/api/sites/R1/history?${query}`);
    refused(r, 400);
    const name = query.match(/^[a-zA-Z_]+/)![0];
    expect(JSON.stringify(r.body.error)).toContain(name);
  });

  it('history at the last page allowed answers an empty page', async () => {
    const r = await as('get', '/api/sites/M1/history?page=1000000&pageSize=100');
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({ items: [], page: 1000000, pageSize: 100 });
  });

  it.each(['limit=0', 'limit=1.5', 'limit=-5', 'limit=1e400', 'limit[]=3', 'limit=1&limit=2', 'q[]=a', 'q[a]=b', 'q=a&q=b', `q=${'x'.repeat(201)}`, 'near=1'])(
    'sources with %s is a 400 naming the parameter',
    async (query) => {
      const r = await as('get', `/api/carriages/R1.TV1/sources?${query}`);
      refused(r, 400);
      expect(JSON.stringify(r.body.error)).toContain(query.match(/^[a-z]+/)![0]);
    },
  );

  it('a NUL in the sources search is a 400', async () => {
    refused(await as('get', '/api/carriages/R1.TV1/sources?q=M%00'), 400);
  });

  it.each(['version[]=1', 'version=1&version=1', 'version=1e400', 'version=1&cascade[]=true', 'version=1&cascade=yes', 'version=1&documents[a]=keep'])(
    'a delete with %s is a 400 and deletes nothing',
    async (query) => {
      const before = await feedRows();
      refused(await as('delete', `/api/feeds/R1.TV1.R?${query}`), 400);
      expect(await feedRows()).toEqual(before);
    },
  );
});

describe('bodies', () => {
  it.each([
    ['an array', [{ version: 1, role: 'main' }]],
    ['a string', 'role=main'],
    ['version as an array', { version: [1], role: 'main' }],
    ['version as a string', { version: '1', role: 'main' }],
    ['version not whole', { version: 1.5, role: 'main' }],
    ['role as an array', { version: 1, role: ['main'] }],
    ['rxChannel as an object', { version: 1, rxChannel: { length: 3 } }],
    ['a huge rxChannel', { version: 1, rxChannel: '3'.repeat(100_000) }],
    ['bearing out of range', { version: 1, bearingDeg: 1e308 }],
    ['via as a string', { version: 1, via: 'M1' }],
    ['via of 10,000 codes', { version: 1, via: Array.from({ length: 10_000 }, (_, i) => `S${i}`) }],
  ])('a feed change with %s is refused and nothing changes', async (_what, body) => {
    const before = await feedRows();
    const r = await as('patch', '/api/feeds/R1.TV1.R?confirm=second-main-feed').send(body as object);
    refused(r);
    expect(await feedRows()).toEqual(before);
  });

  it.each([
    ['a 100,000-character code', { code: 'C'.repeat(100_000), site: 'H1', service: 'TV1' }],
    ['a NUL in the channel', { code: 'H1.TV9', site: 'H1', service: 'TV1', channel: '4\u00001' }],
    ['a frequency of 1e308', { code: 'H1.TV9', site: 'H1', service: 'TV1', frequencyMHz: 1e308 }],
    ['a frequency as a string', { code: 'H1.TV9', site: 'H1', service: 'TV1', frequencyMHz: '634' }],
    ['the service as an array', { code: 'H1.TV9', site: 'H1', service: ['TV1'] }],
  ])('a carriage created with %s is a 4xx and no row', async (_what, body) => {
    refused(await as('post', '/api/carriages').send(body));
    expect(await rows(`SELECT count(*)::int AS n FROM carriages WHERE site_id = (SELECT id FROM sites WHERE code = 'H1')`)).toEqual([{ n: 0 }]);
  });
});

/**
 * Hostile query strings on the analysis and checks read routes: huge values,
 * repeated keys (which the query parser turns into arrays), NUL bytes,
 * numbers beyond range, prototype keys. Each is a 400 naming
 * the field (or a 404 for a code that does not exist), never a 500, and the
 * network is still answered normally afterwards.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { opsNetwork } from '../helpers/ops-network';
import { makeTestApp, type TestApp } from '../helpers/testApp';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
  await t.reset();
  const r = await request(t.app).post('/api/network/import').set(t.auth('engineer')).send(opsNetwork());
  expect(r.status).toBe(200);
});
afterAll(async () => t?.close());

const get = (path: string) => request(t.app).get(path).set(t.auth('viewer'));
const repeat = (key: string, value: string, times: number) => Array.from({ length: times }, () => `${key}=${value}`).join('&');
const long = (n: number) => 'A'.repeat(n);

/** [path, the field the 400 names] */
const BAD: [string, RegExp][] = [
  // carriage search
  [`/api/analysis/carriage-search?q=${long(10_000)}`, /q is at most 200/],
  ['/api/analysis/carriage-search?q=MA&q=TV', /q/],
  ['/api/analysis/carriage-search?q=MA%00TV', /query\.q: must not hold NUL/],
  ['/api/analysis/carriage-search', /q is the text/],
  ['/api/analysis/carriage-search?q=MA&pageSize=1e999', /pageSize/],
  ['/api/analysis/carriage-search?q=MA&pageSize=-1', /pageSize is at least 1/],
  ['/api/analysis/carriage-search?q=MA&pageSize=3&pageSize=4', /pageSize/],
  ['/api/analysis/carriage-search?q=MA&pageSize=99999999999999999999999', /pageSize is a whole number/],
  // kinds=
  [`/api/analysis/spof?${repeat('kinds', 'site', 1000)}`, /kinds is a comma-separated list/],
  [`/api/analysis/spof?kinds=${Array(2000).fill('site').join(',')}`, /kinds is a comma-separated list/],
  ['/api/analysis/spof?kinds=site%00', /query\.kinds: must not hold NUL/],
  ['/api/analysis/spof?kinds=__proto__', /kinds is a comma-separated list/],
  ['/api/analysis/spof?kinds=,,,', /kinds is a comma-separated list/],
  ['/api/analysis/exposure?kinds=site&kinds=feed', /kinds is a comma-separated list/],
  ['/api/analysis/exposure-groups?kinds=constructor', /kinds is a comma-separated list/],
  ['/api/analysis/pairs?kinds=site&kinds=group', /kinds is a comma-separated list/],
  // limit / offset
  ['/api/analysis/exposure?limit=1e999', /limit/],
  ['/api/analysis/exposure?limit=999999999999', /limit is at most/],
  ['/api/analysis/exposure?limit=1&limit=2', /limit/],
  ['/api/analysis/exposure?limit=%00', /limit/],
  ['/api/analysis/exposure?limit=0x7fffffffffffffff', /limit is a whole number/],
  ['/api/analysis/exposure-groups?limit=-5', /limit is at least 1/],
  ['/api/analysis/diversity?limit=10&offset=1e999', /offset/],
  ['/api/analysis/diversity?limit=10&offset=-1', /offset is at least 0/],
  ['/api/analysis/unfed?limit=99999', /limit is at most/],
  ['/api/analysis/unfed?offset=0&offset=1', /offset/],
  ['/api/analysis/unfed?limit=2.5', /limit is a whole number/],
  ['/api/analysis/unfed?__proto__=1', /__proto__|unrecognized|Unrecognized/],
  ['/api/analysis/proposals?limit=1e309', /limit/],
  ['/api/analysis/pairs?limit=abc', /limit/],
  ['/api/checks?limit=10&offset=1e12', /offset is too large/],
  ['/api/checks?limit=1&limit=1', /limit/],
  [`/api/checks?check=${long(5000)}`, /check is a comma-separated list/],
  // format=csv
  ['/api/analysis/exposure?format=csv&format=csv', /format is json or csv/],
  ['/api/analysis/exposure?format=csv%00', /query\.format: must not hold NUL/],
  ['/api/analysis/diversity?format=xlsx', /format is json or csv/],
  ['/api/analysis/unfed?format[]=csv', /format is json or csv|format/],
  ['/api/checks?format=CSV', /format is json or csv/],
  // with=
  ['/api/analysis/exposure?with=names&with=names', /with is names/],
  ['/api/analysis/exposure?with=names%00', /query\.with: must not hold NUL/],
  [`/api/analysis/exposure?with=${long(10_000)}`, /with is names/],
];

describe('hostile query strings on the analysis routes', () => {
  it.each(BAD)('%s is a 400 naming the field', async (path, message) => {
    const r = await get(path);
    expect(r.status).toBe(400);
    expect(r.body.error.message).toMatch(message);
    expect(JSON.stringify(r.body)).not.toMatch(/stack|TypeError|at Object\./);
  });

  it('a code with a NUL byte or 5,000 characters is a 404 or 400, never a 500', async () => {
    for (const path of [
      '/api/carriages/MA.TV%00/chain',
      `/api/carriages/${long(5000)}/chain`,
      '/api/analysis/proposals?carriage=MA.TV%00',
      `/api/analysis/proposals?carriage=${long(5000)}`,
      '/api/feeds/F%00/checks',
    ]) {
      const r = await get(path);
      expect([400, 404], path).toContain(r.status);
      expect(r.body.error.message, path).toBeTruthy();
    }
  });

  it('answers normally afterwards', async () => {
    const r = await get('/api/analysis/carriage-search?q=MA.TV');
    expect(r.status).toBe(200);
    expect(r.body.items.map((i: { code: string }) => i.code)).toEqual(['MA.TV']);
    const spof = await get('/api/analysis/spof?kinds=site,carriage');
    expect(spof.status).toBe(200);
    expect(spof.body.carriages.length).toBeGreaterThan(0);
  });
});

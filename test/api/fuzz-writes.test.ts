/**
 * Hostile requests against every write route of the route table (POST, PUT,
 * PATCH, DELETE, read from the RouteTable specs, so a new route is covered
 * the moment it is registered) and against the importer with CSV files:
 * wrong types, huge strings, deep nesting, the names every object answers
 * to, NUL and lone surrogates, numbers at their extremes, lists where
 * objects go. No answer may be a 500, and a refused request writes nothing
 * (every table's row count and the network version stay as they were).
 *
 * Runs per route: HEADWATER_FUZZ_RUNS (default 100; 1,000 for the full pass).
 * HEADWATER_FUZZ_ROUTES (e.g. "post /api/analysis/reach/sites,post /api/sites")
 * keeps only those routes, for a long pass over new ones.
 */
import fc from 'fast-check';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { smallNetwork } from '../fixtures/small-network';
import { useTestApp } from '../helpers/testApp';

const RUNS = Number(process.env.HEADWATER_FUZZ_RUNS ?? 100);
const ONLY = process.env.HEADWATER_FUZZ_ROUTES?.split(',').map((r) => r.trim().toLowerCase());
/** half a minute per 100 runs per route at most; the full pass on a busy machine takes its time */
const TIMEOUT_MS = Math.max(1_800_000, RUNS * 18_000);
const app = useTestApp({ network: smallNetwork });

const TABLES = ['sites', 'services', 'risk_groups', 'carriages', 'feeds', 'feed_via_sites', 'feed_groups', 'site_groups', 'users', 'audit_log'];

async function snapshot(): Promise<string> {
  const [rows] = await app().db.sequelize.query(
    `SELECT ${TABLES.map((t) => `(SELECT count(*) FROM ${t}) AS ${t}`).join(', ')}, (SELECT version FROM network_state WHERE id = 1) AS version`,
  );
  return JSON.stringify(rows[0]);
}

const RESERVED = fc.constantFrom('__proto__', 'constructor', 'prototype');
const hostileString = fc.oneof(
  fc.string(),
  fc.string({ unit: 'binary' }),
  RESERVED,
  fc.constantFrom('a\u0000b', '\u0000', '\ud800', 'x\udc00y', '=cmd()', "'", '', ' ', '%', '_', "'; DROP TABLE sites; --"),
  fc.integer({ min: 1_000, max: 200_000 }).map((n) => 'x'.repeat(n)),
  fc.integer({ min: 100, max: 100_000 }).map((n) => `${'9'.repeat(n)}x`),
  fc.constantFrom('O1', 'M1', 'R1', 'TV1', 'FM1', 'G-PWR', 'O1.TV1', 'M1.TV1', 'origin', 'relay', 'dtt', 'fm', 'main', 'reserve', 'site', 'feed', 'group', 'admin', 'viewer'),
);
const hostileNumber = fc.oneof(
  fc.double(),
  fc.integer(),
  fc.constantFrom(0, -0, 1, -1, 1e308, -1e308, 5e-324, Number.MAX_SAFE_INTEGER + 2, 2_147_483_648, -2_147_483_649, 360.0000001, 90.5),
);
const leaf = fc.oneof(hostileString, hostileNumber, fc.boolean(), fc.constant(null));
const KEYS = fc.oneof(
  fc.constantFrom('code', 'name', 'role', 'kind', 'lat', 'lon', 'site', 'service', 'from', 'to', 'medium', 'via', 'groups', 'version', 'failed',
    'format', 'sites', 'services', 'carriages', 'feeds', 'email', 'password', 'disabled', 'note', 'households', 'baseVersion'),
  RESERVED,
  fc.string(),
);
const deep = fc.integer({ min: 20, max: 3_000 }).map((depth) => {
  let v: unknown = 1;
  for (let i = 0; i < depth; i++) v = i % 2 ? [v] : { a: v };
  return v;
});
const { value: hostileValue } = fc.letrec((tie) => ({
  value: fc.oneof({ depthSize: 'small' }, leaf, tie('object'), tie('array'), deep),
  object: fc.dictionary(KEYS, tie('value'), { maxKeys: 8 }),
  array: fc.array(tie('value'), { maxLength: 6 }),
}));

/** A body shaped like a real one with hostile parts, or anything at all. */
const body = fc.oneof(
  hostileValue,
  fc.record({ code: hostileString, name: hostileString, role: hostileString, kind: hostileString, lat: hostileNumber, lon: hostileNumber }, { requiredKeys: [] }),
  fc.record({ version: fc.oneof(hostileNumber, hostileString), name: hostileString, note: hostileString, groups: fc.array(hostileString, { maxLength: 4 }) }, { requiredKeys: [] }),
  fc.record({ format: fc.oneof(fc.constant('network/1'), hostileString), sites: fc.array(hostileValue, { maxLength: 4 }), baseVersion: hostileNumber }, { requiredKeys: [] }),
  fc.record({ failed: fc.array(fc.record({ kind: hostileString, code: hostileString }), { maxLength: 4 }) }),
  fc.record({ email: hostileString, password: hostileString, role: hostileString, name: hostileString, disabled: leaf }, { requiredKeys: [] }),
);
const param = fc.oneof(hostileString.filter((s) => s.length < 5_000), fc.integer().map(String));
const query = fc.dictionary(fc.oneof(fc.constantFrom('version', 'cascade', 'dryRun', 'replace', 'undoNewer', 'q'), RESERVED, fc.string({ maxLength: 10 })), fc.oneof(param, fc.constantFrom('true', 'false', '1')), { maxKeys: 3 });

/** Percent-encoding; a lone surrogate has no UTF-8 form, so it is sent as the bytes of one (invalid UTF-8, hostile too). */
const enc = (s: string) => {
  try {
    return encodeURIComponent(s);
  } catch {
    return `${encodeURIComponent(s.replace(/[\ud800-\udfff]/g, ''))}%ED%A0%80`;
  }
};

const fill = (path: string, values: string[]) => {
  let i = 0;
  return path.replace(/:(\w+)/g, () => enc(values[i++] ?? 'X'));
};
const queryString = (q: Record<string, string>) => {
  const parts = Object.entries(q).map(([k, v]) => `${enc(k)}=${enc(v)}`);
  return parts.length ? `?${parts.join('&')}` : '';
};

describe('fuzzing every write route', () => {
  it('lists the write routes, the import and the people among them', () => {
    const writes = app().routes.filter((r) => r.method !== 'get').map((r) => `${r.method} ${r.path}`);
    expect(writes).toEqual(expect.arrayContaining(['post /api/network/import', 'post /api/sites', 'patch /api/feeds/:code', 'delete /api/groups/:code', 'post /api/users']));
  });

  it(`answers no hostile request with a 500 and writes nothing for a refused one (${RUNS} runs per route)`, async () => {
    const writes = app().routes.filter((r) => r.method !== 'get' && (!ONLY || ONLY.includes(`${r.method} ${r.path}`)));
    expect(writes.length, `no write route matches HEADWATER_FUZZ_ROUTES=${ONLY?.join(',')}`).toBeGreaterThan(0);
    for (const spec of writes) {
      const t0 = performance.now();
      let before = await snapshot();
      await fc.assert(
        fc.asyncProperty(body, fc.array(param, { minLength: 2, maxLength: 2 }), query, async (sent, params, q) => {
          const url = fill(spec.path, params) + queryString(q);
          const r = await request(app().app)[spec.method](url).set(app().auth('admin')).set('Content-Type', 'application/json').send(JSON.stringify(sent));
          expect(r.status, `${spec.method} ${url} -> ${r.status} ${r.text.slice(0, 300)}`).toBeLessThan(500);
          const after = await snapshot();
          if (r.status >= 400) expect(after, `${spec.method} ${url} -> ${r.status} changed the database`).toBe(before);
          before = after;
        }),
        { numRuns: RUNS },
      );
      // the record of a full pass (docs/bench/fuzz-*.txt) quotes these lines
      console.log(`fuzz ${spec.method} ${spec.path}: ${RUNS} runs, no 500, no partial write, ${Math.round(performance.now() - t0)} ms`);
    }
  }, TIMEOUT_MS);

  it(`answers no hostile CSV upload with a 500 and imports nothing from a refused one (${RUNS} runs)`, async () => {
    const t0 = performance.now();
    const kinds = fc.constantFrom('sites.csv', 'services.csv', 'groups.csv', 'carriages.csv', 'feeds.csv', 'manifest.csv', 'x.csv', '__proto__.csv');
    const cell = hostileString.map((s) => (s.length > 20_000 ? s.slice(0, 20_000) : s));
    const csv = fc.array(fc.array(fc.oneof(cell, fc.constantFrom('code', 'name', 'role', 'lat', 'lon', 'kind', '"', '""', '\r\n')), { maxLength: 8 }), { maxLength: 6 }).map((rows) =>
      rows.map((r) => r.join(',')).join('\n'),
    );
    let before = await snapshot();
    await fc.assert(
      fc.asyncProperty(fc.array(fc.tuple(kinds, csv), { minLength: 1, maxLength: 3 }), fc.boolean(), async (files, replace) => {
        let req = request(app().app).post(`/api/network/import?replace=${replace}`).set(app().auth('admin'));
        for (const [name, text] of files) req = req.attach('file', Buffer.from(text), name);
        const r = await req;
        expect(r.status, `${r.status} ${r.text.slice(0, 300)}`).toBeLessThan(500);
        const after = await snapshot();
        if (r.status >= 400) expect(after).toBe(before);
        before = after;
      }),
      { numRuns: RUNS },
    );
    console.log(`fuzz CSV upload to post /api/network/import: ${RUNS} runs, no 500, no partial write, ${Math.round(performance.now() - t0)} ms`);
  }, TIMEOUT_MS);
});

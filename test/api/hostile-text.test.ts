/**
 * Codes and text that would break an object map or that PostgreSQL cannot
 * store: the names every JavaScript object answers to as codes and keys,
 * NUL characters and lone surrogates in codes, names, URL parameters and
 * query strings, bodies nested without end. Each is a 4xx naming the field,
 * and nothing is written.
 */
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { smallNetwork } from '../fixtures/small-network';
import { useTestApp } from '../helpers/testApp';
import { countOf, uploadFiles } from '../helpers/upload';

const app = useTestApp({ network: smallNetwork });
const RESERVED = ['__proto__', 'constructor', 'prototype'];
const as = (method: 'get' | 'post' | 'patch' | 'delete', url: string) => request(app().app)[method](url).set(app().auth('engineer'));

describe('reserved names as codes', () => {
  it.each(RESERVED)('refuses %s as a code in a single create, with 400 and no row', async (code) => {
    const r = await as('post', '/api/services').send({ code, name: 'X', kind: 'fm' });
    expect(r.status).toBe(400);
    expect(r.body.error.details[0]).toMatchObject({ field: 'code' });
    expect(await countOf(app(), 'services')).toBe(2);
  });

  it.each(RESERVED)('refuses %s as a code in the URL of every kind of route with 400', async (code) => {
    for (const [method, url] of [
      ['get', `/api/sites/${code}`],
      ['patch', `/api/sites/${code}`],
      ['delete', `/api/sites/${code}?version=1`],
      ['get', `/api/carriages/${code}/chain`],
      ['get', `/api/feeds/${code}/checks`],
    ] as const) {
      const r = await as(method, url).send(method === 'patch' ? { version: 1, name: 'X' } : undefined);
      expect(r.status, `${method} ${url}`).toBe(400);
      expect(r.body.error.details[0].field).toBe('code');
    }
  });

  it.each(RESERVED)('refuses %s as an element of a failure set with 400', async (code) => {
    const r = await as('post', '/api/analysis/reach').send({ failed: [{ kind: 'site', code }] });
    expect(r.status).toBe(400);
  });

  it('refuses __proto__ as a key of a body with 400', async () => {
    const r = await as('post', '/api/services').set('Content-Type', 'application/json').send('{"code":"S9","name":"X","kind":"fm","__proto__":{"admin":true}}');
    expect(r.status).toBe(400);
    expect(r.body.error.details[0].field).toBe('__proto__');
    const patch = await as('patch', '/api/services/TV1').set('Content-Type', 'application/json').send('{"version":1,"constructor":{"name":"x"}}');
    expect(patch.status).toBe(400);
  });

  it('reports a reserved code in an import document and in a CSV file, and imports nothing', async () => {
    const doc = await as('post', '/api/network/import').send({ format: 'network/1', services: [{ code: 'constructor', name: 'X', kind: 'fm' }] });
    expect(doc.status).toBe(422);
    expect(doc.body.errors[0]).toMatchObject({ field: 'code' });
    expect(doc.body.errors[0].message).toMatch(/cannot be __proto__, constructor or prototype/);
    const csv = await uploadFiles(app(), [{ name: 'services.csv', data: 'code,name,kind\nprototype,X,fm\n' }]);
    expect(csv.status).toBe(422);
    expect(csv.body.errors[0]).toMatchObject({ row: 2, field: 'code' });
    expect(await countOf(app(), 'services')).toBe(2);
  });
});

describe('text PostgreSQL cannot store', () => {
  it('answers 400 naming the field for a NUL in a URL code, a query string and a name', async () => {
    const code = await as('get', '/api/sites/O%001');
    expect(code.status).toBe(400);
    expect(code.body.error.details[0].field).toBe('code');
    const q = await as('get', '/api/sites?q=a%00b');
    expect(q.status).toBe(400);
    expect(q.body.error.details[0].field).toBe('query.q');
    const audit = await request(app().app).get('/api/audit?code=a%00').set(app().auth('admin'));
    expect(audit.status).toBe(400);
    const name = await as('post', '/api/services').send({ code: 'S9', name: 'a\u0000b', kind: 'fm' });
    expect(name.status).toBe(400);
    expect(name.body.error.details[0].field).toBe('name');
    const edit = await as('patch', '/api/groups/G-TEL').send({ version: 1, note: 'x\u0000' });
    expect(edit.status).toBe(400);
    expect(await countOf(app(), 'services')).toBe(2);
  });

  it('answers 400 for a lone surrogate in a name, sent as a JSON escape', async () => {
    const r = await as('post', '/api/services').set('Content-Type', 'application/json').send('{"code":"S9","name":"a\\ud800b","kind":"fm"}');
    expect(r.status).toBe(400);
    expect(r.body.error.details[0].field).toBe('name');
    const pair = await as('post', '/api/services').set('Content-Type', 'application/json').send('{"code":"S9","name":"a\\ud83d\\udce1b","kind":"fm"}');
    expect(pair.status).toBe(201);
  });

  it('answers 400 for a NUL in the sign-in e-mail', async () => {
    const r = await request(app().app).post('/api/auth/login').send({ email: 'admin@test.example\u0000', password: 'x' });
    expect(r.status).toBe(400);
  });

  it('reports a NUL in a CSV name as an error of its row and field', async () => {
    const r = await uploadFiles(app(), [{ name: 'services.csv', data: 'code,name,kind\nS9,a\u0000b,fm\n' }]);
    expect(r.status).toBe(422);
    expect(r.body.errors[0]).toMatchObject({ row: 2, field: 'name' });
    expect(await countOf(app(), 'services')).toBe(2);
  });
});

describe('nesting', () => {
  it('answers 400 for a body nested thousands of levels deep', async () => {
    const deep = `${'['.repeat(5_000)}${']'.repeat(5_000)}`;
    const r = await as('post', '/api/analysis/reach').set('Content-Type', 'application/json').send(`{"failed":${deep}}`);
    expect(r.status).toBe(400);
    const doc = await as('post', '/api/network/import').set('Content-Type', 'application/json').send(`{"format":"network/1","sites":[${'{"a":'.repeat(5_000)}1${'}'.repeat(5_000)}]}`);
    expect(doc.status).toBe(400);
  });
});

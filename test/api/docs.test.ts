/**
 * The API's own description at /api/docs: an OpenAPI document generated from
 * the route table and the zod schemas, and a viewer whose files come from
 * this server only.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from '../helpers/testApp';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => t?.close());

interface Op {
  summary: string;
  security?: unknown[];
  parameters: { name: string; in: string; required: boolean }[];
  requestBody?: { content: { 'application/json': { schema: { properties: Record<string, unknown>; required?: string[] } } } };
}

describe('GET /api/docs/openapi.json', () => {
  it('lists every registered route with its method, its roles and the schemas it validates with', async () => {
    const r = await request(t.app).get('/api/docs/openapi.json');
    expect(r.status).toBe(200);
    expect(r.body.openapi).toBe('3.1.0');
    const paths = r.body.paths as Record<string, Record<string, Op>>;
    for (const spec of t.routes) {
      const op = paths[spec.path.replace(/:(\w+)/g, '{$1}')]?.[spec.method];
      expect(op, `${spec.method} ${spec.path}`).toBeDefined();
      expect(!!op.security, `${spec.method} ${spec.path} needs a token`).toBe(spec.roles !== 'public');
    }
    const reach = paths['/api/analysis/reach'].post;
    expect(reach.requestBody!.content['application/json'].schema.required).toEqual(['failed']);
    expect(reach.summary).toMatch(/households/);
    const site = paths['/api/sites'].post.requestBody!.content['application/json'].schema;
    expect(Object.keys(site.properties)).toEqual(expect.arrayContaining(['code', 'name', 'role', 'lat', 'lon', 'households']));
    const list = paths['/api/sites'].get.parameters.map((p) => `${p.in}:${p.name}`);
    expect(list).toEqual(expect.arrayContaining(['query:page', 'query:pageSize', 'query:sort', 'query:role']));
    expect(paths['/api/sites/{code}'].delete.parameters).toEqual(
      expect.arrayContaining([expect.objectContaining({ name: 'code', in: 'path', required: true }), expect.objectContaining({ name: 'version', in: 'query', required: true })]),
    );
    expect(paths['/api/health'].get.security).toBeUndefined();
  });
});

describe('the viewer', () => {
  it('moves /api/docs to /api/docs/ so its files resolve beside it', async () => {
    const r = await request(t.app).get('/api/docs');
    expect(r.status).toBe(301);
    expect(r.headers.location).toBe('/api/docs/');
  });

  it('serves a page that loads only this server\'s files and points at the generated document', async () => {
    const page = await request(t.app).get('/api/docs/');
    expect(page.status).toBe(200);
    expect(page.text).toContain('<title>Headwater API</title>');
    const sources = [...page.text.matchAll(/(?:src|href)="([^"]+)"/g)].map((m) => m[1]).filter((u) => !u.startsWith('#'));
    expect(sources.length).toBeGreaterThan(2);
    for (const u of sources) expect(u, u).not.toMatch(/^(https?:)?\/\//);
    const init = await request(t.app).get('/api/docs/swagger-ui-init.js');
    expect(init.status).toBe(200);
    expect(init.text).toContain('/api/docs/openapi.json');
    const bundle = await request(t.app).get('/api/docs/swagger-ui-bundle.js');
    expect(bundle.status).toBe(200);
    expect(bundle.headers['content-type']).toMatch(/javascript/);
  });

  it('serves nothing else from the viewer\'s folder', async () => {
    for (const f of ['package.json', 'index.html', '..%2Fpackage.json']) {
      const r = await request(t.app).get(`/api/docs/${f}`);
      expect(r.status, f).toBe(404);
      expect(r.body.error.code).toBe('not-found');
    }
  });
});

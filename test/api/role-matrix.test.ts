/**
 * Walks every route the server registers and checks each role's answer:
 * 401 without a token, 403 for a role the route does not allow, and neither
 * for a role it allows. A new route is covered the moment it is registered.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROLES } from '@/shared/api';
import { makeTestApp, type TestApp } from '../helpers/testApp';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
  await t.reset();
});
afterAll(async () => t?.close());

// Signing out ends every token of that person, so those routes are walked last.
const ENDS_SESSIONS = new Set(['/api/auth/logout']);
// A person's own session and password: every role may, and it changes nothing else.
const OWN_ACCOUNT = new Set(['/api/auth/logout', '/api/auth/password']);

const fill = (path: string) => path.replace(/:(\w+)/g, (_m, name) => (name === 'id' ? '999999' : 'NO-SUCH-CODE'));

describe('role matrix', () => {
  it('has routes to walk, including the admin and the analysis ones', () => {
    const paths = t.routes.map((r) => `${r.method} ${r.path}`);
    expect(paths).toContain('get /api/users');
    expect(paths.length).toBeGreaterThan(5);
  });

  it('answers every protected route 401 without a token, 403 to roles it does not allow', async () => {
    const failures: string[] = [];
    const walk = [...t.routes].sort((a, b) => Number(ENDS_SESSIONS.has(a.path)) - Number(ENDS_SESSIONS.has(b.path)));
    for (const spec of walk) {
      if (spec.roles === 'public') continue;
      const url = fill(spec.path);
      const anon = await request(t.app)[spec.method](url).send({});
      if (anon.status !== 401) failures.push(`${spec.method} ${spec.path} without token -> ${anon.status}`);
      for (const role of ROLES) {
        const r = await request(t.app)[spec.method](url).set(t.auth(role)).send({});
        const allowed = spec.roles.includes(role);
        if (allowed && (r.status === 401 || r.status === 403)) failures.push(`${spec.method} ${spec.path} as ${role} (allowed) -> ${r.status}`);
        if (!allowed && r.status !== 403) failures.push(`${spec.method} ${spec.path} as ${role} (not allowed) -> ${r.status}`);
        if (r.status >= 500) failures.push(`${spec.method} ${spec.path} as ${role} -> ${r.status} ${JSON.stringify(r.body)}`);
      }
    }
    expect(failures).toEqual([]);
  });

  it('never lets a viewer change the network or the people', () => {
    // a person's own notice subscription changes neither the network nor the people
    const writable = t.routes.filter((r) => r.method !== 'get' && r.roles !== 'public' && !r.path.startsWith('/api/analysis') && !OWN_ACCOUNT.has(r.path) && r.path !== '/api/subscriptions');
    expect(writable.length).toBeGreaterThan(10);
    for (const spec of writable) expect(spec.roles, `${spec.method} ${spec.path}`).not.toContain('viewer');
  });
});

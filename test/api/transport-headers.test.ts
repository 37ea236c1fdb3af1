/**
 * Plain HTTP on a LAN works: HSTS and upgrade-insecure-requests only over
 * HTTPS (directly, or behind a proxy trusted through TRUST_PROXY), and
 * X-Forwarded-For from an untrusted client cannot reset the sign-in limit.
 */
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { createApp } from '@/server/app';
import { parseTrustProxy } from '@/server/config';
import { useTestApp, emailFor } from '../helpers/testApp';

const getT = useTestApp();

/** The same context, with TRUST_PROXY set as an operator would. */
const behindProxy = (value: string) => {
  const t = getT();
  return createApp({ ...t.ctx, config: { ...t.config, TRUST_PROXY: value } }).app;
};

const csp = (r: request.Response) => String(r.headers['content-security-policy'] ?? '');

describe('security headers follow the transport', () => {
  it('sends no HSTS and no upgrade-insecure-requests over plain HTTP, for the API and the web app', async () => {
    const t = getT();
    for (const path of ['/api/health', '/', '/reach']) {
      const r = await request(t.app).get(path);
      expect(r.headers['strict-transport-security'], path).toBeUndefined();
      expect(csp(r), path).not.toMatch(/upgrade-insecure-requests/);
      expect(csp(r), path).toMatch(/script-src 'self'/);
    }
  });

  it('ignores X-Forwarded-Proto when no proxy is trusted', async () => {
    const t = getT();
    const r = await request(t.app).get('/api/health').set('X-Forwarded-Proto', 'https');
    expect(r.headers['strict-transport-security']).toBeUndefined();
    expect(csp(r)).not.toMatch(/upgrade-insecure-requests/);
  });

  it('sends both behind a trusted proxy that says the request came over HTTPS', async () => {
    const app = behindProxy('loopback');
    const secure = await request(app).get('/api/health').set('X-Forwarded-Proto', 'https');
    expect(secure.headers['strict-transport-security']).toMatch(/max-age=\d+/);
    expect(csp(secure)).toMatch(/upgrade-insecure-requests/);
    const plain = await request(app).get('/api/health').set('X-Forwarded-Proto', 'http');
    expect(plain.headers['strict-transport-security']).toBeUndefined();
    expect(csp(plain)).not.toMatch(/upgrade-insecure-requests/);
  });
});

describe('the sign-in limit and X-Forwarded-For', () => {
  const failOnce = (app: Parameters<typeof request>[0], i: number, forwardedFor: string) =>
    request(app).post('/api/auth/login').set('X-Forwarded-For', forwardedFor).send({ email: emailFor('viewer'), password: `wrong-${i}` });

  it('gives no fresh attempts for an invented X-Forwarded-For when TRUST_PROXY is unset', async () => {
    const t = getT();
    const statuses: number[] = [];
    for (let i = 0; i < 10; i++) statuses.push((await failOnce(t.app, i, `203.0.113.${i + 1}`)).status);
    expect(statuses.slice(0, 9)).toEqual(Array(9).fill(401));
    expect(statuses[9]).toBe(429);
  });

  it('counts per forwarded address when the proxy is trusted', async () => {
    const app = behindProxy('loopback');
    const statuses: number[] = [];
    for (let i = 0; i < 10; i++) statuses.push((await failOnce(app, i, `203.0.113.${i + 1}`)).status);
    expect(statuses).toEqual(Array(10).fill(401));
  });
});

describe('TRUST_PROXY', () => {
  it('is off when unset, empty, 0 or false, and otherwise as Express takes it', () => {
    for (const off of [undefined, '', ' ', '0', 'false']) expect(parseTrustProxy(off)).toBe(false);
    expect(parseTrustProxy('true')).toBe(true);
    expect(parseTrustProxy('2')).toBe(2);
    expect(parseTrustProxy('loopback, 10.0.0.0/8')).toBe('loopback, 10.0.0.0/8');
  });
});

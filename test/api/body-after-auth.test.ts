/**
 * Bodies are parsed only after the token and the role are checked: an
 * anonymous or unauthorised body, however large, malformed or compressed,
 * gets 401/403 without being read, and each route keeps its own limit.
 */
import zlib from 'node:zlib';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { envSchema } from '@/server/config';
import { useTestApp } from '../helpers/testApp';

const getT = useTestApp();

/** `mb` megabytes of spaces (valid JSON whitespace) and then `tail`, gzipped to a few kB. */
function gzipBomb(mb: number, tail: string): Buffer {
  return zlib.gzipSync(Buffer.concat([Buffer.alloc(mb * 1024 * 1024, 0x20), Buffer.from(tail)]), { level: 9 });
}

// supertest would JSON-encode a Buffer sent as application/json; send the bytes as they are
const raw = (body: unknown) => body as string;

describe('body parsing after authentication', () => {
  it('answers bogus JSON from an anonymous caller 401, not 400 (the body is never parsed)', async () => {
    const t = getT();
    for (const path of ['/api/sites', '/api/network/import', '/api/users']) {
      const r = await request(t.app).post(path).set('Content-Type', 'application/json').send('{"not json');
      expect(r.status, path).toBe(401);
      expect(r.body.error.code).toBe('unauthenticated');
    }
  });

  it('answers bogus JSON from a role that may not use the route 403, not 400', async () => {
    const t = getT();
    const r = await request(t.app).post('/api/users').set(t.auth('viewer')).set('Content-Type', 'application/json').send('{"not json');
    expect(r.status).toBe(403);
  });

  it('answers an anonymous body over the small limit 401, not 413', async () => {
    const t = getT();
    const big = '{"name":"' + 'x'.repeat(3 * 1024 * 1024) + '"}';
    const r = await request(t.app).post('/api/sites').set('Content-Type', 'application/json').send(big);
    expect(r.status).toBe(401);
    const signedIn = await request(t.app).post('/api/sites').set(t.auth('engineer')).set('Content-Type', 'application/json').send(big);
    expect(signedIn.status).toBe(413);
  });

  it('answers an anonymous gzip bomb 401 without inflating it (a bogus tail is never reached)', async () => {
    const t = getT();
    const bomb = gzipBomb(40, '{"unfinished":');
    expect(bomb.length).toBeLessThan(100_000);
    const send = (h: Record<string, string>) =>
      request(t.app).post('/api/network/import').set(h).set('Content-Type', 'application/json').set('Content-Encoding', 'gzip').serialize(raw).send(bomb);
    const anon = await send({});
    expect(anon.status).toBe(401);
    expect(anon.body.error.code).toBe('unauthenticated');
    // signed in, the same bytes are inflated and parsed: the bogus tail shows it
    const signedIn = await send(t.auth('engineer'));
    expect(signedIn.status).toBe(400);
    expect(signedIn.body.error.code).toBe('malformed-json');
  });

  it('counts the import limit on the inflated bytes: a gzip inflating past it is 413 for a signed-in engineer', async () => {
    const t = getT();
    // one megabyte past the configured import limit (server/config.ts, "160mb")
    const limitMb = Number.parseInt(envSchema.shape.IMPORT_BODY_LIMIT.parse(undefined), 10);
    expect(limitMb).toBeGreaterThan(0);
    const bomb = gzipBomb(limitMb + 1, '[]');
    const r = await request(t.app).post('/api/network/import').set(t.auth('engineer')).set('Content-Type', 'application/json').set('Content-Encoding', 'gzip').serialize(raw).send(bomb);
    expect(r.status).toBe(413);
    expect(r.body.error.code).toBe('too-large');
  });

  it('gives sign-in a small limit: a 100 kB body is 413, never parsed', async () => {
    const t = getT();
    const r = await request(t.app).post('/api/auth/login').send({ email: 'a@test.example', password: 'x'.repeat(100_000) });
    expect(r.status).toBe(413);
  });
});

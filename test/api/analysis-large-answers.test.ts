/**
 * Answers over a megabyte (the weak points of every carriage, the whole
 * exposure ranking) are written in pieces with turns between them: the bytes
 * are the engine's answer as JSON, the length is declared, and the ETag names
 * the network version so a client that has the answer gets a 304.
 */
import { parse } from 'csv-parse/sync';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { generateNetwork } from '@/scripts/generator';
import { NetworkEngine } from '@/server/engine/engine';
import { appWithNetwork, type TestApp } from '../helpers/testApp';

let t: TestApp;
const doc = generateNetwork({ sites: 2_500, seed: 11 });
beforeAll(async () => {
  t = await appWithNetwork(doc);
}, 180_000);
afterAll(async () => t?.close());

const get = (p: string) => request(t.app).get(p).set(t.auth('viewer')).set('Accept-Encoding', 'identity');

describe('large analysis answers', () => {
  it('the weak points of every carriage: the engine answer byte for byte, its length declared, a version ETag', async () => {
    const r = await get('/api/analysis/spof');
    expect(r.status).toBe(200);
    expect(r.headers['content-type']).toMatch(/^application\/json/);
    const version = r.body.networkVersion as number;
    expect(version).toBeGreaterThan(0);
    const expected = JSON.stringify(NetworkEngine.build(doc, version).spof());
    // more than one piece of a megabyte, so the piecewise path is the one tested
    expect(expected.length).toBeGreaterThan(1 << 20);
    expect(r.text).toBe(expected);
    expect(Number(r.headers['content-length'])).toBe(Buffer.byteLength(expected));
    expect(r.headers.etag).toBe(`W/"network-${version}"`);
    const again = await get('/api/analysis/spof').set('If-None-Match', r.headers.etag);
    expect(again.status).toBe(304);
    expect(again.text).toBe('');
  });

  it('the whole exposure ranking and the first rows agree, and a HEAD request sends no body', async () => {
    const whole = await get('/api/analysis/exposure');
    expect(whole.status).toBe(200);
    expect(whole.text.length).toBeGreaterThan(1 << 20);
    const first = await get('/api/analysis/exposure?limit=25');
    expect(first.status).toBe(200);
    expect(first.body.elements).toEqual(whole.body.elements.slice(0, 25));
    const file = await get('/api/analysis/exposure?format=csv');
    expect(file.status).toBe(200);
    const lines = parse(file.text, { columns: true }) as Record<string, string>[];
    expect(lines).toHaveLength(whole.body.elements.length);
    const firstRow = whole.body.elements[0];
    expect(lines[0]).toMatchObject({ rank: '1', kind: firstRow.element.kind, code: firstRow.element.code, same_loss_as: '', households_lost: String(firstRow.households), carriages_lost: String(firstRow.carriages) });
    expect(lines.map((l) => l.code)).toEqual(whole.body.elements.map((e: { element: { code: string } }) => e.element.code));
    const head = await request(t.app).head('/api/analysis/exposure').set(t.auth('viewer')).set('Accept-Encoding', 'identity');
    expect(head.status).toBe(200);
    expect(Number(head.headers['content-length'])).toBe(Buffer.byteLength(whole.text));
    expect(head.text ?? '').toBe('');
  });

  it('the export of a network over a megabyte: kept in pieces, the same document plain and gzipped, lengths declared', async () => {
    const plain = await get('/api/network/export');
    expect(plain.status).toBe(200);
    expect(plain.text.length).toBeGreaterThan(2 << 20);
    expect(Number(plain.headers['content-length'])).toBe(Buffer.byteLength(plain.text));
    expect(plain.body.sites).toHaveLength(doc.sites.length);
    const zipped = await request(t.app).get('/api/network/export').set(t.auth('viewer')).set('Accept-Encoding', 'gzip');
    expect(zipped.status).toBe(200);
    expect(zipped.headers['content-encoding']).toBe('gzip');
    expect(Number(zipped.headers['content-length'])).toBeLessThan(Buffer.byteLength(plain.text) / 3);
    expect(zipped.text).toBe(plain.text);
  });
});

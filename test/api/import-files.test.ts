/**
 * Import by file upload (JSON, a CSV alone, a zip of CSVs) and export in both
 * formats (docs/format.md): a CSV error names its row, and
 * export -> import into an empty database -> export gives the same document.
 */
import fs from 'node:fs';
import path from 'node:path';
import JSZip from 'jszip';
import request from 'supertest';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import type { NetworkDocument } from '@/shared/schemas/network';
import { smallNetwork } from '../fixtures/small-network';
import { makeTestApp, type TestApp } from '../helpers/testApp';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => t?.close());
beforeEach(async () => t.reset());

const DEMO = path.resolve(__dirname, '../fixtures/demo-network.json');

/** The demo network, the richest document the project ships. */
const sourceNetwork = (): NetworkDocument => JSON.parse(fs.readFileSync(DEMO, 'utf8'));

/** supertest keeps a binary answer as a Buffer only when told how to read it */
const binary = (res: request.Response, done: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => done(null, Buffer.concat(chunks)));
};

const withoutVersion = ({ baseVersion: _version, ...doc }: NetworkDocument) => doc;

const exportJson = async (): Promise<NetworkDocument> => {
  const r = await request(t.app).get('/api/network/export').set(t.auth('viewer'));
  expect(r.status).toBe(200);
  return r.body;
};

const exportZip = async (): Promise<Buffer> => {
  const r = await request(t.app).get('/api/network/export?format=csv').set(t.auth('viewer')).buffer(true).parse(binary);
  expect(r.status).toBe(200);
  expect(r.headers['content-type']).toMatch(/application\/zip/);
  return r.body as Buffer;
};

const upload = (files: Array<{ name: string; data: Buffer | string }>, query = '') => {
  let req = request(t.app).post(`/api/network/import${query}`).set(t.auth('engineer'));
  for (const f of files) req = req.attach('file', Buffer.from(f.data), f.name);
  return req;
};

async function countOf(table: string): Promise<number> {
  const [rows] = await t.db.sequelize.query(`SELECT count(*)::int AS n FROM ${table}`);
  return (rows as { n: number }[])[0].n;
}

describe('export and round trip', () => {
  it('round-trips the demo network (or the small one) through JSON', async () => {
    const source = sourceNetwork();
    const first = await request(t.app).post('/api/network/import').set(t.auth('engineer')).send(source);
    expect(first.status).toBe(200);
    const a = await exportJson();
    for (const kind of ['sites', 'services', 'groups', 'carriages', 'feeds'] as const) {
      expect(a[kind].map((e) => e.code).sort()).toEqual(source[kind].map((e) => e.code).sort());
    }
    await t.reset();
    const again = await request(t.app).post('/api/network/import').set(t.auth('engineer')).send(a);
    expect(again.status).toBe(200);
    const b = await exportJson();
    // each export states the version it was taken at; the network itself is the same
    expect(b.baseVersion).toEqual(expect.any(Number));
    expect(withoutVersion(b)).toEqual(withoutVersion(a));
  });

  it('exports entities sorted by code, with only the fields that are set', async () => {
    await request(t.app).post('/api/network/import').set(t.auth('engineer')).send(smallNetwork());
    const doc = await exportJson();
    expect(doc.format).toBe('network/1');
    expect(doc.sites.map((s) => s.code)).toEqual([...doc.sites.map((s) => s.code)].sort());
    const origin = doc.carriages.find((c) => c.code === 'O1.TV1')!;
    expect(origin).toEqual({ code: 'O1.TV1', site: 'O1', service: 'TV1' });
    expect(doc.feeds.find((f) => f.code === 'M1.FM1.M')!.via).toEqual(['H1']);
  });

  it('round-trips through the CSV zip', async () => {
    await request(t.app).post('/api/network/import').set(t.auth('engineer')).send(sourceNetwork());
    const a = await exportJson();
    const zipped = await exportZip();
    const names = Object.keys((await JSZip.loadAsync(zipped)).files).sort();
    expect(names).toEqual(['carriages.csv', 'feeds.csv', 'groups.csv', 'manifest.csv', 'services.csv', 'sites.csv']);
    await t.reset();
    const r = await upload([{ name: 'network.zip', data: zipped }]);
    expect(r.status).toBe(200);
    expect(r.body.counts.feeds.created).toBe(a.feeds.length);
    expect(withoutVersion(await exportJson())).toEqual(withoutVersion(a));
  });

  it('refuses an unknown export format with 400', async () => {
    const r = await request(t.app).get('/api/network/export?format=xml').set(t.auth('viewer'));
    expect(r.status).toBe(400);
    expect(r.body.error.message).toMatch(/format/);
  });
});

describe('upload', () => {
  it('imports a JSON document sent as a file', async () => {
    // with the byte order mark some editors write
    const r = await upload([{ name: 'network.json', data: `\uFEFF${JSON.stringify(smallNetwork())}` }], '?dryRun=true');
    expect(r.status).toBe(200);
    expect(r.body.dryRun).toBe(true);
    expect(r.body.counts.sites.created).toBe(5);
    expect(await countOf('sites')).toBe(0);
  });

  it('imports one CSV file alone, and several CSV files sent together', async () => {
    const services = 'code,name,kind\nTV9,Test Multiplex,dtt\nFM9,"Radio, Nine",fm\n';
    const alone = await upload([{ name: 'services.csv', data: services }]);
    expect(alone.status).toBe(200);
    expect(alone.body.counts.services).toMatchObject({ received: 2, created: 2 });
    const exported = await exportJson();
    expect(exported.services.find((s) => s.code === 'FM9')!.name).toBe('Radio, Nine');

    const sites = 'code,name,role,lat,lon,groups\nS9,Site Nine,origin,-38.5,-29.5,GX\n';
    const groups = 'code,name,note\nGX,Group X,\n';
    const carriages = 'code,site,service,erpW\nS9.TV9,S9,TV9,1000\n';
    const together = await upload([{ name: 'sites.csv', data: sites }, { name: 'groups.csv', data: groups }, { name: 'carriages.csv', data: carriages }]);
    expect(together.status).toBe(200);
    const doc = await exportJson();
    expect(doc.sites).toEqual([{ code: 'S9', name: 'Site Nine', role: 'origin', lat: -38.5, lon: -29.5, groups: ['GX'] }]);
    expect(doc.carriages).toEqual([{ code: 'S9.TV9', site: 'S9', service: 'TV9', erpW: 1000 }]);
  });

  it('names the file and row (as a spreadsheet numbers it: header = row 1) of a CSV error', async () => {
    const sites = 'code,name,role,lat,lon\nA1,Alpha,origin,-38,-29\nA2,Beta,relay,-38.1,-29.1\nA3,Gamma,relay,-138,-29.2\n';
    const r = await upload([{ name: 'sites.csv', data: sites }]);
    expect(r.status).toBe(422);
    expect(r.body.errors).toEqual([expect.objectContaining({ kind: 'sites', file: 'sites.csv', row: 4, code: 'A3', field: 'lat' })]);
    expect(r.body.errors[0].message).toMatch(/row 4|A3/);
    expect(await countOf('sites')).toBe(0);
  });

  it('reports a CSV error inside a zip with its row too', async () => {
    const zip = new JSZip();
    zip.file('services.csv', 'code,name,kind\nTV1,One,dtt\nTV2,Two,hologram\n');
    const r = await upload([{ name: 'bad.zip', data: await zip.generateAsync({ type: 'nodebuffer' }) }]);
    expect(r.status).toBe(422);
    expect(r.body.errors).toEqual([expect.objectContaining({ kind: 'services', row: 3, code: 'TV2', field: 'kind', rule: 'unknown-enum' })]);
  });

  it('refuses files it cannot read with 422 and a sentence, never a 500', async () => {
    const badJson = await upload([{ name: 'network.json', data: '{"format":' }]);
    expect(badJson.status).toBe(422);
    expect(badJson.body.errors[0]).toMatchObject({ rule: 'invalid-json', file: 'network.json' });
    const unknown = await upload([{ name: 'stations.csv', data: 'code\nX\n' }]);
    expect(unknown.status).toBe(422);
    expect(unknown.body.errors[0].message).toMatch(/stations\.csv/);
    const mixed = await upload([{ name: 'network.json', data: '{}' }, { name: 'sites.csv', data: 'code\n' }]);
    expect(mixed.status).toBe(422);
    const notZip = await upload([{ name: 'network.zip', data: 'not a zip at all' }]);
    expect(notZip.status).toBe(422);
  });

  it('answers 400 for a multipart request without a file field, and 413 for a file over the limit', async () => {
    const none = await request(t.app).post('/api/network/import').set(t.auth('engineer')).field('note', 'no file');
    expect(none.status).toBe(400);
    const wrongField = await request(t.app).post('/api/network/import').set(t.auth('engineer')).attach('document', Buffer.from('{}'), 'n.json');
    expect(wrongField.status).toBe(400);
    const big = Buffer.alloc(Math.ceil(t.config.UPLOAD_LIMIT_MB * 1024 * 1024) + 1, 32);
    const tooLarge = await upload([{ name: 'network.json', data: big }]);
    expect(tooLarge.status).toBe(413);
  });
});

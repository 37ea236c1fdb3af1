/**
 * The JSON export answered from the in-memory model is the same document
 * PostgreSQL holds, and a model that is behind the database is not used.
 */
import http from 'node:http';
import zlib from 'node:zlib';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { drawingJson, warmDrawing } from '@/server/services/exportCache';
import { loadNetworkDocument } from '@/server/services/networkLoader';
import { drawingDocumentSchema, drawingOf } from '@/shared/schemas/drawing';
import { smallNetwork } from '../fixtures/small-network';
import { useTestApp } from '../helpers/testApp';

const app = useTestApp({ network: smallNetwork });
const getT = app;

describe('JSON export', () => {
  it('equals the stored network, from memory when current and from PostgreSQL when the model is behind', async () => {
    const t = app();
    const first = await request(t.app).get('/api/network/export').set(t.auth('viewer'));
    expect(first.status).toBe(200);
    expect(first.headers['content-type']).toMatch(/^application\/json/);
    const stored = await loadNetworkDocument(t.db.sequelize);
    // the export names the version it was made from (a replace-import from it knows what it would undo)
    expect(first.body).toEqual({ ...stored.document, baseVersion: stored.version });
    expect(Number(first.headers['x-network-version'])).toBe(stored.version);
    const again = await request(t.app).get('/api/network/export').set(t.auth('viewer'));
    expect(again.text).toBe(first.text);

    // a change the model has not seen yet: the export reads PostgreSQL
    await t.db.sequelize.query(`UPDATE sites SET name = 'Renamed behind the model' WHERE code = 'R1'`);
    const [rows] = await t.db.sequelize.query('UPDATE network_state SET version = version + 1 WHERE id = 1 RETURNING version');
    const version = Number((rows as { version: number }[])[0].version);
    expect(t.ctx.network.model!.networkVersion).toBeLessThan(version);
    const fresh = await request(t.app).get('/api/network/export').set(t.auth('viewer'));
    expect(Number(fresh.headers['x-network-version'])).toBe(version);
    expect(fresh.body.sites.find((s: { code: string }) => s.code === 'R1').name).toBe('Renamed behind the model');
  });

  it('sends the same bytes gzipped to a client that accepts gzip, and 304 for a matching ETag', async () => {
    const t = getT();
    const plain = await request(t.app).get('/api/network/export').set(t.auth('viewer')).set('Accept-Encoding', 'identity');
    expect(plain.status).toBe(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
    // raw bytes over a real socket: supertest would unzip them on the way
    const server = t.app.listen(0, '127.0.0.1');
    await new Promise((r) => server.once('listening', r));
    const port = (server.address() as { port: number }).port;
    const zipped = await new Promise<{ headers: http.IncomingHttpHeaders; raw: Buffer }>((resolve, reject) => {
      http
        .get({ host: '127.0.0.1', port, path: '/api/network/export', headers: { ...t.auth('viewer'), 'Accept-Encoding': 'gzip, deflate' } }, (res) => {
          const chunks: Buffer[] = [];
          res.on('data', (c: Buffer) => chunks.push(c));
          res.on('end', () => resolve({ headers: res.headers, raw: Buffer.concat(chunks) }));
        })
        .on('error', reject);
    });
    server.close();
    expect(zipped.headers['content-encoding']).toBe('gzip');
    expect(zipped.headers.vary).toMatch(/Accept-Encoding/);
    expect(Number(zipped.headers['content-length'])).toBe(zipped.raw.length);
    expect(zlib.gunzipSync(zipped.raw).toString()).toBe(plain.text);
    const stored = await loadNetworkDocument(t.db.sequelize);
    expect(JSON.parse(plain.text)).toEqual({ ...stored.document, baseVersion: stored.version });

    const etag = plain.headers.etag;
    expect(etag).toMatch(/^"v\d+-/);
    const again = await request(t.app).get('/api/network/export').set(t.auth('viewer')).set('If-None-Match', etag);
    expect(again.status).toBe(304);
    // an edit makes a new version, and a new ETag
    const current = await request(t.app).get('/api/sites/R1').set(t.auth('engineer'));
    const edit = await request(t.app).patch('/api/sites/R1').set(t.auth('engineer')).send({ version: current.body.site.version, name: 'Renamed relay' });
    expect(edit.status).toBe(200);
    const changed = await request(t.app).get('/api/network/export').set(t.auth('viewer')).set('If-None-Match', etag);
    expect(changed.status).toBe(200);
    expect(changed.headers.etag).not.toBe(etag);
    expect(changed.body.sites.find((s: { code: string }) => s.code === 'R1').name).toBe('Renamed relay');
  });

  it("answers the diagram's columns of the stored network to a viewer, with its own ETag, and follows an edit", async () => {
    const t = getT();
    const first = await request(t.app).get('/api/network/drawing').set(t.auth('viewer'));
    expect(first.status).toBe(200);
    expect(first.headers['content-type']).toMatch(/^application\/json/);
    const stored = await loadNetworkDocument(t.db.sequelize);
    expect(drawingDocumentSchema.parse(first.body)).toEqual(drawingOf(stored.document, stored.version));
    expect(first.body.sites.code).toEqual(stored.document.sites.map((s) => s.code));
    expect(Number(first.headers['x-network-version'])).toBe(stored.version);
    const etag = first.headers.etag;
    expect(etag).toMatch(/^"drawing-v\d+-/);
    const exported = await request(t.app).get('/api/network/export').set(t.auth('viewer'));
    expect(exported.headers.etag).not.toBe(etag);
    expect((await request(t.app).get('/api/network/drawing').set(t.auth('viewer')).set('If-None-Match', etag)).status).toBe(304);

    const current = await request(t.app).get('/api/sites/R2').set(t.auth('engineer'));
    const edit = await request(t.app).patch('/api/sites/R2').set(t.auth('engineer')).send({ version: current.body.site.version, name: 'Relay Two renamed' });
    expect(edit.status).toBe(200);
    const changed = await request(t.app).get('/api/network/drawing').set(t.auth('viewer')).set('If-None-Match', etag);
    expect(changed.status).toBe(200);
    expect(changed.body.sites.name[changed.body.sites.code.indexOf('R2')]).toBe('Relay Two renamed');
    const after = await loadNetworkDocument(t.db.sequelize);
    expect(after.document.sites.find((s) => s.code === 'R2')?.name).toBe('Relay Two renamed');
    expect(changed.body.networkVersion).toBe(after.version);
  });

  it('makes the diagram\'s columns ahead of the first request when warmed (start-up), and the request is answered with those bytes', async () => {
    const t = getT();
    const warmed = await warmDrawing(t.ctx);
    expect(warmed).not.toBeNull();
    const stored = await loadNetworkDocument(t.db.sequelize);
    expect(warmed!.version).toBe(stored.version);
    expect(await drawingJson(t.ctx)).toBe(warmed);
    const answer = await request(t.app).get('/api/network/drawing').set(t.auth('viewer'));
    expect(answer.status).toBe(200);
    expect(answer.headers.etag).toBe(warmed!.etag);
    expect(JSON.parse(Buffer.concat(warmed!.body).toString('utf8'))).toEqual(drawingOf(stored.document, stored.version));
  });
});

/**
 * Documents on sites and feeds against the object-store stand-in started by
 * the test frame (s3rver through the real AWS SDK): round trip with checksum
 * and presigned download, previews, types decided from bytes, size limit,
 * roles, a failure half-way, and the owner's delete asking what to do.
 */
import crypto from 'node:crypto';
import http from 'node:http';
import zlib from 'node:zlib';
import request from 'supertest';
import sharp from 'sharp';
import { beforeEach, describe, expect, it } from 'vitest';
import { DocumentRow } from '@/server/db/models/documents';
import { smallNetwork } from '../fixtures/small-network';
import { useTestApp, type TestApp } from '../helpers/testApp';

const app = useTestApp({ network: smallNetwork });
let t: TestApp;
beforeEach(() => {
  t = app();
});

const PDF = Buffer.from('%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n');
const photo = () => sharp({ create: { width: 800, height: 600, channels: 3, background: { r: 40, g: 120, b: 200 } } }).jpeg().toBuffer();
const sha = (b: Buffer) => crypto.createHash('sha256').update(b).digest('hex');
const objectKeys = () => t.ctx.objects!.keys();

const upload = (path: string, bytes: Buffer, name: string, role: 'admin' | 'engineer' | 'operator' | 'viewer' = 'operator') =>
  request(t.app).post(path).set(t.auth(role)).attach('file', bytes, { filename: name, contentType: 'application/octet-stream' });

describe('documents', () => {
  it('round trip: upload a photo, list it, download the same bytes through a presigned link, preview, delete', async () => {
    const bytes = await photo();
    const up = await upload('/api/sites/M1/documents', bytes, 'mast north face.jpg');
    expect(up.status).toBe(201);
    expect(up.body).toMatchObject({ name: 'mast north face.jpg', type: 'image/jpeg', size: bytes.length, sha256: sha(bytes), createdBy: 'operator@test.example', preview: true });
    const rows = await DocumentRow.findAll();
    expect(rows.map((r) => [r.ownerKind, r.ownerCode, r.sha256])).toEqual([['sites', 'M1', sha(bytes)]]);
    expect((await objectKeys()).sort()).toEqual([rows[0].objectKey, rows[0].previewKey].sort());

    const list = await request(t.app).get('/api/sites/M1/documents').set(t.auth('viewer'));
    expect(list.status).toBe(200);
    expect(list.body.items).toEqual([up.body]);

    const link = await request(t.app).get(`/api/sites/M1/documents/${up.body.id}`).set(t.auth('viewer'));
    expect(link.status).toBe(302);
    expect(link.headers.location).toMatch(/X-Amz-Signature=/);
    const fetched = Buffer.from(await (await fetch(link.headers.location)).arrayBuffer());
    expect(sha(fetched)).toBe(sha(bytes));

    const preview = await request(t.app).get(`/api/sites/M1/documents/${up.body.id}/preview`).set(t.auth('viewer')).buffer(true);
    expect(preview.status).toBe(200);
    const meta = await sharp(preview.body as Buffer).metadata();
    expect(Math.max(meta.width!, meta.height!)).toBe(320);

    const del = await request(t.app).delete(`/api/sites/M1/documents/${up.body.id}`).set(t.auth('engineer'));
    expect(del.status).toBe(204);
    expect(await DocumentRow.count()).toBe(0);
    expect(await objectKeys()).toEqual([]);
    const gone = await request(t.app).get(`/api/sites/M1/documents/${up.body.id}`).set(t.auth('viewer'));
    expect(gone.status).toBe(404);
    expect(gone.body.error.message).toMatch(/no document/);
  });

  it('decides the type from the bytes: PDF, CSV text; a lying extension or an unknown type is 415', async () => {
    const pdf = await upload('/api/feeds/M1.TV1.M/documents', PDF, 'path profile.pdf');
    expect(pdf.status).toBe(201);
    expect(pdf.body).toMatchObject({ type: 'application/pdf', preview: false });
    const csv = await upload('/api/feeds/M1.TV1.M/documents', Buffer.from('bearing,level\n210,-62\n'), 'levels.csv');
    expect(csv.body).toMatchObject({ type: 'text/csv' });

    const lying = await upload('/api/sites/M1/documents', PDF, 'photo.jpg');
    expect(lying.status).toBe(415);
    expect(lying.body.error.message).toMatch(/name says \.jpg .* but the bytes are PDF/);
    const zip = await upload('/api/sites/M1/documents', Buffer.from('504b0304140000000800', 'hex'), 'notes.txt');
    expect(zip.status).toBe(415);
    const binary = await upload('/api/sites/M1/documents', Buffer.from([0x00, 0xff, 0x10, 0x80, 0x00]), 'blob.bin');
    expect(binary.status).toBe(415);
    const brokenImage = await upload('/api/sites/M1/documents', (await photo()).subarray(0, 200), 'cut.jpg');
    expect(brokenImage.status).toBe(415);
    expect(await DocumentRow.count({ where: { ownerKind: 'sites' } })).toBe(0);
    expect((await objectKeys()).length).toBe(2);
  });

  it('refuses over-size (413), a viewer (403), a missing owner or document (404), each with a message', async () => {
    const big = await upload('/api/sites/M1/documents', Buffer.alloc(25 * 1024 * 1024 + 10, 0x41), 'huge.txt');
    expect(big.status).toBe(413);
    expect(big.body.error.message).toMatch(/at most 25 MB/);
    const viewer = await upload('/api/sites/M1/documents', PDF, 'a.pdf', 'viewer');
    expect(viewer.status).toBe(403);
    expect(viewer.body.error.message).toMatch(/roles/);
    const noSite = await upload('/api/sites/NOPE/documents', PDF, 'a.pdf');
    expect(noSite.status).toBe(404);
    expect(noSite.body.error.message).toMatch(/no site with code NOPE/);
    const noFile = await request(t.app).post('/api/sites/M1/documents').set(t.auth('operator')).send({});
    expect(noFile.status).toBe(400);
    expect(noFile.body.error.message).toMatch(/field named "file"/);
    expect(await DocumentRow.count()).toBe(0);
    expect(await objectKeys()).toEqual([]);
  });

  it('a failure after the object is written leaves no row and no object', async () => {
    await t.db.sequelize.query(`
      CREATE OR REPLACE FUNCTION test_refuse_document() RETURNS trigger AS $$ BEGIN RAISE EXCEPTION 'refused by test'; END $$ LANGUAGE plpgsql;
      CREATE TRIGGER test_refuse_document BEFORE INSERT ON documents FOR EACH ROW EXECUTE FUNCTION test_refuse_document();`);
    try {
      const r = await upload('/api/sites/M1/documents', await photo(), 'mast.jpg');
      expect(r.status).toBe(503);
      expect(r.body.error.message).toMatch(/nothing was kept/);
      expect(JSON.stringify(r.body)).not.toMatch(/refused by test|documents|INSERT/);
    } finally {
      await t.db.sequelize.query('DROP TRIGGER test_refuse_document ON documents; DROP FUNCTION test_refuse_document();');
    }
    expect(await DocumentRow.count()).toBe(0);
    expect(await objectKeys()).toEqual([]);
  });

  it("deleting a site with documents asks: 409 naming the count, then documents=keep or documents=delete", async () => {
    await upload('/api/sites/H1/documents', PDF, 'survey.pdf');
    await upload('/api/sites/H1/documents', await photo(), 'cabin.jpg');
    const version = 1;
    // H1 carries a feed via it: cascade, and its documents
    const refused = await request(t.app).delete(`/api/sites/H1?version=${version}&cascade=true`).set(t.auth('engineer'));
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(/site H1 has 2 documents; .*documents=delete.*documents=keep/);
    expect(refused.body.error.details).toEqual({ documents: 2 });
    expect((await request(t.app).get('/api/sites/H1').set(t.auth('viewer'))).status).toBe(200);

    const bad = await request(t.app).delete(`/api/sites/H1?version=${version}&cascade=true&documents=maybe`).set(t.auth('engineer'));
    expect(bad.status).toBe(400);

    const ok = await request(t.app).delete(`/api/sites/H1?version=${version}&cascade=true&documents=delete`).set(t.auth('engineer'));
    expect(ok.status).toBe(200);
    expect(await DocumentRow.count()).toBe(0);
    for (let i = 0; i < 50 && (await objectKeys()).length > 0; i++) await new Promise((r) => setTimeout(r, 50));
    expect(await objectKeys()).toEqual([]);
  });

  it('documents=keep leaves the rows and objects in place', async () => {
    await upload('/api/sites/R2/documents', PDF, 'licence.pdf');
    const version = 1;
    const ok = await request(t.app).delete(`/api/sites/R2?version=${version}&cascade=true&documents=keep`).set(t.auth('engineer'));
    expect(ok.status).toBe(200);
    expect((await DocumentRow.findAll()).map((r) => r.ownerCode)).toEqual(['R2']);
    expect((await objectKeys()).length).toBe(1);
  });
});

/** A PNG whose header claims width x height pixels, with almost no image data: what a decompression bomb looks like to a decoder. */
function pngClaiming(width: number, height: number): Buffer {
  const crcTable = Array.from({ length: 256 }, (_, n) => {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    return c >>> 0;
  });
  const crc = (b: Buffer) => {
    let c = 0xffffffff;
    for (const x of b) c = crcTable[(c ^ x) & 0xff] ^ (c >>> 8);
    return (c ^ 0xffffffff) >>> 0;
  };
  const chunk = (type: string, data: Buffer) => {
    const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
    const out = Buffer.alloc(8 + data.length + 4);
    out.writeUInt32BE(data.length, 0);
    body.copy(out, 4);
    out.writeUInt32BE(crc(body), 8 + data.length);
    return out;
  };
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr.set([8, 2, 0, 0, 0], 8); // 8-bit RGB
  return Buffer.concat([Buffer.from('89504e470d0a1a0a', 'hex'), chunk('IHDR', ihdr), chunk('IDAT', zlib.deflateSync(Buffer.alloc(64))), chunk('IEND', Buffer.alloc(0))]);
}

describe('documents refuse uploads that lie', () => {
  const nothingKept = async () => {
    expect(await DocumentRow.count()).toBe(0);
    expect(await objectKeys()).toEqual([]);
  };

  it('refuses an image whose header claims a billion pixels (415) without decoding it', async () => {
    const r = await upload('/api/sites/M1/documents', pngClaiming(40_000, 40_000), 'huge.png');
    expect(r.status).toBe(415);
    expect(r.body.error.message).toMatch(/image could not be read/);
    await nothingKept();
  });

  it('refuses a photo named as a PDF, and a text file named as a photo (415)', async () => {
    const asPdf = await upload('/api/sites/M1/documents', await photo(), 'survey.pdf');
    expect(asPdf.status).toBe(415);
    expect(asPdf.body.error.message).toMatch(/name says \.pdf .* but the bytes are JPEG image/);
    const asPhoto = await upload('/api/sites/M1/documents', Buffer.from('just words\n'), 'mast.png');
    expect(asPhoto.status).toBe(415);
    expect(asPhoto.body.error.message).toMatch(/name says \.png .* but the bytes are plain text/);
    await nothingKept();
  });

  it('refuses a body that declares more than the limit (413) before reading it', async () => {
    const server = t.app.listen(0);
    try {
      const { port } = server.address() as import('node:net').AddressInfo;
      const answer = await new Promise<{ status: number; body: string }>((resolve, reject) => {
        const req = http.request(
          { port, method: 'POST', path: '/api/sites/M1/documents', headers: { ...t.auth('operator'), 'content-type': 'multipart/form-data; boundary=x', 'content-length': String(200 * 1024 * 1024) } },
          (res) => {
            let body = '';
            res.on('data', (d) => (body += d));
            res.on('end', () => resolve({ status: res.statusCode!, body }));
          },
        );
        req.on('error', reject);
        req.write('--x\r\nContent-Disposition: form-data; name="file"; filename="a.txt"\r\n\r\nabc');
      });
      expect(answer.status).toBe(413);
      expect(JSON.parse(answer.body).error.message).toMatch(/at most 25 MB/);
    } finally {
      server.closeAllConnections();
      server.close();
    }
    await nothingKept();
  });

  it('refuses two files, a cut-off multipart body, and a bad owner or id, each with a 4xx', async () => {
    const two = await request(t.app).post('/api/sites/M1/documents').set(t.auth('operator')).attach('file', PDF, 'a.pdf').attach('file', PDF, 'b.pdf');
    expect(two.status).toBe(400);
    expect(two.body.error.message).toMatch(/one file/);
    const cut = await request(t.app)
      .post('/api/sites/M1/documents')
      .set(t.auth('operator'))
      .set('content-type', 'multipart/form-data; boundary=x')
      .send('--x\r\nContent-Disposition: form-data; name="file"; filename="a.txt"\r\n\r\nabc');
    expect(cut.status).toBe(400);
    const proto = await upload('/api/sites/__proto__/documents', PDF, 'a.pdf');
    expect(proto.status).toBe(400);
    for (const id of ['-1', '1e3', '99999999999999999999', '0x10']) {
      const r = await request(t.app).get(`/api/sites/M1/documents/${id}`).set(t.auth('viewer'));
      expect(r.status, id).toBe(404);
    }
    await nothingKept();
  });

  it('keeps only the last part of a file name that climbs folders', async () => {
    const r = await upload('/api/sites/M1/documents', Buffer.from('levels\n'), '..\\..\\../etc/levels.txt');
    expect(r.status).toBe(201);
    expect(r.body.name).toBe('levels.txt');
    const [row] = await DocumentRow.findAll();
    expect(row.name).toBe('levels.txt');
    expect(row.objectKey).not.toContain('..');
  });
});

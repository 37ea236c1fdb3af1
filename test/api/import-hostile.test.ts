/**
 * Hostile uploads: cells built to make a pattern backtrack, files with more
 * problems than a report lists. Each answer is a quick 4xx with a bounded
 * body, and nothing is written.
 */
import request from 'supertest';
import { describe, expect, it, vi } from 'vitest';
import { MAX_REPORTED_ISSUES } from '@/shared/schemas/import';
import { UPLOAD_LIMITS } from '@/server/interchange/limits';
import { CsvKindReader, MAX_RECORD_SEPARATORS } from '@/server/interchange/csv-read';
import { smallNetwork } from '../fixtures/small-network';
import { useTestApp } from '../helpers/testApp';
import { countOf, uploadFiles } from '../helpers/upload';
import { buildZip } from '../helpers/zip';

const SITES_HEADER = 'code,name,role,lat,lon\n';
/** A sites.csv of about `bytes` bytes, in rows long enough to stay under the row limit: one row repeated. */
const bigSites = (bytes: number) => {
  const row = `S1,${'Site '.repeat(40)},origin,0,0\n`;
  return SITES_HEADER + row.repeat(Math.ceil(bytes / row.length));
};

const app = useTestApp();

describe('long cells', () => {
  it('answers a 100 KB digit run in a number column quickly, without quoting it back', async () => {
    const cell = `${'1'.repeat(100_000)}x`;
    const started = Date.now();
    const r = await uploadFiles(app(), [{ name: 'sites.csv', data: `code,name,role,lat,lon\nS1,One,origin,${cell},0\n` }]);
    const took = Date.now() - started;
    expect(r.status).toBe(422);
    expect(r.body.errors).toEqual([expect.objectContaining({ file: 'sites.csv', row: 2, field: 'lat', rule: 'wrong-type' })]);
    expect(r.text.length).toBeLessThan(2_000);
    // the backtracking pattern took about 24 s here; a linear one takes milliseconds
    expect(took).toBeLessThan(3_000);
    expect(await countOf(app(), 'sites')).toBe(0);
  });
});

describe('many problems', () => {
  it(`lists the first ${MAX_REPORTED_ISSUES} errors and counts the rest`, async () => {
    const rows = Array.from({ length: 2_500 }, (_, i) => `S${i},Site ${i},nowhere,0,0`).join('\n');
    const r = await uploadFiles(app(), [{ name: 'sites.csv', data: `code,name,role,lat,lon\n${rows}\n` }]);
    expect(r.status).toBe(422);
    expect(r.body.errors).toHaveLength(MAX_REPORTED_ISSUES);
    expect(r.body.moreErrors).toBe(1_500);
    expect(r.body.errors[0]).toMatchObject({ row: 2, code: 'S0', rule: 'unknown-enum' });
    expect(await countOf(app(), 'sites')).toBe(0);
  });

  it('caps a JSON document report the same way', async () => {
    const sites = Array.from({ length: 1_200 }, (_, i) => ({ code: `S${i}`, name: `Site ${i}`, role: 'origin', lat: 99, lon: 0 }));
    const r = await request(app().app).post('/api/network/import').set(app().auth('engineer')).send({ format: 'network/1', sites });
    expect(r.status).toBe(422);
    expect(r.body.errors).toHaveLength(MAX_REPORTED_ISSUES);
    expect(r.body.moreErrors).toBe(200);
  });
});

describe('zips and the memory budget', () => {
  const over = UPLOAD_LIMITS.maxBytes + 1024 * 1024;

  it('refuses a small zip that honestly declares more than the limit with 413, before inflating it', async () => {
    const zip = buildZip([{ name: 'sites.csv', data: 'x'.repeat(over) }]);
    expect(zip.length).toBeLessThan(700_000);
    const r = await uploadFiles(app(), [{ name: 'net.zip', data: zip }]);
    expect(r.status).toBe(413);
    expect(r.body.error.code).toBe('too-large');
    expect(r.body.error.message).toMatch(/64 MB/);
    expect(await countOf(app(), 'sites')).toBe(0);
  });

  it('refuses a zip whose directory understates an entry with 422, never a 500', async () => {
    const zip = buildZip([{ name: 'sites.csv', data: bigSites(over), declaredSize: 100 }]);
    const r = await uploadFiles(app(), [{ name: 'net.zip', data: zip }]);
    expect(r.status).toBe(422);
    expect(r.body.errors).toEqual([expect.objectContaining({ rule: 'bad-zip', file: 'net.zip' })]);
    expect(await countOf(app(), 'sites')).toBe(0);
  });

  it('counts real bytes across all files of one request: two zips under the limit alone, over it together', async () => {
    const half = Math.ceil(over / 2);
    const services = 'code,name,kind\n' + `TV,${'Multiplex '.repeat(20)},dtt\n`.repeat(Math.ceil(half / 210));
    const r = await uploadFiles(app(), [
      { name: 'a.zip', data: buildZip([{ name: 'sites.csv', data: bigSites(half) }]) },
      { name: 'b.zip', data: buildZip([{ name: 'services.csv', data: services }]) },
    ]);
    expect(r.status).toBe(413);
    expect(await countOf(app(), 'sites')).toBe(0);
  });

  it('stops at the row limit', async () => {
    const rows = 'S1,Site,origin,0,0\n'.repeat(UPLOAD_LIMITS.maxRecords + 1);
    const r = await uploadFiles(app(), [{ name: 'net.zip', data: buildZip([{ name: 'sites.csv', data: SITES_HEADER + rows }]) }]);
    expect(r.status).toBe(413);
    expect(r.body.error.message).toMatch(/500,000 rows/);
  });

  it('never quotes a huge header cell back: it is cut to a few dozen characters', async () => {
    const header = `${'h'.repeat(200_000)},code,name,role,lat,lon\n`;
    const r = await uploadFiles(app(), [{ name: 'net.zip', data: buildZip([{ name: 'sites.csv', data: header }]) }]);
    expect(r.status).toBe(422);
    expect(r.body.errors[0]).toMatchObject({ rule: 'unknown-column' });
    expect(r.body.errors[0].field.length).toBeLessThanOrEqual(40);
    expect(r.text.length).toBeLessThan(2_000);
  });

  it('refuses a row longer than any valid one without reading the file further', async () => {
    const text = SITES_HEADER + `S1,${'n'.repeat(UPLOAD_LIMITS.maxRecordChars + 10)},origin,0,0\n` + 'S2,Two,origin,0,0\n';
    const r = await uploadFiles(app(), [{ name: 'sites.csv', data: text }]);
    expect(r.status).toBe(422);
    expect(r.body.errors, JSON.stringify(r.body.errors)).toEqual([expect.objectContaining({ rule: 'csv-syntax', row: 2 })]);
    expect(r.text.length).toBeLessThan(2_000);
  });
});

describe('wide rows and long files', () => {
  const tooMany = new RegExp(`^sites\\.csv row 2 holds more than ${MAX_RECORD_SEPARATORS.toLocaleString('en')} separators`);

  /** A sites.csv whose row 2 is too wide: one csv-syntax error naming the limit, and no site stored. */
  async function expectTooWide(text: string) {
    const r = await uploadFiles(app(), [{ name: 'sites.csv', data: text }]);
    expect(r.status).toBe(422);
    expect(r.body.errors).toEqual([expect.objectContaining({ file: 'sites.csv', row: 2, rule: 'csv-syntax' })]);
    expect(r.body.errors[0].message).toMatch(tooMany);
    expect(await countOf(app(), 'sites')).toBe(0);
  }

  it('refuses a row of a million bare separators at once, without building a cell for each', async () => {
    await expectTooWide(`${SITES_HEADER}S1,One,origin,0,0${','.repeat(1_000_000)}\nS2,Two,origin,0,0\n`);
  });

  it('counts the separators of a whole record, when quoted line breaks cut it into short lines', async () => {
    const piece = `${','.repeat(MAX_RECORD_SEPARATORS / 2)}"a\nb"`;
    await expectTooWide(`${SITES_HEADER}S1,One,origin,0,0${piece.repeat(3)}\n`);
  });

  it('leaves separators inside quotes out of the count: such a record reaches the field checks', async () => {
    const text = `code,name,note\nG1,One,"${','.repeat(MAX_RECORD_SEPARATORS + 1)}"\n`;
    const r = await uploadFiles(app(), [{ name: 'groups.csv', data: text }]);
    expect(r.status).toBe(422);
    expect(r.body.errors).toEqual([expect.objectContaining({ file: 'groups.csv', row: 2, field: 'note', rule: 'wrong-length' })]);
    expect(await countOf(app(), 'risk_groups')).toBe(0);
  });

  it('reads a large CSV file in pieces, giving other work a turn between them', async () => {
    const read = CsvKindReader.prototype.record;
    let first = true;
    let turned = false;
    let recordsAfterATurn = 0;
    const spy = vi.spyOn(CsvKindReader.prototype, 'record').mockImplementation(function (this: CsvKindReader, cells: string[]) {
      if (first) {
        first = false;
        setImmediate(() => (turned = true));
      } else if (turned) recordsAfterATurn++;
      read.call(this, cells);
    });
    try {
      const r = await uploadFiles(app(), [{ name: 'sites.csv', data: bigSites(1_000_000) }]);
      expect(r.status).toBe(422);
      expect(r.body.errors[0]).toMatchObject({ rule: 'duplicate-code', row: 3 });
    } finally {
      spy.mockRestore();
    }
    expect(first).toBe(false);
    expect(recordsAfterATurn).toBeGreaterThan(0);
    expect(await countOf(app(), 'sites')).toBe(0);
  });
});

describe('multipart limits', () => {
  it('refuses a form with too many fields with 400', async () => {
    let req = request(app().app).post('/api/network/import').set(app().auth('engineer'));
    for (let i = 0; i < 30; i++) req = req.field(`f${i}`, 'x');
    const r = await req.attach('file', Buffer.from(JSON.stringify(smallNetwork())), 'n.json');
    expect(r.status).toBe(400);
    expect(await countOf(app(), 'sites')).toBe(0);
  });

  it('refuses a large form field with 400', async () => {
    const r = await request(app().app).post('/api/network/import').set(app().auth('engineer')).field('note', 'x'.repeat(100_000)).attach('file', Buffer.from('{}'), 'n.json');
    expect(r.status).toBe(400);
  });
});

describe('imports take turns', () => {
  it('runs imports one at a time: a crowd beyond the waiting room is told 429 with Retry-After, the rest all complete', async () => {
    const doc = JSON.stringify(smallNetwork());
    const answers = await Promise.all(Array.from({ length: 10 }, () => uploadFiles(app(), [{ name: 'n.json', data: doc }])));
    const refused = answers.filter((r) => r.status === 429);
    const done = answers.filter((r) => r.status === 200);
    expect(refused.length).toBeGreaterThan(0);
    expect(refused[0].headers['retry-after']).toBe('10');
    expect(refused[0].body.error.code).toBe('import-busy');
    expect(done.length + refused.length).toBe(10);
    const [rows] = await app().db.sequelize.query(`SELECT count(*)::int AS n FROM audit_log WHERE action = 'import'`);
    // the first import creates the network; the others change nothing and are recorded all the same
    expect((rows as { n: number }[])[0].n).toBe(done.length);
  });
});

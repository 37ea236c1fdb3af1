/**
 * Hostile uploads: cells built to make a pattern backtrack (the number check
 * reads them in one pass: counted, not timed), files with more problems than
 * a report lists. Each answer is a quick 4xx with a bounded
 * body, and nothing is written.
 */
import request from 'supertest';
import { describe, expect, it, vi } from 'vitest';
import fc from 'fast-check';
import { isDecimal, scanDecimal } from '@/server/interchange/decimal';
import { MAX_REPORTED_ISSUES } from '@/shared/schemas/import';
import { formatBytes, formatCount } from '@/shared/format';
import { UPLOAD_LIMITS } from '@/server/interchange/limits';
import { CsvKindReader, MAX_RECORD_SEPARATORS } from '@/server/interchange/csv-read';
import { smallNetwork } from '../fixtures/small-network';
import { useTestApp } from '../helpers/testApp';
import { countOf, uploadFiles } from '../helpers/upload';
import { buildZip } from '../helpers/zip';
import { generateNetwork } from '@/scripts/generator';
import { SMALL_BODY_BYTES } from '@/server/http/jsonInTurns';
import { Tokenizer } from '@streamparser/json';

const SITES_HEADER = 'code,name,role,lat,lon\n';
/** A sites.csv of about `bytes` bytes, in rows long enough to stay under the row limit: one row repeated. */
const bigSites = (bytes: number) => {
  const row = `S1,${'Site '.repeat(40)},origin,0,0\n`;
  return SITES_HEADER + row.repeat(Math.ceil(bytes / row.length));
};

const app = useTestApp();

/** The numbers a CSV number column takes, as a pattern: the definition the one-pass check is compared with, on short cells only. */
const DECIMAL_LANGUAGE = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;

/** The number check's answer for `text` and how many characters it read to give it. */
function counted(text: string): { ok: boolean; reads: number } {
  let reads = 0;
  const ok = scanDecimal(text.length, (i) => {
    reads++;
    return text.charCodeAt(i);
  });
  return { ok, reads };
}

describe('long cells', () => {
  it('answers a 100 KB digit run in a number column with a 422, without quoting it back', async () => {
    const cell = `${'1'.repeat(100_000)}x`;
    const r = await uploadFiles(app(), [{ name: 'sites.csv', data: `code,name,role,lat,lon\nS1,One,origin,${cell},0\n` }]);
    expect(r.status).toBe(422);
    expect(r.body.errors).toEqual([expect.objectContaining({ file: 'sites.csv', row: 2, field: 'lat', rule: 'wrong-type' })]);
    expect(r.text.length).toBeLessThan(2_000);
    expect(await countOf(app(), 'sites')).toBe(0);
  });

  // Linear by construction rather than by a stopwatch: the number check reads each character at most once, in order,
  // and stops at the first that cannot continue a number. A pattern (the earlier \d+\.?\d* tried every split of a digit
  // run: quadratic) reads the whole cell before it answers, so these counts fail for it.
  it('reads a hostile number cell once, stopping where it stops being a number', () => {
    const run = '1'.repeat(100_000);
    const cases: [text: string, ok: boolean, reads: number][] = [
      [`${run}x`, false, 100_001],
      [run, true, 100_000],
      [`${run}.${run}`, true, 200_001],
      [`${run}.${run}e`, false, 200_002],
      [`${run}e+${run}`, true, 200_002],
      [`${run}..${run}`, false, 100_002],
      [`${run}e${run}e`, false, 200_002],
      [`-.${run}x${run}`, false, 100_003],
      ['+'.repeat(100_000), false, 2],
      [`.${'.'.repeat(100_000)}`, false, 2],
      [`x${run}`, false, 1],
    ];
    for (const [text, ok, reads] of cases) {
      expect(counted(text), text.slice(0, 12)).toEqual({ ok, reads });
      expect(isDecimal(text)).toBe(ok);
    }
  });

  it('takes exactly the cells the number pattern takes (short cells, where a pattern is quick)', () => {
    const cell = fc.array(fc.constantFrom('0', '1', '9', '.', 'e', 'E', '+', '-', 'x', ' ', ','), { maxLength: 12 }).map((chars) => chars.join(''));
    fc.assert(fc.property(cell, (text) => isDecimal(text) === DECIMAL_LANGUAGE.test(text)), { numRuns: 20_000 });
    for (const text of ['0', '-0', '+1.', '.5', '1e5', '1E-5', '-.5e+3', '12.50']) expect(isDecimal(text), text).toBe(true);
    for (const text of ['', '.', '+', '-.', '1e', '1e+', 'e5', '1.2.3', '0x1F', 'Infinity', 'NaN', ' 1', '1 ', '1,5', '١']) expect(isDecimal(text), text).toBe(false);
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

describe('a network-sized JSON body', () => {
  // Above a megabyte the body is parsed in turns (server/http/jsonInTurns.ts); these bodies are a few megabytes.
  const network = generateNetwork({ sites: 1_500, seed: 5 });
  const body = JSON.stringify(network);

  it('imports as JSON.parse would have read it, other work getting turns while it is read', async () => {
    expect(body.length).toBeGreaterThan(SMALL_BODY_BYTES);
    const write = Tokenizer.prototype.write;
    let slices = 0;
    let turned = false;
    let slicesAfterATurn = 0;
    const spy = vi.spyOn(Tokenizer.prototype, 'write').mockImplementation(function (this: Tokenizer, input) {
      if (slices++ === 0) setImmediate(() => (turned = true));
      else if (turned) slicesAfterATurn++;
      write.call(this, input);
    });
    let r;
    try {
      r = await request(app().app).post('/api/network/import').set(app().auth('engineer')).set('Content-Type', 'application/json').send(body);
    } finally {
      spy.mockRestore();
    }
    expect(r.status).toBe(200);
    expect(slicesAfterATurn).toBeGreaterThan(0);
    expect(await countOf(app(), 'sites')).toBe(network.sites.length);
    expect(await countOf(app(), 'feeds')).toBe(network.feeds.length);
  });

  it.each([
    ['cut short', body.slice(0, body.length - 10)],
    ['with text after it', `${body} x`],
    ['nested past the limit', `{"format":"network/1","sites":[${'['.repeat(100)}${' '.repeat(SMALL_BODY_BYTES)}]}`],
  ])('refuses one %s with 400, and writes nothing', async (_what, text) => {
    const r = await request(app().app).post('/api/network/import').set(app().auth('engineer')).set('Content-Type', 'application/json').send(text);
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('malformed-json');
    expect(await countOf(app(), 'sites')).toBe(0);
  });

  it('refuses a charset other than UTF-8 with 415', async () => {
    const r = await request(app().app).post('/api/network/import').set(app().auth('engineer')).set('Content-Type', 'application/json; charset=latin1').send(body);
    expect(r.status).toBe(415);
    expect(r.body.error.message).toMatch(/charset "LATIN1"/);
    expect(await countOf(app(), 'sites')).toBe(0);
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
    expect(r.body.error.message).toContain(formatBytes(UPLOAD_LIMITS.maxBytes));
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
    expect(r.body.error.message).toContain(`${formatCount(UPLOAD_LIMITS.maxRecords)} rows`);
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

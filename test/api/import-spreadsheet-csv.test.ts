/**
 * CSV as spreadsheets save it (server/interchange/csv-dialect.ts): a
 * `;`-separated file with decimal commas and a tab-separated one import like
 * the comma file; a file that is not UTF-8 is refused naming the file and
 * the row of its first bad byte, and nothing is written.
 */
import JSZip from 'jszip';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { documentToCsv } from '@/server/interchange/csv';
import { smallNetwork } from '../fixtures/small-network';
import { makeTestApp, type TestApp } from '../helpers/testApp';
import { countOf, uploadFiles } from '../helpers/upload';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => t?.close());
beforeEach(async () => t.reset());

/** Every file of the small network as a spreadsheet in a decimal-comma locale writes it. */
function semicolonFiles(): Array<{ name: string; data: string }> {
  return Object.entries(documentToCsv(smallNetwork())).map(([name, text]) => ({
    name,
    // every number with a decimal point gets a decimal comma; lists (split on ";") are quoted
    data: text
      .split('\n')
      .map((line) => line.split(',').map((cell) => (cell.includes(';') ? `"${cell}"` : cell.replace(/^(-?\d+)\.(\d+)$/, '$1,$2'))).join(';'))
      .join('\r\n'),
  }));
}

async function storedSite(code: string): Promise<{ lat: number; lon: number; name: string } | undefined> {
  const [rows] = await t.db.sequelize.query('SELECT name, lat, lon FROM sites WHERE code = $1', { bind: [code] });
  return (rows as { lat: number; lon: number; name: string }[])[0];
}

describe('spreadsheet CSV', () => {
  it('imports ;-separated files with decimal commas as the same network', async () => {
    const files = semicolonFiles();
    expect(files.find((f) => f.name === 'sites.csv')!.data).toMatch(/;-?\d+,\d+;/);
    const r = await uploadFiles(t, files);
    expect(r.status, JSON.stringify(r.body.errors?.slice(0, 3))).toBe(200);
    expect(r.body.counts.sites.created).toBe(smallNetwork().sites.length);
    for (const site of smallNetwork().sites) {
      const stored = await storedSite(site.code);
      expect(stored).toMatchObject({ lat: site.lat, lon: site.lon, name: site.name });
    }
    expect(await countOf(t, 'feeds')).toBe(smallNetwork().feeds.length);
  });

  it('imports a tab-separated zip', async () => {
    const zip = new JSZip();
    for (const [name, text] of Object.entries(documentToCsv(smallNetwork()))) zip.file(name, text.replace(/,/g, '\t'));
    const r = await uploadFiles(t, [{ name: 'net.zip', data: await zip.generateAsync({ type: 'nodebuffer' }) }]);
    expect(r.status).toBe(200);
    expect(await countOf(t, 'carriages')).toBe(smallNetwork().carriages.length);
  });

  it('refuses a file that is not UTF-8, naming the file and the row of the first bad byte, and writes nothing', async () => {
    const network = smallNetwork();
    network.sites[3] = { ...network.sites[3], name: 'Côte relay' };
    const files = Object.entries(documentToCsv(network)).map(([name, text]) => ({ name, data: Buffer.from(text, name === 'sites.csv' ? 'latin1' : 'utf8') }));
    const r = await uploadFiles(t, files);
    expect(r.status).toBe(422);
    const notUtf8 = r.body.errors.filter((e: { rule: string }) => e.rule === 'not-utf8');
    expect(notUtf8).toHaveLength(1);
    expect(notUtf8[0]).toMatchObject({ kind: 'sites', file: 'sites.csv' });
    expect(notUtf8[0].message).toMatch(/^sites\.csv is not UTF-8 text: row 5 \(the header is row 1\) holds the byte 0xF4/);
    expect(await countOf(t, 'sites')).toBe(0);
    expect(await countOf(t, 'audit_log')).toBe(0);
  });

  it('refuses UTF-16 files (a spreadsheet\'s "Unicode text"), with or without a byte order mark, saying so', async () => {
    const { 'sites.csv': sites, ...rest } = documentToCsv(smallNetwork());
    for (const text of [`\ufeff${sites}`, sites]) {
      const files = [{ name: 'sites.csv', data: Buffer.from(text, 'utf16le') }, ...Object.entries(rest).map(([name, data]) => ({ name, data }))];
      const r = await uploadFiles(t, files);
      expect(r.status).toBe(422);
      const notUtf8 = r.body.errors.filter((e: { rule: string }) => e.rule === 'not-utf8');
      expect(notUtf8, JSON.stringify(r.body.errors).slice(0, 500)).toHaveLength(1);
      expect(notUtf8[0]).toMatchObject({ kind: 'sites', file: 'sites.csv' });
      expect(notUtf8[0].message).toMatch(/^sites\.csv is UTF-16 text, not UTF-8/);
      expect(r.body.errors.filter((e: { file?: string }) => e.file === 'sites.csv')).toHaveLength(1);
    }
    expect(await countOf(t, 'sites')).toBe(0);
    expect(await countOf(t, 'audit_log')).toBe(0);
  });
});

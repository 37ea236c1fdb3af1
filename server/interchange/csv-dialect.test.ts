import { Readable } from 'node:stream';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { documentToCsv, readCsvFiles } from './csv';
import { decimalPoint, detectDialect, firstBadByte, NotUtf8Error, Utf8Check } from './csv-dialect';
import { CsvKindReader, readCsvStream } from './csv-read';
import { IssueList } from './issues';
import { UploadBudget } from './limits';
import { readNetworkUpload, readUploads } from './upload';
import { smallNetwork } from '@/test/fixtures/small-network';

/** The sites.csv a spreadsheet in a decimal-comma locale writes: `;` between cells, `,` as the decimal mark. */
const semicolonSites = (sites = smallNetwork().sites) =>
  documentToCsv({ ...smallNetwork(), sites })['sites.csv']
    .split('\n')
    .map((line) => line.replace(/,/g, ';').replace(/(\d)\.(\d)/g, '$1,$2'))
    .join('\n');

describe('CSV dialect', () => {
  it.each([
    ['code,name,role,lat,lon\r\n', ',', false],
    ['code;name;role;lat;lon\n', ';', true],
    ['code\tname\trole\tlat\tlon\n', '\t', false],
    ['\uFEFFcode;name;"a,b,c"\n', ';', true],
    ['code\n', ',', false],
  ] as const)('tells %j apart', (line, delimiter, decimalComma) => {
    expect(detectDialect(line)).toEqual({ delimiter, decimalComma });
  });

  it('reads decimal commas in number cells only', () => {
    expect(decimalPoint('-38,25')).toBe('-38.25');
    expect(decimalPoint('12')).toBe('12');
    expect(decimalPoint('1,2,3')).toBe('1,2,3');
  });

  it('reads a ;-separated sites.csv with decimal commas as the same sites, in memory and streamed', async () => {
    const text = semicolonSites();
    expect(text.split('\n')[0]).toContain(';');
    const inMemory = readCsvFiles([{ name: 'sites.csv', text }]);
    expect(inMemory.errors).toEqual([]);
    expect(inMemory.raw.sites).toEqual(smallNetwork().sites);
    const streamed = await readUploads([{ name: 'sites.csv', data: Buffer.from(text) }]);
    expect(streamed.sourceErrors).toEqual([]);
    expect((streamed.raw as { sites: unknown[] }).sites).toEqual(smallNetwork().sites);
  });

  it('reads a tab-separated file', async () => {
    const text = documentToCsv(smallNetwork())['services.csv'].replace(/,/g, '\t');
    const result = await readUploads([{ name: 'services.csv', data: Buffer.from(text) }]);
    expect(result.sourceErrors).toEqual([]);
    expect((result.raw as { services: unknown[] }).services).toEqual(smallNetwork().services);
  });
});

describe('UTF-8', () => {
  it('finds the first bad byte', () => {
    expect(firstBadByte(Buffer.from('Zürich', 'utf8'))).toBe(-1);
    expect(firstBadByte(Buffer.from('Zürich', 'latin1'))).toBe(1);
    expect(firstBadByte(Buffer.from([0x61, 0xc0, 0x80]))).toBe(1); // overlong
    expect(firstBadByte(Buffer.from([0xed, 0xa0, 0x80]))).toBe(0); // a surrogate
    expect(firstBadByte(Buffer.from([0x61, 0xe2, 0x82]))).toBe(1); // cut short
  });

  it('agrees with the decoder of the platform, over any cut into chunks', () => {
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 40 }), fc.array(fc.nat(40), { maxLength: 4 }), (bytes, cuts) => {
        let valid = true;
        try {
          new TextDecoder('utf-8', { fatal: true }).decode(bytes);
        } catch {
          valid = false;
        }
        const check = new Utf8Check();
        const points = [0, ...[...cuts].sort((a, b) => a - b).map((c) => Math.min(c, bytes.length)), bytes.length];
        let thrown: unknown;
        try {
          for (let i = 1; i < points.length; i++) check.push(bytes.subarray(points[i - 1], points[i]));
          check.end();
        } catch (err) {
          thrown = err;
        }
        expect(thrown === undefined).toBe(valid);
        if (thrown) expect((thrown as NotUtf8Error).byte).toBe(bytes[firstBadByte(bytes)]);
      }),
      { numRuns: 500 },
    );
  });

  it('names the file and the row of the first byte that is not UTF-8 (the header is row 1)', async () => {
    const sites = smallNetwork().sites.map((s, i) => (i === 2 ? { ...s, name: 'Mont Réel' } : s));
    const latin1 = Buffer.from(documentToCsv({ ...smallNetwork(), sites })['sites.csv'], 'latin1');
    const result = await readNetworkUpload('sites.csv', latin1);
    expect(result.document).toBeNull();
    expect(result.errors).toHaveLength(1);
    expect(result.errors[0]).toMatchObject({ kind: 'sites', file: 'sites.csv', rule: 'not-utf8' });
    expect(result.errors[0].message).toMatch(/^sites\.csv is not UTF-8 text: row 4 \(the header is row 1\) holds the byte 0xE9/);
  });

  it('counts rows across chunks', async () => {
    const lines = ['code,name,kind', ...Array.from({ length: 3000 }, (_, i) => `S${i},Service ${i},fm`)];
    lines[2500] = 'S2499,Servi\xe7e,fm';
    const data = Buffer.from(lines.join('\n'), 'latin1');
    const chunks = Array.from({ length: Math.ceil(data.length / 1000) }, (_, i) => data.subarray(i * 1000, (i + 1) * 1000));
    const issues = new IssueList();
    const read = await readCsvStream(Readable.from(chunks), new CsvKindReader('services', 'services.csv', issues), new UploadBudget());
    expect(read.entities).toEqual([]);
    expect(issues.list[0].message).toContain('row 2,501 (the header is row 1) holds the byte 0xE7');
  });
});

import JSZip from 'jszip';
import { describe, expect, it } from 'vitest';
import { entitySchemas, ENTITY_KINDS } from '@/shared/schemas/network';
import fc from 'fast-check';
import { CSV_COLUMNS, REQUIRED_COLUMNS, cellText, cellValue, guardCell, unguardCell } from './csv-columns';
import { CSV_FILE_NAMES, documentToCsv, documentToZip, kindOfFile, readCsvFiles } from './csv';
import { UPLOAD_LIMITS, UploadLimitError } from './limits';
import { readNetworkUpload, validateCsvFiles } from './upload';
import { smallNetwork } from '@/test/fixtures/small-network';
import { generateNetwork } from '@/scripts/generator';

describe('CSV columns', () => {
  it('name exactly the fields of each schema, in the order docs/format.md lists them', () => {
    for (const kind of ENTITY_KINDS) {
      expect(CSV_COLUMNS[kind].map(([c]) => c)).toEqual(Object.keys(entitySchemas[kind].shape));
    }
  });

  it.each([
    ['', 'number', undefined],
    ['  ', 'string', undefined],
    ['12.5', 'number', 12.5],
    ['-3e2', 'number', -300],
    ['0x1F', 'number', '0x1F'],
    ['Infinity', 'number', 'Infinity'],
    ['abc', 'number', 'abc'],
    ['TRUE', 'boolean', true],
    ['false', 'boolean', false],
    ['yes', 'boolean', 'yes'],
    ['G1; G2;;', 'list', ['G1', 'G2']],
    [' 21 ', 'string', ' 21 '],
  ] as const)('cell %j in a %s column reads as %j', (cell, type, value) => {
    expect(cellValue(cell, type)).toEqual(value);
  });

  it('writes lists with ";" and absent values as empty cells', () => {
    expect(cellText(['A', 'B'])).toBe('A;B');
    expect(cellText(undefined)).toBe('');
    expect(cellText(false)).toBe('false');
    expect(cellText(0.1 + 0.2)).toBe('0.30000000000000004');
  });

  it('knows the five file names, in any case and inside a folder', () => {
    expect(kindOfFile('Sites.CSV')).toBe('sites');
    expect(kindOfFile('export/feeds.csv')).toBe('feeds');
    expect(kindOfFile('site.csv')).toBeUndefined();
  });
});

describe('reading CSV files', () => {
  it('reads rows into entities, keeping each row number as a spreadsheet shows it (header = row 1), coercing numbers, booleans and lists', () => {
    const read = readCsvFiles([
      { name: 'sites.csv', text: '\uFEFFcode,name,role,lat,lon,groups\nS1,"Hill, North",origin,-38.5,-29.25,G1;G2\n\nS2,Low,relay,1,2,\n' },
      { name: 'carriages.csv', text: 'code,site,service,onChannelRepeater,erpW,channel\nC1,S2,TV,true,150,021\n' },
    ]);
    expect(read.errors).toEqual([]);
    expect(read.raw.sites).toEqual([
      { code: 'S1', name: 'Hill, North', role: 'origin', lat: -38.5, lon: -29.25, groups: ['G1', 'G2'] },
      { code: 'S2', name: 'Low', role: 'relay', lat: 1, lon: 2 },
    ]);
    expect(read.raw.carriages).toEqual([{ code: 'C1', site: 'S2', service: 'TV', onChannelRepeater: true, erpW: 150, channel: '021' }]);
    expect(read.rowsOf.sites).toEqual({ file: 'sites.csv', rows: [2, 3] });
  });

  it('reports a non-number in a number column with its file, row and field, never NaN', () => {
    const result = validateCsvFiles([{ name: 'sites.csv', text: 'code,name,role,lat,lon\nS1,A,origin,0,0\nS2,B,relay,north,0\n' }]);
    expect(result.document).toBeNull();
    expect(result.errors).toEqual([
      { kind: 'sites', file: 'sites.csv', row: 3, code: 'S2', field: 'lat', rule: 'wrong-type', message: 'site S2: lat must be a number (got "north")' },
    ]);
  });

  it('reports unknown files, unknown and repeated columns, and missing required columns', () => {
    const { errors } = readCsvFiles([
      { name: 'towers.csv', text: 'code\nT1\n' },
      { name: 'groups.csv', text: 'code,name,colour,name\nG1,One,red,Again\n' },
      { name: 'services.csv', text: 'code,kind\nTV,dtt\n' },
    ]);
    expect(errors.map((e) => [e.rule, e.file, e.field])).toEqual([
      ['unknown-file', 'towers.csv', undefined],
      ['unknown-column', 'groups.csv', 'colour'],
      ['duplicate-column', 'groups.csv', 'name'],
      ['missing-column', 'services.csv', 'name'],
    ]);
    expect(errors[0].message).toBe('file "towers.csv" is not part of a network: the files are sites.csv, services.csv, groups.csv, carriages.csv, feeds.csv');
    expect(errors[1].message).toBe('groups.csv: unknown column "colour" (the columns are code, name, note)');
  });

  it('reports every malformed row with its row number, and keeps the rows after it', () => {
    const read = readCsvFiles([{ name: 'groups.csv', text: 'code,name\nG1,One\nG2\nG3,Three\nG4,"Four\n' }]);
    expect(read.errors.map((e) => [e.rule, e.row])).toEqual([
      ['csv-syntax', 3],
      ['csv-syntax', 5],
    ]);
    expect(read.raw.groups).toEqual([{ code: 'G1', name: 'One' }, { code: 'G3', name: 'Three' }]);
    expect(read.rowsOf.groups?.rows).toEqual([2, 4]);
  });

  it('keeps row numbers right after several malformed rows in a row', () => {
    const read = readCsvFiles([{ name: 'groups.csv', text: 'code,name\nG1,One\nbad\nG3,Three\nbad\nbad\nG6,Six\n"open\n' }]);
    expect(read.errors.map((e) => e.row)).toEqual([3, 5, 6, 8]);
    expect(read.rowsOf.groups?.rows).toEqual([2, 4, 7]);
    expect(read.raw.groups?.map((g) => g.code)).toEqual(['G1', 'G3', 'G6']);
  });

  it('reports the same kind uploaded twice', () => {
    const { errors } = readCsvFiles([
      { name: 'a/sites.csv', text: 'code,name,role,lat,lon\n' },
      { name: 'b/sites.csv', text: 'code,name,role,lat,lon\n' },
    ]);
    expect(errors).toEqual([expect.objectContaining({ rule: 'duplicate-file', file: 'b/sites.csv' })]);
  });

  it('reports an empty file as having no header', () => {
    const { errors } = readCsvFiles([{ name: 'feeds.csv', text: '' }]);
    expect(errors).toEqual([expect.objectContaining({ rule: 'missing-header', file: 'feeds.csv' })]);
  });
});

describe('CSV export and round trip', () => {
  it('writes a header with every column, then one row per entity', () => {
    const files = documentToCsv(smallNetwork());
    expect(Object.keys(files)).toEqual(Object.values(CSV_FILE_NAMES));
    const lines = files['feeds.csv'].trimEnd().split('\n');
    expect(lines[0]).toBe('code,from,to,medium,role,via,groups,rxFrequencyMHz,rxChannel,rxAntenna,bearingDeg');
    expect(lines[3]).toBe('M1.FM1.M,O1.FM1,M1.FM1,microwave,main,H1,,7500,,,');
    expect(lines).toHaveLength(1 + smallNetwork().feeds.length);
  });

  it('document -> CSV zip -> document gives back the same document (small network)', async () => {
    const doc = smallNetwork();
    const zip = await documentToZip(doc);
    const result = await readNetworkUpload('network.zip', zip);
    expect(result.errors).toEqual([]);
    expect(result.document).toEqual(doc);
  });

  it('document -> CSV zip -> document gives back the same generated network of 300 sites', async () => {
    const doc = generateNetwork({ sites: 300, seed: 11 });
    const result = await readNetworkUpload('export.zip', await documentToZip(doc));
    expect(result.errors).toEqual([]);
    expect(result.document).toEqual(doc);
  });

  it('quotes names with commas, quotes and line breaks so they survive', () => {
    const doc = smallNetwork();
    doc.sites[0].name = 'Origin "One", the\nold studio';
    doc.groups[2].note = 'route 7; leased';
    const files = documentToCsv(doc);
    const result = validateCsvFiles(Object.entries(files).map(([name, text]) => ({ name, text })));
    expect(result.document?.sites[0].name).toBe(doc.sites[0].name);
    expect(result.document?.groups[2].note).toBe('route 7; leased');
  });
});

describe('uploads', () => {
  it('reads a JSON document by its name', async () => {
    const result = await readNetworkUpload('net.json', Buffer.from(JSON.stringify(smallNetwork())));
    expect(result.errors).toEqual([]);
    expect(result.document).toEqual(smallNetwork());
  });

  it('reads a JSON document saved with a byte order mark', async () => {
    const result = await readNetworkUpload('net.JSON', Buffer.from(`\uFEFF${JSON.stringify(smallNetwork())}`));
    expect(result.errors).toEqual([]);
  });

  it('reports JSON that does not parse', async () => {
    const result = await readNetworkUpload('net.json', Buffer.from('{"format": '));
    expect(result.errors).toEqual([expect.objectContaining({ kind: 'document', rule: 'invalid-json', file: 'net.json' })]);
  });

  it('reads one CSV file alone', async () => {
    const result = await readNetworkUpload('services.csv', Buffer.from('code,name,kind\nTV,Multiplex,dtt\n'));
    expect(result.errors).toEqual([]);
    expect(result.document?.services).toEqual([{ code: 'TV', name: 'Multiplex', kind: 'dtt' }]);
  });

  it('recognises a zip by its signature whatever its name, and skips archiver metadata', async () => {
    const zip = new JSZip();
    zip.file('net/services.csv', 'code,name,kind\nTV,Multiplex,dtt\n');
    zip.file('__MACOSX/net/._services.csv', 'binary junk');
    const data = await zip.generateAsync({ type: 'nodebuffer' });
    const result = await readNetworkUpload('upload.bin', data);
    expect(result.errors).toEqual([]);
    expect(result.document?.services).toHaveLength(1);
  });

  it('reports a broken zip, an empty zip and an unknown file type', async () => {
    expect((await readNetworkUpload('x.zip', Buffer.from('PK\u0003\u0004 not really'))).errors[0].rule).toBe('bad-zip');
    expect((await readNetworkUpload('x.zip', await new JSZip().generateAsync({ type: 'nodebuffer' }))).errors[0].rule).toBe('empty-zip');
    expect((await readNetworkUpload('network.xlsx', Buffer.from('x'))).errors[0]).toMatchObject({ rule: 'unknown-file', file: 'network.xlsx' });
  });

  it('puts file errors and row errors of a zip in one report', async () => {
    const zip = new JSZip();
    zip.file('sites.csv', 'code,name,role,lat,lon,height\nS1,A,origin,0,0,3\nS2,B,main,0,-200,4\n');
    zip.file('readme.txt', 'hello');
    const result = await readNetworkUpload('n.zip', await zip.generateAsync({ type: 'nodebuffer' }));
    expect(result.document).toBeNull();
    expect(result.errors.map((e) => [e.rule, e.file, e.row, e.field])).toEqual([
      ['unknown-column', 'sites.csv', undefined, 'height'],
      ['unknown-file', 'readme.txt', undefined, undefined],
      ['out-of-range', 'sites.csv', 3, 'lon'],
    ]);
  });
});

describe('zip size limit', () => {
  it('refuses a zip that declares more than the limit before inflating anything, naming the limit', async () => {
    const zip = new JSZip();
    // 3 MB of one repeated character compresses to a few kB; the limit is lowered to 2 MB for the test
    zip.file('sites.csv', 'x'.repeat(3_000_000));
    const data = await zip.generateAsync({ type: 'nodebuffer', compression: 'DEFLATE' });
    expect(data.length).toBeLessThan(100_000);
    const limits = { ...UPLOAD_LIMITS, maxBytes: 2 * 1024 * 1024 };
    await expect(readNetworkUpload('n.zip', data, { limits })).rejects.toThrow(UploadLimitError);
    await expect(readNetworkUpload('n.zip', data, { limits })).rejects.toThrow(/2 MB/);
    const read = await readNetworkUpload('n.zip', data, { limits: { ...limits, maxBytes: 4 * 1024 * 1024 } });
    // under a higher limit the file is read: its one 3 MB "record" is over the record size, reported once
    expect(read.errors.map((e) => e.rule)).toEqual(['csv-syntax']);
    expect(read.errors[0].message.length).toBeLessThan(300);
  });
});

describe('spreadsheet formula guard', () => {
  it.each([
    ['=SUM(A1)', "'=SUM(A1)"],
    ['+1', "'+1"],
    ['-A1', "'-A1"],
    ['@x', "'@x"],
    ['\tx', "'\tx"],
    ['\rx', "'\rx"],
    ["'=x", "''=x"],
    ["'abc", "'abc"],
    ['abc', 'abc'],
    ['', ''],
  ])('export writes %j as %j, and import reads it back', (text, cell) => {
    expect(guardCell(text)).toBe(cell);
    expect(unguardCell(cell)).toBe(text);
  });

  it('import takes off exactly one quote, and only before a formula character', () => {
    expect(cellValue("'=x", 'string')).toBe('=x');
    expect(cellValue("''=x", 'string')).toBe("'=x");
    expect(cellValue("'abc", 'string')).toBe("'abc");
    expect(cellValue("'-A;B", 'list')).toEqual(['-A', 'B']);
  });

  it('never guards numbers: -12.5 is written and read as a number', () => {
    expect(cellText(-12.5)).toBe('-12.5');
    expect(cellValue('-12.5', 'number')).toBe(-12.5);
    expect(cellText('-12.5')).toBe("'-12.5");
  });

  it('export then import is the identity on any text', () => {
    const start = fc.constantFrom('', '=', '+', '-', '@', '\t', '\r', "'", "''", "'=", "''-", 'a');
    fc.assert(fc.property(start, fc.string(), (head, tail) => {
      const text = head + tail;
      expect(unguardCell(guardCell(text))).toBe(text);
    }), { numRuns: 2000 });
  });

  it('round-trips a network whose text starts with formula characters through the CSV files', () => {
    const doc = smallNetwork();
    doc.sites[0].name = '=HYPERLINK("x")';
    doc.services[0].name = "'=already quoted";
    doc.groups[2].note = '-40 dB pad, @ the top';
    doc.sites[1].lon = -12.5;
    const files = documentToCsv(doc);
    expect(files['sites.csv']).toContain(`'=HYPERLINK`);
    expect(files['sites.csv']).toContain(',-12.5,');
    const result = validateCsvFiles(Object.entries(files).map(([name, text]) => ({ name, text })));
    expect(result.errors).toEqual([]);
    expect(result.document?.sites[0].name).toBe('=HYPERLINK("x")');
    expect(result.document?.services[0].name).toBe("'=already quoted");
    expect(result.document?.groups[2].note).toBe('-40 dB pad, @ the top');
    expect(result.document?.sites[1].lon).toBe(-12.5);
  });
});

describe('the CSV columns taken from the schemas', () => {
  it('are the fields docs/format.md lists, in its order, with their types and the required ones', () => {
    expect(CSV_COLUMNS).toEqual({
      sites: [
        ['code', 'string'], ['name', 'string'], ['role', 'string'], ['lat', 'number'], ['lon', 'number'],
        ['groundHeightM', 'number'], ['mastHeightM', 'number'], ['households', 'number'], ['groups', 'list'],
      ],
      services: [['code', 'string'], ['name', 'string'], ['kind', 'string']],
      groups: [['code', 'string'], ['name', 'string'], ['note', 'string']],
      carriages: [
        ['code', 'string'], ['site', 'string'], ['service', 'string'], ['frequencyMHz', 'number'], ['channel', 'string'],
        ['erpW', 'number'], ['polarisation', 'string'], ['antennaHeightM', 'number'], ['onChannelRepeater', 'boolean'],
      ],
      feeds: [
        ['code', 'string'], ['from', 'string'], ['to', 'string'], ['medium', 'string'], ['role', 'string'],
        ['via', 'list'], ['groups', 'list'], ['rxFrequencyMHz', 'number'], ['rxChannel', 'string'],
        ['rxAntenna', 'string'], ['bearingDeg', 'number'],
      ],
    });
    expect(REQUIRED_COLUMNS).toEqual({
      sites: ['code', 'name', 'role', 'lat', 'lon'],
      services: ['code', 'name', 'kind'],
      groups: ['code', 'name'],
      carriages: ['code', 'site', 'service'],
      feeds: ['code', 'from', 'to', 'medium', 'role'],
    });
  });
});

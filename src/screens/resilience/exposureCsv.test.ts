import { describe, expect, it } from 'vitest';
import { csvField, exposureCsv, exposureFileName, textCell } from './exposureCsv';

describe('csvField (RFC 4180 section 2)', () => {
  it('leaves plain text and numbers alone', () => {
    expect(csvField('M-CORR')).toBe('M-CORR');
    expect(csvField(185000)).toBe('185000');
  });

  it('quotes commas, quotes and line breaks, doubling quotes', () => {
    expect(csvField('Hill, North')).toBe('"Hill, North"');
    expect(csvField('the "old" mast')).toBe('"the ""old"" mast"');
    expect(csvField('a\nb')).toBe('"a\nb"');
  });

  it('refuses a number that is not finite', () => {
    expect(() => csvField(Number.NaN)).toThrow(/NaN is not a finite number/);
  });
});

describe('textCell (OWASP CSV injection guard)', () => {
  it('prefixes text that starts like a formula', () => {
    expect(textCell('=HYPERLINK("x")')).toBe(`'=HYPERLINK("x")`);
    expect(textCell('+1')).toBe("'+1");
    expect(textCell('@SUM(A1)')).toBe("'@SUM(A1)");
    expect(textCell('Northern supply')).toBe('Northern supply');
  });
});

describe('exposureCsv', () => {
  it('writes a header and one CRLF-ended line per element', () => {
    const csv = exposureCsv([
      { rank: 1, element: { kind: 'site', code: 'O-LPC' }, name: 'Lanneth Playout Centre', households: 851490, carriages: 208 },
      { rank: 2, element: { kind: 'group', code: 'PWR-N' }, name: 'Power, north', households: 519830, carriages: 178 },
      { rank: 3, element: { kind: 'feed', code: 'F.1' }, households: 10, carriages: 1 },
    ]);
    expect(csv).toBe(
      'rank,kind,code,name,households_off_air,carriages_off_air\r\n' +
        '1,site,O-LPC,Lanneth Playout Centre,851490,208\r\n' +
        '2,group,PWR-N,"Power, north",519830,178\r\n' +
        '3,feed,F.1,,10,1\r\n',
    );
  });

  it('writes just the header for an empty ranking', () => {
    expect(exposureCsv([])).toBe('rank,kind,code,name,households_off_air,carriages_off_air\r\n');
  });
});

describe('exposureFileName', () => {
  it('names the network version and the date', () => {
    expect(exposureFileName(12, new Date('2026-03-04T10:00:00Z'))).toBe('headwater-exposure-v12-2026-03-04.csv');
  });
});

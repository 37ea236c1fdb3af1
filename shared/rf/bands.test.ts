import { describe, expect, it } from 'vitest';
import { channelsAt, channelToFrequencyMHz, dabBlock, frequencyToChannel, parseChannel, tryParseChannel, uhfChannel, vhfChannel } from './bands';
import { DAB_BLOCKS } from './dabBlocks';

describe('UHF TV channels 21-69', () => {
  // [S] TSDuck tsduck.hfbands.xml (base 474 MHz, width 8 MHz), docs/checks.md, "Channels and frequencies".
  it.each([
    [21, 474, 470, 478],
    [39, 618, 614, 622],
    [60, 786, 782, 790],
    [69, 858, 854, 862],
  ])('channel %s -> %s MHz (%s-%s)', (n, fc, lo, hi) => {
    const c = uhfChannel(n);
    expect(c.centreMHz).toBe(fc);
    expect(c.lowerMHz).toBe(lo);
    expect(c.upperMHz).toBe(hi);
    expect(frequencyToChannel(fc, 'uhf-tv')?.label).toBe(String(n));
  });

  it('a frequency inside the channel (with a +3 x 166.666 kHz offset) finds the channel', () => {
    expect(frequencyToChannel(618.5, 'uhf-tv')?.label).toBe('39');
    expect(frequencyToChannel(614, 'uhf-tv')?.label).toBe('39');
    expect(frequencyToChannel(622, 'uhf-tv')?.label).toBe('40');
    expect(frequencyToChannel(469.9, 'uhf-tv')).toBeNull();
    expect(frequencyToChannel(862, 'uhf-tv')).toBeNull();
  });

  it('rejects channels outside 21-69', () => {
    expect(() => uhfChannel(20)).toThrow(/21-69/);
    expect(() => uhfChannel(70)).toThrow(/21-69/);
  });
});

describe('VHF Band III TV channels 5-12', () => {
  // [S] TSDuck: fc = 177.5 + 7(N - 5), 7 MHz.
  it('channel 5 -> 177.5 MHz, 12 -> 226.5 MHz', () => {
    expect(vhfChannel(5).centreMHz).toBe(177.5);
    expect(vhfChannel(5).lowerMHz).toBe(174);
    expect(vhfChannel(12).centreMHz).toBe(226.5);
    expect(vhfChannel(12).upperMHz).toBe(230);
    expect(frequencyToChannel(184.5, 'vhf-tv')?.label).toBe('6');
  });
});

describe('T-DAB Band III blocks', () => {
  // Every entry of the table in docs/checks.md, "Channels and frequencies" [S: three secondary sources agree].
  const table: [string, number][] = [
    ['5A', 174.928], ['5B', 176.64], ['5C', 178.352], ['5D', 180.064],
    ['6A', 181.936], ['6B', 183.648], ['6C', 185.36], ['6D', 187.072],
    ['7A', 188.928], ['7B', 190.64], ['7C', 192.352], ['7D', 194.064],
    ['8A', 195.936], ['8B', 197.648], ['8C', 199.36], ['8D', 201.072],
    ['9A', 202.928], ['9B', 204.64], ['9C', 206.352], ['9D', 208.064],
    ['10A', 209.936], ['10B', 211.648], ['10C', 213.36], ['10D', 215.072], ['10N', 210.096],
    ['11A', 216.928], ['11B', 218.64], ['11C', 220.352], ['11D', 222.064], ['11N', 217.088],
    ['12A', 223.936], ['12B', 225.648], ['12C', 227.36], ['12D', 229.072], ['12N', 224.096],
    ['13A', 230.784], ['13B', 232.496], ['13C', 234.208], ['13D', 235.776], ['13E', 237.488], ['13F', 239.2],
  ];
  it('has exactly the 41 published blocks', () => {
    expect(Object.keys(DAB_BLOCKS).sort()).toEqual(table.map(([b]) => b).sort());
  });
  it.each(table)('%s -> %s MHz, both ways', (label, f) => {
    expect(channelToFrequencyMHz(label, 'dab')).toBe(f);
    expect(frequencyToChannel(f, 'dab')?.label).toBe(label);
  });
  it('spacing is not uniform: 5A->5B 1.712, 5D->6A 1.872 MHz', () => {
    expect(dabBlock('5B').centreMHz - dabBlock('5A').centreMHz).toBeCloseTo(1.712, 9);
    expect(dabBlock('6A').centreMHz - dabBlock('5D').centreMHz).toBeCloseTo(1.872, 9);
  });
  it('a frequency between blocks is no block; inside one, that block', () => {
    expect(frequencyToChannel(181.0, 'dab')).toBeNull();
    expect(frequencyToChannel(225.9, 'dab')?.label).toBe('12B');
  });
});

describe('FM Band II', () => {
  // GE84 band 87.5-108 MHz [C]; 100 kHz raster [M, recalled].
  it('reads "97.3" and "97.3 MHz" as a raster point', () => {
    expect(parseChannel('97.3').centreMHz).toBeCloseTo(97.3, 9);
    expect(parseChannel('97.3 MHz', 'fm').label).toBe('97.3');
    expect(frequencyToChannel(97.32, 'fm')?.label).toBe('97.3');
    expect(frequencyToChannel(108.5, 'fm')).toBeNull();
    expect(tryParseChannel('97.35', 'fm')).toBeNull();
    expect(tryParseChannel('86.0', 'fm')).toBeNull();
  });
});

describe('channel labels', () => {
  it('reads "39", "C39", "ch 39", "12B", "5A", "12"', () => {
    expect(parseChannel('39').centreMHz).toBe(618);
    expect(parseChannel('C39').centreMHz).toBe(618);
    expect(parseChannel('ch 39').centreMHz).toBe(618);
    expect(parseChannel('12B').centreMHz).toBe(225.648);
    expect(parseChannel('5a').centreMHz).toBe(174.928);
    expect(parseChannel('12').band).toBe('vhf-tv');
  });
  it('the service kind narrows the bands tried', () => {
    expect(tryParseChannel('39', 'dab')).toBeNull();
    expect(tryParseChannel('12B', 'dtt')).toBeNull();
    expect(tryParseChannel('39', 'am')).toBeNull();
  });
  it('an unknown label is an error naming the label', () => {
    expect(() => parseChannel('X9')).toThrow(/"X9" is not a known channel/);
    expect(() => parseChannel('14E', 'dab')).toThrow(/"14E".*DAB ensemble/);
    expect(tryParseChannel('70')).toBeNull();
  });
  it('channelsAt lists every band holding a frequency (Band III TV 5 and DAB 5A overlap)', () => {
    const labels = channelsAt(175).map((c) => `${c.band}:${c.label}`);
    expect(labels).toEqual(['vhf-tv:5', 'dab:5A']);
  });
});

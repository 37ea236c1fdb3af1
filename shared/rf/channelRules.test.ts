import { describe, expect, it } from 'vitest';
import { allowedFrequenciesText, bandEdgesMHz, checkChannel, frequencyProblem } from './channelRules';

describe('band edges', () => {
  // Band IV/V 470-862 MHz and Band III 174-230 MHz are the European TV band edges of the GE06
  // plan (recalled from memory, matching 306 + 8N and 177.5 + 7(N - 5) at the first and last channel).
  it('TV bands span the first channel lower edge to the last channel upper edge', () => {
    expect(bandEdgesMHz('uhf-tv')).toEqual({ lower: 470, upper: 862 });
    expect(bandEdgesMHz('vhf-tv')).toEqual({ lower: 174, upper: 230 });
  });
  it('DAB spans block 5A (174.928 MHz) to 13F (239.2 MHz), half of 1.536 MHz either side', () => {
    expect(bandEdgesMHz('dab')).toEqual({ lower: 174.16, upper: 239.968 });
  });
  it('says the ranges lowest first', () => {
    expect(allowedFrequenciesText('dtt')).toBe('174-230 MHz or 470-862 MHz');
    expect(allowedFrequenciesText('am')).toBe('');
  });
});

describe('checkChannel', () => {
  it('reads a channel of the kind and gives its centre frequency', () => {
    const c = checkChannel('dtt', '30');
    expect(c.ok && c.channel?.centreMHz).toBe(546);
    const d = checkChannel('dab', '12b');
    expect(d.ok && d.channel?.centreMHz).toBe(225.648);
  });
  it('refuses a channel outside the kind with the allowed range', () => {
    const c = checkChannel('dtt', '70');
    expect(c).toEqual({ ok: false, message: 'channel 70 is not one a digital TV service can use: VHF channels 5-12 or UHF channels 21-69' });
    const d = checkChannel('fm', '12B');
    expect(d.ok).toBe(false);
    expect(!d.ok && d.message).toMatch(/FM 87\.5-108 MHz/);
  });
  it('lets anything through for a kind with no plan, and a blank label', () => {
    expect(checkChannel('am', 'X1').ok).toBe(true);
    expect(checkChannel('dtt', '  ').ok).toBe(true);
  });
});

describe('frequencyProblem', () => {
  it('accepts a frequency in one of the kind bands', () => {
    expect(frequencyProblem('dtt', 546)).toBeNull();
    expect(frequencyProblem('dtt', 200)).toBeNull();
    expect(frequencyProblem('fm', 87.5)).toBeNull();
  });
  it('names the range when outside', () => {
    expect(frequencyProblem('dtt', 300)).toBe('frequency 300 MHz is outside what a digital TV service uses: 174-230 MHz or 470-862 MHz');
    expect(frequencyProblem('fm', 546)).toMatch(/87\.5-108 MHz/);
    expect(frequencyProblem('other', 5)).toBeNull();
  });
});

import { describe, expect, it } from 'vitest';
import { bandErrors, frequencyForChannel, proposedCode } from './formAssist';

describe('proposedCode', () => {
  it('makes a carriage code from site and service, a feed code from the carriage and role', () => {
    expect(proposedCode('carriages', { site: 'R7', service: 'TV1' })).toBe('R7.TV1');
    expect(proposedCode('carriages', { site: 'R7', service: '' })).toBeNull();
    expect(proposedCode('feeds', { to: 'R7.TV1', role: 'main' })).toBe('R7.TV1.M');
    expect(proposedCode('feeds', { to: 'R7.TV1', role: 'reserve' })).toBe('R7.TV1.R');
    expect(proposedCode('sites', { code: 'X' })).toBeNull();
  });
});

describe('channels in the form', () => {
  it('fills the centre frequency of a channel of the service kind (UHF 30 = 306 + 8 x 30 = 546 MHz)', () => {
    expect(frequencyForChannel('dtt', '30')).toBe('546');
    expect(frequencyForChannel('dab', '12B')).toBe('225.648');
    expect(frequencyForChannel('dtt', '12B')).toBeNull();
    expect(frequencyForChannel(undefined, '30')).toBeNull();
  });

  it('refuses a channel or frequency outside the kind with the allowed range', () => {
    const e = bandErrors('carriages', { channel: '75', frequencyMHz: '300' }, 'dtt');
    expect(e.channel).toMatch(/UHF channels 21-69/);
    expect(e.frequencyMHz).toMatch(/174-230 MHz or 470-862 MHz/);
    expect(bandErrors('carriages', { channel: '30', frequencyMHz: '546' }, 'dtt')).toEqual({});
    expect(bandErrors('carriages', { channel: '75' }, undefined)).toEqual({});
  });
});

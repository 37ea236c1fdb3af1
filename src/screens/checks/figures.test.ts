import { describe, expect, it } from 'vitest';
import { fixed, formatBearing, formatFigure, formatMargin, formatWatts, placesFor, unitText } from './figures';

describe('fixed', () => {
  it('never prints a negative zero', () => {
    expect(fixed(-0.04, 1)).toBe('0.0');
    expect(fixed(-0, 0)).toBe('0');
    expect(fixed(-0.06, 1)).toBe('-0.1');
  });
});

describe('formatFigure', () => {
  it('gives levels to 0.1 dB and shows dBuV/m as dBµV/m', () => {
    expect(formatFigure(121.987, 'dB')).toBe('122.0 dB');
    expect(formatFigure(48.24, 'dBuV/m')).toBe('48.2 dBµV/m');
  });

  it('gives short distances to 10 m and long ones to 100 m', () => {
    expect(formatFigure(3.4567, 'km')).toBe('3.46 km');
    expect(formatFigure(84.4321, 'km')).toBe('84.4 km');
    expect(placesFor(9.999, 'km')).toBe(2);
    expect(placesFor(10, 'km')).toBe(1);
  });

  it('gives frequencies to 1 kHz without trailing zeros, keeping one decimal', () => {
    expect(formatFigure(618, 'MHz')).toBe('618.0 MHz');
    expect(formatFigure(97.3, 'MHz')).toBe('97.3 MHz');
    expect(formatFigure(174.928, 'MHz')).toBe('174.928 MHz');
    expect(formatFigure(8, 'MHz')).toBe('8.0 MHz');
  });

  it('writes degrees with the degree sign and no space', () => {
    expect(formatFigure(4.26, 'deg')).toBe('4.3°');
    expect(unitText('deg')).toBe('°');
  });

  it('passes an unknown unit through unchanged', () => {
    expect(formatFigure(2.5, 'furlong')).toBe('2.5 furlong');
  });
});

describe('formatMargin', () => {
  it('signs a positive margin and leaves a negative one as is', () => {
    expect(formatMargin(2.44, 'dB')).toBe('+2.4 dB');
    expect(formatMargin(-7.81, 'dBuV/m')).toBe('-7.8 dBµV/m');
  });

  it('gives no sign to a margin that rounds to zero, at the unit’s own precision', () => {
    expect(formatMargin(0.04, 'm')).toBe('0.0 m');
    expect(formatMargin(-0.04, 'm')).toBe('0.0 m');
    expect(formatMargin(0.04, 'km')).toBe('+0.04 km');
  });
});

describe('formatBearing', () => {
  it('pads to three digits so bearings line up', () => {
    expect(formatBearing(7.46)).toBe('007.5°');
    expect(formatBearing(263)).toBe('263.0°');
    expect(formatBearing(0)).toBe('000.0°');
  });

  it('prints a bearing that rounds up to 360 as north', () => {
    expect(formatBearing(359.96)).toBe('000.0°');
  });
});

describe('formatWatts', () => {
  it('uses kW, MW and mW where they read better', () => {
    expect(formatWatts(850)).toBe('850 W');
    expect(formatWatts(12_500)).toBe('12.5 kW');
    expect(formatWatts(2_000)).toBe('2.00 kW');
    expect(formatWatts(250_000)).toBe('250 kW');
    expect(formatWatts(2_000_000)).toBe('2.00 MW');
    expect(formatWatts(0.25)).toBe('250.0 mW');
    expect(formatWatts(5.5)).toBe('5.50 W');
  });
});

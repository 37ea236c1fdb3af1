import { describe, expect, it } from 'vitest';
import {
  codesText,
  countOf,
  erpText,
  figure,
  fixed,
  formatBearing,
  formatBytes,
  formatPercent,
  formatCompact,
  formatCount,
  formatDb,
  formatDegrees,
  formatFieldStrength,
  formatFigure,
  formatKm,
  formatMargin,
  formatMHz,
  formatWatts,
  householdsText,
  placesFor,
  positionText,
  unitText,
  whenText,
  withUnit,
} from './format';

describe('formatCount', () => {
  it('groups thousands with commas and rounds', () => {
    expect(formatCount(0)).toBe('0');
    expect(formatCount(999)).toBe('999');
    expect(formatCount(1000)).toBe('1,000');
    expect(formatCount(851490)).toBe('851,490');
    expect(formatCount(1234567.6)).toBe('1,234,568');
    expect(formatCount(-4200)).toBe('-4,200');
  });

  it('refuses what is not a number', () => {
    expect(() => formatCount(Number.POSITIVE_INFINITY)).toThrow(/Infinity is not a finite number/);
  });
});

describe('countOf', () => {
  it('says one or many', () => {
    expect(countOf(1, 'carriage')).toBe('1 carriage');
    expect(countOf(2500, 'household')).toBe('2,500 households');
    expect(countOf(0, 'loss', 'losses')).toBe('0 losses');
  });
});

describe('formatKm', () => {
  it('gives one decimal with the unit, or a dash', () => {
    expect(formatKm(41.9999832)).toBe('42.0 km');
    expect(formatKm(null)).toBe('— km');
  });
});

describe('formatCompact', () => {
  it('shortens thousands and millions', () => {
    expect(formatCompact(0)).toBe('0');
    expect(formatCompact(950)).toBe('950');
    expect(formatCompact(1500)).toBe('1.5k');
    expect(formatCompact(250_000)).toBe('250k');
    expect(formatCompact(1_000_000)).toBe('1M');
    expect(formatCompact(2_500_000)).toBe('2.5M');
    expect(formatCompact(0.5)).toBe('0.5');
  });
});

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

describe('inventory figures', () => {
  it('puts units on figures and a dash for absent ones', () => {
    expect(withUnit(173, 'm')).toBe('173 m');
    expect(withUnit(95.8, 'MHz', 1)).toBe('95.8 MHz');
    expect(withUnit(185000, 'households')).toBe('185,000 households');
    expect(withUnit(undefined, 'm')).toBe('—');
    expect(withUnit(Number.NaN, 'm')).toBe('—');
    expect(figure(1234.5, 1)).toBe('1,234.5');
    expect(figure(null)).toBe('—');
  });

  it('shows ERP in kW from 1 kW up', () => {
    expect(erpText(38100)).toBe('38.1 kW');
    expect(erpText(1000)).toBe('1.0 kW');
    expect(erpText(250)).toBe('250 W');
    expect(erpText(0)).toBe('0 W');
    expect(erpText(undefined)).toBe('—');
  });

  it('writes positions with hemisphere letters', () => {
    expect(positionText(-38.227355, -29.316707)).toBe('38.22736° S, 29.31671° W');
    expect(positionText(51.5, 0.1)).toBe('51.50000° N, 0.10000° E');
    expect(() => positionText(Number.NaN, 0)).toThrow(RangeError);
  });

  it('words households and code lists', () => {
    expect(householdsText(1)).toBe('1 household');
    expect(householdsText(12400)).toBe('12,400 households');
    expect(householdsText(undefined)).toBe('households not recorded');
    expect(codesText(['A', 'B'])).toBe('A; B');
    expect(codesText([])).toBe('none');
  });

  it('shows a time in words and leaves an unreadable one as it came', () => {
    expect(whenText('2026-12-01T22:39:51.658Z')).toMatch(/2026/);
    expect(whenText('not a time')).toBe('not a time');
  });
});

describe('one spelling per unit', () => {
  it('names each quantity with its unit', () => {
    expect(formatFieldStrength(48.24)).toBe('48.2 dBµV/m');
    expect(formatMHz(618)).toBe('618.0 MHz');
    expect(formatMHz(174.928)).toBe('174.928 MHz');
    expect(formatDb(-7.84)).toBe('-7.8 dB');
    expect(formatDegrees(123.44)).toBe('123.4°');
    expect(formatKm(23.46)).toBe('23.5 km');
    expect(formatWatts(12_500)).toBe('12.5 kW');
    expect(erpText(38_100)).toBe('38.1 kW');
    expect(householdsText(12_400)).toBe('12,400 households');
  });

  it('groups thousands the same way with decimals and signs, without a locale', () => {
    expect(withUnit(1_234_567.25, 'm', 1)).toBe('1,234,567.3 m');
    expect(withUnit(-12_400, 'W')).toBe('-12,400 W');
    expect(figure(999.96, 1)).toBe('1,000.0');
    expect(figure(-0.04, 1)).toBe('0.0');
  });

  it('says a share as a percentage with two decimals and grouped thousands', () => {
    expect(formatPercent(0.999531)).toBe('99.95 %');
    expect(formatPercent(1)).toBe('100.00 %');
    expect(formatPercent(12.5)).toBe('1,250.00 %');
  });

  it('says file sizes in B, kB and MB', () => {
    expect(formatBytes(812)).toBe('812 B');
    expect(formatBytes(12_700)).toBe('12.4 kB');
    expect(formatBytes(3_250_000)).toBe('3.1 MB');
    expect(formatBytes(64 * 1024 * 1024)).toBe('64 MB');
    expect(formatBytes(2048)).toBe('2 kB');
  });
});

import { describe, expect, it } from 'vitest';
import { codesText, erpText, figure, householdsText, positionText, whenText, withUnit } from './format';

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

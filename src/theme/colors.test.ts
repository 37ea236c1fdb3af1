import { describe, expect, it } from 'vitest';
import { colors } from './colors';
import { contrastRatio, relativeLuminance } from './contrast';

// WCAG 2.1 success criterion 1.4.3: at least 4.5:1 for body text;
// 1.4.11: at least 3:1 for borders of controls and graphic objects.
const TEXT_MIN = 4.5;
const GRAPHIC_MIN = 3;

describe('contrastRatio (WCAG 2.1 definitions)', () => {
  it('refuses something that is not a #RRGGBB colour', () => {
    expect(() => relativeLuminance('red')).toThrow(/expected a colour like #1A2B3C/);
    expect(() => relativeLuminance('#fff')).toThrow(/got "#fff"/);
  });

  it('gives 21:1 for black on white and 1:1 for a colour on itself', () => {
    expect(contrastRatio('#000000', '#FFFFFF')).toBeCloseTo(21, 6);
    expect(contrastRatio('#0E5A63', '#0E5A63')).toBeCloseTo(1, 6);
  });

  it('gives the widely quoted 4.48:1 for #777777 on white', () => {
    expect(contrastRatio('#777777', '#FFFFFF')).toBeCloseTo(4.48, 2);
  });
});

describe('theme colours', () => {
  const textPairs: Array<[string, keyof typeof colors, keyof typeof colors]> = [
    ['ink on surface', 'ink', 'surface'],
    ['ink on canvas', 'ink', 'canvas'],
    ['ink on sunken', 'ink', 'sunken'],
    ['muted ink on surface', 'inkMuted', 'surface'],
    ['muted ink on canvas', 'inkMuted', 'canvas'],
    ['muted ink on sunken', 'inkMuted', 'sunken'],
    ['accent on surface', 'accent', 'surface'],
    ['accent on its soft tint', 'accent', 'accentSoft'],
    ['button text on accent', 'accentInk', 'accent'],
    ['mark on surface', 'mark', 'surface'],
    ['text on a mark', 'markInk', 'mark'],
    ['ink on a mark tint', 'ink', 'markSoft'],
    ['mark on its tint', 'mark', 'markSoft'],
    ['good on its tint', 'good', 'goodSoft'],
    ['warn on its tint', 'warn', 'warnSoft'],
    ['bad on its tint', 'bad', 'badSoft'],
    ['bad on surface', 'bad', 'surface'],
  ];
  it.each(textPairs)('%s reaches 4.5:1', (_name, fg, bg) => {
    expect(contrastRatio(colors[fg], colors[bg])).toBeGreaterThanOrEqual(TEXT_MIN);
  });

  it('strong lines and the focus ring stand out 3:1 from the surface', () => {
    expect(contrastRatio(colors.lineStrong, colors.surface)).toBeGreaterThanOrEqual(GRAPHIC_MIN);
    expect(contrastRatio(colors.focus, colors.surface)).toBeGreaterThanOrEqual(GRAPHIC_MIN);
  });
});

/**
 * Contrast ratio of two sRGB colours, as defined by WCAG 2.1 ("relative
 * luminance" and "contrast ratio" in the Definitions section,
 * https://www.w3.org/TR/WCAG21/#dfn-relative-luminance).
 */
const HEX = /^#([0-9a-f]{6})$/i;

function channel(c8: number): number {
  const c = c8 / 255;
  // WCAG 2.1 uses 0.03928 as the linear-segment threshold.
  return c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

export function relativeLuminance(hex: string): number {
  const m = HEX.exec(hex);
  if (!m) throw new Error(`relativeLuminance: expected a colour like #1A2B3C, got ${JSON.stringify(hex)}`);
  const n = parseInt(m[1], 16);
  const r = (n >> 16) & 0xff;
  const g = (n >> 8) & 0xff;
  const b = n & 0xff;
  return 0.2126 * channel(r) + 0.7152 * channel(g) + 0.0722 * channel(b);
}

export function contrastRatio(a: string, b: string): number {
  const la = relativeLuminance(a);
  const lb = relativeLuminance(b);
  const [hi, lo] = la >= lb ? [la, lb] : [lb, la];
  return (hi + 0.05) / (lo + 0.05);
}

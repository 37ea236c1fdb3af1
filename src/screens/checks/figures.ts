/**
 * Numbers with units and a precision that suits each quantity (docs/screens.md: numbers carry
 * units and sensible precision). The precision choices are ours (common practice, no source):
 * screening figures are not worth more digits than their inputs carry.
 */

/** Display form of the units the API sends. */
const UNIT_TEXT: Readonly<Record<string, string>> = {
  dB: 'dB',
  dBuV: 'dBµV',
  'dBuV/m': 'dBµV/m',
  'dB(uV/m)': 'dBµV/m',
  dBW: 'dBW',
  dBm: 'dBm',
  'dBW/m2': 'dBW/m²',
  km: 'km',
  m: 'm',
  MHz: 'MHz',
  GHz: 'GHz',
  deg: '°',
  W: 'W',
  kW: 'kW',
};

/** Fixed decimals, never "-0.0". */
export function fixed(value: number, places: number): string {
  if (!Number.isFinite(value)) return String(value);
  const text = value.toFixed(places);
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}

/** Decimals per unit: distances in km scale with size, levels to 0.1 dB, heights to 0.1 m. */
export function placesFor(value: number, unit: string): number {
  const size = Math.abs(value);
  switch (unit) {
    case 'km':
      return size < 10 ? 2 : 1;
    case 'MHz':
      return 3;
    case 'GHz':
      return 3;
    case 'W':
      return size < 10 ? 2 : size < 100 ? 1 : 0;
    default:
      return 1;
  }
}

/** Frequencies drop trailing zeros down to one decimal: 618.0, 97.3, 174.928. */
function trimFrequency(text: string): string {
  return text.includes('.') ? text.replace(/0+$/, '').replace(/\.$/, '.0') : text;
}

export function unitText(unit: string): string {
  return UNIT_TEXT[unit] ?? unit;
}

/** "48.2 dBµV/m", "23.46 km", "618.0 MHz", "123.4°". */
export function formatFigure(value: number, unit: string): string {
  let text = fixed(value, placesFor(value, unit));
  if (unit === 'MHz' || unit === 'GHz') text = trimFrequency(text);
  const u = unitText(unit);
  return u === '°' ? `${text}°` : `${text} ${u}`;
}

/** A signed distance from a limit: "+2.4 dB", "-7.8 dB", "0.0 m". */
export function formatMargin(margin: number, unit: string): string {
  const body = formatFigure(margin, unit);
  // A margin that rounds to zero gets no sign.
  return Number(fixed(margin, placesFor(margin, unit))) > 0 ? `+${body}` : body;
}

/** A bearing from true north, always three digits before the point: "007.5°", "263.0°". */
export function formatBearing(deg: number): string {
  const text = fixed(deg, 1);
  // 359.96 rounds to 360.0, which is north.
  const norm = text === '360.0' ? '0.0' : text;
  return `${norm.padStart(5, '0')}°`;
}

/** Power in W with a metric prefix where it reads better: "850 W", "12.5 kW", "250 mW". */
export function formatWatts(watts: number): string {
  const size = Math.abs(watts);
  if (size >= 1e6) return `${fixed(watts / 1e6, 2)} MW`;
  if (size >= 1e3) return `${fixed(watts / 1e3, size >= 1e5 ? 0 : size >= 1e4 ? 1 : 2)} kW`;
  if (size > 0 && size < 1) return `${fixed(watts * 1e3, size < 0.01 ? 2 : 1)} mW`;
  return formatFigure(watts, 'W');
}

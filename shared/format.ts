/**
 * Every number a person reads, with its unit, formatted in one place: counts
 * and households with a comma every three digits, power in W or kW, distances
 * in km, field strength in dBµV/m, frequencies in MHz, levels in dB, angles in
 * °. The same on every platform: no locale lookup, which differs between
 * browsers and the native JS engine. Units are spelled one way everywhere
 * (dBµV/m, °, km), server sentences included.
 *
 * Precision is ours (common practice, no source): screening figures are not
 * worth more digits than their inputs carry. Time stamps are here too, since
 * every screen shows them the same way.
 */

// ---- counts ----

export function formatCount(n: number): string {
  if (!Number.isFinite(n)) throw new RangeError(`formatCount: ${String(n)} is not a finite number`);
  const whole = Math.round(n);
  const digits = String(Math.abs(whole)).replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  return whole < 0 ? `-${digits}` : digits;
}

/** "1 carriage", "3 carriages". */
export function countOf(n: number, one: string, many = `${one}s`): string {
  return `${formatCount(n)} ${n === 1 ? one : many}`;
}

/** Kilometres to one decimal, or a dash when the distance is not known. */
export function formatKm(km: number | null | undefined): string {
  return km === null || km === undefined || !Number.isFinite(km) ? '— km' : `${km.toFixed(1)} km`;
}

/** Short axis labels: 950, 1.5k, 250k, 1M, 2.5M. */
export function formatCompact(n: number): string {
  if (!Number.isFinite(n)) throw new RangeError(`formatCompact: ${String(n)} is not a finite number`);
  const a = Math.abs(n);
  const trim = (v: number) => String(Math.round(v * 10) / 10);
  if (a >= 1e6) return `${trim(n / 1e6)}M`;
  if (a >= 1e3) return `${trim(n / 1e3)}k`;
  return trim(n);
}

// ---- figures with units (feed checks, calculator) ----

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

/** Named forms of the figures above, one per quantity. */
export const formatFieldStrength = (dbUvPerM: number) => formatFigure(dbUvPerM, 'dBuV/m');
export const formatMHz = (mhz: number) => formatFigure(mhz, 'MHz');
export const formatDb = (db: number) => formatFigure(db, 'dB');
export const formatDegrees = (deg: number) => formatFigure(deg, 'deg');

/** A share as a percentage with two decimals: 0.99953 -> "99.95 %". */
export function formatPercent(fraction: number, places = 2): string {
  return `${grouped(fraction * 100, places)} %`;
}

/** A file size: "812 B", "12.4 kB", "3.1 MB", "64 MB". */
export function formatBytes(bytes: number): string {
  // One decimal, dropped when it is 0: "2 MB", a limit, reads as it was set.
  const tenth = (v: number) => fixed(v, 1).replace(/\.0$/, '');
  if (bytes < 1024) return `${formatCount(bytes)} B`;
  if (bytes < 1024 * 1024) return `${tenth(bytes / 1024)} kB`;
  return `${grouped(bytes / 1024 / 1024, 1).replace(/\.0$/, '')} MB`;
}

// ---- inventory figures: units always said, thousands grouped; positions with the hemisphere letter ----

/** Fixed decimals with the whole part grouped: 12,400.5. */
const grouped = (n: number, digits: number) => {
  const [whole, part] = fixed(n, digits).split('.');
  const sign = whole.startsWith('-') ? '-' : '';
  const digitsText = whole.replace('-', '').replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  return `${sign}${digitsText}${part === undefined ? '' : `.${part}`}`;
};

/** A figure with its unit: "173 m", "95.8 MHz"; "—" when absent. */
export function withUnit(value: number | null | undefined, unit: string, digits = 0): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return `${grouped(value, digits)} ${unit}`;
}

/** A figure without its unit (the unit is in a table header); "—" when absent. */
export function figure(value: number | null | undefined, digits = 0): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return grouped(value, digits);
}

/** ERP in W shown in kW with one decimal, or in W below 1 kW: "38.1 kW", "250 W". */
export function erpText(watts: number | null | undefined): string {
  if (watts === null || watts === undefined || !Number.isFinite(watts)) return '—';
  return watts >= 1000 ? `${grouped(watts / 1000, 1)} kW` : `${grouped(watts, 0)} W`;
}

/**
 * "38.22736° S, 29.31671° W": five decimals are about 1 m on the ground,
 * finer than any site record needs (common practice, no source).
 */
export function positionText(lat: number, lon: number): string {
  if (!Number.isFinite(lat) || !Number.isFinite(lon)) throw new RangeError(`positionText: lat and lon must be numbers, got ${lat}, ${lon}`);
  const part = (v: number, pos: string, neg: string) => `${Math.abs(v).toFixed(5)}° ${v < 0 ? neg : pos}`;
  return `${part(lat, 'N', 'S')}, ${part(lon, 'E', 'W')}`;
}

/** "12,400 households", "1 household", "households not recorded". */
export function householdsText(n: number | null | undefined): string {
  if (n === null || n === undefined) return 'households not recorded';
  return `${grouped(n, 0)} ${n === 1 ? 'household' : 'households'}`;
}

/** A list of codes as one line: "A; B", or "none". */
export function codesText(codes: readonly string[] | null | undefined): string {
  return codes && codes.length ? codes.join('; ') : 'none';
}

/** "1 Dec 2026, 22:39" in the viewer's time zone, with the ISO time for exactness elsewhere. */
export function whenText(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  return d.toLocaleString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });
}

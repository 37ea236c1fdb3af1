/**
 * How inventory figures read on screen: units always said, sensible
 * precision, thousands grouped. Positions as degrees with the hemisphere
 * letter, so a sign is never the only clue to south or west.
 */

const grouped = (n: number, digits: number) => n.toLocaleString('en', { minimumFractionDigits: digits, maximumFractionDigits: digits });

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

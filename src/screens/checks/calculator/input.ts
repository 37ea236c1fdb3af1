/**
 * Reading what a person types into the calculator. Each reader answers a value or an error
 * sentence naming the field and what is wrong, to show under that field.
 */

export type Parsed<T> = { ok: true; value: T } | { ok: false; error: string };

export interface NumberRule {
  /** The field's name as the label says it: "Distance". */
  label: string;
  /** Unit named in messages: "km". */
  unit?: string;
  min?: number;
  max?: number;
  /** The minimum itself is not allowed (distance above 0). */
  minExclusive?: boolean;
  integer?: boolean;
}

// One optional sign, digits with at most one decimal point (or comma), optional exponent.
const NUMBER = /^[+-]?(\d+([.,]\d*)?|[.,]\d+)(e[+-]?\d+)?$/i;

function withUnit(v: number, unit?: string): string {
  return unit ? `${v} ${unit}` : String(v);
}

/**
 * A decimal number. A comma is read as the decimal point ("97,3"), since many engineers
 * type it so; thousands separators are refused rather than guessed.
 */
export function parseNumber(text: string, rule: NumberRule): Parsed<number> {
  const t = text.trim().replace(/\s+/g, '');
  const unitHint = rule.unit ? ` of ${rule.unit}` : '';
  if (t === '') return { ok: false, error: `${rule.label} is empty: enter a number${unitHint}` };
  if (!NUMBER.test(t)) return { ok: false, error: `${rule.label} must be a number${unitHint} (got "${text.trim()}")` };
  const value = Number(t.replace(',', '.'));
  if (!Number.isFinite(value)) return { ok: false, error: `${rule.label} is too large` };
  if (rule.integer && !Number.isInteger(value)) return { ok: false, error: `${rule.label} must be a whole number (got ${value})` };
  if (rule.min !== undefined) {
    if (rule.minExclusive ? value <= rule.min : value < rule.min) {
      return { ok: false, error: `${rule.label} must be ${rule.minExclusive ? 'above' : 'at least'} ${withUnit(rule.min, rule.unit)} (got ${withUnit(value, rule.unit)})` };
    }
  }
  if (rule.max !== undefined && value > rule.max) {
    return { ok: false, error: `${rule.label} must be at most ${withUnit(rule.max, rule.unit)} (got ${withUnit(value, rule.unit)})` };
  }
  return { ok: true, value };
}

/**
 * A latitude or longitude in decimal degrees: "51.4821", "-3.18", "51.4821 N", "3.18W",
 * "51.4821°". A hemisphere letter and a minus sign together are refused as ambiguous.
 */
export function parseCoordinate(text: string, axis: 'lat' | 'lon', label: string): Parsed<number> {
  const t = text.trim().toUpperCase().replace(/°/g, ' ').trim();
  const limit = axis === 'lat' ? 90 : 180;
  const letters = axis === 'lat' ? 'N or S' : 'E or W';
  if (t === '') return { ok: false, error: `${label} is empty: enter decimal degrees, e.g. ${axis === 'lat' ? '52.1 or 52.1 N' : '-3.4 or 3.4 W'}` };
  const m = /^([+-]?[\d.,]+)\s*([NSEW])?$/.exec(t);
  if (!m) return { ok: false, error: `${label} must be decimal degrees, optionally followed by ${letters} (got "${text.trim()}")` };
  const [, num, hemi] = m;
  if (hemi) {
    const allowed = axis === 'lat' ? 'NS' : 'EW';
    if (!allowed.includes(hemi)) return { ok: false, error: `${label} takes ${letters}, not ${hemi}` };
    if (/^[+-]/.test(num)) return { ok: false, error: `${label}: use either a sign or ${letters}, not both` };
  }
  // With a hemisphere letter the number is a magnitude.
  const n = parseNumber(num, { label, unit: 'degrees', min: hemi ? 0 : -limit, max: limit });
  if (!n.ok) return n;
  const signed = hemi === 'S' || hemi === 'W' ? -n.value : n.value;
  return { ok: true, value: signed === 0 ? 0 : signed };
}

export type PowerUnit = 'W' | 'dBW' | 'dBm';
export type PowerReference = 'erp' | 'eirp';

/** A transmitter power in the chosen unit, as dBW. Watts must be above 0 (a log of 0 has no value). */
export function parsePowerDbw(text: string, unit: PowerUnit, label = 'Power'): Parsed<number> {
  if (unit === 'W') {
    const w = parseNumber(text, { label, unit: 'W', min: 0, minExclusive: true });
    return w.ok ? { ok: true, value: 10 * Math.log10(w.value) } : w;
  }
  // Broadcast powers span roughly -30 to +70 dBW; outside +-200 is a typing slip.
  const db = parseNumber(text, { label, unit, min: -200, max: 200 });
  if (!db.ok) return db;
  return { ok: true, value: unit === 'dBm' ? db.value - 30 : db.value };
}


/**
 * An error is shown once the person has typed something or has left the field: an empty
 * form opening with a column of red messages would shout before anyone did anything.
 */
export function visibleError(text: string, touched: boolean, error: string | undefined | null): string | null {
  if (!error) return null;
  return touched || text.trim() !== '' ? error : null;
}

/**
 * The arithmetic of a horizontal bar chart: a rounded top of scale, bar
 * lengths in px, tick values, and whether a value's text fits inside its bar.
 * The "nice number" rounding (1, 2, 5 x 10^k) follows Heckbert, "Nice numbers
 * for graph labels", Graphics Gems (1990).
 */

/** The smallest of 1, 2, 5, 10 x 10^k that is >= value (value > 0). */
export function niceCeiling(value: number): number {
  if (!Number.isFinite(value) || value < 0) throw new RangeError(`niceCeiling: expected a finite number >= 0, got ${String(value)}`);
  if (value === 0) return 1;
  const power = 10 ** Math.floor(Math.log10(value));
  const fraction = value / power;
  // The small tolerance keeps exact values (5, 200) from tipping a step up through rounding.
  const step = [1, 2, 5, 10].find((s) => fraction <= s * (1 + 1e-12)) ?? 10;
  return step * power;
}

export interface BarScale {
  /** Top of the scale: the nice ceiling of the largest value (1 when all are 0). */
  max: number;
  /** Length in px of a bar for `value`, between 0 and `trackPx`. */
  length: (value: number) => number;
  /** Evenly spaced tick values from 0 to max. */
  ticks: number[];
}

export function barScale(values: readonly number[], trackPx: number, tickCount = 4): BarScale {
  if (!Number.isFinite(trackPx) || trackPx <= 0) throw new RangeError(`barScale: trackPx must be a number > 0, got ${String(trackPx)}`);
  for (const v of values) {
    if (!Number.isFinite(v) || v < 0) throw new RangeError(`barScale: values must be finite and >= 0, got ${String(v)}`);
  }
  const max = niceCeiling(Math.max(0, ...values));
  const n = Math.max(1, Math.round(tickCount));
  const ticks = Array.from({ length: n + 1 }, (_, i) => (max * i) / n);
  return {
    max,
    length: (value) => Math.max(0, Math.min(trackPx, (value / max) * trackPx)),
    ticks,
  };
}

/**
 * Where a bar's value text goes: inside the bar (light text on the bar) when
 * the bar is long enough for the text plus padding, else just after it.
 * Text width is estimated from the character count (`charPx` per character,
 * about 0.6 em for a monospaced face).
 */
export function valuePlacement(barPx: number, text: string, charPx: number, paddingPx = 6): { inside: boolean; x: number } {
  const textPx = text.length * charPx;
  if (barPx >= textPx + 2 * paddingPx) return { inside: true, x: barPx - paddingPx };
  return { inside: false, x: barPx + paddingPx };
}

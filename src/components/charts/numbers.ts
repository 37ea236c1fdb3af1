/**
 * Counts as people read them: whole numbers with a comma every three digits
 * ("851,490"), the same on every platform (no locale lookup, which differs
 * between browsers and the native JS engine).
 */
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

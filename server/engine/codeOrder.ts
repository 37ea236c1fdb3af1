/**
 * Lists kept in code order (plain code-point order, the order the network
 * loader reads entities in and the incremental update relies on).
 */
type Coded = { code: string };

/** `items` (in code order) with the `codes` taken out and `now` (the current state of those codes) put in place. */
export function patchList<T extends Coded>(items: readonly T[], codes: readonly string[], now: readonly T[]): T[] {
  const gone = new Set(codes);
  for (const e of now) gone.add(e.code);
  const out = items.filter((e) => !gone.has(e.code));
  for (const e of [...now].sort((a, b) => (a.code < b.code ? -1 : a.code > b.code ? 1 : 0))) {
    let lo = 0;
    let hi = out.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (out[mid].code < e.code) lo = mid + 1;
      else hi = mid;
    }
    out.splice(lo, 0, e);
  }
  return out;
}

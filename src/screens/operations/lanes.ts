/** Stacks overlapping windows into lanes for the timeline: each window goes to the first lane free at its start. */
export function lanes<T extends { start: string; end: string }>(items: readonly T[]): T[][] {
  const sorted = [...items].sort((a, b) => Date.parse(a.start) - Date.parse(b.start));
  const out: T[][] = [];
  const ends: number[] = [];
  for (const it of sorted) {
    const s = Date.parse(it.start);
    const lane = ends.findIndex((e) => e <= s);
    if (lane >= 0) {
      out[lane].push(it);
      ends[lane] = Date.parse(it.end);
    } else {
      out.push([it]);
      ends.push(Date.parse(it.end));
    }
  }
  return out;
}

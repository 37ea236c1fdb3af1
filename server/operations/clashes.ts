/**
 * Clash detection (rule 10): two spells (planned works, or a work and an open
 * incident) clash when their windows overlap and their joint loss is not
 * empty. Windows are half-open [start, end): a window that ends when another
 * starts does not overlap it. An open incident runs to +Infinity.
 *
 * Every pair: sort by start and sweep, keeping the spells still running, so
 * only overlapping pairs reach the (cached) reach computation.
 */
import type { Element } from '@/shared/schemas/analysis';
import type { Clash, WorkState } from '@/shared/schemas/operations';
import type { OperationsReachCache } from './reach';

export interface Spell {
  code: string;
  kind: 'work' | 'incident';
  state: WorkState | 'open';
  /** epoch ms */
  start: number;
  /** epoch ms, Infinity while open */
  end: number;
  elements: Element[];
}

export const overlaps = (a: Spell, b: Spell) => a.start < b.end && b.start < a.end;

const iso = (ms: number) => (Number.isFinite(ms) ? new Date(ms).toISOString() : null);

/** The clash of `a` with `b`, seen from `a` (null when there is none). */
export function clashOf(cache: OperationsReachCache, a: Spell, b: Spell): Clash | null {
  if (a.code === b.code || (a.kind === 'incident' && b.kind === 'incident') || !overlaps(a, b)) return null;
  const j = cache.joint(a.elements, b.elements);
  if (!j) return null;
  return {
    work: b.code,
    with: b.kind,
    otherState: b.state,
    overlap: { start: iso(Math.max(a.start, b.start))!, end: iso(Math.min(a.end, b.end)) },
    jointLost: j.jointLost,
    households: j.households,
  };
}

/** The clashes of one spell with the others. */
export function clashesWith(cache: OperationsReachCache, one: Spell, others: readonly Spell[]): Clash[] {
  const out: Clash[] = [];
  for (const b of others) {
    const c = clashOf(cache, one, b);
    if (c) out.push(c);
  }
  return out.sort((x, y) => (x.overlap.start < y.overlap.start ? -1 : x.overlap.start > y.overlap.start ? 1 : x.work < y.work ? -1 : 1));
}

/** Every clash among the spells, listed on both sides: code -> its clashes. */
export function allClashes(cache: OperationsReachCache, spells: readonly Spell[]): Map<string, Clash[]> {
  const byStart = [...spells].sort((a, b) => a.start - b.start);
  const out = new Map<string, Clash[]>(spells.map((s) => [s.code, []]));
  let running: Spell[] = [];
  for (const s of byStart) {
    running = running.filter((r) => r.end > s.start);
    for (const r of running) {
      const seenFromS = clashOf(cache, s, r);
      if (!seenFromS) continue;
      out.get(s.code)!.push(seenFromS);
      out.get(r.code)!.push({ ...seenFromS, work: s.code, with: s.kind, otherState: s.state });
    }
    running.push(s);
  }
  for (const list of out.values()) list.sort((x, y) => (x.overlap.start < y.overlap.start ? -1 : x.overlap.start > y.overlap.start ? 1 : x.work < y.work ? -1 : 1));
  return out;
}

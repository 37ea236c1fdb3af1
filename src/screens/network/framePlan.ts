/**
 * What one frame of the geographic diagram draws, in screen px: the level of
 * detail for the zoom (./lod.ts), its groups and lone sites in view, the
 * bundled lines, the failure marks and the labels that find room. Pure
 * arithmetic over the level's typed arrays, so it runs every frame of a
 * gesture; the canvas painter (./paintGeo.ts) only strokes what it lists.
 * What does not change with the view (each line's style, the order in which
 * groups ask for a label, the failure marks summed per group) is worked out
 * once per level and failure set (levelPrep), not per frame.
 */
import type { FeedRole, Medium, SiteRole } from '@/shared/schemas/network';
import { formatCount } from '@/shared/format';
import type { DiagramModel } from './diagramModel';
import { placeLabels, type LabelCandidate, type PlacedLabel } from './labelPlacement';
import { byImportance, groupMarks, MIXED, type GroupMarks, type Level, type LodIndex } from './lod';
import { SITE_R } from './markStyle';
import { clipSegment, showPatterns, visibleWorld, type View } from './viewport';

export type Status = 'off-air' | 'on-reserve';

export interface PlannedMark {
  /** Group index in the level. */
  group: number;
  x: number;
  y: number;
  r: number;
  /** A lone site's role; null for a group of several. */
  role: SiteRole | null;
  /** The site it stands for (lone site) or its lead site (group). */
  site: number;
  count: number;
  off: number;
  reserve: number;
}

export interface PlannedLines {
  role: FeedRole;
  medium: Medium | typeof MIXED;
  /** Width step 1..4 (more feeds, wider line). */
  weight: number;
  /** x1 y1 x2 y2 per segment. */
  segs: number[];
}

export interface FramePlan {
  level: number;
  marks: PlannedMark[];
  /** In paint order: main lines under reserve lines, thinner under wider. */
  lines: PlannedLines[];
  labels: PlacedLabel[];
  /** Dash patterns drawn (few enough lines in view). */
  patterns: boolean;
  counts: { groups: number; singles: number; lines: number; sitesInGroups: number; offMarks: number; reserveMarks: number };
}

const LABEL_FONT_PX = 12;
const COUNT_FONT_PX = 11;
/**
 * Names drawn at most per frame (our own cap, common practice: a screenful
 * stays readable). Counts inside group circles are not held to it: a circle
 * without its number says nothing, and the counts never overlap either.
 */
export const MAX_NAMES = 120;

export function groupRadius(count: number): number {
  return Math.min(16, 7 + 2.2 * Math.log2(count));
}

export function lineWeight(feeds: number): number {
  return feeds <= 1 ? 1 : feeds <= 3 ? 2 : feeds <= 15 ? 3 : 4;
}

export interface PlanInput {
  model: DiagramModel;
  lod: LodIndex;
  view: View;
  width: number;
  height: number;
  statuses: ReadonlyMap<string, Status>;
  siteIndex: ReadonlyMap<string, number>;
  /** Text width in px for a label (canvas measureText on the web; an estimate in tests). */
  measure: (text: string, fontPx: number) => number;
  /** Leave labels out (during a gesture, to keep frames short). */
  labels?: boolean;
}

interface LevelPrep {
  /** Per bundled line: its style's index in `styles` (sorted in paint order). */
  lineStyle: Int32Array;
  styles: { role: FeedRole; medium: Medium | typeof MIXED; weight: number }[];
  /** Groups that may be named, by importance (lead's role, then households): lone sites and groups holding an origin or main station. */
  nameOrder: Int32Array;
  /** The failure marks summed per group, for the last failure set (and site index) seen. */
  marks: { statuses: ReadonlyMap<string, Status>; siteIndex: ReadonlyMap<string, number>; by: GroupMarks } | null;
}

const preps = new WeakMap<Level, LevelPrep>();

function levelPrep(model: DiagramModel, lv: Level): LevelPrep {
  let prep = preps.get(lv);
  if (prep) return prep;
  const keyed = new Map<string, number>();
  const raw: LevelPrep['styles'] = [];
  const rawStyle = new Int32Array(lv.lineA.length);
  for (let i = 0; i < lv.lineA.length; i++) {
    const weight = lineWeight(lv.lineFeeds[i]);
    const key = `${lv.lineRole[i]}|${lv.lineMedium[i]}|${weight}`;
    let at = keyed.get(key);
    if (at === undefined) keyed.set(key, (at = raw.push({ role: lv.lineRole[i], medium: lv.lineMedium[i], weight }) - 1));
    rawStyle[i] = at;
  }
  // Main lines under reserve lines, so the double line of a reserve stays readable where both run.
  const order = raw.map((_, i) => i).sort((a, b) => (raw[a].role === raw[b].role ? raw[a].weight - raw[b].weight : raw[a].role === 'main' ? -1 : 1));
  const rank = new Int32Array(raw.length);
  order.forEach((at, i) => (rank[at] = i));
  const lineStyle = rawStyle.map((at) => rank[at]);
  const named: number[] = [];
  for (let g = 0; g < lv.count.length; g++) if (lv.count[g] === 1 || lv.origins[g] + lv.mains[g] > 0) named.push(g);
  named.sort((p, q) => byImportance(model, lv.lead[p], lv.lead[q]) || p - q);
  prep = { lineStyle, styles: order.map((at) => raw[at]), nameOrder: Int32Array.from(named), marks: null };
  preps.set(lv, prep);
  return prep;
}

function marksFor(prep: LevelPrep, lv: Level, siteIndex: ReadonlyMap<string, number>, statuses: ReadonlyMap<string, Status>): GroupMarks | null {
  if (statuses.size === 0) return null;
  // Failure sets are replaced, never edited in place (the screen derives a new map), so identity tells a new one.
  if (prep.marks?.statuses !== statuses || prep.marks.siteIndex !== siteIndex) prep.marks = { statuses, siteIndex, by: groupMarks(lv, siteIndex, statuses) };
  return prep.marks.by;
}

export function planFrame({ model, lod, view, width, height, statuses, siteIndex, measure, labels = true }: PlanInput): FramePlan {
  const lv = lod.levelFor(view.k);
  const prep = levelPrep(model, lv);
  const marksBy = marksFor(prep, lv, siteIndex, statuses);
  const rect = visibleWorld(view, width, height, 24);
  const marks: PlannedMark[] = [];
  let groups = 0;
  let sitesInGroups = 0;
  let offMarks = 0;
  let reserveMarks = 0;
  const grow = Math.min(1.6, 1 + Math.log2(view.k) / 8);
  for (let g = 0; g < lv.count.length; g++) {
    const wx = lv.x[g];
    const wy = lv.y[g];
    if (wx < rect.x0 || wx > rect.x1 || wy < rect.y0 || wy > rect.y1) continue;
    const count = lv.count[g];
    const site = lv.lead[g];
    const role = count === 1 ? model.sites[site].role : null;
    const off = marksBy ? marksBy.off[g] : 0;
    const reserve = marksBy ? marksBy.reserve[g] : 0;
    if (off > 0) offMarks++;
    else if (reserve > 0) reserveMarks++;
    if (role === null) {
      groups++;
      sitesInGroups += count;
    }
    marks.push({ group: g, x: wx * view.k + view.tx, y: wy * view.k + view.ty, r: role ? SITE_R[role] * grow : groupRadius(count), role, site, count, off, reserve });
  }

  // Lines that cross the view, cut to it: the browser rasterises a stroke along its whole length, and
  // close up most bundled lines run far off screen (the bounding-box test alone let thousands through).
  const segs: number[][] = prep.styles.map(() => []);
  let lineCount = 0;
  for (let i = 0; i < lv.lineA.length; i++) {
    const a = lv.lineA[i];
    const b = lv.lineB[i];
    const ax = lv.x[a];
    const ay = lv.y[a];
    const bx = lv.x[b];
    const by = lv.y[b];
    if (Math.max(ax, bx) < rect.x0 || Math.min(ax, bx) > rect.x1 || Math.max(ay, by) < rect.y0 || Math.min(ay, by) > rect.y1) continue;
    const cut = clipSegment(ax, ay, bx, by, rect);
    if (!cut) continue;
    lineCount++;
    segs[prep.lineStyle[i]].push(cut[0] * view.k + view.tx, cut[1] * view.k + view.ty, cut[2] * view.k + view.tx, cut[3] * view.k + view.ty);
  }
  const lines: PlannedLines[] = [];
  prep.styles.forEach((st, i) => {
    if (segs[i].length > 0) lines.push({ ...st, segs: segs[i] });
  });

  return {
    level: lv.level,
    marks,
    lines,
    labels: labels ? planLabels(model, lv, prep, marks, width, height, measure) : [],
    patterns: showPatterns(lineCount),
    counts: { groups, singles: marks.length - groups, lines: lineCount, sitesInGroups, offMarks, reserveMarks },
  };
}

/** Labels per frame: counts inside group circles first (they carry the number), then names by importance, off air first (the operations desk looks for them). */
function planLabels(model: DiagramModel, lv: Level, prep: LevelPrep, marks: PlannedMark[], width: number, height: number, measure: PlanInput['measure']): PlacedLabel[] {
  const candidates: LabelCandidate[] = [];
  const markOf = new Int32Array(lv.count.length).fill(-1);
  marks.forEach((m, i) => (markOf[m.group] = i));
  for (const m of marks) {
    if (m.role !== null) continue;
    const text = formatCount(m.count);
    candidates.push({ x: m.x, y: m.y, r: m.r, width: measure(text, COUNT_FONT_PX) + 2, height: COUNT_FONT_PX + 2, text, centred: true });
  }
  const counts = candidates.length;
  // Only the most important few are measured and tried: the rest could not find room under the cap anyway.
  let room = 4 * MAX_NAMES;
  const name = (m: PlannedMark) => {
    const text = labelText(model, m);
    candidates.push({ x: m.x, y: m.y, r: m.r + 2, width: measure(text, LABEL_FONT_PX) + 4, height: LABEL_FONT_PX + 4, text });
    room--;
  };
  // Off air first: every group with a site off air may be named, in the order of importance of its lead.
  const offFirst = marks.filter((m) => m.off > 0).sort((p, q) => byImportance(model, p.site, q.site));
  for (const m of offFirst) {
    if (room <= 0) break;
    name(m);
  }
  for (let i = 0; i < prep.nameOrder.length && room > 0; i++) {
    const at = markOf[prep.nameOrder[i]];
    if (at < 0 || marks[at].off > 0) continue;
    name(marks[at]);
  }
  return placeLabels(candidates, width, height, counts + MAX_NAMES);
}

/** "Name", "Name and 12 nearby", with the failure count when there is one. */
export function labelText(model: DiagramModel, m: PlannedMark): string {
  const name = model.sites[m.site].name;
  const base = m.count > 1 ? `${name} and ${formatCount(m.count - 1)} nearby` : name;
  if (m.off > 0) return m.count > 1 ? `${base}: ${formatCount(m.off)} off air` : `${base}: off air`;
  return base;
}

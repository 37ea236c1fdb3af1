/**
 * What one frame of the geographic diagram draws, in screen px: the level of
 * detail for the zoom (./lod.ts), its groups and lone sites in view, the
 * bundled lines, the failure marks and the labels that find room. Pure
 * arithmetic over the level's typed arrays, so it runs every frame of a
 * gesture; the canvas painter (./paintGeo.ts) only strokes what it lists.
 */
import type { FeedRole, Medium, SiteRole } from '@/shared/schemas/network';
import { formatCount } from '@/shared/format';
import type { DiagramModel } from './diagramModel';
import { placeLabels, type LabelCandidate, type PlacedLabel } from './labelPlacement';
import { groupMarks, MIXED, type LodIndex } from './lod';
import { SITE_R } from './markStyle';
import { showPatterns, visibleWorld, type View } from './viewport';

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
  lines: PlannedLines[];
  labels: PlacedLabel[];
  /** Dash patterns drawn (few enough lines in view). */
  patterns: boolean;
  counts: { groups: number; singles: number; lines: number; sitesInGroups: number; offMarks: number; reserveMarks: number };
}

const LABEL_FONT_PX = 12;
const COUNT_FONT_PX = 11;
/** Labels drawn at most per frame (our own cap, common practice: a screenful stays readable). */
export const MAX_LABELS = 120;

export function groupRadius(count: number): number {
  return Math.min(16, 7 + 2.2 * Math.log2(count));
}

export function lineWeight(feeds: number): number {
  return feeds <= 1 ? 1 : feeds <= 3 ? 2 : feeds <= 15 ? 3 : 4;
}

const ROLE_RANK: Record<SiteRole, number> = { origin: 0, main: 1, relay: 2 };

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

export function planFrame({ model, lod, view, width, height, statuses, siteIndex, measure, labels = true }: PlanInput): FramePlan {
  const lv = lod.levelFor(view.k);
  const marksBy = statuses.size > 0 ? groupMarks(lv, siteIndex, statuses) : null;
  const rect = visibleWorld(view, width, height, 24);
  const marks: PlannedMark[] = [];
  const inView = new Uint8Array(lv.count.length);
  let groups = 0;
  let sitesInGroups = 0;
  let offMarks = 0;
  let reserveMarks = 0;
  const grow = Math.min(1.6, 1 + Math.log2(view.k) / 8);
  for (let g = 0; g < lv.count.length; g++) {
    const wx = lv.x[g];
    const wy = lv.y[g];
    if (wx < rect.x0 || wx > rect.x1 || wy < rect.y0 || wy > rect.y1) continue;
    inView[g] = 1;
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

  // Lines whose bounding box meets the view; both ends' screen points.
  const byStyle = new Map<string, PlannedLines>();
  let lineCount = 0;
  for (let i = 0; i < lv.lineA.length; i++) {
    const a = lv.lineA[i];
    const b = lv.lineB[i];
    const ax = lv.x[a];
    const ay = lv.y[a];
    const bx = lv.x[b];
    const by = lv.y[b];
    if (Math.max(ax, bx) < rect.x0 || Math.min(ax, bx) > rect.x1 || Math.max(ay, by) < rect.y0 || Math.min(ay, by) > rect.y1) continue;
    lineCount++;
    const weight = lineWeight(lv.lineFeeds[i]);
    const key = `${lv.lineRole[i]}|${lv.lineMedium[i]}|${weight}`;
    let entry = byStyle.get(key);
    if (!entry) byStyle.set(key, (entry = { role: lv.lineRole[i], medium: lv.lineMedium[i], weight, segs: [] }));
    entry.segs.push(ax * view.k + view.tx, ay * view.k + view.ty, bx * view.k + view.tx, by * view.k + view.ty);
  }

  let placed: PlacedLabel[] = [];
  if (labels) {
    const candidates: LabelCandidate[] = [];
    // Counts inside group circles first (they carry the number), then names by importance.
    for (const m of marks) {
      if (m.role !== null) continue;
      const text = formatCount(m.count);
      candidates.push({ x: m.x, y: m.y, r: m.r, width: measure(text, COUNT_FONT_PX) + 2, height: COUNT_FONT_PX + 2, text, centred: true });
    }
    const named = marks
      .filter((m) => m.role !== null || lv.origins[m.group] + lv.mains[m.group] > 0 || m.off > 0)
      .sort((p, q) => rankOf(model, p) - rankOf(model, q) || (model.sites[q.site].households ?? 0) - (model.sites[p.site].households ?? 0));
    // Only the most important few are measured and tried: the rest could not find room under the cap anyway.
    for (const m of named.slice(0, 4 * MAX_LABELS)) {
      const text = labelText(model, m);
      candidates.push({ x: m.x, y: m.y, r: m.r + 2, width: measure(text, LABEL_FONT_PX) + 4, height: LABEL_FONT_PX + 4, text });
    }
    placed = placeLabels(candidates, width, height, MAX_LABELS);
  }
  return {
    level: lv.level,
    marks,
    lines: [...byStyle.values()],
    labels: placed,
    patterns: showPatterns(lineCount),
    counts: { groups, singles: marks.length - groups, lines: lineCount, sitesInGroups, offMarks, reserveMarks },
  };
}

function rankOf(model: DiagramModel, m: PlannedMark): number {
  // Off-air marks first: the operations desk looks for them.
  return (m.off > 0 ? 0 : 3) + ROLE_RANK[model.sites[m.site].role];
}

/** "Name", "Name and 12 nearby", with the failure count when there is one. */
export function labelText(model: DiagramModel, m: PlannedMark): string {
  const name = model.sites[m.site].name;
  const base = m.count > 1 ? `${name} and ${formatCount(m.count - 1)} nearby` : name;
  if (m.off > 0) return m.count > 1 ? `${base}: ${formatCount(m.off)} off air` : `${base}: off air`;
  return base;
}

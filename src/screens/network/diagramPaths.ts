/**
 * SVG path data for what is in view, in screen px: one path per feed style
 * and one per site mark, however many sites there are, so the page holds a
 * dozen elements rather than thousands.
 */
import type { FeedRole, Medium, SiteRole } from '@/shared/schemas/network';
import type { DiagramLink } from './diagramModel';
import { clipSegment, type Rect, type View } from './viewport';

const r1 = (n: number) => Math.round(n * 10) / 10;

export type StyleKey = `${Medium}|${FeedRole}`;

/** Straight lines per medium and role ("M x y L x y M ..."), cut to `clip` (screen px) when given. */
export function linkPaths(xs: Float64Array, ys: Float64Array, links: readonly DiagramLink[], indices: readonly number[], v: View, clip?: Rect): Map<StyleKey, string> {
  const parts = new Map<StyleKey, string[]>();
  for (const i of indices) {
    const l = links[i];
    let seg: [number, number, number, number] | null = [xs[l.from] * v.k + v.tx, ys[l.from] * v.k + v.ty, xs[l.to] * v.k + v.tx, ys[l.to] * v.k + v.ty];
    if (clip) seg = clipSegment(seg[0], seg[1], seg[2], seg[3], clip);
    if (!seg) continue;
    const key = `${l.medium}|${l.role}` as StyleKey;
    let list = parts.get(key);
    if (!list) parts.set(key, (list = []));
    list.push(`M${r1(seg[0])} ${r1(seg[1])}L${r1(seg[2])} ${r1(seg[3])}`);
  }
  return new Map([...parts].map(([k, list]) => [k, list.join('')]));
}

/** Site marks by role: origin a square, main a diamond, relay a circle (radius `r`). */
export function siteShape(role: SiteRole, x: number, y: number, r: number): string {
  const X = r1(x);
  const Y = r1(y);
  if (role === 'origin') return `M${r1(x - r)} ${r1(y - r)}h${r1(2 * r)}v${r1(2 * r)}h${r1(-2 * r)}z`;
  if (role === 'main') {
    const d = r1(r * 1.35);
    return `M${X} ${r1(y - d)}l${d} ${d}l${-d} ${d}l${-d} ${-d}z`;
  }
  return `M${r1(x - r)} ${Y}a${r1(r)} ${r1(r)} 0 1 0 ${r1(2 * r)} 0a${r1(r)} ${r1(r)} 0 1 0 ${r1(-2 * r)} 0z`;
}

/** An off-air mark: a cross through the site. */
export function crossShape(x: number, y: number, r: number): string {
  return `M${r1(x - r)} ${r1(y - r)}L${r1(x + r)} ${r1(y + r)}M${r1(x + r)} ${r1(y - r)}L${r1(x - r)} ${r1(y + r)}`;
}

/** An on-reserve mark: a ring around the site with its left half filled by a second path (see halfShape). */
export function ringShape(x: number, y: number, r: number): string {
  return `M${r1(x - r)} ${r1(y)}a${r1(r)} ${r1(r)} 0 1 0 ${r1(2 * r)} 0a${r1(r)} ${r1(r)} 0 1 0 ${r1(-2 * r)} 0z`;
}

export function halfShape(x: number, y: number, r: number): string {
  return `M${r1(x)} ${r1(y - r)}a${r1(r)} ${r1(r)} 0 0 0 0 ${r1(2 * r)}z`;
}

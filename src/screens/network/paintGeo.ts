/**
 * Paints a frame plan (./framePlan.ts) on a 2D canvas: land, bundled feed
 * lines (main a single dark line, reserve a double line; medium by dash
 * pattern when few enough lines are in view), groups as circles holding
 * their number, lone sites by role shape (origin square, main station
 * diamond, relay open circle), the failure marks on top (off air a cross,
 * on reserve a half-filled ring) and the labels with a white halo.
 * Shapes and words carry the meaning; colour only repeats it (./markStyle.ts).
 */
import { feedStrokes } from '@/src/components/charts/feedStyle';
import { colors, fonts } from '@/src/theme';
import { plainStrokes } from './denseLines';
import type { FramePlan, PlannedMark } from './framePlan';
import { FAIL_MARK, GROUP_MARK, ROLE_MARK, ROLE_PAINT_ORDER, SELECTED_RING } from './markStyle';
import type { View } from './viewport';

const dashOf = (dash: string | undefined) => (dash ? dash.split(' ').map(Number) : []);

export interface PaintInput {
  plan: FramePlan;
  view: View;
  width: number;
  height: number;
  dpr: number;
  land: Path2D | null;
  /** The chosen site's screen point, ringed. */
  selected: { x: number; y: number } | null;
}

export function paintGeo(ctx: CanvasRenderingContext2D, { plan, view, width, height, dpr, land, selected }: PaintInput) {
  ctx.setTransform(dpr, 0, 0, dpr, 0, 0);
  ctx.fillStyle = colors.surface;
  ctx.fillRect(0, 0, width, height);
  if (land) {
    ctx.save();
    ctx.setTransform(view.k * dpr, 0, 0, view.k * dpr, view.tx * dpr, view.ty * dpr);
    ctx.fillStyle = colors.sunken;
    ctx.strokeStyle = colors.line;
    ctx.lineWidth = 1 / view.k;
    ctx.fill(land);
    ctx.stroke(land);
    ctx.restore();
  }

  ctx.lineCap = 'butt';
  // In the plan's order: main lines under reserve lines, so the double line of a reserve stays readable where both run.
  for (const group of plan.lines) {
    const scale = 0.5 + 0.35 * group.weight;
    const layers = plan.patterns && group.medium !== 'mixed' ? feedStrokes(group.medium, group.role, scale) : plainStrokes(group.role).map((l) => ({ ...l, width: l.width * scale, dash: undefined }));
    ctx.beginPath();
    const s = group.segs;
    for (let i = 0; i < s.length; i += 4) {
      ctx.moveTo(s[i], s[i + 1]);
      ctx.lineTo(s[i + 2], s[i + 3]);
    }
    for (const layer of layers) {
      ctx.strokeStyle = layer.stroke;
      ctx.lineWidth = layer.width;
      ctx.setLineDash(dashOf(layer.dash));
      ctx.stroke();
    }
  }
  ctx.setLineDash([]);

  // Reserve rings under the marks they surround.
  const ringR = (m: PlannedMark) => m.r + FAIL_MARK.gap;
  ctx.beginPath();
  for (const m of plan.marks) {
    if (m.off > 0 || m.reserve === 0) continue;
    ctx.moveTo(m.x + ringR(m), m.y);
    ctx.arc(m.x, m.y, ringR(m), 0, Math.PI * 2);
  }
  ctx.fillStyle = colors.surface;
  ctx.fill();
  ctx.strokeStyle = FAIL_MARK.reserveStroke;
  ctx.lineWidth = FAIL_MARK.reserveWidth;
  ctx.stroke();
  ctx.beginPath();
  for (const m of plan.marks) {
    if (m.off > 0 || m.reserve === 0) continue;
    ctx.moveTo(m.x, m.y - ringR(m));
    ctx.arc(m.x, m.y, ringR(m), -Math.PI / 2, Math.PI / 2, true);
    ctx.closePath();
  }
  ctx.fillStyle = FAIL_MARK.reserveStroke;
  ctx.fill();

  // Groups: a tinted circle with a double outline (a lone relay has a single thin one).
  ctx.beginPath();
  for (const m of plan.marks) {
    if (m.role !== null) continue;
    ctx.moveTo(m.x + m.r, m.y);
    ctx.arc(m.x, m.y, m.r, 0, Math.PI * 2);
  }
  ctx.fillStyle = GROUP_MARK.fill;
  ctx.fill();
  ctx.strokeStyle = GROUP_MARK.outer;
  ctx.lineWidth = GROUP_MARK.outerWidth;
  ctx.stroke();
  ctx.strokeStyle = GROUP_MARK.inner;
  ctx.lineWidth = GROUP_MARK.innerWidth;
  ctx.stroke();

  for (const role of ROLE_PAINT_ORDER) {
    ctx.beginPath();
    for (const m of plan.marks) {
      if (m.role !== role) continue;
      const r = m.r;
      if (role === 'origin') {
        ctx.rect(m.x - r, m.y - r, 2 * r, 2 * r);
      } else if (role === 'main') {
        const d = r * 1.35;
        ctx.moveTo(m.x, m.y - d);
        ctx.lineTo(m.x + d, m.y);
        ctx.lineTo(m.x, m.y + d);
        ctx.lineTo(m.x - d, m.y);
        ctx.closePath();
      } else {
        ctx.moveTo(m.x + r, m.y);
        ctx.arc(m.x, m.y, r, 0, Math.PI * 2);
      }
    }
    const style = ROLE_MARK[role];
    ctx.fillStyle = style.fill;
    ctx.fill();
    ctx.strokeStyle = style.stroke;
    ctx.lineWidth = style.width;
    ctx.stroke();
  }

  // Off-air crosses over everything else.
  ctx.beginPath();
  for (const m of plan.marks) {
    if (m.off === 0) continue;
    const r = m.r + FAIL_MARK.gap;
    ctx.moveTo(m.x - r, m.y - r);
    ctx.lineTo(m.x + r, m.y + r);
    ctx.moveTo(m.x + r, m.y - r);
    ctx.lineTo(m.x - r, m.y + r);
  }
  ctx.strokeStyle = FAIL_MARK.offStroke;
  ctx.lineWidth = FAIL_MARK.offWidth;
  ctx.lineCap = 'round';
  ctx.stroke();

  if (selected) {
    ctx.beginPath();
    ctx.arc(selected.x, selected.y, SELECTED_RING.r, 0, Math.PI * 2);
    ctx.strokeStyle = SELECTED_RING.stroke;
    ctx.lineWidth = SELECTED_RING.width;
    ctx.stroke();
  }

  ctx.textBaseline = 'middle';
  ctx.lineJoin = 'round';
  for (const l of plan.labels) {
    ctx.font = `${l.centred ? 'bold 11px' : '12px'} ${fonts.text}`;
    ctx.textAlign = l.centred ? 'center' : 'left';
    const x = l.centred ? l.x + l.width / 2 : l.x + 2;
    const y = l.y + l.height / 2;
    if (!l.centred) {
      ctx.strokeStyle = colors.surface;
      ctx.lineWidth = 3;
      ctx.strokeText(l.text, x, y);
    }
    ctx.fillStyle = colors.ink;
    ctx.fillText(l.text, x, y);
  }
}

/** Label widths by canvas measure, cached per font size and text (names repeat frame after frame). */
export function canvasMeasure(ctx: CanvasRenderingContext2D): (text: string, fontPx: number) => number {
  const cache = new Map<string, number>();
  return (text, fontPx) => {
    const key = `${fontPx}|${text}`;
    let w = cache.get(key);
    if (w === undefined) {
      ctx.font = `${fontPx === 11 ? 'bold 11px' : `${fontPx}px`} ${fonts.text}`;
      w = ctx.measureText(text).width;
      cache.set(key, w);
    }
    return w;
  };
}

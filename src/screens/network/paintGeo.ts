/**
 * Paints a frame plan (./framePlan.ts) on a 2D canvas: land, bundled feed
 * lines (main a single dark line, reserve a double line; medium by dash
 * pattern when few enough lines are in view), groups as circles holding
 * their number, lone sites by role shape (origin square, main station
 * diamond, relay open circle), the failure marks on top (off air a cross,
 * on reserve a half-filled ring) and the labels with a white halo.
 * Shapes and words carry the meaning; colour only repeats it.
 */
import { feedStrokes } from '@/src/components/charts/feedStyle';
import { colors, fonts } from '@/src/theme';
import { plainStrokes } from './denseLines';
import type { FramePlan, PlannedMark } from './framePlan';
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
  // Main lines under reserve lines, so the double line of a reserve stays readable where both run.
  const ordered = [...plan.lines].sort((a, b) => (a.role === b.role ? a.weight - b.weight : a.role === 'main' ? -1 : 1));
  for (const group of ordered) {
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
  const ringR = (m: PlannedMark) => m.r + 4;
  ctx.beginPath();
  for (const m of plan.marks) {
    if (m.off > 0 || m.reserve === 0) continue;
    ctx.moveTo(m.x + ringR(m), m.y);
    ctx.arc(m.x, m.y, ringR(m), 0, Math.PI * 2);
  }
  ctx.fillStyle = colors.surface;
  ctx.fill();
  ctx.strokeStyle = colors.warn;
  ctx.lineWidth = 2;
  ctx.stroke();
  ctx.beginPath();
  for (const m of plan.marks) {
    if (m.off > 0 || m.reserve === 0) continue;
    ctx.moveTo(m.x, m.y - ringR(m));
    ctx.arc(m.x, m.y, ringR(m), -Math.PI / 2, Math.PI / 2, true);
    ctx.closePath();
  }
  ctx.fillStyle = colors.warn;
  ctx.fill();

  // Groups: a circle with a double outline (a lone relay has a single thin one).
  ctx.beginPath();
  for (const m of plan.marks) {
    if (m.role !== null) continue;
    ctx.moveTo(m.x + m.r, m.y);
    ctx.arc(m.x, m.y, m.r, 0, Math.PI * 2);
  }
  ctx.fillStyle = colors.accentSoft;
  ctx.fill();
  ctx.strokeStyle = colors.accent;
  ctx.lineWidth = 3;
  ctx.stroke();
  ctx.strokeStyle = colors.surface;
  ctx.lineWidth = 1;
  ctx.stroke();

  for (const role of ['relay', 'main', 'origin'] as const) {
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
    ctx.fillStyle = role === 'relay' ? colors.surface : role === 'main' ? colors.accent : colors.ink;
    ctx.fill();
    ctx.strokeStyle = colors.ink;
    ctx.lineWidth = role === 'relay' ? 1.5 : 1.2;
    ctx.stroke();
  }

  // Off-air crosses over everything else.
  ctx.beginPath();
  for (const m of plan.marks) {
    if (m.off === 0) continue;
    const r = m.r + 4;
    ctx.moveTo(m.x - r, m.y - r);
    ctx.lineTo(m.x + r, m.y + r);
    ctx.moveTo(m.x + r, m.y - r);
    ctx.lineTo(m.x - r, m.y + r);
  }
  ctx.strokeStyle = colors.bad;
  ctx.lineWidth = 3;
  ctx.lineCap = 'round';
  ctx.stroke();

  if (selected) {
    ctx.beginPath();
    ctx.arc(selected.x, selected.y, 14, 0, Math.PI * 2);
    ctx.strokeStyle = colors.focus;
    ctx.lineWidth = 3;
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

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

  // Every line and mark is its own path. Chromium's software canvas (no GPU) rasterises one path of
  // thousands of pieces through its general anti-aliased filler, some ten times slower than the same
  // pieces one by one (measured in Debian's Chromium at 1440x660: 3,000 segments 220-340 ms as one
  // path, 20 ms one by one; 1,500 circles 135 ms and 14 ms). Colours are opaque, so the look is the same.
  ctx.lineCap = 'butt';
  // In the plan's order: main lines under reserve lines, so the double line of a reserve stays readable where both run.
  for (const group of plan.lines) {
    const scale = 0.5 + 0.35 * group.weight;
    const layers = plan.patterns && group.medium !== 'mixed' ? feedStrokes(group.medium, group.role, scale) : plainStrokes(group.role).map((l) => ({ ...l, width: l.width * scale, dash: undefined }));
    const s = group.segs;
    for (const layer of layers) {
      ctx.strokeStyle = layer.stroke;
      ctx.lineWidth = layer.width;
      ctx.setLineDash(dashOf(layer.dash));
      for (let i = 0; i < s.length; i += 4) {
        ctx.beginPath();
        ctx.moveTo(s[i], s[i + 1]);
        ctx.lineTo(s[i + 2], s[i + 3]);
        ctx.stroke();
      }
    }
  }
  ctx.setLineDash([]);

  // Reserve rings (a ring, half of it filled) under the marks they surround.
  const ringR = (m: PlannedMark) => m.r + FAIL_MARK.gap;
  ctx.lineWidth = FAIL_MARK.reserveWidth;
  ctx.strokeStyle = FAIL_MARK.reserveStroke;
  for (const m of plan.marks) {
    if (m.off > 0 || m.reserve === 0) continue;
    ctx.beginPath();
    ctx.arc(m.x, m.y, ringR(m), 0, Math.PI * 2);
    ctx.fillStyle = colors.surface;
    ctx.fill();
    ctx.stroke();
    ctx.beginPath();
    ctx.moveTo(m.x, m.y - ringR(m));
    ctx.arc(m.x, m.y, ringR(m), -Math.PI / 2, Math.PI / 2, true);
    ctx.closePath();
    ctx.fillStyle = FAIL_MARK.reserveStroke;
    ctx.fill();
  }

  // Groups: a tinted circle with a double outline (a lone relay has a single thin one).
  for (const m of plan.marks) {
    if (m.role !== null) continue;
    ctx.beginPath();
    ctx.arc(m.x, m.y, m.r, 0, Math.PI * 2);
    ctx.fillStyle = GROUP_MARK.fill;
    ctx.fill();
    ctx.strokeStyle = GROUP_MARK.outer;
    ctx.lineWidth = GROUP_MARK.outerWidth;
    ctx.stroke();
    ctx.strokeStyle = GROUP_MARK.inner;
    ctx.lineWidth = GROUP_MARK.innerWidth;
    ctx.stroke();
  }

  for (const role of ROLE_PAINT_ORDER) {
    const style = ROLE_MARK[role];
    ctx.fillStyle = style.fill;
    ctx.strokeStyle = style.stroke;
    ctx.lineWidth = style.width;
    for (const m of plan.marks) {
      if (m.role !== role) continue;
      const r = m.r;
      ctx.beginPath();
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
        ctx.arc(m.x, m.y, r, 0, Math.PI * 2);
      }
      ctx.fill();
      ctx.stroke();
    }
  }

  // Off-air crosses over everything else.
  ctx.strokeStyle = FAIL_MARK.offStroke;
  ctx.lineWidth = FAIL_MARK.offWidth;
  ctx.lineCap = 'round';
  for (const m of plan.marks) {
    if (m.off === 0) continue;
    const r = m.r + FAIL_MARK.gap;
    ctx.beginPath();
    ctx.moveTo(m.x - r, m.y - r);
    ctx.lineTo(m.x + r, m.y + r);
    ctx.moveTo(m.x + r, m.y - r);
    ctx.lineTo(m.x - r, m.y + r);
    ctx.stroke();
  }

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

/**
 * A gesture frame: the last full drawing (`snapshot`, device px) drawn with
 * `matrix` (./snapshot.ts), over the background where it no longer reaches.
 */
export function paintSnapshot(ctx: CanvasRenderingContext2D, snapshot: CanvasImageSource, matrix: readonly [number, number, number, number, number, number], width: number, height: number, dpr: number) {
  ctx.setTransform(dpr, 0, 0, dpr, 0, 0);
  ctx.fillStyle = colors.surface;
  ctx.fillRect(0, 0, width, height);
  ctx.setTransform(...matrix);
  // Moving, the picture need not be sharp: the cheapest smoothing keeps the copy to a few ms.
  ctx.imageSmoothingQuality = 'low';
  ctx.drawImage(snapshot, 0, 0);
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

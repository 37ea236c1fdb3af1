/**
 * Pan and zoom of the diagram, and what is worth drawing at the current view.
 * A view maps diagram px (the fitted projection at zoom 1) to screen px:
 *   screen = world * k + (tx, ty)
 * Everything here is plain arithmetic over typed arrays, so a network of a
 * few thousand sites is culled in well under a frame.
 */

export interface View {
  k: number;
  tx: number;
  ty: number;
}

export interface Rect {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

export const IDENTITY: View = { k: 1, tx: 0, ty: 0 };
export const MIN_ZOOM = 1;
export const MAX_ZOOM = 64;

export function toScreen(v: View, x: number, y: number): [number, number] {
  return [x * v.k + v.tx, y * v.k + v.ty];
}

export function toWorld(v: View, sx: number, sy: number): [number, number] {
  return [(sx - v.tx) / v.k, (sy - v.ty) / v.k];
}

/**
 * Keeps the diagram from being dragged out of sight: at least a quarter of
 * the box still shows some of it.
 */
export function clampView(v: View, width: number, height: number): View {
  const k = Math.max(MIN_ZOOM, Math.min(MAX_ZOOM, v.k));
  const minTx = width * 0.25 - width * k;
  const maxTx = width * 0.75;
  const minTy = height * 0.25 - height * k;
  const maxTy = height * 0.75;
  return { k, tx: Math.max(minTx, Math.min(maxTx, v.tx)), ty: Math.max(minTy, Math.min(maxTy, v.ty)) };
}

/** Zooms by `factor` about the screen point (sx, sy), which stays over the same diagram point. */
export function zoomAt(v: View, factor: number, sx: number, sy: number, width: number, height: number): View {
  if (!Number.isFinite(factor) || factor <= 0) throw new RangeError(`zoomAt: factor must be a number > 0, got ${String(factor)}`);
  const k = Math.max(MIN_ZOOM, Math.min(MAX_ZOOM, v.k * factor));
  const [wx, wy] = toWorld(v, sx, sy);
  return clampView({ k, tx: sx - wx * k, ty: sy - wy * k }, width, height);
}

export function panBy(v: View, dx: number, dy: number, width: number, height: number): View {
  return clampView({ k: v.k, tx: v.tx + dx, ty: v.ty + dy }, width, height);
}

/** The diagram area on screen, widened by `marginPx` so shapes at the edge are not cut. */
export function visibleWorld(v: View, width: number, height: number, marginPx = 0): Rect {
  const [x0, y0] = toWorld(v, -marginPx, -marginPx);
  const [x1, y1] = toWorld(v, width + marginPx, height + marginPx);
  return { x0, y0, x1, y1 };
}

/** Indices of the points inside `r`. */
export function cullPoints(xs: Float64Array, ys: Float64Array, r: Rect): number[] {
  const out: number[] = [];
  for (let i = 0; i < xs.length; i++) {
    const x = xs[i];
    const y = ys[i];
    if (x >= r.x0 && x <= r.x1 && y >= r.y0 && y <= r.y1) out.push(i);
  }
  return out;
}

/**
 * Indices of the segments (a[i] -> b[i], as point indices) worth drawing:
 * their bounding box meets `r` (a conservative test: a few diagonals near a
 * corner are drawn although they pass just outside) and they are at least
 * `minScreenPx` long on screen (a shorter line is hidden under its sites).
 */
export function cullSegments(xs: Float64Array, ys: Float64Array, a: Int32Array, b: Int32Array, r: Rect, k: number, minScreenPx = 1): number[] {
  const out: number[] = [];
  const minWorld2 = (minScreenPx / k) ** 2;
  for (let i = 0; i < a.length; i++) {
    const ax = xs[a[i]];
    const ay = ys[a[i]];
    const bx = xs[b[i]];
    const by = ys[b[i]];
    if (Math.max(ax, bx) < r.x0 || Math.min(ax, bx) > r.x1 || Math.max(ay, by) < r.y0 || Math.min(ay, by) > r.y1) continue;
    const dx = bx - ax;
    const dy = by - ay;
    if (dx * dx + dy * dy < minWorld2) continue;
    out.push(i);
  }
  return out;
}

/** The point among `candidates` nearest the screen point, within `radiusPx`; -1 when none is. */
export function nearestPoint(xs: Float64Array, ys: Float64Array, candidates: readonly number[], v: View, sx: number, sy: number, radiusPx: number): number {
  let best = -1;
  let bestD2 = radiusPx * radiusPx;
  for (const i of candidates) {
    const dx = xs[i] * v.k + v.tx - sx;
    const dy = ys[i] * v.k + v.ty - sy;
    const d2 = dx * dx + dy * dy;
    if (d2 <= bestD2) {
      bestD2 = d2;
      best = i;
    }
  }
  return best;
}

/**
 * Names are drawn only when few enough sites are in view to read them: about
 * one name per 9,000 px^2 of diagram (a 12 px label of ~15 characters is
 * ~100 x 16 px, so this leaves room around each), and never more than
 * MAX_LABELS. Our own rule of thumb (common practice, no source).
 */
export const MAX_LABELS = 80;
export const PX2_PER_LABEL = 9000;
export function showLabels(sitesInView: number, width: number, height: number): boolean {
  const room = Math.min(MAX_LABELS, Math.floor((width * height) / PX2_PER_LABEL));
  return sitesInView > 0 && sitesInView <= room;
}

/**
 * Dash patterns cost the renderer dearly over thousands of lines (each dash
 * is its own piece of outline), and cannot be told apart in a dense overview
 * anyway: above this many lines in view they are drawn plain, and the screen
 * says so. Our own rule of thumb (common practice, no source).
 */
export const MAX_PATTERNED_LINES = 600;
export function showPatterns(linesInView: number): boolean {
  return linesInView <= MAX_PATTERNED_LINES;
}

/**
 * While a gesture runs, the last drawn picture is moved and scaled as a
 * whole (a CSS-style transform, cheap) rather than redrawn: the transform
 * that takes the picture drawn at view `drawn` to where view `live` puts it.
 * screen_live = screen_drawn * s + (dx, dy), with s = live.k / drawn.k.
 */
export function gestureTransform(drawn: View, live: View): { dx: number; dy: number; s: number } {
  const s = live.k / drawn.k;
  return { s, dx: live.tx - drawn.tx * s, dy: live.ty - drawn.ty * s };
}

/**
 * The part of segment a-b inside `r`, or null when none is: Liang and
 * Barsky's parametric clipping ("A new concept and method for line
 * clipping", ACM Transactions on Graphics 3(1), 1984). Long feed lines seen
 * close up are cut to the screen, so a dash pattern is never laid along
 * thousands of px nobody sees.
 */
export function clipSegment(ax: number, ay: number, bx: number, by: number, r: Rect): [number, number, number, number] | null {
  const dx = bx - ax;
  const dy = by - ay;
  let t0 = 0;
  let t1 = 1;
  const edges: Array<[number, number]> = [
    [-dx, ax - r.x0],
    [dx, r.x1 - ax],
    [-dy, ay - r.y0],
    [dy, r.y1 - ay],
  ];
  for (const [p, q] of edges) {
    if (p === 0) {
      if (q < 0) return null;
      continue;
    }
    const t = q / p;
    if (p < 0) {
      if (t > t1) return null;
      if (t > t0) t0 = t;
    } else {
      if (t < t0) return null;
      if (t < t1) t1 = t;
    }
  }
  return [ax + t0 * dx, ay + t0 * dy, ax + t1 * dx, ay + t1 * dy];
}

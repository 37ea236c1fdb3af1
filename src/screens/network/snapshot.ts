/**
 * The cached picture moved during a gesture. Rasterising the full drawing
 * (thousands of anti-aliased strokes) costs the browser far more than the
 * drawing calls themselves, above all with a software-rendered canvas, so a
 * drag, wheel or pinch does not redraw it per frame: the last full drawing is
 * kept as a bitmap and copied with the transform that takes the view it was
 * drawn at to the live view (one image copy per frame). The full detail is
 * drawn again when the gesture pauses or ends.
 */
import { gestureTransform, type View } from './viewport';

/**
 * A gesture that rests this long gets its detail redrawn. Our choice: longer
 * than the wheel's settle time (NetworkDiagram.tsx, whose end redraws anyway)
 * and than the gaps between pointer events on a loaded phone, where a shorter
 * rest (140 ms) had full redraws fire mid-drag, each one slowing the next
 * events further.
 */
export const PAUSE_REDRAW_MS = 250;

/** What a drawing depends on besides the view: a snapshot drawn with other inputs is not reused. */
export type SnapshotKey = readonly unknown[];

export function sameKey(a: SnapshotKey, b: SnapshotKey): boolean {
  return a.length === b.length && a.every((v, i) => Object.is(v, b[i]));
}

/**
 * The canvas matrix (a, b, c, d, e, f for setTransform, in device px) that
 * draws a bitmap made at view `drawn` where view `live` puts it, on a canvas
 * of pixel ratio `dpr`. Both bitmap and canvas are in device px, so the scale
 * is the zoom ratio and the shift the gesture's shift times the ratio.
 */
export function snapshotMatrix(drawn: View, live: View, dpr: number): [number, number, number, number, number, number] {
  if (!(dpr > 0)) throw new RangeError(`snapshotMatrix: pixel ratio must be > 0, got ${String(dpr)}`);
  const t = gestureTransform(drawn, live);
  return [t.s, 0, 0, t.s, t.dx * dpr, t.dy * dpr];
}


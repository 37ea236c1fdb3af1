/**
 * The drawn picture moved during a gesture. Rasterising the full drawing
 * (thousands of anti-aliased strokes) costs the browser far more than the
 * drawing calls themselves, above all with a software-rendered canvas, so a
 * drag, wheel or pinch does not redraw it per frame: when a gesture starts,
 * the canvas's last full drawing is copied once to a bitmap, and each frame
 * draws that bitmap with the transform that takes the view it was drawn at
 * to the live view (one image copy per frame). Full drawings go straight
 * onto the canvas (no copy after each). A CSS transform of the canvas
 * instead (the compositor's work) measured worse at 1440 px with the
 * software compositor on a loaded machine (frames p95 50 ms in four runs of
 * five, against 33 ms with the copy). The full
 * detail is drawn again when the gesture pauses or ends.
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


/**
 * Runs `work` once the next frame has been shown (a frame, then a task), and
 * returns how to call it off. What follows a drawing but is not the picture
 * (the summary and the list of sites in view) waits for it, so the picture
 * is not held back by it.
 */
export function afterNextFrame(work: () => void): () => void {
  let timer: ReturnType<typeof setTimeout> | null = null;
  const frame = requestAnimationFrame(() => {
    timer = setTimeout(work, 0);
  });
  return () => {
    cancelAnimationFrame(frame);
    if (timer !== null) clearTimeout(timer);
  };
}

/**
 * The drawn picture moved during a gesture. Rasterising the full drawing
 * (thousands of anti-aliased strokes) costs the browser far more than the
 * drawing calls themselves, above all with a software-rendered canvas, so a
 * drag, wheel or pinch does not redraw it per frame: the canvas keeps the
 * last full drawing and is moved and scaled as a whole by a CSS transform
 * that takes the view it was drawn at to the live view. The compositor
 * applies it: no canvas drawing and no copy on the page's thread per frame
 * (an earlier copy of an offscreen bitmap per frame cost a full-size image
 * copy each time, and a copy after every full drawing). The full detail is
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
 * The CSS transform (with transform-origin at the top left) that shows a
 * picture drawn at view `drawn` where view `live` puts it: scale by the zoom
 * ratio, then shift. In CSS px, whatever the device's pixel ratio.
 */
export function snapshotCss(drawn: View, live: View): string {
  if (!(drawn.k > 0) || !(live.k > 0)) throw new RangeError(`snapshotCss: zoom must be > 0, got ${String(drawn.k)} and ${String(live.k)}`);
  const t = gestureTransform(drawn, live);
  if (t.s === 1 && t.dx === 0 && t.dy === 0) return '';
  return `matrix(${t.s}, 0, 0, ${t.s}, ${t.dx}, ${t.dy})`;
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

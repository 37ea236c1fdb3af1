/**
 * The geographic diagram on a <canvas> (web): tens of thousands of SVG nodes
 * would stall a phone, one canvas redrawn from a frame plan does not. Draws
 * at most once per animation frame, at the device's pixel ratio, straight
 * onto the canvas. During a gesture a copy of the last full drawing is moved
 * and scaled (./snapshot.ts) instead of painting again, and the detail
 * is painted when the gesture pauses or ends: the browser rasterises
 * thousands of strokes far more slowly than it records them. The screen's
 * own update after a drawing (`onDrawn`) waits until the picture is shown.
 * When the page records (src/testHooks.ts), each draw's time and what it
 * drew are kept on window.__headwaterDiagram for the browser benchmark and
 * tests.
 */
import { useEffect, useMemo, useRef } from 'react';
import { colors } from '@/src/theme';
import type { DiagramModel } from './diagramModel';
import { planFrame, type FramePlan, type Status } from './framePlan';
import type { LodIndex } from './lod';
import { canvasMeasure, paintGeo, paintSnapshot } from './paintGeo';
import { recording } from '@/src/testHooks';
import { afterNextFrame, PAUSE_REDRAW_MS, sameKey, snapshotMatrix, type SnapshotKey } from './snapshot';
import type { View } from './viewport';

export interface DrawRecord {
  at: number;
  ms: number;
  level: number;
  gesture: boolean;
  /** A gesture frame that moved the last full drawing rather than painting it again (its counts are that drawing's). */
  moved: boolean;
  groups: number;
  singles: number;
  lines: number;
  sitesInGroups: number;
  offMarks: number;
  reserveMarks: number;
  /** Labels drawn: text and box (screen px). */
  labels: { text: string; x: number; y: number; width: number; height: number }[];
  /** Lone sites drawn with a failure mark: code and mark. */
  marked: { code: string; status: Status }[];
  statuses: number;
  /** The land's bounding box on screen (px, relative to the canvas), when land is drawn. */
  land: { x: number; y: number; width: number; height: number } | null;
}

interface DiagramHook {
  draws: DrawRecord[];
  last: DrawRecord | null;
}

declare global {
  interface Window {
    __headwaterDiagram?: DiagramHook;
  }
}

const KEEP_DRAWS = 600;

/** Bounding box of an SVG path of absolute coordinate pairs (d3-geo's output: M, L, Z only). */
export function pathBox(d: string): { x0: number; y0: number; x1: number; y1: number } | null {
  const nums = d.match(/-?\d+(?:\.\d+)?(?:e-?\d+)?/g);
  if (!nums || nums.length < 2) return null;
  let x0 = Infinity;
  let y0 = Infinity;
  let x1 = -Infinity;
  let y1 = -Infinity;
  for (let i = 0; i + 1 < nums.length; i += 2) {
    const x = Number(nums[i]);
    const y = Number(nums[i + 1]);
    x0 = Math.min(x0, x);
    x1 = Math.max(x1, x);
    y0 = Math.min(y0, y);
    y1 = Math.max(y1, y);
  }
  return { x0, y0, x1, y1 };
}

function record(plan: FramePlan, model: DiagramModel, ms: number, gesture: boolean, moved: boolean, statuses: number, landBox: ReturnType<typeof pathBox>, view: View): DrawRecord {
  const marked: DrawRecord['marked'] = [];
  for (const m of plan.marks) {
    if (m.role === null) continue;
    if (m.off > 0) marked.push({ code: model.sites[m.site].code, status: 'off-air' });
    else if (m.reserve > 0) marked.push({ code: model.sites[m.site].code, status: 'on-reserve' });
  }
  return { at: performance.now(), ms, level: plan.level, gesture, moved, ...plan.counts, labels: plan.labels.map(({ text, x, y, width, height }) => ({ text, x, y, width, height })), marked, statuses, land: landBox ? { x: landBox.x0 * view.k + view.tx, y: landBox.y0 * view.k + view.ty, width: (landBox.x1 - landBox.x0) * view.k, height: (landBox.y1 - landBox.y0) * view.k } : null };
}

export interface GeoCanvasProps {
  model: DiagramModel;
  lod: LodIndex;
  siteIndex: ReadonlyMap<string, number>;
  width: number;
  height: number;
  view: View;
  /** A gesture is running: labels are left out until it ends. */
  gesture: boolean;
  statuses: ReadonlyMap<string, Status>;
  /** Land outline in diagram px at zoom 1. */
  land: string | null;
  /** The chosen site's index in the model. */
  selected: number | null;
  xs: Float64Array;
  ys: Float64Array;
  /** The last plan drawn, for hit testing taps. */
  planRef: { current: FramePlan | null };
  /** Called after each draw outside a gesture, once that drawing has been shown. */
  onDrawn?: (plan: FramePlan) => void;
}

export function GeoCanvas({ model, lod, siteIndex, width, height, view, gesture, statuses, land, selected, xs, ys, planRef, onDrawn }: GeoCanvasProps) {
  const canvas = useRef<HTMLCanvasElement | null>(null);
  const frame = useRef<number | null>(null);
  const landPath = useMemo(() => (land ? new Path2D(land) : null), [land]);
  // The land's box is read only for the records, once per outline.
  const landBox = useMemo(() => {
    let box: ReturnType<typeof pathBox> | undefined;
    return () => (box === undefined ? (box = land ? pathBox(land) : null) : box);
  }, [land]);
  const dpr = typeof window !== 'undefined' ? Math.min(2, window.devicePixelRatio || 1) : 1;
  const measure = useRef<((t: string, px: number) => number) | null>(null);

  // The view, inputs and plan of the picture on the canvas (its last full drawing), and its copy for gestures.
  const snap = useRef<{ view: View; key: SnapshotKey; plan: FramePlan; copied: boolean } | null>(null);
  const bitmap = useRef<HTMLCanvasElement | null>(null);
  // The screen's update after a drawing (summary, sites in view), waiting for the picture to be shown.
  const cancelDrawn = useRef<(() => void) | null>(null);
  useEffect(() => () => cancelDrawn.current?.(), []);

  useEffect(() => {
    const key: SnapshotKey = [model, lod, siteIndex, width, height, statuses, landPath, selected, xs, ys, dpr];
    let pause: ReturnType<typeof setTimeout> | null = null;
    const keep = (rec: DrawRecord) => {
      const hook = (window.__headwaterDiagram ??= { draws: [], last: null });
      hook.last = rec;
      hook.draws.push(rec);
      if (hook.draws.length > KEEP_DRAWS) hook.draws.splice(0, hook.draws.length - KEEP_DRAWS);
    };
    // Paints the whole plan straight onto the canvas.
    const full = (labels: boolean) => {
      const el = canvas.current;
      const ctx = el?.getContext('2d');
      if (!el || !ctx) return;
      const t0 = performance.now();
      if (!measure.current) measure.current = canvasMeasure(ctx);
      const plan = planFrame({ model, lod, view, width, height, statuses, siteIndex, measure: measure.current, labels });
      const sel = selected !== null && selected < xs.length ? { x: xs[selected] * view.k + view.tx, y: ys[selected] * view.k + view.ty } : null;
      paintGeo(ctx, { plan, view, width, height, dpr, land: landPath, selected: sel });
      snap.current = { view, key, plan, copied: false };
      planRef.current = plan;
      if (recording()) keep(record(plan, model, performance.now() - t0, gesture, false, statuses.size, landBox(), view));
      if (!gesture && onDrawn) {
        cancelDrawn.current?.();
        cancelDrawn.current = afterNextFrame(() => {
          cancelDrawn.current = null;
          onDrawn(plan);
        });
      }
    };
    // A gesture frame: the last full drawing (copied once per drawing, at the first frame that moves it) drawn at the live view.
    const moved = () => {
      const el = canvas.current;
      const ctx = el?.getContext('2d');
      const last = snap.current;
      if (!el || !ctx || !last) return;
      const t0 = performance.now();
      const copy = (bitmap.current ??= document.createElement('canvas'));
      if (!last.copied) {
        if (copy.width !== el.width || copy.height !== el.height) {
          copy.width = el.width;
          copy.height = el.height;
        }
        const cctx = copy.getContext('2d');
        if (!cctx) return;
        cctx.setTransform(1, 0, 0, 1, 0, 0);
        cctx.drawImage(el, 0, 0);
        last.copied = true;
      }
      paintSnapshot(ctx, copy, snapshotMatrix(last.view, view, dpr), width, height, dpr);
      if (recording()) keep(record(last.plan, model, performance.now() - t0, true, true, statuses.size, landBox(), view));
    };

    if (frame.current !== null) cancelAnimationFrame(frame.current);
    frame.current = requestAnimationFrame(() => {
      frame.current = null;
      const last = snap.current;
      if (!gesture || !last || !sameKey(last.key, key)) {
        full(!gesture);
        return;
      }
      moved();
      // Its detail (marks and lines where the view now is; names wait for the end) once the gesture rests.
      pause = setTimeout(() => {
        pause = null;
        frame.current = requestAnimationFrame(() => {
          frame.current = null;
          full(false);
        });
      }, PAUSE_REDRAW_MS);
    });
    return () => {
      if (frame.current !== null) cancelAnimationFrame(frame.current);
      frame.current = null;
      if (pause !== null) clearTimeout(pause);
    };
  }, [model, lod, siteIndex, width, height, view, gesture, statuses, landPath, landBox, selected, xs, ys, dpr, planRef, onDrawn]);

  return (
    <canvas
      ref={canvas}
      width={Math.round(width * dpr)}
      height={Math.round(height * dpr)}
      style={{ width, height, display: 'block', background: colors.surface }}
      aria-hidden
      data-testid="network-canvas"
    />
  );
}

import { describe, expect, it } from 'vitest';
import { clampView, clipSegment, cullPoints, cullSegments, gestureTransform, IDENTITY, MAX_ZOOM, nearestPoint, panBy, showLabels, showPatterns, toScreen, toWorld, visibleWorld, zoomAt } from './viewport';

const W = 400;
const H = 300;

describe('zoomAt and panBy', () => {
  it('refuses a zoom factor that is not positive', () => {
    expect(() => zoomAt(IDENTITY, 0, 0, 0, W, H)).toThrow(/factor must be a number > 0, got 0/);
  });

  it('keeps the diagram point under the cursor where it was', () => {
    const v = zoomAt(IDENTITY, 2, 100, 50, W, H);
    expect(v.k).toBe(2);
    expect(toWorld(v, 100, 50)).toEqual([100, 50]);
    const v2 = zoomAt(v, 3, 300, 200, W, H);
    const [wx, wy] = toWorld(v, 300, 200);
    const [sx, sy] = toScreen(v2, wx, wy);
    expect(sx).toBeCloseTo(300, 9);
    expect(sy).toBeCloseTo(200, 9);
  });

  it('stays within the zoom limits', () => {
    expect(zoomAt(IDENTITY, 0.1, 0, 0, W, H).k).toBe(1);
    expect(zoomAt(IDENTITY, 1000, 0, 0, W, H).k).toBe(MAX_ZOOM);
  });

  it('cannot drag the diagram out of sight', () => {
    const far = panBy(IDENTITY, 10_000, -10_000, W, H);
    expect(far.tx).toBe(W * 0.75);
    expect(far.ty).toBe(H * 0.25 - H);
    expect(clampView({ k: 2, tx: 10, ty: 10 }, W, H)).toEqual({ k: 2, tx: 10, ty: 10 });
  });
});

describe('culling', () => {
  const xs = Float64Array.from([10, 200, 390, 500, 200.2]);
  const ys = Float64Array.from([10, 150, 290, 150, 150.2]);

  it('finds the points on screen', () => {
    expect(cullPoints(xs, ys, visibleWorld(IDENTITY, W, H))).toEqual([0, 1, 2, 4]);
    // Zoomed 4x about the middle, only the middle points remain.
    const v = zoomAt(IDENTITY, 4, 200, 150, W, H);
    expect(cullPoints(xs, ys, visibleWorld(v, W, H))).toEqual([1, 4]);
    // A margin brings the point just off the right edge back.
    expect(cullPoints(xs, ys, visibleWorld(IDENTITY, W, H, 120))).toEqual([0, 1, 2, 3, 4]);
  });

  it('keeps segments that cross the view even with both ends outside, and drops sub-pixel ones', () => {
    const px = Float64Array.from([-100, 500, 50, 50.3, -100, -50]);
    const py = Float64Array.from([150, 150, 50, 50.3, -100, -100]);
    const a = Int32Array.from([0, 2, 4]);
    const b = Int32Array.from([1, 3, 5]);
    const r = visibleWorld(IDENTITY, W, H);
    // 0: crosses the screen; 1: 0.42 px long; 2: wholly outside.
    expect(cullSegments(px, py, a, b, r, 1)).toEqual([0]);
    // At 8x about (50, 50) the short one is 3.4 px long and kept; the long one (y = 150) is now below the screen.
    const v = zoomAt(IDENTITY, 8, 50, 50, W, H);
    expect(cullSegments(px, py, a, b, visibleWorld(v, W, H), v.k)).toEqual([1]);
  });

  it('handles a 2,000-site layout and a view that holds a small part of it', () => {
    const n = 2000;
    const gx = new Float64Array(n);
    const gy = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      gx[i] = (i % 50) * (W / 50);
      gy[i] = Math.floor(i / 50) * (H / 40);
    }
    expect(cullPoints(gx, gy, visibleWorld(IDENTITY, W, H))).toHaveLength(n);
    const v = zoomAt(IDENTITY, 10, 200, 150, W, H);
    const inView = cullPoints(gx, gy, visibleWorld(v, W, H));
    // A tenth of the width and height: about 1/100 of the grid (5 columns x 4 rows, edges included).
    expect(inView.length).toBeGreaterThanOrEqual(20);
    expect(inView.length).toBeLessThanOrEqual(30);
  });
});

describe('nearestPoint', () => {
  const xs = Float64Array.from([100, 110, 300]);
  const ys = Float64Array.from([100, 100, 100]);

  it('picks the nearest within the radius, or none', () => {
    expect(nearestPoint(xs, ys, [0, 1, 2], IDENTITY, 107, 101, 22)).toBe(1);
    expect(nearestPoint(xs, ys, [0, 1, 2], IDENTITY, 200, 200, 22)).toBe(-1);
    // Only candidates count (culled-out points cannot be tapped).
    expect(nearestPoint(xs, ys, [0, 2], IDENTITY, 107, 101, 22)).toBe(0);
  });

  it('works in screen px under zoom', () => {
    const v = { k: 4, tx: -300, ty: -300 };
    // Site 0 is at screen (100, 100), site 1 at (140, 100).
    expect(nearestPoint(xs, ys, [0, 1, 2], v, 135, 100, 22)).toBe(1);
  });
});

describe('showLabels', () => {
  it('labels only as many sites as the box has room for', () => {
    expect(showLabels(0, 390, 500)).toBe(false);
    // 390 x 500 px has room for 21 names.
    expect(showLabels(21, 390, 500)).toBe(true);
    expect(showLabels(22, 390, 500)).toBe(false);
    // A wide box is capped at 80.
    expect(showLabels(80, 1400, 800)).toBe(true);
    expect(showLabels(81, 1400, 800)).toBe(false);
  });
});

describe('showPatterns', () => {
  it('drops dash patterns only for a dense view', () => {
    expect(showPatterns(600)).toBe(true);
    expect(showPatterns(601)).toBe(false);
  });
});

describe('gestureTransform', () => {
  it('moves a drawn point to where the live view puts it', () => {
    const drawn = { k: 2, tx: 10, ty: -20 };
    const live = zoomAt(panBy(drawn, 30, 15, W, H), 1.5, 100, 80, W, H);
    const t = gestureTransform(drawn, live);
    for (const [wx, wy] of [
      [0, 0],
      [123, 45],
      [300, 200],
    ]) {
      const [dxs, dys] = toScreen(drawn, wx, wy);
      const [lxs, lys] = toScreen(live, wx, wy);
      expect(dxs * t.s + t.dx).toBeCloseTo(lxs, 9);
      expect(dys * t.s + t.dy).toBeCloseTo(lys, 9);
    }
  });

  it('is the identity when nothing moved', () => {
    expect(gestureTransform({ k: 3, tx: 5, ty: 6 }, { k: 3, tx: 5, ty: 6 })).toEqual({ s: 1, dx: 0, dy: 0 });
  });
});

describe('clipSegment (Liang-Barsky 1984)', () => {
  const r = { x0: 0, y0: 0, x1: 100, y1: 50 };

  it('keeps a segment wholly inside', () => {
    expect(clipSegment(10, 10, 90, 40, r)).toEqual([10, 10, 90, 40]);
  });

  it('cuts a segment that crosses the box at both ends', () => {
    expect(clipSegment(-100, 25, 200, 25, r)).toEqual([0, 25, 100, 25]);
    const [x0, y0, x1, y1] = clipSegment(-50, -25, 150, 75, r)!;
    // The line y = x/2 + 0 enters at (0, 0) and leaves at (100, 50).
    expect([x0, y0, x1, y1].map((v) => Math.round(v * 1e9) / 1e9)).toEqual([0, 0, 100, 50]);
  });

  it('drops a segment that misses the box, even when its bounding box overlaps it', () => {
    expect(clipSegment(-10, 60, 200, 60, r)).toBeNull();
    // Corner-cutting diagonal passing outside the top-right corner.
    expect(clipSegment(90, -20, 120, 10, r)).toBeNull();
  });

  it('handles vertical and horizontal segments and points', () => {
    expect(clipSegment(50, -10, 50, 80, r)).toEqual([50, 0, 50, 50]);
    expect(clipSegment(120, 10, 130, 10, r)).toBeNull();
    expect(clipSegment(5, 5, 5, 5, r)).toEqual([5, 5, 5, 5]);
  });
});

import { afterEach, describe, expect, it, vi } from 'vitest';
import { afterNextFrame, sameKey, snapshotMatrix } from './snapshot';
import { panBy, toScreen, zoomAt, IDENTITY } from './viewport';

const W = 400;
const H = 300;

/** Applies a setTransform matrix to a device-px point. */
const apply = (m: number[], x: number, y: number) => [m[0] * x + m[2] * y + m[4], m[1] * x + m[3] * y + m[5]];

describe('snapshotMatrix', () => {
  it.each([1, 2])('puts every pixel of the bitmap where the live view draws its diagram point (pixel ratio %d)', (dpr) => {
    const drawn = zoomAt(IDENTITY, 3, 120, 90, W, H);
    const live = zoomAt(panBy(drawn, -40, 25, W, H), 1.7, 300, 40, W, H);
    const m = snapshotMatrix(drawn, live, dpr);
    for (const [wx, wy] of [
      [0, 0],
      [57, 141],
      [390, 280],
    ]) {
      const [sx, sy] = toScreen(drawn, wx, wy);
      const [lx, ly] = toScreen(live, wx, wy);
      const [px, py] = apply(m, sx * dpr, sy * dpr);
      expect(px).toBeCloseTo(lx * dpr, 9);
      expect(py).toBeCloseTo(ly * dpr, 9);
    }
  });

  it('is the identity when the view has not moved', () => {
    const v = zoomAt(IDENTITY, 2, 10, 10, W, H);
    expect(snapshotMatrix(v, v, 2)).toEqual([1, 0, 0, 1, 0, 0]);
  });

  it('refuses a pixel ratio that is not positive', () => {
    expect(() => snapshotMatrix(IDENTITY, IDENTITY, 0)).toThrow(/pixel ratio must be > 0, got 0/);
  });
});

describe('afterNextFrame', () => {
  afterEach(() => vi.unstubAllGlobals());
  const frames = () => {
    const queued: FrameRequestCallback[] = [];
    vi.stubGlobal('requestAnimationFrame', (cb: FrameRequestCallback) => queued.push(cb));
    vi.stubGlobal('cancelAnimationFrame', (id: number) => (queued[id - 1] = () => undefined));
    return () => queued.splice(0).forEach((cb) => cb(0));
  };

  it('runs the work in a task after the next frame, not before', async () => {
    vi.useFakeTimers();
    try {
      const nextFrame = frames();
      const work = vi.fn();
      afterNextFrame(work);
      vi.runAllTimers();
      expect(work).not.toHaveBeenCalled();
      nextFrame();
      expect(work).not.toHaveBeenCalled();
      vi.runAllTimers();
      expect(work).toHaveBeenCalledTimes(1);
    } finally {
      vi.useRealTimers();
    }
  });

  it('can be called off before the frame or after it', () => {
    vi.useFakeTimers();
    try {
      const nextFrame = frames();
      const early = vi.fn();
      afterNextFrame(early)();
      nextFrame();
      vi.runAllTimers();
      expect(early).not.toHaveBeenCalled();
      const late = vi.fn();
      const cancel = afterNextFrame(late);
      nextFrame();
      cancel();
      vi.runAllTimers();
      expect(late).not.toHaveBeenCalled();
    } finally {
      vi.useRealTimers();
    }
  });
});

describe('sameKey', () => {
  it('compares inputs by identity, so a new failure set or model is a new drawing', () => {
    const statuses = new Map();
    expect(sameKey([1, statuses, 'a'], [1, statuses, 'a'])).toBe(true);
    expect(sameKey([1, statuses], [1, new Map()])).toBe(false);
    expect(sameKey([1], [1, 2])).toBe(false);
  });
});

/**
 * Greedy label placement with collision boxes: candidates come in order of
 * importance; each tries a few spots around its mark (right, left, above,
 * below) and takes the first whose box meets no label already placed and
 * lies inside the box drawn. What finds no room is left out, so labels never
 * overlap. A uniform bucket grid keeps each test to the few boxes nearby.
 * (The greedy rule is common practice in map labelling; our own parameters.)
 */

export interface LabelCandidate {
  /** Anchor (the mark's centre), screen px. */
  x: number;
  y: number;
  /** Mark radius, px: the label keeps clear of it. */
  r: number;
  width: number;
  height: number;
  text: string;
  /** Only centred on the anchor (a count inside a circle), no other spot. */
  centred?: boolean;
}

export interface PlacedLabel {
  text: string;
  /** Box, screen px (x, y = top left). */
  x: number;
  y: number;
  width: number;
  height: number;
  centred: boolean;
}

const BUCKET = 64;

export function placeLabels(candidates: readonly LabelCandidate[], width: number, height: number, max = Infinity): PlacedLabel[] {
  const placed: PlacedLabel[] = [];
  const buckets = new Map<number, number[]>();
  const cols = Math.ceil(width / BUCKET) + 2;
  const keysOf = (b: { x: number; y: number; width: number; height: number }) => {
    const out: number[] = [];
    const c0 = Math.max(-1, Math.floor(b.x / BUCKET));
    const c1 = Math.floor((b.x + b.width) / BUCKET);
    const r0 = Math.max(-1, Math.floor(b.y / BUCKET));
    const r1 = Math.floor((b.y + b.height) / BUCKET);
    for (let r = r0; r <= r1; r++) for (let c = c0; c <= c1; c++) out.push((r + 1) * cols + c + 1);
    return out;
  };
  const free = (b: { x: number; y: number; width: number; height: number }) => {
    if (b.x < 0 || b.y < 0 || b.x + b.width > width || b.y + b.height > height) return false;
    for (const key of keysOf(b)) {
      for (const j of buckets.get(key) ?? []) {
        const o = placed[j];
        if (b.x < o.x + o.width && o.x < b.x + b.width && b.y < o.y + o.height && o.y < b.y + b.height) return false;
      }
    }
    return true;
  };
  for (const c of candidates) {
    if (placed.length >= max) break;
    const gap = c.r + 3;
    const spots = c.centred
      ? [{ x: c.x - c.width / 2, y: c.y - c.height / 2 }]
      : [
          { x: c.x + gap, y: c.y - c.height / 2 },
          { x: c.x - gap - c.width, y: c.y - c.height / 2 },
          { x: c.x - c.width / 2, y: c.y - gap - c.height },
          { x: c.x - c.width / 2, y: c.y + gap },
        ];
    for (const s of spots) {
      const box = { text: c.text, x: s.x, y: s.y, width: c.width, height: c.height, centred: !!c.centred };
      if (!free(box)) continue;
      const at = placed.length;
      placed.push(box);
      for (const key of keysOf(box)) {
        const list = buckets.get(key);
        if (list) list.push(at);
        else buckets.set(key, [at]);
      }
      break;
    }
  }
  return placed;
}

/** True when two placed labels share any area (the tests' check, also used by the browser test hook). */
export function overlaps(a: PlacedLabel, b: PlacedLabel): boolean {
  return a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;
}

/**
 * The diagram's width as last measured for a window of the same width. The
 * box's width is known only once the screen has been laid out, a frame or
 * two after its first render; until then the picture cannot be placed, so a
 * page opened on the network screen drew its first frame one layout later
 * than it could. With the width remembered from the last visit, the first
 * render places the picture; the layout then only confirms the width (or
 * corrects it, as before, when the screen has changed since).
 */
const KEY = 'headwater.diagramWidth.v1';

type Store = Pick<Storage, 'getItem' | 'setItem'>;

function store(): Store | null {
  try {
    return typeof window !== 'undefined' && window.localStorage ? window.localStorage : null;
  } catch {
    return null; // storage refused (private browsing)
  }
}

/** The remembered width for a window `windowWidth` px wide, or 0 (not known). */
export function rememberedDiagramWidth(windowWidth: number, from: Store | null = store()): number {
  try {
    const held = JSON.parse(from?.getItem(KEY) ?? 'null') as { window?: unknown; width?: unknown } | null;
    if (!held || held.window !== windowWidth || typeof held.width !== 'number' || !Number.isInteger(held.width) || held.width <= 0 || held.width > windowWidth) return 0;
    return held.width;
  } catch {
    return 0;
  }
}

/** Remembers `width` as the diagram's width in a window `windowWidth` px wide. */
export function rememberDiagramWidth(windowWidth: number, width: number, to: Store | null = store()): void {
  if (!(width > 0) || !(windowWidth > 0)) return;
  try {
    to?.setItem(KEY, JSON.stringify({ window: windowWidth, width }));
  } catch {
    // full or refused: the next visit measures first, as without it
  }
}

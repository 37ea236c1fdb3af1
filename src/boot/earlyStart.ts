/**
 * The first script a page runs (index.html loads it before the app's own,
 * built by scripts/lib/bootScript.ts). The app's scripts take a second or
 * more to arrive and start on a slow phone; meanwhile this small one:
 *  - asks the browser to fetch, beside them, the script chunks the opened
 *    address will need (the layouts, the route's screen), which the app
 *    would otherwise ask for one after another as it renders;
 *  - on the network screen, sends for the diagram's drawing (the largest
 *    answer of the app) with the stored session's token, and leaves the
 *    promise of the parsed answer where the app takes it
 *    (src/api/queries/drawingEarly.ts). Parsing it in a worker instead was
 *    measured slower: copying the columns back to the page costs about half
 *    the parse, and the worker competes with the page for the processor.
 * It reads nothing but the address and the stored session, changes nothing
 * the app keeps, and any failure leaves the app to do it all as usual.
 * It imports nothing: it is bundled on its own and must stay small.
 */

export interface BootPlan {
  /** localStorage key of the stored session (src/session/persisted.ts). */
  sessionKey: string;
  /** The drawing's API path (shared/api.ts). */
  drawingPath: string;
  /** Script chunks every page needs (the layouts), as served paths. */
  always: string[];
  /** Script chunks by opened path ("/network"), as served paths. */
  byPath: Record<string, string[]>;
  /** The chunk of the screens loaded on demand, and the paths that do not need it. */
  deferred: { chunk: string; notFor: string[] } | null;
}

/** The drawing's answer as parsed JSON, not yet checked (the app checks it as any answer). */
export interface EarlyAnswer {
  value: unknown;
}

/** What a page opened early on the network screen holds for the app: null when there was no usable answer. */
export interface EarlyDrawing {
  token: string;
  answer: Promise<EarlyAnswer | null>;
}

declare global {
  interface Window {
    __headwaterEarlyDrawing?: EarlyDrawing;
  }
}

export type BootWindow = Pick<Window, 'location' | 'localStorage' | 'fetch' | 'document' | '__headwaterEarlyDrawing'>;

/** The opened path without trailing slashes ("/" stays "/"). */
export function openedPath(pathname: string): string {
  return pathname.length > 1 ? pathname.replace(/\/+$/, '') || '/' : pathname;
}

/** The stored session's token, or null when there is none or it cannot be read. */
export function storedToken(raw: string | null | undefined): string | null {
  if (!raw) return null;
  try {
    const value = JSON.parse(raw) as { version?: unknown; token?: unknown; user?: unknown } | null;
    if (!value || value.version !== 1 || typeof value.token !== 'string' || value.token === '' || !value.user || typeof value.user !== 'object') return null;
    return value.token;
  } catch {
    return null;
  }
}

/** The script chunks a page opened at `path` needs first. */
export function chunksFor(plan: BootPlan, path: string): string[] {
  const out = [...plan.always, ...(plan.byPath[path] ?? [])];
  if (plan.deferred && !plan.deferred.notFor.includes(path)) out.push(plan.deferred.chunk);
  return out;
}

export function earlyStart(win: BootWindow, plan: BootPlan): void {
  const path = openedPath(win.location.pathname);
  const head = win.document.head;
  for (const href of chunksFor(plan, path)) {
    const link = win.document.createElement('link');
    link.rel = 'preload';
    link.as = 'script';
    link.href = href;
    head.appendChild(link);
  }
  if (path !== '/network') return;
  let raw: string | null;
  try {
    raw = win.localStorage.getItem(plan.sessionKey);
  } catch {
    return; // storage refused (private browsing): the app asks as usual
  }
  const token = storedToken(raw);
  if (!token) return;
  win.__headwaterEarlyDrawing = { token, answer: askDrawingOnPage(win.fetch.bind(win), plan.drawingPath, token) };
}

/** The drawing asked for and parsed as it arrives; null for anything but a 200 JSON answer. */
export function askDrawingOnPage(fetchFn: typeof fetch, path: string, token: string): Promise<EarlyAnswer | null> {
  // Low priority: on a weak signal the app's own scripts, asked for at the same moment and needed first,
  // should not share the line with this answer (0.8 MB at 20,000 sites). Reasoned, not measured: on the
  // test machine's loopback the two priorities could not be told apart.
  return fetchFn(path, { headers: { Accept: 'application/json', Authorization: `Bearer ${token}` }, priority: 'low' } as RequestInit)
    .then((res) => (res.ok ? res.json().then((value: unknown) => ({ value })) : null))
    .catch(() => null);
}

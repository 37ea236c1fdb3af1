/**
 * The diagram's columns asked for as the page starts. A page opened on the
 * network screen (a shared link, a reload) would otherwise send this, the
 * largest answer of the app, only once the scripts, fonts, session and the
 * screen's own chunk are in: over a second at 20,000 sites on the test
 * machine. The root layout calls `startDrawingEarly` when the page opens
 * there, with the stored session's token, and `useDiagramDrawing` takes the
 * answer once (`takeEarlyDrawing`) if the session is still the one it was
 * asked for; anything else (signed out, another person, an error answer, no
 * connection) falls back to the usual request, which reports it as always.
 */
import { api } from '@/shared/api';
import { readPersistedSession, SESSION_STORAGE_KEY } from '@/src/session/persisted';

let early: { token: string; answer: Promise<Response | null> } | null = null;

/** True for the network screen's address (map or schematic: both draw from the columns). */
export function opensNetworkDiagram(pathname: string): boolean {
  const path = pathname.length > 1 ? pathname.replace(/\/+$/, '') : pathname;
  return path === '/network';
}

/** Sends the request now when a session is stored (true), else does nothing (false). */
export function startDrawingEarly(storage: Pick<Storage, 'getItem'> | undefined): boolean {
  let raw: string | null | undefined;
  try {
    raw = storage?.getItem(SESSION_STORAGE_KEY);
  } catch {
    return false; // storage refused (private browsing): the usual request will do
  }
  const { token } = readPersistedSession(raw);
  if (!token) return false;
  const answer = fetch(api.networkDrawing, { headers: { Accept: 'application/json', Authorization: `Bearer ${token}` } }).catch(() => null);
  early = { token, answer };
  return true;
}

/** The early answer, once, when it was asked with `token` and came back ok; null otherwise (the caller then asks as usual). */
export async function takeEarlyDrawing(token: string | null): Promise<Response | null> {
  const held = early;
  early = null;
  if (!held || !token || held.token !== token) return null;
  const res = await held.answer;
  return res && res.ok ? res : null;
}

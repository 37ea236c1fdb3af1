/**
 * Where to go after signing in. A shared link (say, a failure set) opened while
 * signed out passes through the sign-in screen as `?next=/reach?...`; only a
 * path on this origin is honoured, so the parameter cannot send anyone to
 * another site (an "open redirect", OWASP Unvalidated Redirects and Forwards
 * Cheat Sheet).
 */
import type { Href } from 'expo-router';

/** A place in the app as a string (Expo Router's typed routes). */
export type AppPath = Extract<Href, string>;

const FALLBACK: AppPath = '/';

/**
 * The address the page was opened at (web), read when this module is first
 * evaluated, before any screen renders. A signed-out visitor of a deep link
 * is sent to sign-in with it: by the time the session has been read, the
 * router may already have rewritten the address bar to "/" (the signed-in
 * group's navigator is not mounted while the session is being restored).
 */
export const openedAt: string | null =
  typeof window !== 'undefined' && typeof window.location?.pathname === 'string' ? `${window.location.pathname}${window.location.search}` : null;

/**
 * A path on this origin, other than the sign-in screen. Checked at run time,
 * since it arrives in a URL; one that matches no route shows the not-found screen.
 */
function isOwnPath(value: string): value is AppPath {
  if (value === '' || !value.startsWith('/')) return false;
  // "//host" and "/\\host" are read by browsers as another origin.
  if (value.startsWith('//') || value.startsWith('/\\')) return false;
  // Control characters (tabs, newlines) are stripped by URL parsers and can hide a "//".
  // eslint-disable-next-line no-control-regex -- matching control characters is this test's purpose
  if (/[\u0000-\u001f\u007f]/.test(value)) return false;
  return !(value === '/sign-in' || value.startsWith('/sign-in?') || value.startsWith('/sign-in/'));
}

export function safeNextPath(next: unknown): AppPath {
  const value = Array.isArray(next) ? next[0] : next;
  return typeof value === 'string' && isOwnPath(value) ? value : FALLBACK;
}

/** The sign-in path that brings the person back to `pathname` afterwards. */
export function signInHref(pathname: string, search = ''): AppPath {
  const target = safeNextPath(`${pathname}${search}`);
  return target === FALLBACK ? '/sign-in' : `/sign-in?next=${encodeURIComponent(target)}`;
}

/**
 * The query string of the current place, rebuilt from Expo Router's global
 * search params minus the route's own path params (the names in "[code]" or
 * "[...rest]" segments), which are already part of the pathname.
 */
export function queryFromParams(params: Record<string, string | string[] | undefined>, segments: readonly string[]): string {
  const pathParams = new Set(
    segments.map((s) => /^\[(?:\.\.\.)?([^\]]+)\]$/.exec(s)?.[1]).filter((n): n is string => n !== undefined),
  );
  const q = new URLSearchParams();
  for (const [k, v] of Object.entries(params)) {
    if (pathParams.has(k) || v === undefined) continue;
    for (const one of Array.isArray(v) ? v : [v]) q.append(k, one);
  }
  const s = q.toString();
  return s ? `?${s}` : '';
}

/**
 * Where to go after signing in. A shared link (say, a failure set) opened while
 * signed out passes through the sign-in screen as `?next=/reach?...`; only a
 * path on this origin is honoured, so the parameter cannot send anyone to
 * another site (an "open redirect", OWASP Unvalidated Redirects and Forwards
 * Cheat Sheet).
 */
const FALLBACK = '/';

export function safeNextPath(next: unknown): string {
  const value = Array.isArray(next) ? next[0] : next;
  if (typeof value !== 'string' || value === '') return FALLBACK;
  if (!value.startsWith('/')) return FALLBACK;
  // "//host" and "/\host" are read by browsers as another origin.
  if (value.startsWith('//') || value.startsWith('/\\')) return FALLBACK;
  // Control characters (tabs, newlines) are stripped by URL parsers and can hide a "//".
  if (/[\u0000-\u001f\u007f]/.test(value)) return FALLBACK;
  if (value === '/sign-in' || value.startsWith('/sign-in?') || value.startsWith('/sign-in/')) return FALLBACK;
  return value;
}

/** The sign-in path that brings the person back to `pathname` afterwards. */
export function signInHref(pathname: string, search = ''): string {
  const target = safeNextPath(`${pathname}${search}`);
  return target === FALLBACK ? '/sign-in' : `/sign-in?next=${encodeURIComponent(target)}`;
}

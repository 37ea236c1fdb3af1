/**
 * Text PostgreSQL can store: no NUL character (a text value cannot hold
 * one) and no lone UTF-16 surrogate (it has no UTF-8 form; the driver would
 * silently write U+FFFD instead). Shared by the schemas and the server's
 * input guard. The pattern is linear: each alternative looks at most one
 * character ahead or behind.
 */
// eslint-disable-next-line no-control-regex -- NUL is exactly what this pattern finds
const UNSTORABLE = /\u0000|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

export const UNSTORABLE_TEXT_MESSAGE = 'must not hold NUL characters or broken (lone surrogate) characters';

export function isStorableText(text: string): boolean {
  return !UNSTORABLE.test(text);
}

/** Names that mean something to every JavaScript object; never accepted as a code or a key. */
export const RESERVED_KEYS: ReadonlySet<string> = new Set(['__proto__', 'constructor', 'prototype']);

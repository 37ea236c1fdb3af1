/**
 * The failure set of the reach screen as it travels in a shareable URL:
 * `?fail=site:S1,carriage:S1.TV,feed:F2,group:G3`. Tokens are `kind:code`; codes follow the
 * network document's code rule (docs/format.md), so they never hold
 * a comma or a colon and need no escaping of their own.
 */
import { compareElements, elementKey, type Element } from '@/shared/schemas/analysis';
import { CODE_PATTERN, ELEMENT_KINDS, type ElementKind } from '@/shared/schemas/network';

export interface ParsedFailSet {
  /** Distinct elements in the order first seen. */
  elements: Element[];
  /** Tokens that are not `kind:code`, each with the reason, for a message on screen. */
  bad: { token: string; reason: string }[];
}

const isKind = (k: string): k is ElementKind => (ELEMENT_KINDS as readonly string[]).includes(k);

/** Reads the `fail` parameter (a string, a repeated parameter as an array, or nothing). */
export function parseFailSet(param: string | string[] | undefined | null): ParsedFailSet {
  const raw = Array.isArray(param) ? param.join(',') : (param ?? '');
  const elements: Element[] = [];
  const bad: ParsedFailSet['bad'] = [];
  const seen = new Set<string>();
  for (const piece of raw.split(',')) {
    const token = piece.trim();
    if (token === '') continue;
    const colon = token.indexOf(':');
    if (colon < 0) {
      bad.push({ token, reason: 'expected kind:code, for example site:ABC' });
      continue;
    }
    const kind = token.slice(0, colon).toLowerCase();
    const code = token.slice(colon + 1);
    if (!isKind(kind)) {
      bad.push({ token, reason: `"${token.slice(0, colon)}" is not site, carriage, feed or group` });
      continue;
    }
    if (!CODE_PATTERN.test(code)) {
      bad.push({ token, reason: 'a code is 1-64 letters, digits, "-", "_" or "."' });
      continue;
    }
    const element = { kind, code };
    const key = elementKey(element);
    if (seen.has(key)) continue;
    seen.add(key);
    elements.push(element);
  }
  return { elements, bad };
}

/** The `fail` parameter for a set: sorted (kind, then code) and without repeats, so equal sets give equal URLs. */
export function formatFailSet(elements: readonly Element[]): string {
  const byKey = new Map(elements.map((e) => [elementKey(e), e] as const));
  return [...byKey.values()].sort(compareElements).map(elementKey).join(',');
}

export function addToFailSet(elements: readonly Element[], add: Element): Element[] {
  return elements.some((e) => e.kind === add.kind && e.code === add.code) ? [...elements] : [...elements, add];
}

export function removeFromFailSet(elements: readonly Element[], remove: Element): Element[] {
  return elements.filter((e) => !(e.kind === remove.kind && e.code === remove.code));
}

/** The shareable address of a failure set: `origin` + `/reach?fail=...` (no parameter for an empty set). */
export function reachUrl(origin: string, elements: readonly Element[]): string {
  const fail = formatFailSet(elements);
  return `${origin.replace(/\/$/, '')}/reach${fail ? `?fail=${encodeURIComponent(fail).replace(/%2C/g, ',').replace(/%3A/g, ':')}` : ''}`;
}

/**
 * The unknown elements a 404 from POST /api/analysis/reach names in
 * `details.unknown`, or an empty list when the details are missing.
 */
export function unknownFromDetails(details: unknown): Element[] {
  if (!details || typeof details !== 'object') return [];
  const list = (details as { unknown?: unknown }).unknown;
  if (!Array.isArray(list)) return [];
  return list.filter(
    (e): e is Element => !!e && typeof e === 'object' && isKind(String((e as Element).kind)) && typeof (e as Element).code === 'string',
  );
}

/**
 * Names for analysis elements (sites and groups have names; a feed is
 * described by the carriages it joins), from the network document.
 */
import type { Element } from '@/shared/schemas/analysis';
import type { NetworkDrawing } from '@/src/api/schemas';

export type ElementNamer = (e: Element) => string | undefined;

export function elementNamer(doc: NetworkDrawing | undefined): ElementNamer {
  if (!doc) return () => undefined;
  const sites = new Map(doc.sites.map((s) => [s.code, s.name]));
  const groups = new Map(doc.groups.map((g) => [g.code, g.name]));
  const feeds = new Map(doc.feeds.map((f) => [f.code, `${f.from} → ${f.to}`]));
  return (e) => (e.kind === 'site' ? sites.get(e.code) : e.kind === 'group' ? groups.get(e.code) : feeds.get(e.code));
}

/** "site O-LPC", "group PWR-NORTH". */
export const elementWords = (e: Element) => `${e.kind} ${e.code}`;

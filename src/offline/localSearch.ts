/**
 * Element search on the offline copy, answering as the server's searches do,
 * so the fault reach screen can still add elements with no connection:
 * sites and groups by code or name, feeds by their code, their ends'
 * carriage and site codes or their service's code (the list routes: one
 * piece of text, case-insensitive, ordered by code); carriages through the
 * server's own carriage search (server/services/carriageSearch.ts: every
 * word in the carriage's, site's or service's code or name, exact code first).
 */
import { compareCodes, type Carriage } from '@/shared/schemas/network';
import { searchCarriages, type CarriageSource } from '@/server/services/carriageSearch';
import { carriageHits, type ElementHit, type ElementSearchResult } from '@/src/api/queries/elementHits';
import type { OfflineCopy } from './copyStore';

const byCode = <T extends { code: string }>(items: readonly T[]) => new Map(items.map((i) => [i.code, i]));

interface Lookups extends CarriageSource {
  carriages: Map<string, Carriage>;
}

/** Look-ups by code, built once per copy (the carriage search keeps its index on this object). */
const lookups = new WeakMap<OfflineCopy, Lookups>();
function lookupsOf(copy: OfflineCopy): Lookups {
  let l = lookups.get(copy);
  if (!l) {
    const d = copy.document;
    l = { document: d, sites: byCode(d.sites), services: byCode(d.services), carriages: byCode(d.carriages) };
    lookups.set(copy, l);
  }
  return l;
}

export function localElementSearch(copy: OfflineCopy, text: string, pageSize: number): ElementSearchResult {
  const q = text.trim().toLowerCase();
  const has = (...values: (string | undefined)[]) => values.some((v) => v !== undefined && v.toLowerCase().includes(q));
  const l = lookupsOf(copy);
  const d = copy.document;
  const siteOf = (carriage: string) => l.carriages.get(carriage)?.site;
  const sites = d.sites.filter((s) => has(s.code, s.name)).sort(compareCodes);
  const feeds = d.feeds.filter((f) => has(f.code, f.from, f.to, siteOf(f.from), siteOf(f.to), l.carriages.get(f.from)?.service)).sort(compareCodes);
  const groups = d.groups.filter((g) => has(g.code, g.name)).sort(compareCodes);
  const carriages = searchCarriages(l, text, pageSize);
  const hits: ElementHit[] = [
    ...sites.slice(0, pageSize).map((s) => ({ kind: 'site' as const, code: s.code, label: s.name })),
    ...carriageHits(carriages),
    ...feeds.slice(0, pageSize).map((f) => ({ kind: 'feed' as const, code: f.code, label: `${f.from} → ${f.to}` })),
    ...groups.slice(0, pageSize).map((g) => ({ kind: 'group' as const, code: g.code, label: g.name })),
  ];
  return { hits, totals: { site: sites.length, carriage: carriages.total, feed: feeds.length, group: groups.length } };
}

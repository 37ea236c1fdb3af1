/**
 * Element search on the offline copy, answering in the shape of the server's
 * list search (a code or name holding the text, case-insensitive; a feed by
 * its code or its ends; a carriage by its code, its site's or its service's name), so the fault reach screen can still add elements
 * with no connection.
 */
import type { ElementHit, ElementSearchResult } from '@/src/api/queries/elementSearch';
import type { OfflineCopy } from './copyStore';

export function localElementSearch(copy: OfflineCopy, text: string, pageSize: number): ElementSearchResult {
  const q = text.trim().toLowerCase();
  const has = (...values: (string | undefined)[]) => values.some((v) => v !== undefined && v.toLowerCase().includes(q));
  const d = copy.document;
  const sites = d.sites.filter((s) => has(s.code, s.name));
  const feeds = d.feeds.filter((f) => has(f.code, f.from, f.to));
  const groups = d.groups.filter((g) => has(g.code, g.name));
  const siteName = new Map(d.sites.map((s) => [s.code, s.name]));
  const serviceName = new Map(d.services.map((s) => [s.code, s.name]));
  const carriages = d.carriages.filter((c) => has(c.code, siteName.get(c.site), serviceName.get(c.service)));
  const hits: ElementHit[] = [
    ...sites.slice(0, pageSize).map((s) => ({ kind: 'site' as const, code: s.code, label: s.name })),
    ...carriages.slice(0, pageSize).map((c) => ({ kind: 'carriage' as const, code: c.code, label: `${siteName.get(c.site) ?? c.site}, ${serviceName.get(c.service) ?? c.service}` })),
    ...feeds.slice(0, pageSize).map((f) => ({ kind: 'feed' as const, code: f.code, label: `${f.from} → ${f.to}` })),
    ...groups.slice(0, pageSize).map((g) => ({ kind: 'group' as const, code: g.code, label: g.name })),
  ];
  return { hits, totals: { site: sites.length, carriage: carriages.length, feed: feeds.length, group: groups.length } };
}

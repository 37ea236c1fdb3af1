/**
 * Element search hits as the fault reach screen lists them, from the server's
 * answers (elementSearch.ts) or the offline copy (src/offline/localSearch.ts).
 * Free of React so the offline search and its tests can use it.
 */
import type { Element } from '@/shared/schemas/analysis';
import type { CarriageSearchPage } from '../schemas';

export interface ElementHit extends Element {
  /** A site's or group's name; for a feed, "from -> to"; for a carriage, "site name, service name". */
  label: string;
}

export interface ElementSearchResult {
  hits: ElementHit[];
  /** How many matched per kind, beyond those shown. */
  totals: Record<Element['kind'], number>;
}

/** Carriage hits labelled "site name, service name" (also from the offline copy's search). */
export function carriageHits(page: CarriageSearchPage): ElementHit[] {
  return page.items.map((c) => ({ kind: 'carriage' as const, code: c.code, label: `${c.siteName || c.site}, ${c.serviceName || c.service}` }));
}

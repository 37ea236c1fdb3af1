/**
 * Finds carriages (transmitters) to mark failed, from the served network in
 * memory: by the carriage's code, or by its site and service together ("Ridge
 * FM2", "ST0012 SV03"): every word of the query must appear in the carriage
 * code, the site's code or name, or the service's code or name (case
 * ignored). Exact code matches come first, then code order.
 */
import type { ServedNetwork } from './servedNetwork';

export interface CarriageHit {
  code: string;
  site: string;
  siteName: string;
  service: string;
  serviceName: string;
}

interface Indexed extends CarriageHit {
  /** everything a word may match, lower case, joined by a character no query word holds */
  text: string;
}

/** What the search reads: the served network, or the browser's offline copy with the same look-ups (src/offline/localSearch.ts). */
export type CarriageSource = Pick<ServedNetwork, 'document' | 'sites' | 'services'>;

const indexes = new WeakMap<CarriageSource, Indexed[]>();
const building = new WeakMap<CarriageSource, Promise<void>>();

function entry(m: CarriageSource, c: CarriageSource['document']['carriages'][number]): Indexed {
  const siteName = m.sites.get(c.site)?.name ?? '';
  const serviceName = m.services.get(c.service)?.name ?? '';
  const hit = { code: c.code.trim(), site: c.site, siteName, service: c.service, serviceName };
  return { ...hit, text: [hit.code, c.site, siteName, c.service, serviceName].join('\u0000').toLowerCase() };
}

const byCode = (a: Indexed, b: Indexed) => (a.code < b.code ? -1 : a.code > b.code ? 1 : 0);

/** In code order. The served document already is (it is read and patched in code order), so the sort is usually skipped. */
function ordered(index: Indexed[]): Indexed[] {
  for (let i = 1; i < index.length; i++) if (byCode(index[i - 1], index[i]) > 0) return index.sort(byCode);
  return index;
}

function indexOf(m: CarriageSource): Indexed[] {
  let index = indexes.get(m);
  if (!index) {
    index = ordered(m.document.carriages.map((c) => entry(m, c)));
    indexes.set(m, index);
  }
  return index;
}

/** When to give the event loop a turn and how (a server passes its Turns clock and setImmediate; this file stays free of server imports, as the web app bundles it). */
export interface Pacer {
  due(): boolean;
  pause(): Promise<void>;
}

/**
 * Builds the search's index of `m`, pausing when `pacer` says a turn is due
 * (a server's first search at 20,000 sites held the loop 0.6 s building it
 * in one piece); searches that arrive meanwhile share the work.
 */
export function carriageIndexReady(m: CarriageSource, pacer: Pacer): Promise<void> {
  if (indexes.has(m)) return Promise.resolve();
  let job = building.get(m);
  if (!job) {
    job = (async () => {
      const index: Indexed[] = [];
      for (const c of m.document.carriages) {
        index.push(entry(m, c));
        if (pacer.due()) await pacer.pause();
      }
      indexes.set(m, ordered(index));
    })();
    building.set(m, job);
    void job.finally(() => building.delete(m));
  }
  return job;
}

/** Words of the query: white space, commas and "+" separate them. */
export const queryWords = (q: string) => q.toLowerCase().split(/[\s,+]+/).filter(Boolean);

export function searchCarriages(m: CarriageSource, q: string, pageSize: number): { items: CarriageHit[]; total: number } {
  const words = queryWords(q);
  if (words.length === 0) return { items: [], total: 0 };
  const exact = q.trim().toLowerCase();
  const first: CarriageHit[] = [];
  const rest: CarriageHit[] = [];
  let total = 0;
  for (const c of indexOf(m)) {
    if (!words.every((w) => c.text.includes(w))) continue;
    total++;
    const { text: _text, ...hit } = c;
    if (c.code.toLowerCase() === exact) first.push(hit);
    else if (rest.length < pageSize) rest.push(hit);
  }
  return { items: [...first, ...rest].slice(0, pageSize), total };
}

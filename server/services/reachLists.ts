/**
 * The fault reach as the reach screen reads it at 20,000 sites: a brief answer
 * (counts, the households, per service, and only the first rows of each long
 * list) and the long lists a page at a time. One worst fault there takes
 * 7,000 sites and 20,000 carriages off air, 1.1 MB of answer a phone parsed
 * whole before drawing anything.
 *
 * Answers are kept per network model and failure set, so paging through a
 * list works the reach out once.
 */
import type { BriefReachAnswer, Element, ReachAnswer, ReachCarriagesPage, ReachSiteRow, ReachSitesPage } from '@/shared/schemas/analysis';
import { compareElements, elementKey } from '@/shared/schemas/analysis';
import { pageRows, type PageQuery } from '@/shared/schemas/paging';
import type { ServedNetwork } from './servedNetwork';

interface Kept {
  answer: ReachAnswer;
  /** the sites in the fault desk's order, with names and households; made when first asked for */
  sites?: ReachSiteRow[];
}

/** Failure sets kept per network: the one on screen and a few before it. */
const KEEP = 8;
const kept = new WeakMap<ServedNetwork, Map<string, Kept>>();

/** The reach of `failed` on `m`, worked out once per failure set (the engine throws UnknownElementsError for unknown codes). */
function keptReach(m: ServedNetwork, failed: readonly Element[]): Kept {
  let answers = kept.get(m);
  if (!answers) kept.set(m, (answers = new Map()));
  const key = [...new Map(failed.map((e) => [elementKey(e), e])).values()].sort(compareElements).map(elementKey).join(',');
  let k = answers.get(key);
  if (!k) {
    k = { answer: m.engine.reach([...failed]) };
    if (answers.size >= KEEP) answers.delete(answers.keys().next().value!);
    answers.set(key, k);
  }
  return k;
}

/** Off air before on reserve, then the most households first, then the most carriages off air, then by code: the order a fault desk calls sites in. */
function deskOrder(m: ServedNetwork, k: Kept): ReachSiteRow[] {
  if (!k.sites) {
    const rows = k.answer.sites.map((s) => {
      const site = m.sites.get(s.site);
      return { site: s.site, name: site?.name ?? s.site, households: site?.households ?? 0, lost: s.lost, fallback: s.fallback ?? [] };
    });
    rows.sort((a, b) => Number(b.lost.length > 0) - Number(a.lost.length > 0) || b.households - a.households || b.lost.length - a.lost.length || (a.site < b.site ? -1 : a.site > b.site ? 1 : 0));
    k.sites = rows;
  }
  return k.sites;
}

/** The reach with only the first `first` sites (in the desk's order), carriages off air and on reserve, and the length of each whole list. */
export function briefReach(m: ServedNetwork, failed: readonly Element[], first: number): BriefReachAnswer {
  const k = keptReach(m, failed);
  const { answer } = k;
  const sites = deskOrder(m, k).slice(0, first);
  return {
    networkVersion: answer.networkVersion,
    households: answer.households,
    byService: answer.byService,
    lost: answer.lost.slice(0, first),
    fallback: answer.fallback.slice(0, first),
    sites: sites.map((s) => ({ site: s.site, lost: s.lost, fallback: s.fallback })),
    siteInfo: Object.fromEntries(sites.map((s) => [s.site, { name: s.name, households: s.households }])),
    counts: { sites: answer.sites.length, lost: answer.lost.length, fallback: answer.fallback.length },
  };
}

/** A page of the sites the failure touches, in the desk's order, each with its name and households. */
export function reachSitesPage(m: ServedNetwork, failed: readonly Element[], page: PageQuery): ReachSitesPage {
  const k = keptReach(m, failed);
  const { rows, total, offset } = pageRows(deskOrder(m, k), page);
  return { networkVersion: k.answer.networkVersion, sites: rows, total, offset };
}

/** A page of the carriages off air (`lost`) or on a reserve feed (`fallback`), in the order the reach lists them. */
export function reachCarriagesPage(m: ServedNetwork, failed: readonly Element[], state: 'lost' | 'fallback', page: PageQuery): ReachCarriagesPage {
  const { answer } = keptReach(m, failed);
  const { rows, total, offset } = pageRows(answer[state], page);
  return { networkVersion: answer.networkVersion, state, carriages: rows, total, offset };
}

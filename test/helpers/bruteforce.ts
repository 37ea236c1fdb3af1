/**
 * Rules 1-10 of docs/domain.md evaluated directly on the network document:
 * no graph library, no dominators. "Has programme" is the least fixed point
 * of rule 3, reached by starting from the origin carriages and sweeping the
 * feeds until nothing changes. Slow on purpose, obviously right on purpose.
 * A failed carriage has no programme and takes down every feed it is the
 * source of; the rest of the rules are unchanged.
 */
import type { NetworkDocument } from '@/shared/schemas/network';
import type { Element, ReachAnswer } from '@/shared/schemas/analysis';
import { compareElements } from '@/shared/schemas/analysis';
import { DEFAULT_WEAK_POINT_KINDS, ELEMENT_KINDS } from '@/shared/schemas/network';

const sorted = (codes: Iterable<string>) => [...codes].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));

export class BruteForce {
  constructor(readonly doc: NetworkDocument) {}

  private siteOf = (carriage: string) => this.doc.carriages.find((c) => c.code === carriage)!.site;

  /** Carriage codes that have programme under `failed` (rules 1-3); with `reservesDown`, every reserve feed is also down. */
  programme(failed: Element[], reservesDown = false): Set<string> {
    const doc = this.doc;
    const failedSites = new Set(failed.filter((e) => e.kind === 'site').map((e) => e.code));
    const failedFeeds = new Set(failed.filter((e) => e.kind === 'feed').map((e) => e.code));
    const failedGroups = new Set(failed.filter((e) => e.kind === 'group').map((e) => e.code));
    // A failed carriage has no programme, and every feed whose source it is is down.
    const failedCarriages = new Set(failed.filter((e) => e.kind === 'carriage').map((e) => e.code));
    // Rule 1.
    const siteDown = new Set(
      doc.sites.filter((s) => failedSites.has(s.code) || (s.groups ?? []).some((g) => failedGroups.has(g))).map((s) => s.code),
    );
    const site = new Map(doc.carriages.map((c) => [c.code, c.site]));
    const origin = new Set(doc.sites.filter((s) => s.role === 'origin').map((s) => s.code));
    // Rule 2.
    const feedUp = doc.feeds.filter(
      (f) =>
        !failedFeeds.has(f.code) &&
        !failedCarriages.has(f.from) &&
        !(f.groups ?? []).some((g) => failedGroups.has(g)) &&
        !siteDown.has(site.get(f.from)!) &&
        !siteDown.has(site.get(f.to)!) &&
        !(f.via ?? []).some((v) => siteDown.has(v)) &&
        !(reservesDown && f.role === 'reserve'),
    );
    // Rule 3, least fixed point.
    const has = new Set(doc.carriages.filter((c) => origin.has(c.site) && !siteDown.has(c.site) && !failedCarriages.has(c.code)).map((c) => c.code));
    let changed = true;
    while (changed) {
      changed = false;
      for (const f of feedUp) {
        if (has.has(f.from) && !has.has(f.to) && !siteDown.has(site.get(f.to)!) && !failedCarriages.has(f.to)) {
          has.add(f.to);
          changed = true;
        }
      }
    }
    return has;
  }

  /** Rules 4, 5 and 7, in the engine's answer shape (without networkVersion). */
  reach(failed: Element[]): Omit<ReachAnswer, 'networkVersion'> {
    const doc = this.doc;
    const before = this.programme([]);
    const under = this.programme(failed);
    const underMainOnly = this.programme(failed, true);
    const lost = doc.carriages.filter((c) => before.has(c.code) && !under.has(c.code));
    const fallback = doc.carriages.filter((c) => under.has(c.code) && !underMainOnly.has(c.code));
    const households = new Map(doc.sites.map((s) => [s.code, s.households ?? 0]));
    const siteLost = new Map<string, string[]>();
    const siteFallback = new Map<string, string[]>();
    for (const c of lost) siteLost.set(c.site, [...(siteLost.get(c.site) ?? []), c.service]);
    for (const c of fallback) siteFallback.set(c.site, [...(siteFallback.get(c.site) ?? []), c.service]);
    const siteCodes = sorted(new Set([...siteLost.keys(), ...siteFallback.keys()]));
    let hhLost = 0;
    let hhFallback = 0;
    for (const s of siteCodes) {
      if (siteLost.has(s)) hhLost += households.get(s)!;
      else hhFallback += households.get(s)!;
    }
    const byService = sorted(doc.services.map((s) => s.code))
      .map((service) => ({
        service,
        lost: lost.filter((c) => c.service === service).length,
        fallback: fallback.filter((c) => c.service === service).length,
      }))
      .filter((r) => r.lost > 0 || r.fallback > 0);
    return {
      lost: sorted(lost.map((c) => c.code)),
      fallback: sorted(fallback.map((c) => c.code)),
      households: { lost: hhLost, fallback: hhFallback },
      byService,
      sites: siteCodes.map((site) => ({ site, lost: sorted(siteLost.get(site) ?? []), fallback: sorted(siteFallback.get(site) ?? []) })),
    };
  }

  /** Every element of the given kinds (all four by default), in element order. */
  elements(kinds: readonly Element['kind'][] = ELEMENT_KINDS): Element[] {
    return [
      ...this.doc.sites.map((s) => ({ kind: 'site' as const, code: s.code })),
      ...this.doc.carriages.map((c) => ({ kind: 'carriage' as const, code: c.code })),
      ...this.doc.feeds.map((f) => ({ kind: 'feed' as const, code: f.code })),
      ...this.doc.groups.map((g) => ({ kind: 'group' as const, code: g.code })),
    ]
      .filter((e) => kinds.includes(e.kind))
      .sort(compareElements);
  }

  /** Rule 8. */
  unfed(): string[] {
    const before = this.programme([]);
    return sorted(this.doc.carriages.filter((c) => !before.has(c.code)).map((c) => c.code));
  }

  /** Rule 6, for every fed carriage, by trying every element of the given kinds alone (c itself and c's site excepted). */
  spof(kinds: readonly Element['kind'][] = DEFAULT_WEAK_POINT_KINDS): { carriage: string; spof: Element[] }[] {
    const before = this.programme([]);
    const fed = sorted([...before]);
    const under = new Map(this.elements(kinds).map((x) => [x, this.programme([x])]));
    const self = (x: Element, carriage: string) => (x.kind === 'site' && x.code === this.siteOf(carriage)) || (x.kind === 'carriage' && x.code === carriage);
    return fed.map((carriage) => ({
      carriage,
      spof: [...under.entries()]
        .filter(([x, has]) => !self(x, carriage) && !has.has(carriage))
        .map(([x]) => x)
        .sort(compareElements),
    }));
  }

  /** Rule 7: exposure of every element, ranked as the engine ranks it. */
  exposure(kinds: readonly Element['kind'][] = DEFAULT_WEAK_POINT_KINDS): { element: Element; households: number; carriages: number }[] {
    return this.elements(kinds)
      .map((element) => {
        const r = this.reach([element]);
        return { element, households: r.households.lost, carriages: r.lost.length };
      })
      .sort((a, b) => b.households - a.households || compareElements(a.element, b.element));
  }

  /**
   * Rule 9 (revised): carriages with a reserve feed and at least one avoidable
   * single point of failure (one under which some origin carriage of the
   * service still has programme).
   */
  diversity(): { carriage: string; spof: Element[]; avoidable: Element[] }[] {
    const withReserve = new Set(this.doc.feeds.filter((f) => f.role === 'reserve').map((f) => f.to));
    const origin = new Set(this.doc.sites.filter((s) => s.role === 'origin').map((s) => s.code));
    const serviceOf = new Map(this.doc.carriages.map((c) => [c.code, c.service]));
    const origins = (service: string) => this.doc.carriages.filter((c) => c.service === service && origin.has(c.site)).map((c) => c.code);
    const under = new Map<string, Set<string>>();
    const programmeUnder = (x: Element) => {
      const key = `${x.kind}:${x.code}`;
      if (!under.has(key)) under.set(key, this.programme([x]));
      return under.get(key)!;
    };
    return this.spof()
      .filter((r) => withReserve.has(r.carriage))
      .map((r) => ({
        carriage: r.carriage,
        spof: r.spof,
        avoidable: r.spof.filter((x) => origins(serviceOf.get(r.carriage)!).some((o) => programmeUnder(x).has(o))),
      }))
      .filter((r) => r.avoidable.length > 0);
  }

  /**
   * Rule 10 for every pair of elements of the given kinds, by removing both
   * and walking: pairs with a non-empty joint loss, ranked by its households,
   * ties by the first element then the second (kind, then code).
   */
  pairs(kinds: Element['kind'][] = ['site', 'feed', 'group']): { elements: [Element, Element]; jointLost: string[]; households: number }[] {
    const elements = this.elements().filter((e) => kinds.includes(e.kind));
    const households = new Map(this.doc.sites.map((s) => [s.code, s.households ?? 0]));
    const alone = new Map(elements.map((e) => [e, new Set(this.reach([e]).lost)]));
    const out: { elements: [Element, Element]; jointLost: string[]; households: number }[] = [];
    for (let i = 0; i < elements.length; i++) {
      for (let j = i + 1; j < elements.length; j++) {
        const a = alone.get(elements[i])!;
        const b = alone.get(elements[j])!;
        const both = this.reach([elements[i], elements[j]]).lost;
        const jointLost = both.filter((c) => !a.has(c) && !b.has(c));
        if (jointLost.length === 0) continue;
        const touched = new Set([...a, ...b].map((c) => this.siteOf(c)));
        const sites = new Set(jointLost.map((c) => this.siteOf(c)).filter((s) => !touched.has(s)));
        out.push({ elements: [elements[i], elements[j]], jointLost, households: [...sites].reduce((sum, s) => sum + households.get(s)!, 0) });
      }
    }
    return out.sort((p, q) => q.households - p.households || compareElements(p.elements[0], q.elements[0]) || compareElements(p.elements[1], q.elements[1]));
  }
}

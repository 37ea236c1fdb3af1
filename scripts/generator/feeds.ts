/**
 * Feeds and shared-risk groups of a generated network. Mains take programme
 * from the nearest origin by line, microwave (some through a hop site) or
 * satellite, most with a reserve by another medium, a few with a reserve on
 * the same telecom route (not really diverse). Relays take it off-air from
 * their parent; DAB (single-frequency networks) comes by satellite. A few
 * relays have a reserve: off-air from another site (some in pairs, which
 * makes loops that still have an origin upstream), from the same parent, or
 * by line. Then a few loop pairs feed only each other, and a few relay
 * carriages get no feed at all: data problems for the tools to find.
 *
 * Off-air main feeds pass the path checks by construction (./layout.ts keeps
 * them inside the horizon, ./carriages.ts gives the power). Reserves off-air
 * and microwave paths are screened with the feed checks themselves
 * (server/checks/feedChecks.ts): a path that would fail one is not built
 * (a microwave main falls back to a line). So the only failures left are the
 * deliberate faults ./carriages.ts plants.
 */
import type { Carriage, Feed, FeedRole, Group } from '@/shared/schemas/network';
import { computeFeedChecks } from '@/server/checks/feedChecks';
import { normaliseDeg } from '@/shared/rf/geodesy';
import { SERVICE_SPECS, type Family } from './catalogue';
import { carriageAt, type CarriageTable } from './carriages';
import { bearingTo, round } from './geo';
import type { Counts, Layout, SiteDraft } from './layout';
import type { Prng } from './prng';

const SAT_GROUP: Record<Exclude<Family, 'local'>, Group> = {
  tv: { code: 'SAT-TV', name: 'Satellite transponder, TV distribution' },
  radio: { code: 'SAT-RADIO', name: 'Satellite transponder, radio distribution' },
};
const MIN_OFF_AIR_KM = 5;
const MAX_OFF_AIR_KM = 60;
const RX_ANTENNA: Record<string, readonly string[]> = {
  dtt: ['UHF yagi', 'UHF log-periodic', 'UHF panel'],
  fm: ['FM yagi', 'FM dipole'],
  dab: ['Band III yagi'],
};

/** An off-air feed: receives the parent carriage's channel, antenna pointed along `bearingDeg`. */
export function offAirFeed(code: string, from: Carriage, to: Carriage, role: FeedRole, bearingDeg: number, rxAntenna: string): Feed {
  const feed: Feed = { code, from: from.code, to: to.code, medium: 'off-air', role };
  if (from.frequencyMHz !== undefined) feed.rxFrequencyMHz = from.frequencyMHz;
  if (from.channel !== undefined) feed.rxChannel = from.channel;
  feed.rxAntenna = rxAntenna;
  feed.bearingDeg = normaliseDeg(round(bearingDeg, 1));
  return feed;
}

export function buildFeeds(prng: Prng, layout: Layout, table: CarriageTable, counts: Counts): { feeds: Feed[]; groups: Group[] } {
  const { sites } = layout;
  const feeds: Feed[] = [];
  const used = new Map<string, Group>();
  const useGroup = (g: Group) => (used.set(g.code, g), g.code);
  const carriageOf = (site: number, service: number) => table.carriages[carriageAt(table, site, service)];
  /** True when no check of the feed fails (server/checks/feedChecks.ts). */
  const passes = (feed: Feed, from: number, to: number, service: number) =>
    computeFeedChecks({
      feed,
      source: carriageOf(from, service),
      target: carriageOf(to, service),
      sourceSite: sites[from].site,
      targetSite: sites[to].site,
      serviceKind: SERVICE_SPECS[service].kind,
    }).checks.every((c) => c.ok !== false);
  const antenna = (service: number) => prng.pick(RX_ANTENNA[SERVICE_SPECS[service].kind] ?? RX_ANTENNA.dtt);

  const routes = Math.max(2, Math.ceil(layout.gridSide / 3));
  const routeGroup = (main: SiteDraft): Group => {
    const r = Math.min(routes - 1, Math.floor((main.gridY * routes) / layout.gridSide)) + 1;
    return { code: `TEL-${String(r).padStart(2, '0')}`, name: `Telecom route ${r}` };
  };
  const regionsPerRow = Math.ceil(layout.gridSide / 4);
  const powerGroup = (main: SiteDraft): Group => {
    const r = Math.floor(main.gridX / 4) + Math.floor(main.gridY / 4) * regionsPerRow + 1;
    return { code: `PWR-${String(r).padStart(2, '0')}`, name: `Regional power supply ${r}` };
  };

  const nearestOrigin = (site: SiteDraft, family: Family): number => {
    let best = -1;
    let bestD = Infinity;
    for (const o of layout.origins) {
      if (!sites[o].families.includes(family)) continue;
      const d = (sites[o].site.lat - site.site.lat) ** 2 + (sites[o].site.lon - site.site.lon) ** 2;
      if (d < bestD) [best, bestD] = [o, d];
    }
    return best;
  };

  // Mains: main and reserve feeds from the origins.
  for (const m of layout.mains) {
    const main = sites[m];
    main.site.groups = [useGroup(powerGroup(main))];
    const route = routeGroup(main);
    const hop = hopToward(layout, main);
    const r = prng.next();
    let medium = r < 0.6 || (r < 0.85 && hop < 0) ? 'line' : r < 0.85 ? 'microwave' : 'satellite';
    const reserve = prng.chance(0.85) ? (medium === 'satellite' ? 'line' : prng.chance(0.1) ? 'same-route' : 'satellite') : 'none';
    const linkMHz = prng.int(7125, 8500);
    const microwaveFeed = (k: number): Feed => {
      const to = carriageOf(m, k);
      const from = carriageOf(nearestOrigin(main, SERVICE_SPECS[k].family), k);
      return { code: `${to.code}.M`, from: from.code, to: to.code, medium: 'microwave', role: 'main', via: [sites[hop].site.code], rxFrequencyMHz: linkMHz, rxAntenna: 'dish 1.8 m' };
    };
    // A microwave path that would fail its checks (too long, not clear) is a line instead.
    if (medium === 'microwave' && !main.services.every((k) => SERVICE_SPECS[k].family === 'local' || passes(microwaveFeed(k), nearestOrigin(main, SERVICE_SPECS[k].family), m, k))) {
      medium = 'line';
    }
    for (const k of main.services) {
      const spec = SERVICE_SPECS[k];
      const to = carriageOf(m, k);
      const from = carriageOf(nearestOrigin(main, spec.family), k);
      if (spec.family === 'local') {
        feeds.push({ code: `${to.code}.M`, from: from.code, to: to.code, medium: 'line', role: 'main', groups: [useGroup(route)] });
        continue;
      }
      const sat = SAT_GROUP[spec.family];
      if (medium === 'line' || reserve === 'same-route') {
        feeds.push({ code: `${to.code}.M`, from: from.code, to: to.code, medium: 'line', role: 'main', groups: [useGroup(route)] });
      } else if (medium === 'microwave') {
        feeds.push(microwaveFeed(k));
      } else {
        feeds.push({ code: `${to.code}.M`, from: from.code, to: to.code, medium: 'satellite', role: 'main', groups: [useGroup(sat)], rxAntenna: 'dish 2.4 m' });
      }
      if (reserve === 'satellite') {
        feeds.push({ code: `${to.code}.R`, from: from.code, to: to.code, medium: 'satellite', role: 'reserve', groups: [useGroup(sat)], rxAntenna: 'dish 2.4 m' });
      } else if (reserve === 'line' || reserve === 'same-route') {
        feeds.push({ code: `${to.code}.R`, from: from.code, to: to.code, medium: 'line', role: 'reserve', groups: [useGroup(route)] });
      }
    }
  }

  // Relays: reserve plans first, so the unfed carriages can be chosen where nothing depends on them.
  const treeRelays = new Map<number, number[]>();
  const loopSites = new Set(layout.loopPairs.flat());
  for (const s of layout.relays) {
    if (loopSites.has(s)) continue;
    const list = treeRelays.get(sites[s].tree);
    if (list) list.push(s);
    else treeRelays.set(sites[s].tree, [s]);
  }
  const reserves: Array<{ to: number; from: number; kind: 'alt' | 'same' | 'line' }> = [];
  const isSource = new Uint8Array(sites.length);
  for (const list of treeRelays.values()) {
    list.forEach((s, position) => {
      const relay = sites[s];
      if (prng.chance(0.4)) relay.site.groups = [useGroup(powerGroup(sites[relay.tree]))];
      const r = prng.next();
      if (r < 0.07) {
        const parent = sites[relay.parent];
        const alt = parent.role === 'relay' ? parent.parent : position > 0 ? list[prng.int(0, position - 1)] : -1;
        if (alt < 0 || alt === relay.parent) return;
        reserves.push({ to: s, from: alt, kind: 'alt' });
        isSource[alt] = 1;
        if (sites[alt].role === 'relay' && prng.chance(0.3)) {
          reserves.push({ to: alt, from: s, kind: 'alt' });
          isSource[s] = 1;
        }
      } else if (r < 0.09) {
        reserves.push({ to: s, from: relay.parent, kind: 'same' });
      } else if (r < 0.11) {
        reserves.push({ to: s, from: relay.tree, kind: 'line' });
      }
    });
  }
  const unfed = chooseUnfed(prng, layout, isSource, counts.unfed);

  for (const s of layout.relays) {
    if (loopSites.has(s)) continue;
    const relay = sites[s];
    for (const k of relay.services) {
      const to = carriageOf(s, k);
      if (unfed.has(to.code)) continue;
      const spec = SERVICE_SPECS[k];
      if (spec.kind === 'dab') {
        const from = carriageOf(nearestOrigin(relay, spec.family), k);
        feeds.push({ code: `${to.code}.M`, from: from.code, to: to.code, medium: 'satellite', role: 'main', groups: [useGroup(SAT_GROUP.radio)], rxAntenna: 'dish 1.2 m' });
        continue;
      }
      feeds.push(offAirFeed(`${to.code}.M`, carriageOf(relay.parent, k), to, 'main', relay.bearingBackDeg, antenna(k)));
    }
  }
  for (const plan of reserves) {
    const target = sites[plan.to];
    const source = sites[plan.from];
    const path = bearingTo(target.site.lat, target.site.lon, source.site.lat, source.site.lon);
    // Off-air paths keep to the span relays have from their parents (5-60 km).
    if (plan.kind === 'alt' && (path.distanceKm < MIN_OFF_AIR_KM || path.distanceKm > MAX_OFF_AIR_KM)) continue;
    const toward = path.bearingDeg;
    for (const k of target.services) {
      const at = carriageAt(table, plan.from, k);
      const to = carriageOf(plan.to, k);
      if (at < 0 || SERVICE_SPECS[k].kind === 'dab' || unfed.has(to.code)) continue;
      const from = table.carriages[at];
      // A relay may have its own reserve and be the reserve source of others in return: name each by its source.
      const code = plan.kind === 'alt' ? `${to.code}.R.${source.site.code}` : `${to.code}.R`;
      if (plan.kind === 'line') {
        feeds.push({ code, from: from.code, to: to.code, medium: 'line', role: 'reserve', groups: [useGroup(routeGroup(source))] });
      } else {
        const feed = offAirFeed(code, from, to, 'reserve', plan.kind === 'same' ? target.bearingBackDeg : toward, antenna(k));
        if (passes(feed, plan.from, plan.to, k)) feeds.push(feed);
      }
    }
  }

  // Loop pairs: each relay of the pair takes programme only from the other.
  for (const [a, b] of layout.loopPairs) {
    for (const [to, from] of [[a, b], [b, a]] as const) {
      const there = sites[from].site;
      const here = sites[to].site;
      const k = sites[to].services[0];
      const bearing = bearingTo(here.lat, here.lon, there.lat, there.lon).bearingDeg;
      feeds.push(offAirFeed(`${carriageOf(to, k).code}.M`, carriageOf(from, k), carriageOf(to, k), 'main', bearing, antenna(k)));
    }
  }

  const groups = [...used.values()].sort((x, y) => (x.code < y.code ? -1 : x.code > y.code ? 1 : 0));
  return { feeds, groups };
}

/** The neighbouring main one grid step toward the centre: the hop of a microwave path, or -1. */
function hopToward(layout: Layout, main: SiteDraft): number {
  const half = (layout.gridSide - 1) / 2;
  const dx = half - main.gridX;
  const dy = half - main.gridY;
  if (Math.abs(dx) < 1 && Math.abs(dy) < 1) return -1;
  const gx = Math.abs(dx) >= Math.abs(dy) ? main.gridX + Math.sign(dx) : main.gridX;
  const gy = Math.abs(dx) >= Math.abs(dy) ? main.gridY : main.gridY + Math.sign(dy);
  const i = gy * layout.gridSide + gx;
  return i < layout.mains.length ? layout.mains[i] : -1;
}

/** Relay carriages left without any feed: at leaf relays nothing else takes programme from. */
function chooseUnfed(prng: Prng, layout: Layout, isSource: Uint8Array, count: number): Set<string> {
  const chosen = new Set<string>();
  const loopSites = new Set(layout.loopPairs.flat());
  const relays = layout.relays.filter((s) => !loopSites.has(s));
  if (relays.length === 0) return chosen;
  const start = prng.int(0, relays.length - 1);
  for (let i = 0; i < relays.length && chosen.size < count; i++) {
    const s = relays[(start + i) % relays.length];
    const relay = layout.sites[s];
    if (relay.children > 0 || isSource[s]) continue;
    const k = relay.services[relay.services.length - 1];
    chosen.add(`${relay.site.code}.${SERVICE_SPECS[k].code}`);
  }
  return chosen;
}

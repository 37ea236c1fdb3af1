/**
 * Builds the demo network from the tables in demo-region.ts: positions from
 * each parent's distance and bearing (GeographicLib direct problem), the
 * recorded receive bearings from the relay back to its parent (GeographicLib
 * inverse, shared/rf/geodesy.ts), channels, ERPs, heights and households
 * from a fixed seed. Deterministic: the same code gives the same document.
 */
import type { Carriage, Feed, NetworkDocument, Site } from '@/shared/schemas/network';
import { NETWORK_FORMAT, usualCarriageCode as carriageCode } from '@/shared/schemas/network';
import { normaliseDeg } from '@/shared/rf/geodesy';
import { dabTuning, pickFm, pickUhf, type Tuning } from './catalogue';
import * as region from './demo-region';
import { offAirFeed } from './feeds';
import { bearingTo, placeFrom, round } from './geo';
import { Prng } from './prng';

const SAT = 'SAT-TP7';
const RX_ANTENNA: Record<string, string> = { dtt: 'UHF yagi', fm: 'FM yagi', dab: 'Band III yagi' };
export const OFF_AIR_MIN_KM = 5;
export const OFF_AIR_MAX_KM = 60;

interface Draft {
  site: Site;
  parent?: string;
  depth: number;
  services: readonly string[];
}

export function buildDemoNetwork(): NetworkDocument {
  const prng = new Prng(region.DEMO_SEED);
  const drafts = new Map<string, Draft>();
  const add = (draft: Draft) => drafts.set(draft.site.code, draft);
  const centre = region.DEMO_CENTRE;
  const ground = (lat: number, lon: number, lift: number) => {
    const km = bearingTo(centre.lat, centre.lon, lat, lon).distanceKm;
    // The Lanneth valley floor lies near the centre; the land rises toward the hills around it.
    return Math.round(90 + Math.min(km, 70) * 5 + 40 * Math.sin(lat * 31 + lon * 17) + lift);
  };

  for (const [code, name, , bearing, km, profile] of region.DEMO_ORIGINS) {
    const p = km === 0 ? { lat: centre.lat, lon: centre.lon } : placeFrom(centre.lat, centre.lon, bearing, km);
    const site: Site = { code, name, role: 'origin', lat: round(p.lat, 6), lon: round(p.lon, 6) };
    site.groundHeightM = ground(site.lat, site.lon, 0);
    site.mastHeightM = prng.int(20, 45);
    add({ site, depth: 0, services: region.PROFILES[profile] });
  }
  for (const m of region.DEMO_MAINS) {
    const p = placeFrom(centre.lat, centre.lon, m.bearingDeg, m.km);
    const site: Site = { code: m.code, name: m.name, role: 'main', lat: round(p.lat, 6), lon: round(p.lon, 6) };
    site.groundHeightM = ground(site.lat, site.lon, prng.between(250, 450));
    site.mastHeightM = prng.int(160, 310);
    site.households = m.households;
    site.groups = [m.power];
    add({ site, depth: 0, services: region.PROFILES[m.profile] });
  }
  for (const [code, name, parentCode, km, bearing, profile] of region.DEMO_RELAYS) {
    const parent = need(drafts.get(parentCode), `parent site ${parentCode} of ${code}`);
    const p = placeFrom(parent.site.lat, parent.site.lon, bearing, km);
    const site: Site = { code, name, role: 'relay', lat: round(p.lat, 6), lon: round(p.lon, 6) };
    site.groundHeightM = ground(site.lat, site.lon, prng.between(0, 200));
    site.mastHeightM = prng.int(15, 55);
    site.households = Math.round(prng.logBetween(300, 12000) / (parent.depth + 1) / 10) * 10;
    if (region.DEMO_POWERED_RELAYS[code]) site.groups = [region.DEMO_POWERED_RELAYS[code]];
    add({ site, parent: parentCode, depth: parent.depth + 1, services: region.PROFILES[profile] });
  }

  const carriages = buildCarriages(prng, drafts);
  const feeds = buildFeeds(prng, drafts, carriages);
  return {
    format: NETWORK_FORMAT,
    sites: [...drafts.values()].map((d) => d.site),
    services: region.DEMO_SERVICES.map(({ code, name, kind }) => ({ code, name, kind })),
    groups: [...region.DEMO_GROUPS],
    carriages: [...carriages.values()],
    feeds,
  };
}

function need<T>(value: T | undefined, what: string): T {
  if (value === undefined) throw new Error(`demo region tables: ${what} is missing`);
  return value;
}

const kindOf = (service: string) => need(region.DEMO_SERVICES.find((s) => s.code === service), `service ${service}`).kind;

function buildCarriages(prng: Prng, drafts: Map<string, Draft>): Map<string, Carriage> {
  const carriages = new Map<string, Carriage>();
  const mainFm = new Set<number>();
  // A site must not transmit what it receives: keep clear of the parent and of reserve sources, both ways.
  const related = new Map<string, string[]>();
  const relate = (a: string, b: string) => related.set(a, [...(related.get(a) ?? []), b]);
  for (const d of drafts.values()) if (d.parent !== undefined) relate(d.site.code, d.parent);
  for (const [relay, source] of region.DEMO_RELAY_RESERVES) {
    relate(relay, source);
    relate(source, relay);
  }
  for (const d of drafts.values()) {
    const usedChannels = new Set<string>();
    const usedFm = new Set<number>();
    for (const service of d.services) {
      const code = carriageCode(d.site.code, service);
      const c: Carriage = { code, site: d.site.code, service };
      carriages.set(code, c);
      if (d.site.role === 'origin') continue;
      const kind = kindOf(service);
      const parent = d.parent === undefined ? undefined : carriages.get(carriageCode(d.parent, service));
      const neighbours = (related.get(d.site.code) ?? []).flatMap((other) => carriages.get(carriageCode(other, service)) ?? []);
      let tuning: Tuning;
      if (kind === 'dab') {
        tuning = dabTuning(need(region.DEMO_SERVICES.find((s) => s.code === service)?.block, `block of ${service}`));
      } else if (kind === 'dtt') {
        if (parent && (d.site.code === region.ON_CHANNEL_RELAY || code === region.CLASH_CARRIAGE)) {
          tuning = { channel: parent.channel, frequencyMHz: parent.frequencyMHz as number };
        } else {
          tuning = pickUhf(prng, new Set([...usedChannels, ...neighbours.flatMap((n) => n.channel ?? [])]));
        }
      } else {
        // Mains avoid each other's FM frequencies, so a main can take another's off air as a reserve.
        const avoid = new Set([...usedFm, ...(d.site.role === 'main' ? mainFm : []), ...neighbours.flatMap((n) => n.frequencyMHz ?? [])]);
        tuning = pickFm(prng, avoid);
        if (d.site.role === 'main') mainFm.add(tuning.frequencyMHz);
      }
      if (tuning.channel !== undefined) {
        c.channel = tuning.channel;
        usedChannels.add(tuning.channel);
      }
      c.frequencyMHz = tuning.frequencyMHz;
      usedFm.add(tuning.frequencyMHz);
      c.erpW = erp(prng, kind, d.site.role === 'main', service === 'LCL');
      c.polarisation = kind === 'dtt' ? (d.site.role === 'main' ? 'H' : prng.chance(0.75) ? 'V' : 'H') : kind === 'fm' ? (d.site.role === 'main' ? 'M' : 'V') : 'V';
      c.antennaHeightM = Math.round((d.site.mastHeightM ?? 30) * prng.between(0.6, 0.95));
      if (kind === 'dtt' && d.site.code === region.ON_CHANNEL_RELAY) c.onChannelRepeater = true;
    }
  }
  return carriages;
}

/** ERP ranges: mains tens of kW, relays watts to hundreds of W (common practice, no source). */
function erp(prng: Prng, kind: string, main: boolean, local: boolean): number {
  const [low, high] = local ? [300, 1500] : kind === 'dtt' ? (main ? [20000, 100000] : [5, 400]) : kind === 'fm' ? (main ? [10000, 80000] : [20, 1000]) : main ? [3000, 10000] : [200, 2000];
  const w = prng.logBetween(low, high);
  return w >= 1000 ? Math.round(w / 100) * 100 : Math.round(w);
}

function buildFeeds(prng: Prng, drafts: Map<string, Draft>, carriages: Map<string, Carriage>): Feed[] {
  const feeds: Feed[] = [];
  const site = (code: string) => need(drafts.get(code), `site ${code}`).site;
  const carriage = (siteCode: string, service: string) => need(carriages.get(carriageCode(siteCode, service)), `carriage ${carriageCode(siteCode, service)}`);
  const originFor = (service: string) => {
    const family = service === 'LCL' ? 'local' : kindOf(service) === 'dtt' ? 'tv' : 'radio';
    return need(region.DEMO_ORIGINS.find((o) => o[2] === family), `origin for ${service}`)[0];
  };
  const offAir = (code: string, from: Carriage, to: Carriage, role: 'main' | 'reserve') => {
    const here = site(to.site);
    const there = site(from.site);
    const path = bearingTo(here.lat, here.lon, there.lat, there.lon);
    if (path.distanceKm < OFF_AIR_MIN_KM || path.distanceKm > OFF_AIR_MAX_KM) {
      throw new Error(`demo region tables: off-air feed ${code} spans ${path.distanceKm.toFixed(1)} km, outside ${OFF_AIR_MIN_KM}-${OFF_AIR_MAX_KM} km`);
    }
    const wrong = code === region.WRONG_BEARING_FEED ? region.WRONG_BEARING_OFFSET_DEG : 0;
    return offAirFeed(code, from, to, role, normaliseDeg(path.bearingDeg + wrong), RX_ANTENNA[kindOf(to.service)]);
  };
  const byPlan = (plan: string, code: string, from: Carriage, to: Carriage, role: 'main' | 'reserve', linkMHz: number): Feed => {
    const [medium, arg] = plan.split(':');
    if (medium === 'line') return { code, from: from.code, to: to.code, medium: 'line', role, groups: [need(arg, `route of ${code}`)] };
    if (medium === 'satellite') return { code, from: from.code, to: to.code, medium: 'satellite', role, groups: [SAT], rxAntenna: 'dish 2.4 m' };
    if (medium === 'off-air') return offAir(code, carriage(need(arg, `source of ${code}`), to.service), to, role);
    const feed: Feed = { code, from: from.code, to: to.code, medium: 'microwave', role, ...(arg ? { via: [arg] } : {}), rxFrequencyMHz: linkMHz, rxAntenna: 'dish 1.8 m' };
    // Through a hop the dish points at the hop, not at the source: record a bearing only on a direct path.
    if (!arg) {
      const here = site(to.site);
      const there = site(from.site);
      feed.bearingDeg = normaliseDeg(round(bearingTo(here.lat, here.lon, there.lat, there.lon).bearingDeg, 1));
    }
    return feed;
  };

  for (const m of region.DEMO_MAINS) {
    const linkMHz = prng.int(7125, 8500);
    for (const service of region.PROFILES[m.profile]) {
      const to = carriage(m.code, service);
      const from = carriage(originFor(service), service);
      if (service === 'LCL') {
        feeds.push(byPlan('line:TEL-EAST', `${to.code}.M`, from, to, 'main', linkMHz));
        continue;
      }
      feeds.push(byPlan(m.main, `${to.code}.M`, from, to, 'main', linkMHz));
      const reserve = m.radioReserve && kindOf(service) === 'fm' ? m.radioReserve : m.reserve;
      feeds.push(byPlan(reserve, `${to.code}.R`, from, to, 'reserve', linkMHz));
    }
  }
  for (const [code, , parent, , , profile] of region.DEMO_RELAYS) {
    for (const service of region.PROFILES[profile]) {
      const to = carriage(code, service);
      if (to.code === region.UNFED_CARRIAGE) continue;
      if (kindOf(service) === 'dab') {
        // DAB runs as a single-frequency network: relays cannot take their own block off air.
        const from = carriage(originFor(service), service);
        feeds.push({ code: `${to.code}.M`, from: from.code, to: to.code, medium: 'satellite', role: 'main', groups: [SAT], rxAntenna: 'dish 1.2 m' });
        continue;
      }
      feeds.push(offAir(`${to.code}.M`, carriage(parent, service), to, 'main'));
    }
  }
  for (const [relay, source, how] of region.DEMO_RELAY_RESERVES) {
    const draft = need(drafts.get(relay), `relay ${relay}`);
    for (const service of draft.services) {
      const from = carriages.get(carriageCode(source, service));
      if (!from || kindOf(service) === 'dab') continue;
      const to = carriage(relay, service);
      feeds.push(how === 'off-air' ? offAir(`${to.code}.R`, from, to, 'reserve') : byPlan(how, `${to.code}.R`, from, to, 'reserve', 0));
    }
  }
  return feeds;
}

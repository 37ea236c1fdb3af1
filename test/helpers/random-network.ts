/**
 * Seeded random network documents for the engine's tests and benchmark.
 * Names and places are invented; coordinates are plain numbers in a box.
 *
 * - `smallRandomNetwork`: adversarial small networks (loops, via-sites that
 *   carry the service, groups on feeds and on sites, reserve feeds, several
 *   origins, unfed carriages) for comparison with the brute force.
 * - `nationalNetwork`: a broadcast-shaped network of any size (origins, main
 *   stations fed by line / satellite / microwave with reserves, relay trees
 *   fed off-air) for timing.
 */
import type { NetworkDocument, Site, Carriage, Feed, Medium } from '@/shared/schemas/network';
import { Prng } from '@/scripts/generator/prng';

/** The project's seeded generator (mulberry32, scripts/generator/prng.ts) as a plain function. */
export function prng(seed: number): () => number {
  const p = new Prng(seed);
  return () => p.next();
}

const pick = <T>(rnd: () => number, items: readonly T[]): T => items[Math.floor(rnd() * items.length)];
const MEDIA: Medium[] = ['off-air', 'satellite', 'line', 'microwave'];

export interface SmallNetworkOptions {
  seed: number;
  sites: number;
  services: number;
  groups: number;
  feeds: number;
  /** chance that a site is an origin */
  originChance: number;
  /** chance that a site carries a given service */
  carriageChance: number;
}

export function smallRandomNetwork(o: SmallNetworkOptions): NetworkDocument {
  const rnd = prng(o.seed);
  const groups = Array.from({ length: o.groups }, (_, i) => ({ code: `G${i}`, name: `Group ${i}` }));
  const someGroups = () => groups.filter(() => rnd() < 0.25).map((g) => g.code);
  const sites: Site[] = Array.from({ length: o.sites }, (_, i) => ({
    code: `S${i}`,
    name: `Site ${i}`,
    role: rnd() < o.originChance ? 'origin' : rnd() < 0.3 ? 'main' : 'relay',
    lat: 40 + rnd(),
    lon: 10 + rnd(),
    households: Math.floor(rnd() * 1000),
    groups: someGroups(),
  }));
  const services = Array.from({ length: o.services }, (_, i) => ({ code: `V${i}`, name: `Service ${i}`, kind: 'dtt' as const }));
  const carriages: Carriage[] = [];
  for (const site of sites) {
    for (const service of services) {
      if (rnd() < o.carriageChance) carriages.push({ code: `${site.code}.${service.code}`, site: site.code, service: service.code });
    }
  }
  const feeds: Feed[] = [];
  for (let i = 0; i < o.feeds && carriages.length > 1; i++) {
    const from = pick(rnd, carriages);
    const peers = carriages.filter((c) => c.service === from.service && c.site !== from.site);
    if (peers.length === 0) continue;
    const to = pick(rnd, peers);
    const via = sites.filter((s) => s.code !== from.site && s.code !== to.site && rnd() < 0.15).map((s) => s.code);
    feeds.push({
      code: `F${i}`,
      from: from.code,
      to: to.code,
      medium: pick(rnd, MEDIA),
      role: rnd() < 0.35 ? 'reserve' : 'main',
      via,
      groups: someGroups(),
    });
  }
  return { format: 'network/1', sites, services, groups, carriages, feeds };
}

export interface NationalNetworkOptions {
  sites: number;
  seed: number;
  services?: number;
}

/**
 * A broadcast-shaped network: a few origins, about 1.5 % main stations fed
 * from origins (line or microwave main via hop sites, satellite reserve), the
 * rest relays each fed off-air from an earlier site (so chains are a few to a
 * dozen levels deep), some with an off-air reserve from a second parent.
 * Power regions group sites; satellite and line feeds share transponder and
 * route groups.
 */
export function nationalNetwork(o: NationalNetworkOptions): NetworkDocument {
  const rnd = prng(o.seed);
  const serviceCount = o.services ?? 14;
  const services = Array.from({ length: serviceCount }, (_, i) => ({
    code: `SV${String(i).padStart(2, '0')}`,
    name: `Service ${i}`,
    kind: i < Math.ceil(serviceCount * 0.45) ? ('dtt' as const) : i < Math.ceil(serviceCount * 0.8) ? ('fm' as const) : ('dab' as const),
  }));
  const dtt = services.filter((s) => s.kind === 'dtt').map((s) => s.code);
  const regions = Math.max(4, Math.round(o.sites / 500));
  const groups = [
    ...Array.from({ length: regions }, (_, i) => ({ code: `PWR${i}`, name: `Power region ${i}` })),
    ...Array.from({ length: 6 }, (_, i) => ({ code: `TP${i}`, name: `Transponder ${i}` })),
    ...Array.from({ length: 24 }, (_, i) => ({ code: `RT${i}`, name: `Line route ${i}` })),
  ];
  const origins = Math.max(2, Math.round(o.sites / 4000));
  const mains = Math.max(4, Math.round(o.sites * 0.015));
  const sites: Site[] = [];
  const carried: string[][] = [];
  const carriages: Carriage[] = [];
  const feeds: Feed[] = [];
  const pad = (i: number) => String(i).padStart(6, '0');
  let feedNumber = 0;
  const addSite = (i: number, role: Site['role'], lat: number, lon: number, list: string[]) => {
    const region = Math.max(0, Math.min(regions - 1, Math.floor(((lon + 6) / 12) * regions)));
    const site: Site = {
      code: `ST${pad(i)}`,
      name: `Site ${pad(i)}`,
      role,
      lat,
      lon,
      groundHeightM: Math.round(rnd() * 400),
      mastHeightM: role === 'relay' ? 15 + Math.round(rnd() * 40) : 150 + Math.round(rnd() * 150),
      households: role === 'origin' ? 0 : role === 'main' ? 20000 + Math.floor(rnd() * 200000) : Math.floor(rnd() * 3000),
      groups: rnd() < 0.6 ? [`PWR${region}`] : [],
    };
    sites.push(site);
    carried.push(list);
    for (const s of list) carriages.push({ code: `${site.code}.${s}`, site: site.code, service: s, erpW: role === 'relay' ? 10 + rnd() * 200 : 1e5 });
  };
  const addFeed = (from: number, to: number, service: string, medium: Medium, role: Feed['role'], via: number[], fgroups: string[]) => {
    feeds.push({
      code: `FD${pad(feedNumber++)}`,
      from: `${sites[from].code}.${service}`,
      to: `${sites[to].code}.${service}`,
      medium,
      role,
      via: via.map((v) => sites[v].code),
      groups: fgroups,
    });
  };
  const all = services.map((s) => s.code);
  for (let i = 0; i < origins; i++) addSite(i, 'origin', 50 + rnd() * 8, -6 + rnd() * 12, all);
  for (let i = origins; i < origins + mains; i++) {
    addSite(i, 'main', 50 + rnd() * 8, -6 + rnd() * 12, all);
    const primary = Math.floor(rnd() * origins);
    const reserve = (primary + 1) % origins;
    const medium: Medium = rnd() < 0.5 ? 'line' : 'microwave';
    const hops = medium === 'microwave' && i > origins ? [origins + Math.floor(rnd() * (i - origins))].filter((h) => h !== i) : [];
    const route = medium === 'line' ? [`RT${Math.floor(rnd() * 24)}`] : [];
    const transponder = `TP${Math.floor(rnd() * 6)}`;
    for (const s of all) {
      addFeed(primary, i, s, medium, 'main', hops, route);
      if (rnd() < 0.8) addFeed(reserve, i, s, 'satellite', 'reserve', [], [transponder]);
    }
  }
  for (let i = origins + mains; i < o.sites; i++) {
    const parent = origins + Math.floor(rnd() * (i - origins));
    const p = sites[parent];
    const parentList = carried[parent];
    const list = parentList.filter((s) => dtt.includes(s) || rnd() < 0.45);
    addSite(i, 'relay', p.lat + (rnd() - 0.5) * 0.4, p.lon + (rnd() - 0.5) * 0.6, list.length > 0 ? list : [parentList[0]]);
    const mine = carried[i];
    const line = rnd() < 0.1;
    const route = line ? [`RT${Math.floor(rnd() * 24)}`] : [];
    const hop = !line && rnd() < 0.05 && i > origins + 1 ? [origins + Math.floor(rnd() * (i - origins))].filter((h) => h !== i && h !== parent) : [];
    for (const s of mine) addFeed(parent, i, s, line ? 'line' : 'off-air', 'main', hop, route);
    if (rnd() < 0.3) {
      const second = origins + Math.floor(rnd() * (i - origins));
      if (second !== parent) for (const s of mine) if (carried[second].includes(s)) addFeed(second, i, s, 'off-air', 'reserve', [], []);
    }
  }
  // A few data problems the analysis must report as unfed, not count: two relays feeding each other.
  if (o.sites > 10) {
    const a = o.sites - 1;
    const b = o.sites - 2;
    const shared = carried[a].find((s) => carried[b].includes(s));
    if (shared) {
      const keep = (code: string) => !(code === `${sites[a].code}.${shared}` || code === `${sites[b].code}.${shared}`);
      const cut = feeds.filter((f) => keep(f.to));
      feeds.length = 0;
      for (const f of cut) feeds.push(f);
      addFeed(a, b, shared, 'off-air', 'main', [], []);
      addFeed(b, a, shared, 'off-air', 'main', [], []);
    }
  }
  return { format: 'network/1', sites, services, groups, carriages, feeds };
}

/**
 * Seeded generator of network documents (docs/format.md)
 * with the structure of a real transmission network: a few origins, main
 * stations (about 4 % of sites), relays several hops deep, thirteen services,
 * main and reserve feeds over all four media, microwave paths through hop
 * sites, shared-risk groups, and a few loops and unfed carriages to find.
 * The same seed and size always give the same document.
 */
import { SERVICE_SPECS } from './catalogue';
import { buildCarriages } from './carriages';
import { buildFeeds } from './feeds';
import { layoutSites, planCounts } from './layout';
import { Prng } from './prng';
import { NETWORK_FORMAT, type NetworkDocument } from '@/shared/schemas/network';

export { planCounts } from './layout';

export const MAX_SITES = 1_000_000;

export interface GenerateOptions {
  /** how many sites, 1 to MAX_SITES */
  sites: number;
  /** any whole number; the same seed gives the same network */
  seed: number;
  /**
   * Share (0-1) of relay carriages fed off-air that are planted as faults:
   * they transmit on the channel they receive, undeclared. Default 0.02.
   * Every other off-air feed is inside the radio horizon, above the
   * planning minimum and clear of its own channel.
   */
  faultShare?: number;
}

export const DEFAULT_FAULT_SHARE = 0.02;

export function generateNetwork(opts: GenerateOptions): NetworkDocument {
  const { sites, seed } = opts;
  const faultShare = opts.faultShare ?? DEFAULT_FAULT_SHARE;
  if (typeof faultShare !== 'number' || !(faultShare >= 0 && faultShare <= 1)) throw new RangeError(`faultShare must be a number from 0 to 1 (got ${String(faultShare)})`);
  if (!Number.isInteger(sites) || sites < 1 || sites > MAX_SITES) {
    throw new RangeError(`sites must be a whole number from 1 to ${MAX_SITES} (got ${String(sites)})`);
  }
  if (!Number.isInteger(seed)) throw new RangeError(`seed must be a whole number (got ${String(seed)})`);
  const prng = new Prng(seed);
  const counts = planCounts(sites);
  const layout = layoutSites(prng, counts);
  const table = buildCarriages(prng, layout, faultShare);
  const { feeds, groups } = buildFeeds(prng, layout, table, counts);
  return {
    format: NETWORK_FORMAT,
    sites: layout.sites.map((d) => d.site),
    services: SERVICE_SPECS.map(({ code, name, kind }) => ({ code, name, kind })),
    groups,
    carriages: table.carriages,
    feeds,
  };
}

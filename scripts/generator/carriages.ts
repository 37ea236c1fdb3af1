/**
 * The carriages of a generated network: every service a site carries, with
 * its channel or frequency, ERP, polarisation and antenna height. A relay
 * transmits on a channel other than the one it receives from its parent,
 * except the few declared on-channel repeaters and the deliberate faults: a
 * share (`faultShare`) of relay carriages fed off-air transmit on the very
 * channel they receive, undeclared, for the checks to find.
 *
 * A transmitter's ERP is drawn from its kind's range but never below what
 * puts the planning minimum (shared/rf/minimums.ts), plus a margin, at its
 * farthest off-air receiver in free space (shared/rf/propagation.ts): the
 * same figures the field-strength check compares.
 */
import { usualCarriageCode, type Carriage, type ServiceKind } from '@/shared/schemas/network';
import { offAirFeedMinimum } from '@/shared/rf/minimums';
import { fieldStrengthFromErpDbw } from '@/shared/rf/propagation';
import { SERVICE_SPECS, dabTuning, pickFm, pickUhf, type Tuning } from './catalogue';
import { ANTENNA_SHARE, type Layout } from './layout';
import type { Prng } from './prng';

export interface CarriageTable {
  carriages: Carriage[];
  /** at[site * services + service] = carriage index, or -1 */
  at: Int32Array;
}

const SERVICE_COUNT = SERVICE_SPECS.length;
const ON_CHANNEL_SHARE = 0.015;
/** Field strength kept above the planning minimum at the farthest receiver, dB (our own planning margin). */
const FIELD_MARGIN_DB = 3;

/**
 * The ERP (W) that gives the planning minimum + FIELD_MARGIN_DB at `km` in
 * free space, as the field-strength check computes it; 0 where the kind has
 * no minimum or nothing is received.
 */
export function erpToReachW(kind: ServiceKind, frequencyMHz: number, km: number): number {
  if (!(km > 0)) return 0;
  const min = offAirFeedMinimum(kind, frequencyMHz);
  if (!min.ok) return 0;
  const fieldFrom1W = fieldStrengthFromErpDbw(0, km);
  return 10 ** ((min.minimum.valueDbUvPerM + FIELD_MARGIN_DB - fieldFrom1W) / 10);
}

export function carriageAt(table: CarriageTable, site: number, service: number): number {
  return table.at[site * SERVICE_COUNT + service];
}

export function buildCarriages(prng: Prng, layout: Layout, faultShare: number): CarriageTable {
  const carriages: Carriage[] = [];
  const at = new Int32Array(layout.sites.length * SERVICE_COUNT).fill(-1);
  // Loop relays receive from each other, not from their parent: a fault there would not show as one.
  const loopSites = new Set(layout.loopPairs.flat());
  // Faults by quota, not by chance, so their share is what was asked for (to one carriage in the
  // whole network); the random start spreads them differently for each seed.
  let faultQuota = prng.next();
  layout.sites.forEach((draft, s) => {
    const usedChannels = new Set<string>();
    const usedFrequencies = new Set<number>();
    for (const k of draft.services) {
      const spec = SERVICE_SPECS[k];
      const carriage: Carriage = { code: usualCarriageCode(draft.site.code, spec.code), site: draft.site.code, service: spec.code };
      at[s * SERVICE_COUNT + k] = carriages.length;
      carriages.push(carriage);
      // Origins are playout and uplink: programme enters there, nothing is radiated.
      if (draft.role === 'origin') continue;
      const main = draft.role === 'main';
      const parentCarriage = draft.parent >= 0 ? carriages[at[draft.parent * SERVICE_COUNT + k]] : undefined;
      let tuning: Tuning;
      let onChannel = false;
      let fault = false;
      if (parentCarriage !== undefined && spec.kind !== 'dab' && !loopSites.has(s)) {
        faultQuota += faultShare;
        fault = faultQuota >= 1;
        if (fault) faultQuota -= 1;
      }
      if (spec.kind === 'dab') {
        tuning = dabTuning(spec.block as string);
      } else if (fault && parentCarriage) {
        // A deliberate fault: on the received channel, not declared an on-channel repeater.
        tuning = { channel: parentCarriage.channel, frequencyMHz: parentCarriage.frequencyMHz as number };
      } else if (spec.kind === 'dtt') {
        if (parentCarriage?.channel !== undefined && !usedChannels.has(parentCarriage.channel) && prng.chance(ON_CHANNEL_SHARE)) {
          tuning = { channel: parentCarriage.channel, frequencyMHz: parentCarriage.frequencyMHz as number };
          onChannel = true;
        } else {
          const avoid = new Set(usedChannels);
          if (parentCarriage?.channel !== undefined) avoid.add(parentCarriage.channel);
          tuning = pickUhf(prng, avoid);
        }
      } else {
        const avoid = new Set(usedFrequencies);
        if (parentCarriage?.frequencyMHz !== undefined) avoid.add(parentCarriage.frequencyMHz);
        tuning = pickFm(prng, avoid);
      }
      if (tuning.channel !== undefined) {
        carriage.channel = tuning.channel;
        usedChannels.add(tuning.channel);
      }
      carriage.frequencyMHz = tuning.frequencyMHz;
      usedFrequencies.add(tuning.frequencyMHz);
      carriage.erpW = erpW(prng, spec.kind, main, erpToReachW(spec.kind, tuning.frequencyMHz, draft.reachKm));
      carriage.polarisation = spec.kind === 'dtt' ? (main ? 'H' : prng.chance(0.7) ? 'V' : 'H') : spec.kind === 'fm' ? (main ? 'M' : 'V') : 'V';
      const mast = draft.site.mastHeightM ?? 30;
      carriage.antennaHeightM = Math.round(mast * prng.between(ANTENNA_SHARE.low, ANTENNA_SHARE.high));
      if (onChannel) carriage.onChannelRepeater = true;
    }
  });
  return { carriages, at };
}

/**
 * ERP ranges: mains tens of kW, relays watts to hundreds of W (common
 * practice, no source); at least `floorW`, rounded up as a person would record it.
 */
function erpW(prng: Prng, kind: string, main: boolean, floorW: number): number {
  const [low, high] =
    kind === 'dtt' ? (main ? [10000, 100000] : [2, 500]) : kind === 'fm' ? (main ? [5000, 100000] : [10, 1000]) : main ? [2000, 10000] : [100, 2000];
  const w = Math.min(high, Math.max(prng.logBetween(low, high), floorW));
  return w >= 1000 ? Math.ceil(w / 100) * 100 : Math.ceil(w);
}

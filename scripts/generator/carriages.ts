/**
 * The carriages of a generated network: every service a site carries, with
 * its channel or frequency, ERP, polarisation and antenna height. A relay
 * transmits on a channel other than the one it receives from its parent,
 * except the few declared on-channel repeaters.
 */
import type { Carriage } from '@/shared/schemas/network';
import { SERVICE_SPECS, dabTuning, pickFm, pickUhf, type Tuning } from './catalogue';
import type { Layout } from './layout';
import type { Prng } from './prng';

export interface CarriageTable {
  carriages: Carriage[];
  /** at[site * services + service] = carriage index, or -1 */
  at: Int32Array;
}

const SERVICE_COUNT = SERVICE_SPECS.length;
const ON_CHANNEL_SHARE = 0.015;

export function carriageAt(table: CarriageTable, site: number, service: number): number {
  return table.at[site * SERVICE_COUNT + service];
}

export function buildCarriages(prng: Prng, layout: Layout): CarriageTable {
  const carriages: Carriage[] = [];
  const at = new Int32Array(layout.sites.length * SERVICE_COUNT).fill(-1);
  layout.sites.forEach((draft, s) => {
    const usedChannels = new Set<string>();
    const usedFrequencies = new Set<number>();
    for (const k of draft.services) {
      const spec = SERVICE_SPECS[k];
      const carriage: Carriage = { code: `${draft.site.code}.${spec.code}`, site: draft.site.code, service: spec.code };
      at[s * SERVICE_COUNT + k] = carriages.length;
      carriages.push(carriage);
      // Origins are playout and uplink: programme enters there, nothing is radiated.
      if (draft.role === 'origin') continue;
      const main = draft.role === 'main';
      const parentCarriage = draft.parent >= 0 ? carriages[at[draft.parent * SERVICE_COUNT + k]] : undefined;
      let tuning: Tuning;
      let onChannel = false;
      if (spec.kind === 'dab') {
        tuning = dabTuning(spec.block as string);
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
      carriage.erpW = erpW(prng, spec.kind, main);
      carriage.polarisation = spec.kind === 'dtt' ? (main ? 'H' : prng.chance(0.7) ? 'V' : 'H') : spec.kind === 'fm' ? (main ? 'M' : 'V') : 'V';
      const mast = draft.site.mastHeightM ?? 30;
      carriage.antennaHeightM = Math.round(mast * prng.between(0.6, 0.95));
      if (onChannel) carriage.onChannelRepeater = true;
    }
  });
  return { carriages, at };
}

/** ERP ranges: mains tens of kW, relays watts to hundreds of W (common practice, no source). */
function erpW(prng: Prng, kind: string, main: boolean): number {
  const [low, high] =
    kind === 'dtt' ? (main ? [10000, 100000] : [2, 500]) : kind === 'fm' ? (main ? [5000, 100000] : [10, 1000]) : main ? [2000, 10000] : [100, 2000];
  const w = prng.logBetween(low, high);
  return w >= 1000 ? Math.round(w / 100) * 100 : Math.round(w);
}

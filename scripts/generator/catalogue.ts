/**
 * The services a generated network carries and how their channels are
 * picked: TV multiplexes on UHF channels, FM programmes on the 100 kHz
 * raster, DAB ensembles on Band III blocks (shared/rf/bands.ts), one local
 * service. Names and assignments are invented.
 */
import { dabBlock, uhfChannel } from '@/shared/rf/bands';
import type { Service } from '@/shared/schemas/network';
import type { Prng } from './prng';

/** Which origin a service comes from: the TV playout, the radio playout, or a local studio. */
export type Family = 'tv' | 'radio' | 'local';

export interface ServiceSpec extends Service {
  family: Family;
  /** DAB ensembles run as single-frequency networks: every site on one block */
  block?: string;
}

export const SERVICE_SPECS: readonly ServiceSpec[] = [
  { code: 'MUX1', name: 'Multiplex 1', kind: 'dtt', family: 'tv' },
  { code: 'MUX2', name: 'Multiplex 2', kind: 'dtt', family: 'tv' },
  { code: 'MUX3', name: 'Multiplex 3', kind: 'dtt', family: 'tv' },
  { code: 'MUX4', name: 'Multiplex 4', kind: 'dtt', family: 'tv' },
  { code: 'MUX5', name: 'Multiplex 5', kind: 'dtt', family: 'tv' },
  { code: 'MUX6', name: 'Multiplex 6', kind: 'dtt', family: 'tv' },
  { code: 'FM1', name: 'Corran Air', kind: 'fm', family: 'radio' },
  { code: 'FM2', name: 'Vellow Sound', kind: 'fm', family: 'radio' },
  { code: 'FM3', name: 'Quietmark', kind: 'fm', family: 'radio' },
  { code: 'FM4', name: 'Talk and Traffic', kind: 'fm', family: 'radio' },
  { code: 'DAB1', name: 'Ensemble Kestle', kind: 'dab', family: 'radio', block: '8A' },
  { code: 'DAB2', name: 'Ensemble Morrow', kind: 'dab', family: 'radio', block: '10C' },
  { code: 'LOCAL', name: 'Community Radio', kind: 'fm', family: 'local' },
];

/** UHF channels the generator assigns (21-48: common practice after the 700 MHz clearance, no source). */
const UHF_LOW = 21;
const UHF_HIGH = 48;
/** FM carriers 87.6-107.9 MHz on the 100 kHz raster, in tenths of a MHz. */
const FM_LOW = 876;
const FM_HIGH = 1079;

export interface Tuning {
  channel?: string;
  frequencyMHz: number;
}

/** A UHF channel that is none of `avoid` (channel numbers as text). */
export function pickUhf(prng: Prng, avoid: ReadonlySet<string>): Tuning {
  for (;;) {
    const n = prng.int(UHF_LOW, UHF_HIGH);
    if (!avoid.has(String(n))) return { channel: String(n), frequencyMHz: uhfChannel(n).centreMHz };
  }
}

/** An FM frequency on the raster that is none of `avoid` (frequencies in MHz). */
export function pickFm(prng: Prng, avoid: ReadonlySet<number>): Tuning {
  for (;;) {
    const f = prng.int(FM_LOW, FM_HIGH) / 10;
    if (!avoid.has(f)) return { frequencyMHz: f };
  }
}

export function dabTuning(block: string): Tuning {
  return { channel: block, frequencyMHz: dabBlock(block).centreMHz };
}

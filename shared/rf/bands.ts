/**
 * Channel <-> centre frequency for the broadcast bands in use (docs/checks.md, "Channels and frequencies").
 * - UHF TV, Europe, Bands IV/V: channels 21-69, 8 MHz, fc = 306 + 8N MHz [S: TSDuck band file,
 *   French CSA rule "306 + 8n"].
 * - VHF Band III TV: channels 5-12, 7 MHz, fc = 177.5 + 7(N - 5) MHz [S: TSDuck].
 * - T-DAB Band III: blocks 5A-13F from the published table in dabBlocks.ts [S].
 * - FM Band II: 87.5-108 MHz (GE84 title [C]) on a 100 kHz raster. The raster value is
 *   recalled from memory, unconfirmed [M].
 */
import type { ServiceKind } from '../schemas/network';
import { DAB_BLOCKS, DAB_BLOCK_WIDTH_MHZ } from './dabBlocks';
import { serviceKindWord } from '../words';

export type Band = 'vhf-tv' | 'uhf-tv' | 'dab' | 'fm';
export const BANDS: readonly Band[] = ['vhf-tv', 'uhf-tv', 'dab', 'fm'];

export interface ChannelInfo {
  band: Band;
  /** Canonical label: "39", "7", "12B", "97.3". */
  label: string;
  centreMHz: number;
  widthMHz: number;
  lowerMHz: number;
  upperMHz: number;
}

export const UHF_FIRST = 21;
export const UHF_LAST = 69;
export const UHF_WIDTH_MHZ = 8;
export const VHF_FIRST = 5;
export const VHF_LAST = 12;
export const VHF_WIDTH_MHZ = 7;
export const FM_LOWER_MHZ = 87.5;
export const FM_UPPER_MHZ = 108;
/** [M] recalled from memory, unconfirmed: Region 1 carriers on a 100 kHz raster (docs/checks.md, "Channels and frequencies"). */
export const FM_RASTER_MHZ = 0.1;

/** Bands a service kind may use; AM and "other" have no channel plan here. */
export const BANDS_BY_KIND: Readonly<Record<ServiceKind, readonly Band[]>> = {
  dtt: ['vhf-tv', 'uhf-tv'],
  dab: ['dab'],
  fm: ['fm'],
  am: [],
  other: [],
};

// Frequencies in the tables are exact to 1 kHz, so integer kHz avoids edge rounding.
const kHz = (mhz: number) => Math.round(mhz * 1000);

function info(band: Band, label: string, centreMHz: number, widthMHz: number): ChannelInfo {
  return { band, label, centreMHz, widthMHz, lowerMHz: (kHz(centreMHz) - kHz(widthMHz) / 2) / 1000, upperMHz: (kHz(centreMHz) + kHz(widthMHz) / 2) / 1000 };
}

export function uhfChannel(n: number): ChannelInfo {
  if (!Number.isInteger(n) || n < UHF_FIRST || n > UHF_LAST) throw new RangeError(`UHF TV channel must be a whole number ${UHF_FIRST}-${UHF_LAST} (got ${n})`);
  return info('uhf-tv', String(n), 306 + 8 * n, UHF_WIDTH_MHZ);
}

export function vhfChannel(n: number): ChannelInfo {
  if (!Number.isInteger(n) || n < VHF_FIRST || n > VHF_LAST) throw new RangeError(`VHF Band III TV channel must be a whole number ${VHF_FIRST}-${VHF_LAST} (got ${n})`);
  return info('vhf-tv', String(n), 177.5 + 7 * (n - 5), VHF_WIDTH_MHZ);
}

export function dabBlock(label: string): ChannelInfo {
  const key = label.trim().toUpperCase();
  const centre = DAB_BLOCKS[key];
  if (centre === undefined) throw new RangeError(`"${label}" is not a Band III DAB block (5A-13F, 10N-12N)`);
  return info('dab', key, centre, DAB_BLOCK_WIDTH_MHZ);
}

export function fmChannel(frequencyMHz: number): ChannelInfo {
  if (!Number.isFinite(frequencyMHz) || frequencyMHz < FM_LOWER_MHZ || frequencyMHz > FM_UPPER_MHZ) {
    throw new RangeError(`FM frequency must be ${FM_LOWER_MHZ}-${FM_UPPER_MHZ} MHz (got ${frequencyMHz})`);
  }
  const steps = kHz(frequencyMHz) / kHz(FM_RASTER_MHZ);
  if (!Number.isInteger(steps)) throw new RangeError(`FM frequency ${frequencyMHz} MHz is not on the ${FM_RASTER_MHZ * 1000} kHz raster`);
  const centre = (steps * kHz(FM_RASTER_MHZ)) / 1000;
  return info('fm', centre.toFixed(1), centre, FM_RASTER_MHZ);
}

const TV_LABEL = /^(?:CH\.?|C|K)?\s*(\d{1,2})$/;
const DAB_LABEL = /^(?:CH\.?|C|K)?\s*(\d{1,2}[A-FN])$/;
const FM_LABEL = /^(\d{2,3}(?:\.\d{1,3})?)\s*(?:MHZ)?$/;

/**
 * Reads a channel label: "39", "C39", "CH 39" (TV), "12B", "5A" (DAB), "97.3" or "97.3 MHz" (FM).
 * `kind` narrows the bands tried (dtt: TV channels, dab: blocks, fm: frequencies).
 * Returns null when the label is not a channel of those bands.
 */
export function tryParseChannel(label: string, kind?: ServiceKind): ChannelInfo | null {
  if (typeof label !== 'string') return null;
  const text = label.trim().toUpperCase();
  const bands = kind ? BANDS_BY_KIND[kind] : BANDS;
  const tv = TV_LABEL.exec(text);
  if (tv) {
    const n = Number(tv[1]);
    if (bands.includes('uhf-tv') && n >= UHF_FIRST && n <= UHF_LAST) return uhfChannel(n);
    if (bands.includes('vhf-tv') && n >= VHF_FIRST && n <= VHF_LAST) return vhfChannel(n);
  }
  const dab = DAB_LABEL.exec(text);
  if (dab && bands.includes('dab') && DAB_BLOCKS[dab[1]] !== undefined) return dabBlock(dab[1]);
  const fm = FM_LABEL.exec(text);
  if (fm && bands.includes('fm')) {
    const f = Number(fm[1]);
    if (f >= FM_LOWER_MHZ && f <= FM_UPPER_MHZ && Number.isInteger(kHz(f) / kHz(FM_RASTER_MHZ))) return fmChannel(f);
  }
  return null;
}

/** As tryParseChannel, but throws an error naming the label when it is not a known channel. */
export function parseChannel(label: string, kind?: ServiceKind): ChannelInfo {
  const found = tryParseChannel(label, kind);
  if (!found) {
    const where = kind ? ` for a ${serviceKindWord(kind)} service` : '';
    throw new RangeError(`"${label}" is not a known channel${where} (UHF 21-69, VHF 5-12, DAB 5A-13F, FM 87.5-108 MHz)`);
  }
  return found;
}

/** Centre frequency of a channel label, MHz. */
export function channelToFrequencyMHz(label: string, kind?: ServiceKind): number {
  return parseChannel(label, kind).centreMHz;
}

function within(c: ChannelInfo, f: number): boolean {
  // Half-open [lower, upper) so that a shared edge belongs to one channel only.
  return kHz(f) >= kHz(c.lowerMHz) && kHz(f) < kHz(c.upperMHz);
}

/** Each band's channel list, built once: a frequency look-up is on the hot path of proposals and feed checks. */
const CHANNELS = new Map<Band, readonly ChannelInfo[]>();

function candidates(band: Band): readonly ChannelInfo[] {
  let list = CHANNELS.get(band);
  if (!list) CHANNELS.set(band, (list = channelList(band)));
  return list;
}

function channelList(band: Band): ChannelInfo[] {
  switch (band) {
    case 'uhf-tv':
      return Array.from({ length: UHF_LAST - UHF_FIRST + 1 }, (_, i) => uhfChannel(UHF_FIRST + i));
    case 'vhf-tv':
      return Array.from({ length: VHF_LAST - VHF_FIRST + 1 }, (_, i) => vhfChannel(VHF_FIRST + i));
    case 'dab':
      return Object.keys(DAB_BLOCKS).map(dabBlock);
    case 'fm':
      return [];
  }
}

/**
 * The channel of `band` whose bandwidth holds `frequencyMHz`, or null. Where two DAB blocks
 * overlap (10A and 10N), the nearer centre wins. FM answers the nearest raster point.
 */
export function frequencyToChannel(frequencyMHz: number, band: Band): ChannelInfo | null {
  if (typeof frequencyMHz !== 'number' || !Number.isFinite(frequencyMHz) || frequencyMHz <= 0) {
    throw new RangeError(`frequency must be a finite number of MHz above 0 (got ${String(frequencyMHz)})`);
  }
  if (band === 'fm') {
    const raster = kHz(FM_RASTER_MHZ);
    const nearest = (Math.round(kHz(frequencyMHz) / raster) * raster) / 1000;
    if (nearest < FM_LOWER_MHZ || nearest > FM_UPPER_MHZ) return null;
    return fmChannel(nearest);
  }
  const hits = candidates(band).filter((c) => within(c, frequencyMHz));
  hits.sort((a, b) => Math.abs(a.centreMHz - frequencyMHz) - Math.abs(b.centreMHz - frequencyMHz));
  // A copy: callers get their own record, as before the lists were kept.
  return hits[0] ? { ...hits[0] } : null;
}

/** Every channel, in any of the given bands, whose bandwidth holds the frequency. */
export function channelsAt(frequencyMHz: number, bands: readonly Band[] = BANDS): ChannelInfo[] {
  return bands.map((b) => frequencyToChannel(frequencyMHz, b)).filter((c): c is ChannelInfo => c !== null);
}

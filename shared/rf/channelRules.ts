/**
 * Which channels and frequencies a service kind may use, from the same band
 * tables the feed checks read (./bands.ts). The carriage and feed forms and
 * the inventory API both ask here, so the form refuses a channel with the
 * same words the server would. AM and "other" services have no channel plan
 * here, so nothing is refused for them.
 */
import type { ServiceKind } from '../schemas/network';
import { BANDS_BY_KIND, dabBlock, FM_LOWER_MHZ, FM_UPPER_MHZ, tryParseChannel, uhfChannel, UHF_FIRST, UHF_LAST, vhfChannel, VHF_FIRST, VHF_LAST, type Band, type ChannelInfo } from './bands';
import { DAB_BLOCKS } from './dabBlocks';

/** The channels of each band, said the way an engineer writes them. */
const CHANNEL_WORDS: Record<Band, string> = {
  'uhf-tv': `UHF channels ${UHF_FIRST}-${UHF_LAST}`,
  'vhf-tv': `VHF channels ${VHF_FIRST}-${VHF_LAST}`,
  dab: 'DAB blocks 5A-13F (or 10N-12N)',
  fm: `FM ${FM_LOWER_MHZ}-${FM_UPPER_MHZ} MHz on a 100 kHz step`,
};

const dabEdges = () => {
  const blocks = Object.keys(DAB_BLOCKS).map(dabBlock);
  return { lower: Math.min(...blocks.map((b) => b.lowerMHz)), upper: Math.max(...blocks.map((b) => b.upperMHz)) };
};

/** Lower and upper frequency edge of each band, MHz (lower edge of the first channel, upper edge of the last). */
export function bandEdgesMHz(band: Band): { lower: number; upper: number } {
  switch (band) {
    case 'uhf-tv':
      return { lower: uhfChannel(UHF_FIRST).lowerMHz, upper: uhfChannel(UHF_LAST).upperMHz };
    case 'vhf-tv':
      return { lower: vhfChannel(VHF_FIRST).lowerMHz, upper: vhfChannel(VHF_LAST).upperMHz };
    case 'dab':
      return dabEdges();
    case 'fm':
      return { lower: FM_LOWER_MHZ, upper: FM_UPPER_MHZ };
  }
}

/** True when the kind has a channel plan here (dtt, dab, fm). */
export const hasChannelPlan = (kind: ServiceKind) => BANDS_BY_KIND[kind].length > 0;

/** "UHF channels 21-69 or VHF channels 5-12" for dtt; "" for a kind with no plan. */
export function allowedChannelsText(kind: ServiceKind): string {
  return BANDS_BY_KIND[kind].map((b) => CHANNEL_WORDS[b]).join(' or ');
}

/** "470-862 MHz or 174-230 MHz" for dtt; "" for a kind with no plan. */
export function allowedFrequenciesText(kind: ServiceKind): string {
  return BANDS_BY_KIND[kind]
    .map((b) => bandEdgesMHz(b))
    .sort((a, b) => a.lower - b.lower)
    .map((e) => `${e.lower}-${e.upper} MHz`)
    .join(' or ');
}

const KIND_WORDS: Record<ServiceKind, string> = { dtt: 'a digital TV', fm: 'an FM', dab: 'a DAB', am: 'an AM', other: 'this' };

export type ChannelCheck = { ok: true; channel: ChannelInfo | null } | { ok: false; message: string };

/** A channel label for a service of this kind: its channel (and so its centre frequency), or why not. */
export function checkChannel(kind: ServiceKind, label: string | undefined | null): ChannelCheck {
  if (label === undefined || label === null || label.trim() === '' || !hasChannelPlan(kind)) return { ok: true, channel: null };
  const found = tryParseChannel(label, kind);
  if (found) return { ok: true, channel: found };
  return { ok: false, message: `channel ${label.trim()} is not one ${KIND_WORDS[kind]} service can use: ${allowedChannelsText(kind)}` };
}

/** A frequency for a service of this kind: null when it lies in one of its bands, else why not. */
export function frequencyProblem(kind: ServiceKind, frequencyMHz: number | undefined | null): string | null {
  if (frequencyMHz === undefined || frequencyMHz === null || !Number.isFinite(frequencyMHz) || !hasChannelPlan(kind)) return null;
  const inside = BANDS_BY_KIND[kind].some((b) => {
    const e = bandEdgesMHz(b);
    return frequencyMHz >= e.lower && frequencyMHz <= e.upper;
  });
  return inside ? null : `frequency ${frequencyMHz} MHz is outside what ${KIND_WORDS[kind]} service uses: ${allowedFrequenciesText(kind)}`;
}

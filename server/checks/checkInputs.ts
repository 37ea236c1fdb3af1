/**
 * Reading the inputs of the feed checks: receive and transmit frequency, antenna heights.
 * Each reader answers a value or the exact fields that are missing, so a check is reported
 * as "not computed: <field> missing on <entity>" and never computed from a stand-in 0.
 */
import type { Carriage, Feed, ServiceKind, Site } from '@/shared/schemas/network';
import { BANDS_BY_KIND, frequencyToChannel, tryParseChannel, type ChannelInfo } from '@/shared/rf/bands';
import { serviceKindWord } from '@/shared/words';

export type Read<T> = { ok: true; value: T; how: string } | { ok: false; missing: string };

export interface FrequencyRead {
  mhz: number;
  /** The channel of the service's bands that holds the frequency, when there is one. */
  channel: ChannelInfo | null;
}

function channelAt(mhz: number, kind: ServiceKind): ChannelInfo | null {
  for (const band of BANDS_BY_KIND[kind]) {
    const c = frequencyToChannel(mhz, band);
    if (c) return c;
  }
  return null;
}

function fromLabel(label: string, kind: ServiceKind, where: string): Read<FrequencyRead> {
  const c = tryParseChannel(label, kind);
  if (!c) return { ok: false, missing: `channel "${label}" on ${where} is not a known ${serviceKindWord(kind)} channel` };
  return { ok: true, value: { mhz: c.centreMHz, channel: c }, how: `channel ${c.label} on ${where}` };
}

/**
 * Receive frequency (docs/checks.md): the feed's rxFrequencyMHz, else its
 * rxChannel's frequency, else the parent carriage's frequencyMHz, else its channel's frequency.
 * A channel label that is present but unknown stops the search: falling through to the parent
 * would silently use a frequency the record contradicts.
 */
export function receiveFrequency(feed: Feed, source: Carriage, kind: ServiceKind): Read<FrequencyRead> {
  if (feed.rxFrequencyMHz !== undefined) {
    return { ok: true, value: { mhz: feed.rxFrequencyMHz, channel: channelAt(feed.rxFrequencyMHz, kind) }, how: `receive frequency of feed ${feed.code}` };
  }
  if (feed.rxChannel !== undefined) return fromLabel(feed.rxChannel, kind, `feed ${feed.code}`);
  if (source.frequencyMHz !== undefined) {
    return { ok: true, value: { mhz: source.frequencyMHz, channel: channelAt(source.frequencyMHz, kind) }, how: `frequency of source carriage ${source.code}` };
  }
  if (source.channel !== undefined) return fromLabel(source.channel, kind, `source carriage ${source.code}`);
  return { ok: false, missing: `receive frequency missing (receive frequency and receive channel of feed ${feed.code}, frequency and channel of carriage ${source.code})` };
}

/** Transmit frequency of a carriage: frequencyMHz, else its channel's frequency. */
export function transmitFrequency(carriage: Carriage, kind: ServiceKind): Read<FrequencyRead> {
  if (carriage.frequencyMHz !== undefined) {
    return { ok: true, value: { mhz: carriage.frequencyMHz, channel: channelAt(carriage.frequencyMHz, kind) }, how: `frequency of carriage ${carriage.code}` };
  }
  if (carriage.channel !== undefined) return fromLabel(carriage.channel, kind, `carriage ${carriage.code}`);
  return { ok: false, missing: `transmit frequency missing (frequency and channel of carriage ${carriage.code})` };
}

/**
 * Antenna height above sea level at one end: ground height + antenna height, else + mast
 * height (docs/checks.md). The carriage's antenna is taken as the
 * antenna at that end of the feed; there is no separate receive-antenna height field.
 */
export function antennaHeightAsl(site: Site, carriage: Carriage): Read<number> {
  const missing: string[] = [];
  if (site.groundHeightM === undefined) missing.push(`ground height missing on site ${site.code}`);
  const above = carriage.antennaHeightM ?? site.mastHeightM;
  if (above === undefined) missing.push(`antenna height missing on carriage ${carriage.code} and mast height missing on site ${site.code}`);
  if (missing.length > 0 || site.groundHeightM === undefined || above === undefined) return { ok: false, missing: missing.join('; ') };
  const which = carriage.antennaHeightM !== undefined ? `antenna ${above} m (carriage ${carriage.code})` : `mast ${above} m (site ${site.code})`;
  return { ok: true, value: site.groundHeightM + above, how: `ground ${site.groundHeightM} m + ${which}` };
}

/** Joins the missing-field reasons of several reads into one "not computed" note. */
export function notComputed(...reads: Read<unknown>[]): string | null {
  const missing = reads.filter((r): r is { ok: false; missing: string } => !r.ok).map((r) => r.missing);
  return missing.length > 0 ? `not computed: ${missing.join('; ')}` : null;
}

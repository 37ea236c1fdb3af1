/**
 * The engineer's calculator: typed text in, figures out, errors as sentences. All maths is
 * the shared RF library's (shared/rf), so the calculator and the server's feed checks agree.
 */
import { dabBlock, fmChannel, frequencyToChannel, uhfChannel, vhfChannel, FM_LOWER_MHZ, FM_UPPER_MHZ, UHF_FIRST, UHF_LAST, VHF_FIRST, VHF_LAST, type Band, type ChannelInfo } from '@/shared/rf/bands';
import { geodesicInverse } from '@/shared/rf/geodesy';
import { earthBulgeM, fieldStrengthFromEirpDbw, fieldStrengthFromErpDbw, freeSpaceLossDb, fresnelRadiusM, powerFluxDensityDbw, radioHorizonKm } from '@/shared/rf/propagation';
import { DIPOLE_GAIN_DBI } from '@/shared/rf/units';
import { fixed, formatFigure } from '@/shared/format';
import { parseCoordinate, parseNumber, parsePowerDbw, type Parsed, type PowerReference, type PowerUnit } from './input';

export const BAND_CHOICES: readonly { value: Band; label: string; channelHint: string }[] = [
  { value: 'uhf-tv', label: 'UHF TV', channelHint: `Channel ${UHF_FIRST}-${UHF_LAST}, e.g. 39` },
  { value: 'vhf-tv', label: 'VHF Band III TV', channelHint: `Channel ${VHF_FIRST}-${VHF_LAST}, e.g. 7` },
  { value: 'dab', label: 'DAB Band III', channelHint: 'Block 5A-13F, e.g. 12B' },
  { value: 'fm', label: 'FM Band II', channelHint: `FM is named by frequency: ${FM_LOWER_MHZ}-${FM_UPPER_MHZ} MHz, e.g. 97.3` },
];

export function bandLabel(band: Band): string {
  return BAND_CHOICES.find((b) => b.value === band)?.label ?? band;
}

function attempt(fn: () => ChannelInfo): Parsed<ChannelInfo> {
  try {
    return { ok: true, value: fn() };
  } catch (e) {
    return { ok: false, error: e instanceof Error ? e.message : String(e) };
  }
}

/** A channel (TV), block (DAB) or frequency (FM) of `band` to its centre and edges. */
export function channelOf(band: Band, text: string): Parsed<ChannelInfo> {
  const t = text.trim().replace(/^(ch(annel)?|block)\.?\s*/i, '');
  switch (band) {
    case 'uhf-tv': {
      const n = parseNumber(t, { label: 'Channel', min: UHF_FIRST, max: UHF_LAST, integer: true });
      return n.ok ? attempt(() => uhfChannel(n.value)) : { ok: false, error: `${n.error}; UHF TV channels are ${UHF_FIRST}-${UHF_LAST}` };
    }
    case 'vhf-tv': {
      const n = parseNumber(t, { label: 'Channel', min: VHF_FIRST, max: VHF_LAST, integer: true });
      return n.ok ? attempt(() => vhfChannel(n.value)) : { ok: false, error: `${n.error}; VHF Band III TV channels are ${VHF_FIRST}-${VHF_LAST}` };
    }
    case 'dab':
      if (t === '') return { ok: false, error: 'Channel is empty: enter a DAB block, e.g. 12B' };
      return attempt(() => dabBlock(t));
    case 'fm': {
      const f = parseNumber(t.replace(/\s*mhz$/i, ''), { label: 'Channel', unit: 'MHz', min: FM_LOWER_MHZ, max: FM_UPPER_MHZ });
      return f.ok ? attempt(() => fmChannel(f.value)) : f;
    }
  }
}

/** The channel of `band` whose bandwidth holds the frequency typed in MHz. */
export function channelAt(band: Band, text: string): Parsed<ChannelInfo> {
  const f = parseNumber(text.replace(/\s*mhz$/i, ''), { label: 'Frequency', unit: 'MHz', min: 0, minExclusive: true });
  if (!f.ok) return f;
  const found = frequencyToChannel(f.value, band);
  if (!found) return { ok: false, error: `${f.value} MHz is not in any ${bandLabel(band)} channel` };
  return { ok: true, value: found };
}

export interface Position {
  lat: number;
  lon: number;
}

export interface PathFigures {
  distanceKm: number;
  /** Initial bearing at A towards B, deg from true north. */
  bearingAtoBDeg: number;
  /** Initial bearing at B towards A: where an antenna at B points. */
  bearingBtoADeg: number;
}

/** Ellipsoidal distance and both initial bearings (WGS84, GeographicLib via shared/rf/geodesy). */
export function pathBetween(a: Position, b: Position): PathFigures {
  const ab = geodesicInverse(a.lat, a.lon, b.lat, b.lon);
  const ba = geodesicInverse(b.lat, b.lon, a.lat, a.lon);
  return { distanceKm: ab.distanceKm, bearingAtoBDeg: ab.initialBearingDeg, bearingBtoADeg: ba.initialBearingDeg };
}

export interface PositionText {
  lat: string;
  lon: string;
}

export type FieldErrors<K extends string> = Partial<Record<K, string>>;

export function readPosition(text: PositionText, name: string): { position: Position | null; errors: FieldErrors<'lat' | 'lon'> } {
  const lat = parseCoordinate(text.lat, 'lat', `Latitude of ${name}`);
  const lon = parseCoordinate(text.lon, 'lon', `Longitude of ${name}`);
  const errors: FieldErrors<'lat' | 'lon'> = {};
  if (!lat.ok) errors.lat = lat.error;
  if (!lon.ok) errors.lon = lon.error;
  return { position: lat.ok && lon.ok ? { lat: lat.value, lon: lon.value } : null, errors };
}

export interface LinkText {
  frequencyMHz: string;
  distanceKm: string;
  power: string;
  powerUnit: PowerUnit;
  reference: PowerReference;
}

export interface LinkFigures {
  lossDb: number;
  fieldDbUvPerM: number;
  erpDbw: number;
  eirpDbw: number;
  pfdDbWPerM2: number;
}

/**
 * Free-space loss (ITU-R P.525 section 2.2), field strength from e.r.p. (P.1546 Annex 5
 * eq. (2)) or e.i.r.p. (P.525 section 2.1), and the other power reference (BS.561: 2.15 dB).
 */
export function linkFigures(text: LinkText): { figures: LinkFigures | null; errors: FieldErrors<'frequencyMHz' | 'distanceKm' | 'power'> } {
  const f = parseNumber(text.frequencyMHz, { label: 'Frequency', unit: 'MHz', min: 0, minExclusive: true, max: 300_000 });
  const d = parseNumber(text.distanceKm, { label: 'Distance', unit: 'km', min: 0, minExclusive: true, max: 20_040 });
  const p = parsePowerDbw(text.power, text.powerUnit, 'Power');
  const errors: FieldErrors<'frequencyMHz' | 'distanceKm' | 'power'> = {};
  if (!f.ok) errors.frequencyMHz = f.error;
  if (!d.ok) errors.distanceKm = d.error;
  if (!p.ok) errors.power = p.error;
  if (!f.ok || !d.ok || !p.ok) return { figures: null, errors };
  const erpDbw = text.reference === 'erp' ? p.value : p.value - DIPOLE_GAIN_DBI;
  const eirpDbw = text.reference === 'eirp' ? p.value : p.value + DIPOLE_GAIN_DBI;
  const fieldDbUvPerM = text.reference === 'erp' ? fieldStrengthFromErpDbw(p.value, d.value) : fieldStrengthFromEirpDbw(p.value, d.value);
  return {
    figures: { lossDb: freeSpaceLossDb(f.value, d.value), fieldDbUvPerM, erpDbw, eirpDbw, pfdDbWPerM2: powerFluxDensityDbw(fieldDbUvPerM) },
    errors,
  };
}

export interface HorizonText {
  height1M: string;
  height2M: string;
  distanceKm: string;
  frequencyMHz: string;
}

export interface HorizonFigures {
  horizon1Km: number;
  horizon2Km: number;
  /** Line-of-sight limit between the two antennas, k = 4/3. */
  pathHorizonKm: number;
  /** Present when a distance was given. */
  midPath: { distanceKm: number; withinHorizon: boolean; earthBulgeM: number; fresnelF1M: number | null } | null;
}

/**
 * Radio horizon (sqrt(2 ae h), k = 4/3), and at mid-path earth bulge (d1 d2 / 2 ae) and F1
 * (ITU-R P.530 eq. (2)). Heights are above the smooth earth the formulas assume. Distance
 * and frequency are optional: left empty, their figures are simply not shown.
 */
export function horizonFigures(text: HorizonText): { figures: HorizonFigures | null; errors: FieldErrors<keyof HorizonText> } {
  const h1 = parseNumber(text.height1M, { label: 'Height of antenna 1', unit: 'm', min: 0, max: 10_000 });
  const h2 = parseNumber(text.height2M, { label: 'Height of antenna 2', unit: 'm', min: 0, max: 10_000 });
  const d = text.distanceKm.trim() === '' ? null : parseNumber(text.distanceKm, { label: 'Path length', unit: 'km', min: 0, minExclusive: true, max: 20_040 });
  const f = text.frequencyMHz.trim() === '' ? null : parseNumber(text.frequencyMHz, { label: 'Frequency', unit: 'MHz', min: 0, minExclusive: true, max: 300_000 });
  const errors: FieldErrors<keyof HorizonText> = {};
  if (!h1.ok) errors.height1M = h1.error;
  if (!h2.ok) errors.height2M = h2.error;
  if (d && !d.ok) errors.distanceKm = d.error;
  if (f && !f.ok) errors.frequencyMHz = f.error;
  if (!h1.ok || !h2.ok || (d && !d.ok) || (f && !f.ok)) return { figures: null, errors };
  const horizon1Km = radioHorizonKm(h1.value);
  const horizon2Km = radioHorizonKm(h2.value);
  const total = horizon1Km + horizon2Km;
  let midPath: HorizonFigures['midPath'] = null;
  if (d && d.ok) {
    const half = d.value / 2;
    midPath = {
      distanceKm: d.value,
      withinHorizon: d.value <= total,
      earthBulgeM: earthBulgeM(half, half),
      fresnelF1M: f && f.ok ? fresnelRadiusM(f.value / 1000, half, half) : null,
    };
  }
  return { figures: { horizon1Km, horizon2Km, pathHorizonKm: total, midPath }, errors };
}

/**
 * A channel in words: "Channel 39, UHF TV: centre 618.0 MHz, 614.0-622.0 MHz (8.0 MHz wide)".
 * FM has no channel edges in the plan, only carriers on a raster, so none are claimed.
 */
export function channelWords(c: ChannelInfo): string {
  const centre = formatFigure(c.centreMHz, 'MHz');
  switch (c.band) {
    case 'fm':
      return `${centre}, FM Band II: a carrier on the ${fixed(c.widthMHz * 1000, 0)} kHz raster (raster value not checked against the published text)`;
    case 'dab':
      return `Block ${c.label}, DAB Band III: centre ${centre}, ${fixed(c.lowerMHz, 3)}-${formatFigure(c.upperMHz, 'MHz')} (${formatFigure(c.widthMHz, 'MHz')} wide)`;
    default:
      return `Channel ${c.label}, ${bandLabel(c.band)}: centre ${centre}, ${fixed(c.lowerMHz, 1)}-${formatFigure(c.upperMHz, 'MHz')} (${formatFigure(c.widthMHz, 'MHz')} wide)`;
  }
}

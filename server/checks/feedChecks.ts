/**
 * Engineering screening of one feed (docs/domain.md "What the engineer also screens, per feed",
 * docs/checks.md). Pure: plain records in, the answer out; no database.
 * These are screening checks over free space and a smooth earth, not a coverage prediction.
 */
import type { Carriage, Feed, ServiceKind, Site } from '@/shared/schemas/network';
import { CONFIDENCE_WORDS, type CheckName, type Confidence, type FeedCheck, type FeedChecksAnswer } from '@/shared/schemas/checks';
import { bearingDifferenceDeg, geodesicInverse, normaliseDeg } from '@/shared/rf/geodesy';
import { wattsToDbw } from '@/shared/rf/units';
import { erpText } from '@/shared/format';
import { earthBulgeM, fieldStrengthFromErpDbw, freeSpaceLossDb, fresnelRadiusM, midPathClearance, pathHorizonKm } from '@/shared/rf/propagation';
import { offAirFeedMinimum } from '@/shared/rf/minimums';
import { antennaHeightAsl, notComputed, receiveFrequency, transmitFrequency, type FrequencyRead, type Read } from './checkInputs';
import { failureSentence } from './warnings';

export interface FeedCheckInput {
  feed: Feed;
  /** The parent carriage (feed.from). */
  source: Carriage;
  /** The receiving carriage (feed.to). */
  target: Carriage;
  sourceSite: Site;
  targetSite: Site;
  serviceKind: ServiceKind;
}

/** Largest difference between recorded and computed bearing that passes, deg (docs/checks.md). */
export const BEARING_TOLERANCE_DEG = 5;
/** Below this the two ends are treated as one position: no path to screen. */
const SAME_POSITION_KM = 0.001;

const round = (v: number, places: number) => {
  const f = 10 ** places;
  const r = Math.round(v * f) / f;
  return r === 0 ? 0 : r;
};
const fmt = (v: number, places = 2) => v.toFixed(places);

type Ctx = {
  input: FeedCheckInput;
  distanceKm: number;
  bearingDeg: number;
  rx: Read<FrequencyRead>;
  samePosition: boolean;
};

function check(name: CheckName, unit: string, value: number | null, ok: boolean | null, note: string, limit?: number | null): FeedCheck {
  const c: FeedCheck = { name, value, unit, ok, note };
  if (limit !== undefined) c.limit = limit;
  return c;
}
const notApplicable = (name: CheckName, unit: string, why: string) => check(name, unit, null, null, `not applicable: ${why}`);
const missing = (name: CheckName, unit: string, note: string) => check(name, unit, null, null, note);
const samePositionNote = 'not computed: source and target sites are at the same position';

function freeSpaceLoss(ctx: Ctx): FeedCheck {
  if (ctx.samePosition) return missing('free-space-loss', 'dB', samePositionNote);
  if (!ctx.rx.ok) return missing('free-space-loss', 'dB', notComputed(ctx.rx)!);
  const v = round(freeSpaceLossDb(ctx.rx.value.mhz, ctx.distanceKm), 2);
  return check('free-space-loss', 'dB', v, true, `free space at ${ctx.rx.value.mhz} MHz (${ctx.rx.how}) over ${fmt(ctx.distanceKm, 3)} km, ITU-R P.525`);
}

/** " (value not checked against the published text)" after a limit's source, or nothing when it was read there. */
const sureWords = (confidence: Confidence) => (CONFIDENCE_WORDS[confidence] ? ` (${CONFIDENCE_WORDS[confidence]})` : '');

function fieldStrength(ctx: Ctx): FeedCheck {
  const { source, serviceKind } = ctx.input;
  const unit = 'dBuV/m';
  if (ctx.samePosition) return missing('field-strength', unit, samePositionNote);
  if (source.erpW === undefined) return missing('field-strength', unit, `not computed: ERP missing on carriage ${source.code}`);
  if (source.erpW === 0) return check('field-strength', unit, null, false, `ERP is 0 W on carriage ${source.code}: the source radiates nothing to receive`);
  const value = round(fieldStrengthFromErpDbw(wattsToDbw(source.erpW), ctx.distanceKm), 2);
  const basis = `free space from ${erpText(source.erpW)} ERP (carriage ${source.code}) at ${fmt(ctx.distanceKm, 3)} km, ITU-R P.1546 Annex 5 eq. (2)`;
  const min = offAirFeedMinimum(serviceKind, ctx.rx.ok ? ctx.rx.value.mhz : null);
  if (!min.ok) return check('field-strength', unit, value, null, `${basis}; no limit compared: ${min.reason}`, null);
  const limit = round(min.minimum.valueDbUvPerM, 2);
  const c = check('field-strength', unit, value, value >= limit, `${basis}; limit ${min.minimum.source}, ${min.minimum.reception}${sureWords(min.minimum.confidence)}`, limit);
  c.limitConfidence = min.minimum.confidence;
  return c;
}

function horizon(ctx: Ctx, h1: Read<number>, h2: Read<number>): FeedCheck {
  const gone = notComputed(h1, h2);
  if (gone || !h1.ok || !h2.ok) return check('horizon', 'km', null, null, gone ?? '', null);
  const limit = round(pathHorizonKm(h1.value, h2.value), 3);
  const value = round(ctx.distanceKm, 3);
  return check('horizon', 'km', value, value <= limit, `radio horizon k = 4/3 over a smooth earth from the source site ${h1.value} m (${h1.how}) and receiver ${h2.value} m (${h2.how}) above sea level: an optimistic bound`, limit);
}

function earthBulge(ctx: Ctx): FeedCheck {
  if (ctx.samePosition) return missing('earth-bulge', 'm', samePositionNote);
  const half = ctx.distanceKm / 2;
  return check('earth-bulge', 'm', round(earthBulgeM(half, half), 2), true, `at mid-path (${fmt(half, 3)} km from each end), k = 4/3`);
}

function fresnel(ctx: Ctx): FeedCheck {
  if (ctx.samePosition) return missing('fresnel-f1', 'm', samePositionNote);
  if (!ctx.rx.ok) return missing('fresnel-f1', 'm', notComputed(ctx.rx)!);
  const half = ctx.distanceKm / 2;
  const v = round(fresnelRadiusM(ctx.rx.value.mhz / 1000, half, half), 2);
  return check('fresnel-f1', 'm', v, true, `first Fresnel zone radius at mid-path, ${ctx.rx.value.mhz} MHz (${ctx.rx.how}), ITU-R P.530 eq. (2)`);
}

function clearance(ctx: Ctx, h1: Read<number>, h2: Read<number>): FeedCheck {
  if (ctx.samePosition) return missing('clearance', 'm', samePositionNote);
  const gone = notComputed(ctx.rx, h1, h2);
  if (gone || !ctx.rx.ok || !h1.ok || !h2.ok) return check('clearance', 'm', null, null, gone ?? '', 0);
  const c = midPathClearance(h1.value, h2.value, ctx.distanceKm, ctx.rx.value.mhz / 1000);
  const value = round(c.clearanceM, 2);
  return check(
    'clearance',
    'm',
    value,
    value >= 0,
    `straight line ${fmt(c.lineHeightM)} m above sea level at mid-path minus earth bulge ${fmt(c.earthBulgeM)} m and 0.6 F1 ${fmt(0.6 * c.fresnelRadiusM)} m, smooth earth at sea level: an optimistic bound, terrain not included`,
    0,
  );
}

/**
 * Co-channel receive: the receive and transmit channels overlap when their centres are closer
 * than half the sum of their widths. Without a channel plan (AM, other, out of band) only an
 * identical frequency (to 1 kHz) counts.
 */
function channelClash(ctx: Ctx): FeedCheck {
  const { target, serviceKind } = ctx.input;
  const tx = transmitFrequency(target, serviceKind);
  const gone = notComputed(ctx.rx, tx);
  if (gone || !ctx.rx.ok || !tx.ok) return check('channel-clash', 'MHz', null, null, gone ?? '', null);
  const rx = ctx.rx.value;
  const separation = round(Math.abs(tx.value.mhz - rx.mhz), 3);
  const widths = rx.channel && tx.value.channel ? (rx.channel.widthMHz + tx.value.channel.widthMHz) / 2 : null;
  const limit = widths ?? 0.001;
  const basis = `receives ${rx.mhz} MHz (${ctx.rx.how}), transmits ${tx.value.mhz} MHz (${tx.how})`;
  const rule = widths !== null ? `channels overlap below ${fmt(limit, 3)} MHz apart` : 'no channel plan for this service: only the same frequency counts';
  if (target.onChannelRepeater === true) {
    return check('channel-clash', 'MHz', separation, true, `${basis}; carriage ${target.code} is declared an on-channel repeater`, round(limit, 3));
  }
  return check('channel-clash', 'MHz', separation, separation >= limit, `${basis}; ${rule}`, round(limit, 3));
}

function bearingRecord(ctx: Ctx): FeedCheck {
  const { feed } = ctx.input;
  if (ctx.samePosition) return missing('bearing-record', 'deg', samePositionNote);
  if (feed.bearingDeg === undefined) return missing('bearing-record', 'deg', `not computed: recorded bearing missing on feed ${feed.code}`);
  const diff = round(bearingDifferenceDeg(feed.bearingDeg, ctx.bearingDeg), 2);
  return check(
    'bearing-record',
    'deg',
    diff,
    diff <= BEARING_TOLERANCE_DEG,
    `recorded ${fmt(feed.bearingDeg)}°, computed ${fmt(ctx.bearingDeg)}° from the receiving site to the source site (WGS84)`,
    BEARING_TOLERANCE_DEG,
  );
}

function validate(input: FeedCheckInput): void {
  const { feed, source, target, sourceSite, targetSite } = input;
  if (feed.from !== source.code) throw new Error(`feed ${feed.code}: source carriage is ${feed.from}, but carriage ${source.code} was given`);
  if (feed.to !== target.code) throw new Error(`feed ${feed.code}: receiving carriage is ${feed.to}, but carriage ${target.code} was given`);
  if (source.site !== sourceSite.code) throw new Error(`carriage ${source.code} is at site ${source.site}, but site ${sourceSite.code} was given`);
  if (target.site !== targetSite.code) throw new Error(`carriage ${target.code} is at site ${target.site}, but site ${targetSite.code} was given`);
}

/** All eight checks of one feed, in a fixed order; not-applicable ones carry ok = null and say why. */
export function computeFeedChecks(input: FeedCheckInput): FeedChecksAnswer {
  validate(input);
  const { feed, source, target, sourceSite, targetSite, serviceKind } = input;
  const toParent = geodesicInverse(targetSite.lat, targetSite.lon, sourceSite.lat, sourceSite.lon);
  const toRelay = geodesicInverse(sourceSite.lat, sourceSite.lon, targetSite.lat, targetSite.lon);
  const ctx: Ctx = {
    input,
    distanceKm: toParent.distanceKm,
    bearingDeg: toParent.initialBearingDeg,
    rx: receiveFrequency(feed, source, serviceKind),
    samePosition: toParent.distanceKm < SAME_POSITION_KM,
  };
  const hSource = antennaHeightAsl(sourceSite, source);
  const hTarget = antennaHeightAsl(targetSite, target);
  const microwaveOnly = `${feed.medium} feed; earth bulge, Fresnel zone and clearance are screened for microwave feeds`;

  let checks: FeedCheck[];
  if (feed.medium === 'off-air') {
    checks = [
      freeSpaceLoss(ctx),
      fieldStrength(ctx),
      horizon(ctx, hSource, hTarget),
      notApplicable('earth-bulge', 'm', microwaveOnly),
      notApplicable('fresnel-f1', 'm', microwaveOnly),
      notApplicable('clearance', 'm', microwaveOnly),
      channelClash(ctx),
      bearingRecord(ctx),
    ];
  } else if (feed.medium === 'microwave') {
    checks = [
      freeSpaceLoss(ctx),
      notApplicable('field-strength', 'dBuV/m', 'microwave feed; a link is planned on received level, not broadcast field strength'),
      horizon(ctx, hSource, hTarget),
      earthBulge(ctx),
      fresnel(ctx),
      clearance(ctx, hSource, hTarget),
      notApplicable('channel-clash', 'MHz', 'microwave feed; it does not receive on the broadcast channel'),
      bearingRecord(ctx),
    ];
  } else {
    const why = `${feed.medium} feed; path checks do not apply (distance and bearing are given for reference)`;
    const units: Record<CheckName, string> = { 'free-space-loss': 'dB', 'field-strength': 'dBuV/m', horizon: 'km', 'earth-bulge': 'm', 'fresnel-f1': 'm', clearance: 'm', 'channel-clash': 'MHz', 'bearing-record': 'deg' };
    checks = (Object.keys(units) as CheckName[]).map((n) => notApplicable(n, units[n], why));
  }

  const warnings = checks.filter((c) => c.ok === false).map((c) => failureSentence(feed.code, c));
  // An unreadable channel label is a data error, not just a missing value: say so once.
  const badLabels = new Set(checks.flatMap((c) => c.note.match(/channel "[^"]*" on [^;]*? is not a known [\w -]+? channel/g) ?? []));
  for (const label of badLabels) warnings.push(`Feed ${feed.code}: ${label}.`);

  return {
    feed: feed.code,
    distanceKm: round(toParent.distanceKm, 3),
    bearingDeg: normaliseDeg(round(toParent.initialBearingDeg, 2)),
    reverseBearingDeg: normaliseDeg(round(toRelay.initialBearingDeg, 2)),
    medium: feed.medium,
    checks,
    warnings,
    rxFrequencyMHz: ctx.rx.ok ? ctx.rx.value.mhz : null,
  };
}

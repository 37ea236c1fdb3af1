/**
 * Planning minimum field strengths per service kind (docs/checks.md, "Planning minimum field strengths").
 * Each value carries the reception mode it applies to and how sure it is:
 * 'confirmed' = read in the named source [C], 'secondary' = read only in a secondary source [S],
 * 'recalled' = from memory, unconfirmed [M]. The UI shows the confidence beside the limit.
 */
import type { ServiceKind } from '../schemas/network';
import type { Confidence } from '../schemas/checks';

export interface PlanningMinimum {
  /** dB(uV/m), already corrected to the frequency asked for where the source says so. */
  valueDbUvPerM: number;
  /** Reception mode and conditions the value applies to, in plain English. */
  reception: string;
  confidence: Confidence;
  source: string;
}

export type MinimumLookup = { ok: true; minimum: PlanningMinimum } | { ok: false; reason: string };

export type FmReception = 'stereo' | 'mono';
export type FmEnvironment = 'rural' | 'urban' | 'large-city';

/**
 * ITU-R BS.412-9 (12/1998) minimum median field strength at 10 m above ground, with
 * industrial and domestic interference, dB(uV/m). Stereo row [S] (a secondary page quoting
 * BS.412); mono row [M] recalled from memory, unconfirmed.
 */
export const FM_MINIMUMS: Readonly<Record<FmReception, Readonly<Record<FmEnvironment, number>>>> = {
  stereo: { rural: 54, urban: 66, 'large-city': 74 },
  mono: { rural: 48, urban: 60, 'large-city': 70 },
};
const FM_CONFIDENCE: Record<FmReception, Confidence> = { stereo: 'secondary', mono: 'recalled' };

export type DvbtRpc = 'RPC1' | 'RPC2' | 'RPC3';

/**
 * GE06 (RRC-06 Final Acts, Annex 2 ch. 3) reference planning configurations, Emed,ref at 95 %
 * locations, dB(uV/m). All six values [M] recalled from memory, unconfirmed.
 */
export const DVBT_MINIMUMS: Readonly<Record<DvbtRpc, { band3: number; band45: number; reception: string; correctionFactor: 20 | 30 }>> = {
  RPC1: { band3: 50, band45: 56, reception: 'fixed rooftop reception, 10 m above ground, 95 % of locations', correctionFactor: 20 },
  RPC2: { band3: 67, band45: 78, reception: 'portable outdoor or mobile reception, 95 % of locations', correctionFactor: 30 },
  RPC3: { band3: 76, band45: 88, reception: 'portable indoor reception, 95 % of locations', correctionFactor: 30 },
};
/** GE06 reference frequencies, MHz: Band III and Bands IV/V. */
export const DVBT_REFERENCE_MHZ = { band3: 200, band45: 650 } as const;

export type DabRpc = 'RPC4' | 'RPC5';
/** GE06 T-DAB at 200 MHz, dB(uV/m). Both [M] recalled from memory, unconfirmed. */
export const DAB_MINIMUMS: Readonly<Record<DabRpc, { value: number; reception: string }>> = {
  RPC4: { value: 60, reception: 'mobile reception, 99 % of locations' },
  RPC5: { value: 66, reception: 'portable indoor reception, 95 % of locations' },
};

export function fmMinimum(reception: FmReception = 'stereo', environment: FmEnvironment = 'rural'): PlanningMinimum {
  return {
    valueDbUvPerM: FM_MINIMUMS[reception][environment],
    reception: `FM ${reception}, ${environment.replace('-', ' ')} area, 10 m above ground`,
    confidence: FM_CONFIDENCE[reception],
    source: 'ITU-R BS.412-9',
  };
}

/**
 * DVB-T minimum at `frequencyMHz`, with the GE06 frequency correction [S]: fixed reception
 * 20 log(f/fr), portable and mobile 30 log(f/fr).
 */
export function dvbtMinimum(frequencyMHz: number, rpc: DvbtRpc = 'RPC1'): MinimumLookup {
  if (typeof frequencyMHz !== 'number' || !Number.isFinite(frequencyMHz) || frequencyMHz <= 0) {
    return { ok: false, reason: `frequency must be a number of MHz above 0 (got ${String(frequencyMHz)})` };
  }
  const row = DVBT_MINIMUMS[rpc];
  let base: number;
  let fr: number;
  if (frequencyMHz >= 174 && frequencyMHz <= 230) {
    base = row.band3;
    fr = DVBT_REFERENCE_MHZ.band3;
  } else if (frequencyMHz >= 470 && frequencyMHz <= 862) {
    base = row.band45;
    fr = DVBT_REFERENCE_MHZ.band45;
  } else {
    return { ok: false, reason: `${frequencyMHz} MHz is outside Band III (174-230 MHz) and Bands IV/V (470-862 MHz), where GE06 gives DVB-T minimums` };
  }
  return {
    ok: true,
    minimum: {
      valueDbUvPerM: base + row.correctionFactor * Math.log10(frequencyMHz / fr),
      reception: `DVB-T ${rpc}, ${row.reception}, ${base} dBµV/m at ${fr} MHz corrected by ${row.correctionFactor} log(f/${fr})`,
      confidence: 'recalled',
      source: 'GE06 Final Acts, Annex 2 ch. 3',
    },
  };
}

export function dabMinimum(rpc: DabRpc = 'RPC4'): PlanningMinimum {
  const row = DAB_MINIMUMS[rpc];
  return { valueDbUvPerM: row.value, reception: `T-DAB ${rpc}, ${row.reception}, at 200 MHz`, confidence: 'recalled', source: 'GE06 Final Acts' };
}

/**
 * The minimum to hold an off-air feed against. A relay receives with a fixed directional
 * antenna on its mast, so fixed rooftop values are used: FM stereo rural at 10 m, DVB-T RPC1.
 * The sources give no fixed-reception T-DAB value, so RPC4 (mobile) is used: it asks for
 * more signal than fixed reception would, so it errs on the safe side. AM and other
 * services have no value in these sources and are not computed (docs/checks.md).
 */
export function offAirFeedMinimum(kind: ServiceKind, frequencyMHz: number | null): MinimumLookup {
  switch (kind) {
    case 'fm':
      return { ok: true, minimum: fmMinimum('stereo', 'rural') };
    case 'dtt':
      if (frequencyMHz === null) return { ok: false, reason: 'receive frequency missing (DVB-T minimum depends on frequency)' };
      return dvbtMinimum(frequencyMHz, 'RPC1');
    case 'dab': {
      const m = dabMinimum('RPC4');
      return { ok: true, minimum: { ...m, reception: `${m.reception} (no fixed-reception value in the sources; mobile is the stricter bound)` } };
    }
    case 'am':
      return { ok: false, reason: 'no planning minimum for AM in the sources this check uses' };
    case 'other':
      return { ok: false, reason: 'no planning minimum for service kind "other"' };
  }
}

/**
 * Free-space and smooth-earth screening formulas (docs/checks.md, "Free space" and "Horizon, earth bulge, Fresnel zone").
 * Units: f in MHz unless the name says GHz; distances in km; heights in m.
 */

/** Speed of light, m/s (SI definition). */
export const SPEED_OF_LIGHT = 299_792_458;
/** Mean earth radius used by ITU-R P.452 eq. (6a), km. */
export const EARTH_RADIUS_KM = 6371;
/** Median effective earth-radius factor (k = 4/3; P.452 eq. (5) gives it for Delta N = 39.25). */
export const K_FACTOR = 4 / 3;

/**
 * 20 log10(4 pi 1e9 / c) = 32.4478 dB: the free-space constant for f in MHz and d in km,
 * computed rather than rounded. ITU-R P.525 section 2.2 prints 32.4; NTIA ITM uses 32.45.
 */
export const FREE_SPACE_CONSTANT_DB = 20 * Math.log10((4 * Math.PI * 1e9) / SPEED_OF_LIGHT);

/**
 * Field strength for 1 kW e.r.p.: E = 106.9 - 20 log d, i.e. E = P_erp(dBW) - 20 log d + 76.9.
 * ITU-R P.1546 Annex 5 section 2 eq. (2). The e.i.r.p. form (P.525 section 2.1) comes from
 * e = sqrt(30 p) / d: 10 log 30 + 60 (V -> uV, km -> m) = 74.77, printed as 74.8; the two
 * constants differ by the dipole gain, 76.9 - 74.8 = 2.1 ~ 2.15 dB (ITU-R BS.561).
 */
export const FIELD_CONSTANT_ERP_DB = 76.9;
/** See FIELD_CONSTANT_ERP_DB. ITU-R P.525 section 2.1. */
export const FIELD_CONSTANT_EIRP_DB = 74.8;
/** S (dBW/m^2) = E (dB(uV/m)) - 145.8 (P.525 section 2.1; the GE06 chain uses the same). */
export const PFD_CONSTANT_DB = 145.8;

/** sqrt(c * 1e-6) = 17.3145: F1 (m) = 17.3145 sqrt(d1 d2 / (f d)), f GHz, d km. */
export const FRESNEL_CONSTANT_GHZ = Math.sqrt(SPEED_OF_LIGHT * 1e-6);

function positive(name: string, v: number): void {
  if (typeof v !== 'number' || !Number.isFinite(v) || v <= 0) throw new RangeError(`${name} must be a finite number above 0 (got ${String(v)})`);
}
function nonNegative(name: string, v: number): void {
  if (typeof v !== 'number' || !Number.isFinite(v) || v < 0) throw new RangeError(`${name} must be a finite number, 0 or more (got ${String(v)})`);
}
function finite(name: string, v: number): void {
  if (typeof v !== 'number' || !Number.isFinite(v)) throw new RangeError(`${name} must be a finite number (got ${String(v)})`);
}

/** Effective earth radius ae = 6371 k km (ITU-R P.452 eq. (6a)). */
export function effectiveEarthRadiusKm(k: number = K_FACTOR): number {
  positive('k-factor', k);
  return EARTH_RADIUS_KM * k;
}

/** Free-space basic transmission loss Lbf, dB (ITU-R P.525 section 2.2, exact constant). */
export function freeSpaceLossDb(frequencyMHz: number, distanceKm: number): number {
  positive('frequency (MHz)', frequencyMHz);
  positive('distance (km)', distanceKm);
  return FREE_SPACE_CONSTANT_DB + 20 * Math.log10(frequencyMHz) + 20 * Math.log10(distanceKm);
}

/** Free-space field strength from e.r.p. in dBW, dB(uV/m) (ITU-R P.1546 Annex 5 eq. (2)). */
export function fieldStrengthFromErpDbw(erpDbw: number, distanceKm: number): number {
  finite('e.r.p. (dBW)', erpDbw);
  positive('distance (km)', distanceKm);
  return erpDbw - 20 * Math.log10(distanceKm) + FIELD_CONSTANT_ERP_DB;
}

/** Free-space field strength from e.i.r.p. in dBW, dB(uV/m) (ITU-R P.525 section 2.1). */
export function fieldStrengthFromEirpDbw(eirpDbw: number, distanceKm: number): number {
  finite('e.i.r.p. (dBW)', eirpDbw);
  positive('distance (km)', distanceKm);
  return eirpDbw - 20 * Math.log10(distanceKm) + FIELD_CONSTANT_EIRP_DB;
}

/** Power flux density from field strength, dB(W/m^2) (ITU-R P.525 section 2.1). */
export function powerFluxDensityDbw(fieldDbUvPerM: number): number {
  finite('field strength', fieldDbUvPerM);
  return fieldDbUvPerM - PFD_CONSTANT_DB;
}

/** Radio horizon of one antenna at height h (m) over a smooth earth, km: sqrt(2 ae h). */
export function radioHorizonKm(heightM: number, k: number = K_FACTOR): number {
  nonNegative('antenna height (m)', heightM);
  return Math.sqrt(2 * effectiveEarthRadiusKm(k) * (heightM / 1000));
}

/** Line-of-sight limit between two antennas: the sum of their horizons, km. */
export function pathHorizonKm(height1M: number, height2M: number, k: number = K_FACTOR): number {
  return radioHorizonKm(height1M, k) + radioHorizonKm(height2M, k);
}

/** Earth bulge at d1, d2 from the ends, m: 1000 d1 d2 / (2 ae) (d1 d2 / (12.742 k)). */
export function earthBulgeM(d1Km: number, d2Km: number, k: number = K_FACTOR): number {
  nonNegative('d1 (km)', d1Km);
  nonNegative('d2 (km)', d2Km);
  return (1000 * d1Km * d2Km) / (2 * effectiveEarthRadiusKm(k));
}

/** First Fresnel zone radius, m (ITU-R P.530 section 2.2 eq. (2), exact constant 17.3145). */
export function fresnelRadiusM(frequencyGHz: number, d1Km: number, d2Km: number): number {
  positive('frequency (GHz)', frequencyGHz);
  nonNegative('d1 (km)', d1Km);
  nonNegative('d2 (km)', d2Km);
  const d = d1Km + d2Km;
  positive('path length d1 + d2 (km)', d);
  return FRESNEL_CONSTANT_GHZ * Math.sqrt((d1Km * d2Km) / (frequencyGHz * d));
}

export interface MidPathClearance {
  /** Height of the straight line between the antennas at mid-path, m above sea level. */
  lineHeightM: number;
  earthBulgeM: number;
  fresnelRadiusM: number;
  /** line height - (earth bulge + 0.6 F1), m; negative means the 0.6 F1 zone is obstructed. */
  clearanceM: number;
}

/**
 * Clearance at mid-path over a smooth earth at sea level: the optimistic screening bound
 * (real terrain only lowers it). The 0.6 F1 criterion: at 0.6 F1 clearance the knife-edge
 * loss is about 0 dB, ITU-R P.526 J(nu) with nu = -0.849 (docs/checks.md, "Horizon, earth bulge, Fresnel zone").
 */
export function midPathClearance(height1AslM: number, height2AslM: number, distanceKm: number, frequencyGHz: number, k: number = K_FACTOR): MidPathClearance {
  finite('height 1 (m)', height1AslM);
  finite('height 2 (m)', height2AslM);
  positive('distance (km)', distanceKm);
  const half = distanceKm / 2;
  const lineHeightM = (height1AslM + height2AslM) / 2;
  const bulge = earthBulgeM(half, half, k);
  const f1 = fresnelRadiusM(frequencyGHz, half, half);
  return { lineHeightM, earthBulgeM: bulge, fresnelRadiusM: f1, clearanceM: lineHeightM - (bulge + 0.6 * f1) };
}

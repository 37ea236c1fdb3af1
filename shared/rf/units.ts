/**
 * Power units. dBW = 10 log10(P / 1 W); dBm = dBW + 30.
 * e.i.r.p. = e.r.p. + 2.15 dB: the gain of a half-wave dipole over an isotropic antenna
 * (numeric 1.64). ITU-R BS.561 Annex 1 section 2 (docs/checks.md, "Free space").
 */

/** Half-wave dipole gain over isotropic, dB (ITU-R BS.561). */
export const DIPOLE_GAIN_DBI = 2.15;

function requirePositive(name: string, value: number): void {
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0) {
    throw new RangeError(`${name} must be a finite number above 0 (got ${String(value)})`);
  }
}

function requireFinite(name: string, value: number): void {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new RangeError(`${name} must be a finite number (got ${String(value)})`);
  }
}

export function wattsToDbw(watts: number): number {
  requirePositive('power in W', watts);
  return 10 * Math.log10(watts);
}

export function dbwToWatts(dbw: number): number {
  requireFinite('power in dBW', dbw);
  return 10 ** (dbw / 10);
}

export function dbwToDbm(dbw: number): number {
  requireFinite('power in dBW', dbw);
  return dbw + 30;
}

export function dbmToDbw(dbm: number): number {
  requireFinite('power in dBm', dbm);
  return dbm - 30;
}

export function wattsToDbm(watts: number): number {
  return dbwToDbm(wattsToDbw(watts));
}

export function dbmToWatts(dbm: number): number {
  return dbwToWatts(dbmToDbw(dbm));
}

/** e.r.p. (relative to a half-wave dipole) to e.i.r.p. (relative to isotropic), both in dB units. */
export function erpToEirpDb(erpDb: number): number {
  requireFinite('e.r.p.', erpDb);
  return erpDb + DIPOLE_GAIN_DBI;
}

export function eirpToErpDb(eirpDb: number): number {
  requireFinite('e.i.r.p.', eirpDb);
  return eirpDb - DIPOLE_GAIN_DBI;
}

/** e.r.p. in W to e.i.r.p. in W (factor 10^0.215 = 1.64). */
export function erpToEirpWatts(erpW: number): number {
  requirePositive('e.r.p. in W', erpW);
  return erpW * 10 ** (DIPOLE_GAIN_DBI / 10);
}

export function eirpToErpWatts(eirpW: number): number {
  requirePositive('e.i.r.p. in W', eirpW);
  return eirpW / 10 ** (DIPOLE_GAIN_DBI / 10);
}

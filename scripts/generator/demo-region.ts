/**
 * The demo region: the Lanneth valley, an invented region with invented
 * sites, services and figures, on an invented island (its coastline, drawn
 * by hand around the sites, is assets/demo/demo-coast.json). It lies in
 * open ocean in the South Atlantic so that no real place, station or
 * operator is meant; the ground heights are made up as if it were hill
 * country. Moving a site off the island fails test/unit/interchange/demo.test.ts.
 *
 * Planted data problems, for the tools to find:
 * - UNFED_CARRIAGE has no feed at all;
 * - WRONG_BEARING_FEED records a bearing far from the computed one;
 * - ON_CHANNEL_RELAY is a declared on-channel repeater (allowed);
 *   CLASH_CARRIAGE transmits on the channel it receives and is not declared;
 * - M-ELVA's main and reserve both run on telecom route TEL-WEST, and R-ABK's
 *   reserve comes off-air from the same parent as its main: reserves that
 *   are not really diverse.
 */
import type { Group, Service } from '@/shared/schemas/network';

export const DEMO_CENTRE = { lat: -38.6, lon: -29.4 };
export const DEMO_SEED = 1707;

export const DEMO_SERVICES: ReadonlyArray<Service & { block?: string }> = [
  { code: 'MX1', name: 'Lanneth Multiplex 1', kind: 'dtt' },
  { code: 'MX2', name: 'Lanneth Multiplex 2', kind: 'dtt' },
  { code: 'MX3', name: 'Lanneth Multiplex 3', kind: 'dtt' },
  { code: 'MX4', name: 'Lanneth Multiplex 4', kind: 'dtt' },
  { code: 'MX5', name: 'Lanneth Multiplex 5', kind: 'dtt' },
  { code: 'FMA', name: 'Lanneth Tideline', kind: 'fm' },
  { code: 'FMB', name: 'Corran Air', kind: 'fm' },
  { code: 'FMC', name: 'Vellow Sound', kind: 'fm' },
  { code: 'FMD', name: 'Vale Parley', kind: 'fm' },
  { code: 'DBN', name: 'Lanneth Digital', kind: 'dab', block: '8A' },
  { code: 'DBR', name: 'Vale Regional Digital', kind: 'dab', block: '10C' },
  { code: 'LCL', name: 'Quillon Community Radio', kind: 'fm' },
];

export const DEMO_GROUPS: readonly Group[] = [
  { code: 'PWR-NORTH', name: 'Northern regional power supply' },
  { code: 'PWR-SOUTH', name: 'Southern regional power supply' },
  { code: 'SAT-TP7', name: 'Distribution satellite, transponder 7', note: 'Carries every TV and radio service to the mains and the DAB relays' },
  { code: 'TEL-EAST', name: 'Telecom route east' },
  { code: 'TEL-WEST', name: 'Telecom route west' },
];

/** What a site carries, by profile. */
export const PROFILES: Record<string, readonly string[]> = {
  playoutTv: ['MX1', 'MX2', 'MX3', 'MX4', 'MX5'],
  playoutRadio: ['FMA', 'FMB', 'FMC', 'FMD', 'DBN', 'DBR'],
  studio: ['LCL'],
  main: ['MX1', 'MX2', 'MX3', 'MX4', 'MX5', 'FMA', 'FMB', 'FMC', 'FMD', 'DBN', 'DBR'],
  mainLocal: ['MX1', 'MX2', 'MX3', 'MX4', 'MX5', 'FMA', 'FMB', 'FMC', 'FMD', 'DBN', 'DBR', 'LCL'],
  tv: ['MX1', 'MX2', 'MX3'],
  tv5: ['MX1', 'MX2', 'MX3', 'MX4', 'MX5'],
  fm: ['FMA', 'FMB', 'FMC', 'FMD'],
  all: ['MX1', 'MX2', 'MX3', 'MX4', 'MX5', 'FMA', 'FMB', 'FMC', 'FMD', 'DBN', 'DBR'],
  tvfm: ['MX1', 'MX2', 'MX3', 'FMA', 'FMB'],
  tvlcl: ['MX1', 'MX2', 'MX3', 'FMA', 'LCL'],
  lcl: ['FMA', 'LCL'],
  dab: ['DBN', 'DBR'],
};

/** [code, name, family, bearing from the centre (deg), distance (km), profile] */
export const DEMO_ORIGINS: ReadonlyArray<[string, string, 'tv' | 'radio' | 'local', number, number, string]> = [
  ['O-LPC', 'Lanneth Playout Centre', 'tv', 0, 0, 'playoutTv'],
  ['O-BRH', 'Brevin Radio Playout', 'radio', 250, 14, 'playoutRadio'],
  ['O-QCS', 'Quillon Community Studio', 'local', 120, 38, 'studio'],
];

/**
 * How a main takes programme from the origins: "line:<route group>",
 * "microwave" (direct), "microwave:<hop site>", "satellite", or
 * "off-air:<main>" (radio only, from that main's carriage).
 */
export interface DemoMain {
  code: string;
  name: string;
  bearingDeg: number;
  km: number;
  households: number;
  power: string;
  main: string;
  reserve: string;
  radioReserve?: string;
  profile: string;
}

export const DEMO_MAINS: readonly DemoMain[] = [
  { code: 'M-CORR', name: 'Corrant Beacon', bearingDeg: 10, km: 42, households: 185000, power: 'PWR-NORTH', main: 'line:TEL-WEST', reserve: 'satellite', profile: 'main' },
  { code: 'M-VESK', name: 'Vesk Moor', bearingDeg: 75, km: 55, households: 120000, power: 'PWR-NORTH', main: 'line:TEL-EAST', reserve: 'satellite', profile: 'main' },
  { code: 'M-TAMS', name: 'Tamsel Ridge', bearingDeg: 140, km: 48, households: 96000, power: 'PWR-SOUTH', main: 'microwave', reserve: 'satellite', profile: 'mainLocal' },
  { code: 'M-ORRN', name: 'Orrin Fell', bearingDeg: 200, km: 60, households: 142000, power: 'PWR-SOUTH', main: 'line:TEL-WEST', reserve: 'satellite', profile: 'main' },
  { code: 'M-GANN', name: 'Gannick Down', bearingDeg: 255, km: 50, households: 78000, power: 'PWR-SOUTH', main: 'microwave:R-HOB', reserve: 'satellite', radioReserve: 'off-air:M-ORRN', profile: 'main' },
  { code: 'M-ELVA', name: 'Elvane Height', bearingDeg: 300, km: 66, households: 64000, power: 'PWR-NORTH', main: 'line:TEL-WEST', reserve: 'line:TEL-WEST', profile: 'main' },
  { code: 'M-FOST', name: 'Fostrel Tor', bearingDeg: 335, km: 95, households: 51000, power: 'PWR-NORTH', main: 'satellite', reserve: 'line:TEL-WEST', profile: 'main' },
];

/** [code, name, parent site, distance from the parent (km), bearing from the parent (deg), profile] */
export const DEMO_RELAYS: ReadonlyArray<[string, string, string, number, number, string]> = [
  ['R-ABK', 'Abrin Knoll', 'M-CORR', 18, 40, 'tv5'],
  ['R-BGP', 'Belcor Gap', 'M-CORR', 26, 95, 'tv'],
  ['R-CDX', 'Caddow Cross', 'M-CORR', 12, 330, 'all'],
  ['R-DVB', 'Dunvel Bank', 'R-CDX', 22, 300, 'tvfm'],
  ['R-EKR', 'Eskar Rigg', 'R-DVB', 15, 350, 'tv'],
  ['R-FNH', 'Fennow Hollow', 'M-CORR', 33, 160, 'fm'],
  ['R-HTS', 'Hethra Side', 'R-ABK', 17, 20, 'tv'],
  ['R-IVE', 'Ivra End', 'R-HTS', 9, 75, 'tv'],
  ['R-JSP', 'Jessick Point', 'M-CORR', 44, 215, 'tv'],
  ['R-KVT', 'Kelvor Top', 'M-VESK', 21, 10, 'tv5'],
  ['R-LRB', 'Lorrin Bridge', 'M-VESK', 14, 120, 'all'],
  ['R-MRW', 'Marrock Wood', 'R-LRB', 19, 150, 'tvfm'],
  ['R-NSH', 'Nessel Head', 'M-VESK', 37, 70, 'tv'],
  ['R-ODK', 'Oddry Knoll', 'R-NSH', 11, 40, 'tv'],
  ['R-PLG', 'Pellow Gap', 'M-VESK', 27, 250, 'fm'],
  ['R-QRX', 'Quarn Cross', 'R-KVT', 24, 340, 'tv'],
  ['R-RSB', 'Rusk Bank', 'R-MRW', 8, 200, 'tv'],
  ['R-SWN', 'Sorrin Wood', 'R-KVT', 16, 60, 'tv'],
  ['R-JRV', 'Jarvish Top', 'M-VESK', 30, 160, 'dab'],
  ['R-SLR', 'Sallan Rigg', 'M-TAMS', 16, 90, 'tvlcl'],
  ['R-TRW', 'Tarrow Side', 'M-TAMS', 29, 180, 'tv5'],
  ['R-ULV', 'Ulvin End', 'R-TRW', 13, 220, 'tv'],
  ['R-VRL', 'Varrel Top', 'M-TAMS', 22, 40, 'lcl'],
  ['R-YRN', 'Yarrin Hollow', 'M-TAMS', 41, 130, 'tvfm'],
  ['R-ZNP', 'Zenner Point', 'R-YRN', 17, 150, 'tv'],
  ['R-AVK', 'Avrick Bank', 'M-TAMS', 9, 300, 'tv'],
  ['R-BRK', 'Brisk Head', 'R-TRW', 21, 160, 'tv'],
  ['R-HOB', 'Hobbet Top', 'M-ORRN', 50, 356, 'tv'],
  ['R-CVS', 'Corvish Side', 'M-ORRN', 19, 170, 'all'],
  ['R-DRN', 'Dorran Knoll', 'R-CVS', 23, 200, 'tvfm'],
  ['R-ELK', 'Elkin Rigg', 'R-DRN', 14, 230, 'tv'],
  ['R-FRS', 'Farsel Gap', 'M-ORRN', 31, 260, 'tv5'],
  ['R-GWN', 'Gowan End', 'R-FRS', 12, 300, 'tv'],
  ['R-HLV', 'Halvey Bank', 'M-ORRN', 24, 110, 'fm'],
  ['R-IST', 'Istrel Cross', 'R-HLV', 18, 140, 'fm'],
  ['R-KRM', 'Kormel Bank', 'M-ORRN', 26, 50, 'dab'],
  ['R-JRA', 'Jorra Point', 'M-GANN', 15, 280, 'tv5'],
  ['R-KSN', 'Kessin Wood', 'M-GANN', 27, 330, 'all'],
  ['R-MVN', 'Morvane Head', 'R-KSN', 20, 300, 'tvfm'],
  ['R-NRK', 'Nurrick Hollow', 'R-MVN', 12, 260, 'tv'],
  ['R-OST', 'Ostry Bridge', 'M-GANN', 34, 220, 'tv'],
  ['R-PDW', 'Pradwin Top', 'R-OST', 16, 190, 'tv'],
  ['R-QSL', 'Quessel Gap', 'M-GANN', 22, 170, 'fm'],
  ['R-SNK', 'Sennick Rigg', 'R-JRA', 14, 240, 'tv'],
  ['R-THS', 'Thessick Knoll', 'M-ELVA', 18, 350, 'tv5'],
  ['R-UMR', 'Ummer Side', 'M-ELVA', 25, 250, 'tvfm'],
  ['R-VLK', 'Vallick End', 'R-UMR', 16, 210, 'tv'],
  ['R-WRN', 'Wrenna Cross', 'M-ELVA', 31, 60, 'tv'],
  ['R-YST', 'Yestin Bank', 'R-THS', 19, 20, 'tv'],
  ['R-ZRW', 'Zorrow Top', 'M-ELVA', 12, 150, 'fm'],
  ['R-ARV', 'Arvel Hollow', 'R-WRN', 14, 100, 'tv'],
  ['R-BRN', 'Brennick Point', 'M-FOST', 20, 10, 'tv5'],
  ['R-CVH', 'Cavish Wood', 'M-FOST', 28, 290, 'tvfm'],
  ['R-DSK', 'Deskel Head', 'R-CVH', 17, 250, 'tv'],
  ['R-EMB', 'Embrin Gap', 'M-FOST', 23, 120, 'tv'],
  ['R-FLK', 'Fallick Rigg', 'R-BRN', 15, 340, 'tv'],
  ['R-GRS', 'Gristan Side', 'M-FOST', 36, 200, 'fm'],
  ['R-HVL', 'Hovvel End', 'R-DSK', 11, 300, 'tv'],
  ['R-INC', 'Inchet Knoll', 'R-EMB', 13, 80, 'tv'],
];

/** Extra reserve feeds into relays: [relay, source site, how]. */
export const DEMO_RELAY_RESERVES: ReadonlyArray<[string, string, 'off-air' | 'line:TEL-WEST' | 'line:TEL-EAST']> = [
  ['R-ABK', 'M-CORR', 'off-air'], // a second receiver on the same parent: not really diverse
  ['R-DVB', 'M-CORR', 'off-air'],
  ['R-BGP', 'R-KVT', 'off-air'], // R-BGP and R-KVT back each other up: a loop with origins upstream
  ['R-KVT', 'R-BGP', 'off-air'],
  ['R-SLR', 'M-VESK', 'off-air'],
  ['R-CVS', 'O-LPC', 'line:TEL-WEST'],
  ['R-THS', 'R-WRN', 'off-air'],
];

/** Relays whose sites share a main's regional power supply. */
export const DEMO_POWERED_RELAYS: Readonly<Record<string, string>> = {
  'R-CDX': 'PWR-NORTH', 'R-LRB': 'PWR-NORTH', 'R-AVK': 'PWR-SOUTH', 'R-CVS': 'PWR-SOUTH', 'R-KSN': 'PWR-SOUTH',
};

export const UNFED_CARRIAGE = 'R-ODK.MX3';
export const WRONG_BEARING_FEED = 'R-RSB.MX1.M';
export const WRONG_BEARING_OFFSET_DEG = 38;
export const ON_CHANNEL_RELAY = 'R-IVE';
export const CLASH_CARRIAGE = 'R-GWN.MX2';

import { describe, expect, it } from 'vitest';
import type { Carriage, Feed, Service, Site } from '@/shared/schemas/network';
import { checksForFeed, CheckInputError, indexNetwork, networkCheckFailures, networkCheckFailuresInTurns, type NetworkRecords } from './networkChecks';
import { generateNetwork } from '@/scripts/generator';
import { Turns } from '../interchange/turns';
import { carriage, place, PARENT_POS, site } from './testFixtures';

/** Invented network: one FM service, a main station and three relays with deliberate faults. */
function network(): { sites: Site[]; services: Service[]; carriages: Carriage[]; feeds: Feed[] } & NetworkRecords {
  const near = place(PARENT_POS.lat, PARENT_POS.lon, 90, 12);
  const far = place(PARENT_POS.lat, PARENT_POS.lon, 200, 120);
  const mid = place(PARENT_POS.lat, PARENT_POS.lon, 300, 20);
  const sites: Site[] = [
    site('MAIN', { role: 'main', groundHeightM: 250, mastHeightM: 120 }),
    site('NEAR', { lat: near.lat, lon: near.lon, groundHeightM: 80, mastHeightM: 20 }),
    site('FAR', { lat: far.lat, lon: far.lon, groundHeightM: 0, mastHeightM: 10 }),
    site('MID', { lat: mid.lat, lon: mid.lon, groundHeightM: 150, mastHeightM: 25 }),
  ];
  const services: Service[] = [{ code: 'SVC', name: 'Valley Radio', kind: 'fm' }];
  const carriages: Carriage[] = [
    carriage('C-MAIN', 'MAIN', { frequencyMHz: 99.1, erpW: 5000 }),
    carriage('C-NEAR', 'NEAR', { frequencyMHz: 99.1, erpW: 50 }),
    carriage('C-FAR', 'FAR', { frequencyMHz: 101.4, erpW: 50 }),
    carriage('C-MID', 'MID', { frequencyMHz: 104.2, erpW: 50 }),
  ];
  const feed = (code: string, to: string, over: Partial<Feed> = {}): Feed => ({ code, from: 'C-MAIN', to, medium: 'off-air', role: 'main', ...over }) as Feed;
  const feeds: Feed[] = [
    feed('F-NEAR', 'C-NEAR'), // co-channel receive: error
    feed('F-FAR', 'C-FAR'), // 120 km with a 10 m mast at sea level: beyond horizon, error
    feed('F-MID', 'C-MID', { bearingDeg: (mid.backAzimuthDeg + 60) % 360 }), // bearing 60 deg off: warning
    feed('F-MID-SAT', 'C-MID', { medium: 'satellite', role: 'reserve' }),
  ];
  return { sites, services, carriages, feeds };
}

describe('networkCheckFailures', () => {
  it('lists every failed check, errors before warnings, with margins', () => {
    const a = networkCheckFailures(network(), { networkVersion: 7 });
    expect(a.networkVersion).toBe(7);
    const rows = a.failures.map((f) => `${f.severity} ${f.feed} ${f.check.name}`);
    // 5 kW at 120 km is still 72.3 dBuV/m: F-FAR fails on horizon only.
    expect(rows).toEqual(['error F-NEAR channel-clash', 'error F-FAR horizon', 'warning F-MID bearing-record']);
    const horizon = a.failures.find((f) => f.check.name === 'horizon')!;
    expect(horizon.margin).toBeLessThan(0);
    expect(horizon).toMatchObject({ from: 'C-MAIN', to: 'C-FAR', medium: 'off-air' });
    expect(a.failures.find((f) => f.check.name === 'bearing-record')!.margin).toBeCloseTo(-55, 1);
    expect(a.failures.find((f) => f.check.name === 'channel-clash')!.margin).toBeUndefined();
  });

  it('severity=error drops warnings', () => {
    const a = networkCheckFailures(network(), { severity: 'error' });
    expect(a.failures.every((f) => f.severity === 'error')).toBe(true);
    expect(a.failures.map((f) => f.feed)).toEqual(['F-NEAR', 'F-FAR']);
  });

  it('within one check, the larger shortfall comes first', () => {
    const net = network();
    // 5 W e.r.p.: 42.3 dBuV/m at 120 km (F-FAR), 37.9 at 200 km (F-WEAK, listed after it in the input).
    const weak = place(PARENT_POS.lat, PARENT_POS.lon, 10, 200);
    net.sites.push(site('WEAK', { lat: weak.lat, lon: weak.lon, groundHeightM: 900, mastHeightM: 50 }));
    net.carriages.push(carriage('C-WEAK', 'WEAK', { frequencyMHz: 95.0 }));
    (net.carriages[0] as Carriage).erpW = 5;
    net.feeds.push({ code: 'F-WEAK', from: 'C-MAIN', to: 'C-WEAK', medium: 'off-air', role: 'main' } as Feed);
    const field = networkCheckFailures(net).failures.filter((f) => f.check.name === 'field-strength');
    expect(field.map((f) => f.feed)).toEqual(['F-WEAK', 'F-FAR']);
    const margins = field.map((f) => f.margin!);
    expect([...margins].sort((x, y) => x - y)).toEqual(margins);
  });

  it('an unknown reference is an error naming the code', () => {
    const net = network();
    net.feeds.push({ code: 'F-BAD', from: 'C-NOPE', to: 'C-MID', medium: 'off-air', role: 'main' } as Feed);
    expect(() => networkCheckFailures(net)).toThrow(CheckInputError);
    expect(() => networkCheckFailures(net)).toThrow('feed F-BAD: source carriage C-NOPE does not exist');
  });
});

describe('checksForFeed', () => {
  it('answers one feed by code, and names an unknown code', () => {
    const index = indexNetwork(network());
    expect(checksForFeed(index, 'F-NEAR').feed).toBe('F-NEAR');
    expect(() => checksForFeed(index, 'F-NONE')).toThrow('feed F-NONE does not exist');
  });
});

describe('networkCheckFailuresInTurns', () => {
  it('gives the same list as the one-piece pass, and lets other work run while it goes', async () => {
    const net = generateNetwork({ sites: 1500, seed: 11 });
    let ticks = 0;
    const timer = setInterval(() => ticks++, 0);
    const inTurns = await networkCheckFailuresInTurns(net, { networkVersion: 3 }, new Turns(0)); // a turn every 64 steps
    clearInterval(timer);
    expect(inTurns).toEqual(networkCheckFailures(net, { networkVersion: 3 }));
    expect(inTurns.failures.length).toBeGreaterThan(0);
    expect(ticks).toBeGreaterThan(0);
  });

  it('rejects as the one-piece pass throws', async () => {
    const net = network();
    net.feeds.push({ code: 'F-BAD', from: 'C-NOPE', to: 'C-NEAR', medium: 'off-air', role: 'reserve' } as Feed);
    await expect(networkCheckFailuresInTurns(net)).rejects.toThrow(CheckInputError);
  });
});

/**
 * A small network for the operations tests, answers worked out by hand:
 *
 *   OA.TV --FL (line, main)--------> MA.TV --FR (off-air)--> RA.TV --FB (off-air)--> RB.TV
 *   OB.TV --FS (satellite, reserve)-^                          FM: OA.FM --FM1--> RA.FM
 *
 * Households: MA 1,000, RA 200, RB 50 (origins 0). Group PWR holds site RB.
 * - FL alone: nothing lost; MA.TV, RA.TV, RB.TV on reserve.
 * - FS alone: nothing lost, nothing on reserve.
 * - FL and FS together: MA.TV, RA.TV, RB.TV lost (1,250 households): a joint
 *   loss of 3 carriages, since neither loses anything alone.
 * - site RB alone: RB.TV lost (50 households).
 */
import type { NetworkDocument } from '@/shared/schemas/network';

export function opsNetwork(): NetworkDocument {
  const site = (code: string, role: 'origin' | 'main' | 'relay', households: number, groups: string[] = []) => ({
    code,
    name: `${code} test site`,
    role,
    lat: 10 + households / 10_000,
    lon: 20,
    households,
    groups,
  });
  return {
    format: 'network/1',
    sites: [site('OA', 'origin', 0), site('OB', 'origin', 0), site('MA', 'main', 1000), site('RA', 'relay', 200), site('RB', 'relay', 50, ['PWR'])],
    services: [
      { code: 'TV', name: 'Test multiplex', kind: 'dtt' },
      { code: 'FM', name: 'Test sound programme', kind: 'fm' },
    ],
    groups: [{ code: 'PWR', name: 'Test power region' }],
    carriages: [
      ...['OA', 'OB', 'MA', 'RA', 'RB'].map((s) => ({ code: `${s}.TV`, site: s, service: 'TV' })),
      { code: 'OA.FM', site: 'OA', service: 'FM' },
      { code: 'RA.FM', site: 'RA', service: 'FM' },
    ],
    feeds: [
      { code: 'FL', from: 'OA.TV', to: 'MA.TV', medium: 'line', role: 'main' },
      { code: 'FS', from: 'OB.TV', to: 'MA.TV', medium: 'satellite', role: 'reserve' },
      { code: 'FR', from: 'MA.TV', to: 'RA.TV', medium: 'off-air', role: 'main' },
      { code: 'FB', from: 'RA.TV', to: 'RB.TV', medium: 'off-air', role: 'main' },
      { code: 'FM1', from: 'OA.FM', to: 'RA.FM', medium: 'line', role: 'main' },
    ],
  };
}

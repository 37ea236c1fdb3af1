/**
 * Small hand-built networks whose answers were worked out by hand in the
 * tests (rules 1-9 of docs/domain.md).
 */
import type { NetworkDocument, Site, Feed } from '@/shared/schemas/network';

const site = (code: string, role: Site['role'], households: number, lat: number, lon: number, groups: string[] = []): Site => ({
  code,
  name: `${code} hill`,
  role,
  lat,
  lon,
  households,
  groups,
});
const feed = (code: string, from: string, to: string, role: Feed['role'], medium: Feed['medium'], via: string[] = [], groups: string[] = []): Feed => ({
  code,
  from,
  to,
  medium,
  role,
  via,
  groups,
});

/**
 * Two origins O1 (0 N, 0 E) and O2; main station M fed by microwave from O1
 * via hop site H (which also carries TV, fed by line from O1) with a
 * satellite reserve from O2; relays R1 <- M, R2 <- R1 (reserve from M),
 * R3 <- R2; an unfed loop L1 <-> L2; D carries TV with no feed. Power group
 * PWR holds sites M and R1; transponder group SAT holds feeds F02 and F10.
 */
export function valleyNetwork(): NetworkDocument {
  return {
    format: 'network/1',
    sites: [
      site('O1', 'origin', 0, 0, 0),
      site('O2', 'origin', 0, 0.5, 0.5),
      site('M', 'main', 1000, 0, 1, ['PWR']),
      site('H', 'relay', 0, 0, 0.5),
      site('R1', 'relay', 100, 0.1, 1, ['PWR']),
      site('R2', 'relay', 50, 0.2, 1),
      site('R3', 'relay', 20, 0.3, 1),
      site('L1', 'relay', 5, 0.4, 1),
      site('L2', 'relay', 7, 0.5, 1),
      site('D', 'relay', 0, 0.6, 1),
    ],
    services: [
      { code: 'TV', name: 'Television multiplex', kind: 'dtt' },
      { code: 'FM', name: 'Sound programme', kind: 'fm' },
    ],
    groups: [
      { code: 'PWR', name: 'Power region' },
      { code: 'SAT', name: 'Transponder' },
    ],
    carriages: [
      ...['O1', 'O2', 'M', 'H', 'R1', 'R2', 'R3', 'L1', 'L2', 'D'].map((s) => ({ code: `${s}.TV`, site: s, service: 'TV' })),
      ...['O1', 'M', 'R1'].map((s) => ({ code: `${s}.FM`, site: s, service: 'FM' })),
    ],
    feeds: [
      feed('F01', 'O1.TV', 'M.TV', 'main', 'microwave', ['H']),
      feed('F02', 'O2.TV', 'M.TV', 'reserve', 'satellite', [], ['SAT']),
      feed('F03', 'M.TV', 'R1.TV', 'main', 'off-air'),
      feed('F04', 'R1.TV', 'R2.TV', 'main', 'off-air'),
      feed('F05', 'M.TV', 'R2.TV', 'reserve', 'off-air'),
      feed('F06', 'O1.TV', 'H.TV', 'main', 'line'),
      feed('F07', 'R2.TV', 'R3.TV', 'main', 'off-air'),
      feed('F08', 'L1.TV', 'L2.TV', 'main', 'off-air'),
      feed('F09', 'L2.TV', 'L1.TV', 'main', 'off-air'),
      feed('F10', 'O1.FM', 'M.FM', 'main', 'line', [], ['SAT']),
      feed('F11', 'M.FM', 'R1.FM', 'main', 'off-air'),
    ],
  };
}

/** One relay X with a main and a reserve feed; `shape` decides what the two paths share. */
export function twoPathNetwork(shape: 'same-parent' | 'shared-hop' | 'shared-feed-group' | 'shared-site-group' | 'diverse'): NetworkDocument {
  const sameParent = shape === 'same-parent';
  return {
    format: 'network/1',
    sites: [
      site('P1', 'origin', 0, 0, 0, shape === 'shared-site-group' ? ['G'] : []),
      site('P2', 'origin', 0, 0, 0.2, shape === 'shared-site-group' ? ['G'] : []),
      site('HOP', 'relay', 0, 0, 0.1),
      site('X', 'relay', 300, 0.1, 0.1),
    ],
    services: [{ code: 'TV', name: 'Television multiplex', kind: 'dtt' }],
    groups: [{ code: 'G', name: 'Shared risk' }],
    carriages: ['P1', 'P2', 'X'].map((s) => ({ code: `${s}.TV`, site: s, service: 'TV' })),
    feeds: [
      feed('A', 'P1.TV', 'X.TV', 'main', 'off-air', shape === 'shared-hop' ? ['HOP'] : [], shape === 'shared-feed-group' ? ['G'] : []),
      feed('B', sameParent ? 'P1.TV' : 'P2.TV', 'X.TV', 'reserve', 'line', shape === 'shared-hop' ? ['HOP'] : [], shape === 'shared-feed-group' ? ['G'] : []),
    ],
  };
}

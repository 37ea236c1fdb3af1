/**
 * What deleting one record would take off air, before anyone confirms it.
 * The figures come from the engine's fault reach on the served network
 * (server/engine/reach.ts, rules 4, 5 and 7): a deletion with its cascade
 * leaves the network as the failure of the record would, except that what is
 * deleted is gone for good.
 *
 * - site: the reach of the site failing (its carriages, the feeds in and out
 *   of them and the feeds routed through it all go with it).
 * - feed: the reach of the feed failing.
 * - carriage: the reach of the carriage failing (itself, and every feed whose
 *   source it is).
 * - service: every carriage of the service that has programme today.
 * - group: nothing: its members only leave the group.
 * Unfed carriages (rule 8) are never counted.
 */
import type { ReachAnswer } from '@/shared/schemas/analysis';
import type { DeleteImpact } from '@/shared/schemas/editing';
import type { EntityKind } from '@/shared/schemas/network';
import { notFound } from '../../http/errors';
import type { ServedNetwork } from '../servedNetwork';
import { NOUN } from './shape';

const SHOWN = 50;

function fromReach(m: ServedNetwork, kind: EntityKind, code: string, reach: ReachAnswer, basis: string, extraLost: string[] = []): DeleteImpact {
  const lost = [...new Set([...reach.lost, ...extraLost])].sort();
  const lostSites = new Set(reach.sites.filter((s) => s.lost.length > 0).map((s) => s.site));
  let households = reach.households.lost;
  const byService = new Map(reach.byService.filter((s) => s.lost > 0).map((s) => [s.service, s.lost]));
  for (const c of extraLost) {
    if (reach.lost.includes(c)) continue;
    const carriage = m.carriages.get(c)!;
    byService.set(carriage.service, (byService.get(carriage.service) ?? 0) + 1);
    if (!lostSites.has(carriage.site)) {
      lostSites.add(carriage.site);
      households += m.sites.get(carriage.site)?.households ?? 0;
    }
  }
  // Only carriages the deletion puts on a reserve: some need one even with nothing failed.
  const already = new Set(m.engine.reach([]).fallback);
  const fallback = reach.fallback.filter((c) => !extraLost.includes(c) && !already.has(c));
  return {
    networkVersion: m.networkVersion,
    kind,
    code,
    offAir: { carriages: lost.length, households, sites: lostSites.size, shown: lost.slice(0, SHOWN) },
    fallback: { carriages: fallback.length },
    byService: [...byService].map(([service, n]) => ({ service, lost: n })).sort((a, b) => a.service.localeCompare(b.service)),
    basis,
  };
}

const nothing = (m: ServedNetwork, kind: EntityKind, code: string, basis: string): DeleteImpact => ({
  networkVersion: m.networkVersion,
  kind,
  code,
  offAir: { carriages: 0, households: 0, sites: 0, shown: [] },
  fallback: { carriages: 0 },
  byService: [],
  basis,
});

export function deleteImpact(m: ServedNetwork, kind: EntityKind, code: string): DeleteImpact {
  const known = { sites: m.sites, services: m.services, groups: m.groups, carriages: m.carriages, feeds: m.feeds }[kind];
  if (!known.has(code)) throw notFound(`no ${NOUN[kind]} with code ${code}`, { code });
  const unfed = new Set(m.engine.unfed().carriages.map((c) => c.carriage));
  switch (kind) {
    case 'sites':
      return fromReach(m, kind, code, m.engine.reach([{ kind: 'site', code }]), 'The fault reach of this site failing: its carriages, and every feed into, out of or through it.');
    case 'feeds':
      return fromReach(m, kind, code, m.engine.reach([{ kind: 'feed', code }]), 'The fault reach of this feed failing.');
    case 'carriages':
      // A carriage in the failure set has no programme and every feed it is the source of is down: exactly what deleting it does.
      return fromReach(m, kind, code, m.engine.reach([{ kind: 'carriage', code }]), 'The fault reach of this carriage failing: itself, and every feed it is the source of.');
    case 'services': {
      const fed = m.document.carriages.filter((c) => c.service === code && !unfed.has(c.code)).map((c) => c.code);
      return fromReach(m, kind, code, m.engine.reach([]), 'Every carriage of this service that has programme today.', fed);
    }
    case 'groups':
      return nothing(m, kind, code, 'Nothing goes off air: its sites and feeds only leave the group.');
  }
}

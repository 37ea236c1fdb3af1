/**
 * An event's reach in the terms of subscriptions: the services and sites of
 * the carriages it takes off air or onto reserve, resolved through the
 * in-memory network model. Codes the model no longer knows are kept as given.
 */
import type { OperationsEvent } from '../operations/events';
import type { ServedNetwork } from '../services/servedNetwork';

export interface CarriageLine {
  code: string;
  site: string;
  siteName: string;
}
export interface ServiceLines {
  service: string;
  name: string;
  lost: CarriageLine[];
  fallback: CarriageLine[];
}
export interface ResolvedReach {
  services: string[];
  sites: string[];
  byService: ServiceLines[];
}

export function resolveReach(event: OperationsEvent, model: ServedNetwork | null): ResolvedReach {
  const byService = new Map<string, ServiceLines>();
  const sites = new Set<string>();
  const add = (code: string, which: 'lost' | 'fallback') => {
    const c = model?.carriages.get(code);
    const service = c?.service ?? '(unknown service)';
    let lines = byService.get(service);
    if (!lines) byService.set(service, (lines = { service, name: model?.services.get(service)?.name ?? service, lost: [], fallback: [] }));
    if (c) sites.add(c.site);
    lines[which].push({ code, site: c?.site ?? '', siteName: (c && model?.sites.get(c.site)?.name) ?? c?.site ?? '' });
  };
  for (const code of event.reach.lost) add(code, 'lost');
  for (const code of event.reach.fallback) add(code, 'fallback');
  const ordered = [...byService.values()].sort((a, b) => (a.service < b.service ? -1 : 1));
  return { services: ordered.map((s) => s.service).filter((s) => model?.services.has(s)), sites: [...sites].sort(), byService: ordered };
}

/** Site and service names from the offline copy, for screens whose own name look-ups cannot reach the server. */
import { useMemo } from 'react';
import { useOffline } from './OfflineProvider';

export interface NameLookup {
  site: (code: string) => string | undefined;
  service: (code: string) => string | undefined;
  households: (code: string) => number | undefined;
}

export function useOfflineNames(): NameLookup {
  const { copy } = useOffline();
  return useMemo<NameLookup>(() => {
    if (!copy) return { site: () => undefined, service: () => undefined, households: () => undefined };
    const sites = new Map(copy.document.sites.map((s) => [s.code, s.name]));
    const households = new Map(copy.document.sites.map((s) => [s.code, s.households]));
    const services = new Map(copy.document.services.map((s) => [s.code, s.name]));
    return { site: (c) => sites.get(c), service: (c) => services.get(c), households: (c) => households.get(c) };
  }, [copy]);
}

/**
 * Site and service names from the offline copy, for screens whose own name
 * look-ups cannot reach the server. Only while the browser is offline, and
 * built on the first look-up: reading the copy's document takes seconds on a
 * national network, which a screen that is online must not pay.
 */
import { useMemo } from 'react';
import { useOffline } from './OfflineProvider';

export interface NameLookup {
  site: (code: string) => string | undefined;
  service: (code: string) => string | undefined;
  households: (code: string) => number | undefined;
}

export function useOfflineNames(): NameLookup {
  const { copy, online } = useOffline();
  return useMemo<NameLookup>(() => {
    if (!copy || online) return { site: () => undefined, service: () => undefined, households: () => undefined };
    let maps: { sites: Map<string, string>; households: Map<string, number | undefined>; services: Map<string, string> } | null = null;
    const read = () =>
      (maps ??= {
        sites: new Map(copy.document.sites.map((s) => [s.code, s.name])),
        households: new Map(copy.document.sites.map((s) => [s.code, s.households])),
        services: new Map(copy.document.services.map((s) => [s.code, s.name])),
      });
    return { site: (c) => read().sites.get(c), service: (c) => read().services.get(c), households: (c) => read().households.get(c) };
  }, [copy, online]);
}

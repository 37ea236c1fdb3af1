import type { Href } from 'expo-router';

export type DiagramMode = 'map' | 'schematic';

/** The diagram's address for a service filter, a failure set (canonical text from failSet.ts) and the view; each is left out when empty or the default. */
export function networkHref(service: string | null, failText: string, mode: DiagramMode = 'map'): Href {
  const query = [service ? `service=${encodeURIComponent(service)}` : null, failText ? `fail=${failText}` : null, mode === 'schematic' ? 'view=schematic' : null].filter(Boolean).join('&');
  return query ? `/network?${query}` : '/network';
}

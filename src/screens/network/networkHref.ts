import type { Href } from 'expo-router';

/** The diagram's address for a service filter and a failure set (canonical text from failSet.ts); each is left out when empty. */
export function networkHref(service: string | null, failText: string): Href {
  const query = [service ? `service=${encodeURIComponent(service)}` : null, failText ? `fail=${failText}` : null].filter(Boolean).join('&');
  return query ? `/network?${query}` : '/network';
}

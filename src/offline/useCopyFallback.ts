/**
 * An SWR read that the offline copy can answer (src/offline/README.md): the
 * server is asked as usual; when the browser says it is offline, or the
 * server cannot be reached, and a copy is stored, `fromCopy` answers instead.
 * Offline, the key also names the copy, so the answer is worked out again
 * once the stored copy has been read.
 */
import { useRef } from 'react';
import useSWR, { type SWRConfiguration } from 'swr';
import { isApiError, type ApiError } from '@/src/api/client';
import type { OfflineCopy } from './copyStore';
import { browserOffline } from './online';
import { useOffline } from './OfflineProvider';

export function useCopyFallback<T>(
  key: readonly unknown[] | null,
  fromServer: () => Promise<T>,
  fromCopy: (copy: OfflineCopy) => T | Promise<T>,
  config: SWRConfiguration<T, ApiError>,
) {
  const { copy, online, storedCopy } = useOffline();
  const copyRef = useRef(copy);
  copyRef.current = copy;
  return useSWR<T, ApiError>(
    key === null ? null : online ? key : [...key, 'offline-copy', copy?.fetchedAt ?? 'none'],
    async () => {
      // The stored copy is read only when it is wanted (OfflineProvider says why).
      const stored = async () => copyRef.current ?? (await storedCopy());
      if (browserOffline()) {
        const c = await stored();
        if (c) return fromCopy(c);
      }
      try {
        return await fromServer();
      } catch (e) {
        if (isApiError(e) && e.code === 'network') {
          const c = await stored();
          if (c) return fromCopy(c);
        }
        throw e;
      }
    },
    config,
  );
}

/**
 * The authenticated `send` every screen uses, and the SWR cache of one
 * signed-in session.
 *
 * `ApiProvider` (root layout) gives `send`. A 401 answer to a request made
 * with the current token ends the session (the shell then redirects to
 * sign-in); a 401 for an older token is ignored, so a slow answer cannot sign
 * out the person who has just signed in again.
 *
 * `SessionCache` (signed-in layout) gives SWR a fresh cache for each
 * sign-in. It unmounts on sign-out, so nothing fetched for one person (or an
 * in-flight request SWR would otherwise reuse for up to its deduping
 * interval) reaches the next person on the same device.
 */
import { createContext, useCallback, useContext, useMemo, type ReactNode } from 'react';
import { SWRConfig, type SWRConfiguration } from 'swr';
import { useSession } from '@/src/session/SessionProvider';
import { isApiError, request, type RequestOptions } from './client';
import { retryable } from './retry';

export type Send = (path: string, options?: Omit<RequestOptions, 'token'>) => Promise<unknown>;

const SendContext = createContext<Send | null>(null);

export function ApiProvider({ children }: { children: ReactNode }) {
  const { tokenRef, signOut } = useSession();

  const send = useCallback<Send>(
    async (path, options = {}) => {
      const token = tokenRef.current;
      try {
        return await request(path, { ...options, token });
      } catch (e) {
        if (isApiError(e) && e.status === 401 && token && token === tokenRef.current) signOut('expired');
        throw e;
      }
    },
    [tokenRef, signOut],
  );

  return <SendContext.Provider value={send}>{children}</SendContext.Provider>;
}

export function SessionCache({ children }: { children: ReactNode }) {
  const send = useSend();
  const config = useMemo<SWRConfiguration>(
    () => ({
      provider: () => new Map(),
      fetcher: (key: string) => send(key),
      shouldRetryOnError: retryable,
      errorRetryCount: 3,
    }),
    [send],
  );
  return <SWRConfig value={config}>{children}</SWRConfig>;
}

export function useSend(): Send {
  const send = useContext(SendContext);
  if (!send) throw new Error('useSend must be used inside <ApiProvider> (app/_layout.tsx)');
  return send;
}

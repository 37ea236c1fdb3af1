/**
 * Gives every screen an authenticated `send` and configures SWR with it.
 * A 401 answer to a request made with the current token ends the session
 * (the shell then redirects to sign-in); a 401 for an older token is ignored,
 * so a slow answer cannot sign out the person who just signed in again.
 */
import { createContext, useCallback, useContext, useEffect, useMemo, useRef, type ReactNode } from 'react';
import { SWRConfig, useSWRConfig, type SWRConfiguration } from 'swr';
import { useSession } from '@/src/session/SessionProvider';
import { isApiError, request, type RequestOptions } from './client';

export type Send = (path: string, options?: Omit<RequestOptions, 'token'>) => Promise<unknown>;

const SendContext = createContext<Send | null>(null);

/** Client errors other than timeouts and rate limits will not change on retry. */
function retryable(error: unknown): boolean {
  if (!isApiError(error)) return true;
  if (error.status === 408 || error.status === 429) return true;
  return error.status === 0 || error.status >= 500;
}

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

  const swrConfig = useMemo<SWRConfiguration>(
    () => ({
      fetcher: (key: string) => send(key),
      shouldRetryOnError: retryable,
      errorRetryCount: 3,
    }),
    [send],
  );

  return (
    <SendContext.Provider value={send}>
      <SWRConfig value={swrConfig}>
        <ForgetOnUserChange />
        {children}
      </SWRConfig>
    </SendContext.Provider>
  );
}

/** Answers cached for one person must never show to the next one on this device. */
function ForgetOnUserChange() {
  const { user } = useSession();
  const { mutate } = useSWRConfig();
  const last = useRef(user?.id ?? null);
  useEffect(() => {
    const id = user?.id ?? null;
    if (id === last.current) return;
    last.current = id;
    void mutate(() => true, undefined, { revalidate: false });
  }, [user?.id, mutate]);
  return null;
}

export function useSend(): Send {
  const send = useContext(SendContext);
  if (!send) throw new Error('useSend must be used inside <ApiProvider> (app/_layout.tsx)');
  return send;
}

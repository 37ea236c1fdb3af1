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
import { createContext, useContext, useMemo, type ReactNode } from 'react';
import { SWRConfig, type SWRConfiguration } from 'swr';
import { useSession } from '@/src/session/SessionProvider';
import { ApiError, isApiError, request, requestRaw, type RawRequestOptions, type RequestOptions } from './client';
import { retryable } from './retry';

export type Send = (path: string, options?: Omit<RequestOptions, 'token'>) => Promise<unknown>;
/** The same, for uploads and downloads: resolves with the Response (client.ts requestRaw). */
export type SendRaw = (path: string, options?: Omit<RawRequestOptions, 'token'>) => Promise<Response>;

const SendContext = createContext<{ send: Send; sendRaw: SendRaw } | null>(null);

export function ApiProvider({ children }: { children: ReactNode }) {
  const { tokenRef, signOut, sessionSignal } = useSession();

  const value = useMemo(() => {
    /**
     * Runs one call with the current token; a 401 for that token ends the
     * session. Signed out, nothing is sent (it could only be refused), and a
     * call still running when the session ends is aborted.
     */
    async function withSession<T>(call: (token: string, signal: AbortSignal) => Promise<T>, own?: AbortSignal): Promise<T> {
      const token = tokenRef.current;
      if (!token) throw new ApiError(401, 'signed-out', 'Signed out: sign in again to go on.');
      const session = sessionSignal.current;
      const signal = own ? anySignal([own, session]) : session;
      try {
        return await call(token, signal);
      } catch (e) {
        if (isApiError(e) && e.status === 401 && token && token === tokenRef.current) signOut('expired');
        throw e;
      }
    }
    const send: Send = (path, options = {}) => withSession((token, signal) => request(path, { ...options, token, signal }), options.signal);
    const sendRaw: SendRaw = (path, options = {}) => withSession((token, signal) => requestRaw(path, { ...options, token, signal }), options.signal);
    return { send, sendRaw };
  }, [tokenRef, signOut, sessionSignal]);

  return <SendContext.Provider value={value}>{children}</SendContext.Provider>;
}

/** A signal aborted when any of `signals` is (AbortSignal.any where the platform has it). */
function anySignal(signals: AbortSignal[]): AbortSignal {
  if (typeof AbortSignal.any === 'function') return AbortSignal.any(signals);
  const both = new AbortController();
  for (const s of signals) {
    if (s.aborted) both.abort();
    else s.addEventListener('abort', () => both.abort(), { once: true });
  }
  return both.signal;
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

function useSendContext() {
  const value = useContext(SendContext);
  if (!value) throw new Error('useSend must be used inside <ApiProvider> (app/_layout.tsx)');
  return value;
}

export function useSend(): Send {
  return useSendContext().send;
}

/** For uploads and downloads; the same token, errors and 401 handling as useSend. */
export function useSendRaw(): SendRaw {
  return useSendContext().sendRaw;
}

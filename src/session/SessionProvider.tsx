/**
 * Who is signed in. The token is kept with AsyncStorage (localStorage on the
 * web) so a reload keeps the person signed in; until the stored record has
 * been read the status is `restoring`, and routing waits for it.
 */
import AsyncStorage from '@react-native-async-storage/async-storage';
import { createContext, useCallback, useContext, useEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import type { User } from '@/src/api/schemas';
import { readPersistedSession, SESSION_STORAGE_KEY, writePersistedSession } from './persisted';

export type SessionStatus = 'restoring' | 'signedOut' | 'signedIn';

export interface Session {
  status: SessionStatus;
  token: string | null;
  user: User | null;
  signIn: (token: string, user: User) => void;
  /** Forget the token; `reason` is kept for the sign-in screen's wording. */
  signOut: (reason?: SignOutReason) => void;
  /** Keep the stored user in step with what /api/auth/me says (role changes). */
  replaceUser: (user: User) => void;
  /** Why the last session ended, until the next sign-in. */
  lastSignOut: SignOutReason | null;
  /** The current token, readable without re-rendering (for fetchers). */
  tokenRef: { readonly current: string | null };
  /** Aborted when this session ends, so no request of it is answered after sign-out. */
  sessionSignal: { readonly current: AbortSignal };
}

export type SignOutReason = 'chosen' | 'expired';

const SessionContext = createContext<Session | null>(null);

interface State {
  status: SessionStatus;
  token: string | null;
  user: User | null;
  lastSignOut: SignOutReason | null;
}

function persist(token: string | null, user: User | null): void {
  const write = token && user
    ? AsyncStorage.setItem(SESSION_STORAGE_KEY, writePersistedSession({ version: 1, token, user }))
    : AsyncStorage.removeItem(SESSION_STORAGE_KEY);
  // Storage failing (private browsing quota) only costs surviving a reload.
  write.catch((e: unknown) => console.warn('Headwater: could not store the session', e));
}

export function SessionProvider({ children }: { children: ReactNode }) {
  const [state, setState] = useState<State>({ status: 'restoring', token: null, user: null, lastSignOut: null });
  const tokenRef = useRef<string | null>(null);
  const abortRef = useRef(new AbortController());
  const sessionSignal = useMemo(() => ({ get current() { return abortRef.current.signal; } }), []);

  useEffect(() => {
    let live = true;
    void AsyncStorage.getItem(SESSION_STORAGE_KEY)
      .catch(() => null)
      .then((raw) => {
        if (!live) return;
        const stored = readPersistedSession(raw);
        tokenRef.current = stored.token;
        setState((s) =>
          s.status !== 'restoring'
            ? s
            : stored.token && stored.user
              ? { status: 'signedIn', token: stored.token, user: stored.user, lastSignOut: null }
              : { status: 'signedOut', token: null, user: null, lastSignOut: null },
        );
      });
    return () => {
      live = false;
    };
  }, []);

  const signIn = useCallback((token: string, user: User) => {
    abortRef.current.abort();
    abortRef.current = new AbortController();
    tokenRef.current = token;
    setState({ status: 'signedIn', token, user, lastSignOut: null });
    persist(token, user);
  }, []);

  const signOut = useCallback((reason: SignOutReason = 'chosen') => {
    // Requests still on their way belong to the ended session: stop them, so none is answered with a 401.
    abortRef.current.abort();
    abortRef.current = new AbortController();
    tokenRef.current = null;
    setState({ status: 'signedOut', token: null, user: null, lastSignOut: reason });
    persist(null, null);
  }, []);

  const replaceUser = useCallback((user: User) => {
    setState((s) => {
      if (s.status !== 'signedIn' || !s.token) return s;
      const same = s.user && s.user.id === user.id && s.user.email === user.email && s.user.name === user.name && s.user.role === user.role;
      if (same) return s;
      persist(s.token, user);
      return { ...s, user };
    });
  }, []);

  const value = useMemo<Session>(
    () => ({ ...state, signIn, signOut, replaceUser, tokenRef, sessionSignal }),
    [state, signIn, signOut, replaceUser, sessionSignal],
  );
  return <SessionContext.Provider value={value}>{children}</SessionContext.Provider>;
}

export function useSession(): Session {
  const session = useContext(SessionContext);
  if (!session) throw new Error('useSession must be used inside <SessionProvider> (app/_layout.tsx)');
  return session;
}

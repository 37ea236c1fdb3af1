/**
 * Keeps the offline copy of the network (copyStore.ts) in step with the
 * server while there is a connection, and tells screens whether the browser
 * is online. Mounted once inside the signed-in shell.
 *
 * The copy is fetched in the background (GET /api/network/export) when the
 * server's network version differs from the stored one, at most once every
 * few minutes while edits keep moving the version: a phone on a weak signal
 * should not download the whole network after every edit. The copy always
 * says which version it is and when it was fetched.
 *
 * The stored copy is not read when the page starts, unless the browser is
 * offline then: at 20,000 sites it is a 26 MB text, and reading it back from
 * IndexedDB cost a returning visitor about 0.1 s (wide) and 0.25 s (phone)
 * of the diagram's first draw (scripts/bench-browser-diagram.ts, means of two
 * runs with and without a stored copy). It is read once the page has settled (whenSettled.ts), as
 * soon as the browser goes offline, or when a screen's request finds no
 * connection (`storedCopy`, which useCopyFallback awaits).
 */
import { createContext, useCallback, useContext, useEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import { api } from '@/shared/api';
import { useSendRaw } from '@/src/api/ApiProvider';
import { useSummary } from '@/src/api/queries/summary';
import { useSession } from '@/src/session/SessionProvider';
import { clearCopy, makeCopy, offlineCopySupported, readCopy, writeCopy, type OfflineCopy } from './copyStore';
import { browserOffline } from './online';
import { laterWhenIdle, whenSettled } from './whenSettled';

/** Our choice (common practice, no source): a fresh copy at most every 5 minutes once one exists. */
const MIN_REFRESH_MS = 5 * 60_000;
/** After a failed fetch (our choice): soon enough to have a copy before the signal goes, rare enough not to hammer a weak link. */
const RETRY_MS = 15_000;
/** Our choice: a screen's own requests go first; the copy (megabytes on a national network) follows a few seconds later, when the page is idle. */
const FETCH_DELAY_MS = 3_000;

export interface OfflineState {
  supported: boolean;
  /** the browser says it has a connection (navigator.onLine) */
  online: boolean;
  copy: OfflineCopy | null;
  /** a stored copy was unreadable and was thrown away */
  discarded: boolean;
  /** the stored copy, read now if it has not been yet (null: none, or unreadable) */
  storedCopy: () => Promise<OfflineCopy | null>;
}

const noCopy = () => Promise.resolve(null);
const OfflineContext = createContext<OfflineState>({ supported: false, online: true, copy: null, discarded: false, storedCopy: noCopy });

export function useOffline(): OfflineState {
  return useContext(OfflineContext);
}

/** Follows browserOffline() (online.ts, the one reading of navigator.onLine) as the browser's events change it. */
function useBrowserOnline(): boolean {
  const [online, setOnline] = useState(() => !browserOffline());
  useEffect(() => {
    if (typeof window === 'undefined' || !window.addEventListener) return;
    const update = () => setOnline(!browserOffline());
    window.addEventListener('online', update);
    window.addEventListener('offline', update);
    return () => {
      window.removeEventListener('online', update);
      window.removeEventListener('offline', update);
    };
  }, []);
  return online;
}

export function OfflineProvider({ children }: { children: ReactNode }) {
  const supported = offlineCopySupported();
  const online = useBrowserOnline();
  const session = useSession();
  const sendRaw = useSendRaw();
  const summary = useSummary();
  const [copy, setCopy] = useState<OfflineCopy | null>(null);
  const [discarded, setDiscarded] = useState(false);
  const [read, setRead] = useState(false);
  const fetching = useRef(false);
  const lastFetch = useRef(0);
  // A failed fetch is tried again after a pause (the version alone would not change to prompt it).
  const [attempt, setAttempt] = useState(0);

  const live = useRef(true);
  useEffect(() => {
    live.current = true;
    return () => {
      live.current = false;
    };
  }, []);
  // One read of the store per page; later copies come from refresh below.
  const reading = useRef<Promise<OfflineCopy | null> | null>(null);
  const storedCopy = useCallback((): Promise<OfflineCopy | null> => {
    if (!supported) return noCopy();
    reading.current ??= readCopy()
      .then((r) => {
        if (live.current) {
          setCopy(r.copy);
          if (!r.copy) setDiscarded(r.discarded);
        }
        return r.copy;
      })
      .catch(() => null)
      .finally(() => {
        if (live.current) setRead(true);
      });
    return reading.current;
  }, [supported]);

  useEffect(() => {
    if (!supported) return;
    if (browserOffline()) {
      void storedCopy();
      return;
    }
    return whenSettled(() => void storedCopy());
  }, [supported, storedCopy]);
  useEffect(() => {
    if (!online) void storedCopy();
  }, [online, storedCopy]);

  // A chosen sign-out takes the copy with it: the next person on this device signs in afresh.
  useEffect(() => {
    if (supported && session.status === 'signedOut' && session.lastSignOut === 'chosen') void clearCopy();
  }, [supported, session.status, session.lastSignOut]);

  const refresh = useCallback(async () => {
    if (fetching.current) return;
    fetching.current = true;
    lastFetch.current = Date.now();
    try {
      const res = await sendRaw(api.exportNetwork);
      const version = Number(res.headers.get('X-Network-Version'));
      // Kept as text, parsed only when used offline (copyStore.ts): parsing it here would hold the page for seconds.
      const text = await res.text();
      if (!Number.isInteger(version) || version < 0 || !text.startsWith('{')) throw new Error('the export answer is not a network document');
      const next = makeCopy({ networkVersion: version, fetchedAt: new Date().toISOString(), text });
      await writeCopy(next);
      setCopy(next);
      setDiscarded(false);
    } catch {
      // No copy this time (no connection, or an answer that did not check out): try again in a while.
      lastFetch.current = 0;
      setTimeout(() => setAttempt((n) => n + 1), RETRY_MS);
    } finally {
      fetching.current = false;
    }
  }, [sendRaw]);

  const serverVersion = typeof summary.data?.networkVersion === 'number' ? summary.data.networkVersion : null;
  useEffect(() => {
    if (!supported || !read || !online || serverVersion === null) return;
    if (copy && copy.networkVersion === serverVersion) return;
    if (copy && Date.now() - lastFetch.current < MIN_REFRESH_MS) return;
    // After the delay, when the page is next idle (the screen drawn, no input being handled), at most 10 s later.
    return laterWhenIdle(() => void refresh(), FETCH_DELAY_MS, 10_000);
  }, [supported, read, online, serverVersion, copy, refresh, attempt]);

  const value = useMemo(() => ({ supported, online, copy, discarded, storedCopy }), [supported, online, copy, discarded, storedCopy]);
  return <OfflineContext.Provider value={value}>{children}</OfflineContext.Provider>;
}

/**
 * A route's screen taken from the deferred chunk (deferred.tsx): the route
 * file stays a few lines, and its script is fetched the first time any of
 * those screens opens (the service worker keeps it for offline use).
 */
import { lazy, Suspense, type ComponentType } from 'react';
import { LoadingState } from '@/src/components/states';

type Deferred = typeof import('./deferred');

// One promise for the chunk, so every route waits on the same download.
let chunk: Promise<Deferred> | null = null;
const loadDeferred = () => (chunk ??= import('./deferred').catch((e: unknown) => {
  chunk = null; // a failed download (connection lost) is tried again next time
  throw e;
}));

/**
 * Starts the chunk's download without waiting for a route to ask: a page
 * opened straight on a deferred screen (a shared link, a reload) then fetches
 * it beside the rest of start-up rather than after it.
 */
export function preloadDeferredScreens(): void {
  loadDeferred().catch(() => {
    // retried when a route asks for it
  });
}

export function deferredScreen<P extends object>(pick: (screens: Deferred) => ComponentType<P>): ComponentType<P> {
  const Screen = lazy(() => loadDeferred().then((screens) => ({ default: pick(screens) })));
  function DeferredScreen(props: P) {
    return (
      <Suspense fallback={<LoadingState what="this page" testID="page-loading" />}>
        <Screen {...props} />
      </Suspense>
    );
  }
  return DeferredScreen;
}

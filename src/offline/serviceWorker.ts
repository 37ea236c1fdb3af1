/**
 * Registers the service worker written by scripts/build-sw.ts, so the app
 * shell opens with no connection. Only in the exported web app: a development
 * server has no sw.js, and a phone build has no service workers.
 * Browsers allow service workers on https:// and on localhost only; served
 * over plain HTTP on a LAN address the app works as before, without offline.
 *
 * Not at once: a first install copies every file of the app (some 2.3 MB)
 * and the browser compiles each script for its cache, on the same two cores
 * as the screen being opened. Registered straight away from the sign-in
 * screen, that install overlapped the next screen's first load and held the
 * 20,000-site diagram's first draw back by about 0.4 s (means of runs with
 * the worker and with service workers blocked, scripts/bench-browser-diagram.ts).
 * So it waits (whenSettled.ts): the page's load, 3 s more, then the
 * browser's next idle moment (at most 5 s later). A page left sooner
 * registers nothing; the next one starts again. A returning visitor's
 * worker already answers; its update check waits the same way.
 */
import { Platform } from 'react-native';
import { whenSettled } from './whenSettled';

export function registerServiceWorker(): (() => void) | undefined {
  if (Platform.OS !== 'web' || process.env.NODE_ENV !== 'production') return undefined;
  if (typeof navigator === 'undefined' || !('serviceWorker' in navigator) || !window.isSecureContext) return undefined;
  return whenSettled(() => {
    void import('workbox-window')
      .then(({ Workbox }) => new Workbox('/sw.js').register())
      .catch(() => undefined);
  });
}

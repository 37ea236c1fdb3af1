/**
 * Registers the service worker written by scripts/build-sw.ts, so the app
 * shell opens with no connection. Only in the exported web app: a development
 * server has no sw.js, and a phone build has no service workers.
 * Browsers allow service workers on https:// and on localhost only; served
 * over plain HTTP on a LAN address the app works as before, without offline.
 */
import { Platform } from 'react-native';

export function registerServiceWorker(): void {
  if (Platform.OS !== 'web' || process.env.NODE_ENV !== 'production') return;
  if (typeof navigator === 'undefined' || !('serviceWorker' in navigator) || !window.isSecureContext) return;
  void import('workbox-window')
    .then(({ Workbox }) => new Workbox('/sw.js').register())
    .catch(() => undefined);
}

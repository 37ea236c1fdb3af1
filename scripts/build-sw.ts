/**
 * Writes the web app's service worker (dist/web/sw.js) after the export, with
 * workbox-build: every file of the app shell is precached, and a navigation
 * to any route of the app is answered with index.html from that cache when
 * there is no connection. API requests are never cached by the worker: the
 * offline copy of the network is the app's own (src/offline/README.md).
 */
import path from 'node:path';
import { generateSW } from 'workbox-build';
import { WEB_DIR } from './lib/webBuild';

async function main() {
  const { count, size, warnings } = await generateSW({
    globDirectory: WEB_DIR,
    globPatterns: ['**/*.{html,js,css,ttf,otf,woff2,png,svg,ico,json}'],
    globIgnores: ['sw.js', 'workbox-*.js', 'metadata.json'],
    swDest: path.join(WEB_DIR, 'sw.js'),
    navigateFallback: '/index.html',
    navigateFallbackDenylist: [/^\/api\//],
    // The app's script is one large file as exported; it must fit the precache.
    maximumFileSizeToCacheInBytes: 16 * 1024 * 1024,
    // Expo's export names script files by their content hash, so they never need revalidating.
    dontCacheBustURLsMatching: /\/_expo\/static\//,
    skipWaiting: true,
    clientsClaim: true,
    cleanupOutdatedCaches: true,
    sourcemap: false,
    mode: 'production',
  });
  for (const w of warnings) console.warn(`service worker: ${w}`);
  console.log(`service worker: ${count} files precached (${(size / 1024 / 1024).toFixed(1)} MB)`);
}

main().catch((e) => {
  console.error(`service worker: ${(e as Error).message}`);
  process.exit(1);
});

/** Build the web export (always, or only when stale with --if-stale). */
import { ensureWebBuild } from './lib/webBuild';

try {
  const { built, ms } = ensureWebBuild({ force: !process.argv.includes('--if-stale') });
  console.log(built ? `web app built in ${(ms / 1000).toFixed(1)} s` : 'web app is up to date');
} catch (e) {
  console.error((e as Error).message);
  process.exit(1);
}

/**
 * The static checks `npm test` runs before any suite: the type checker over
 * the whole tree, then ESLint (eslint.config.mjs). Each prints its own errors.
 */
import { spawnSync } from 'node:child_process';
import { REPO_ROOT } from './postgres';

function run(label: string, args: string[]): boolean {
  console.log(`\n=== ${label} ===`);
  const t0 = Date.now();
  const r = spawnSync('npx', args, { cwd: REPO_ROOT, stdio: 'inherit' });
  const ok = r.status === 0;
  console.log(`=== ${label}: ${ok ? 'clean' : 'errors'} in ${((Date.now() - t0) / 1000).toFixed(1)} s ===`);
  return ok;
}

/** true when the types check and ESLint reports no error. Both run even when the first fails. */
export function runStaticChecks(): boolean {
  const types = run('types (tsc --noEmit)', ['tsc', '--noEmit']);
  const lint = run('lint (eslint)', ['eslint', '.']);
  return types && lint;
}

/**
 * The static checks `npm test` runs before any suite: Expo Router's route
 * types, the type checker over the whole tree, then ESLint (eslint.config.mjs).
 * Each prints its own errors.
 */
import { spawnSync } from 'node:child_process';
import { REPO_ROOT } from './postgres';

function run(label: string, args: string[], env: Record<string, string> = {}): boolean {
  console.log(`\n=== ${label} ===`);
  const t0 = Date.now();
  const r = spawnSync('npx', args, { cwd: REPO_ROOT, stdio: 'inherit', env: { ...process.env, ...env } });
  const ok = r.status === 0;
  console.log(`=== ${label}: ${ok ? 'clean' : 'errors'} in ${((Date.now() - t0) / 1000).toFixed(1)} s ===`);
  return ok;
}

/**
 * Typed routes (app.json experiments.typedRoutes): Expo writes the route types
 * into .expo/types/router.d.ts and expo-env.d.ts, both ignored by git as Expo
 * intends. The dev server writes them on start; `expo customize tsconfig.json`
 * writes them without one (it leaves this tsconfig.json as it is).
 */
export function generateRouteTypes(): boolean {
  return run('route types (expo customize tsconfig.json)', ['expo', 'customize', 'tsconfig.json'], { CI: '1', EXPO_OFFLINE: '1', EXPO_NO_TELEMETRY: '1' });
}

export const typecheck = () => generateRouteTypes() && run('types (tsc --noEmit)', ['tsc', '--noEmit']);

/** true when the types check and ESLint reports no error. Both run even when the first fails. */
export function runStaticChecks(): boolean {
  const types = typecheck();
  const lint = run('lint (eslint)', ['eslint', '.']);
  return types && lint;
}

/**
 * npm test: first what the suite needs from Debian (installed when missing,
 * scripts/lib/debian.ts), then the static checks (tsc, ESLint), then the
 * suite in three stages, in order: unit, API against a real PostgreSQL, then
 * the browser end-to-end tests against the web export.
 * Ends with one plain summary line ("N passed, N failed").
 * `npm test -- unit api` runs only those stages (the static checks always run).
 */
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { ensureDebianPackages, type DebianPackage } from './lib/debian';
import { REPO_ROOT } from './lib/postgres';
import { runStaticChecks } from './lib/staticChecks';

const OUT = path.join(REPO_ROOT, 'artifacts');
fs.mkdirSync(OUT, { recursive: true });

interface Stage {
  name: string;
  env?: Record<string, string>;
  /** what the stage needs from the operating system */
  needs: DebianPackage[];
}
const only = process.argv.slice(2);
const allStages: Stage[] = [
  // networkx is the outside reference for the engine's dominators (test/helpers/networkx.ts)
  { name: 'unit', needs: ['python3-networkx'] },
  { name: 'api', needs: ['postgresql'] },
  { name: 'e2e', env: { HEADWATER_TEST_DB: 'headwater_e2e' }, needs: ['postgresql', 'chromium'] },
];
const stages = allStages.filter((s) => only.length === 0 || only.includes(s.name));

try {
  ensureDebianPackages(stages.flatMap((s) => s.needs), 'npm test');
} catch (e) {
  console.error(`\nnpm test cannot start: ${(e as Error).message}`);
  process.exit(1);
}
// In CI a missing networkx fails the cross-check instead of skipping it.
const ciEnv: Record<string, string> = process.env.CI && process.env.CI !== 'false' ? { HEADWATER_REQUIRE_NETWORKX: '1' } : {};

if (!runStaticChecks()) {
  console.error('\nnpm test stopped: fix the type or lint errors above first');
  process.exit(1);
}

let passed = 0;
let failed = 0;
let skipped = 0;
let broken = false;
const t0 = Date.now();
for (const stage of stages) {
  const report = path.join(OUT, `vitest-${stage.name}.json`);
  fs.rmSync(report, { force: true });
  console.log(`\n=== ${stage.name} tests ===`);
  const s0 = Date.now();
  const r = spawnSync('npx', ['vitest', 'run', '--project', stage.name, '--reporter=default', '--reporter=json', `--outputFile.json=${report}`], {
    cwd: REPO_ROOT,
    stdio: 'inherit',
    env: { ...process.env, ...ciEnv, ...stage.env },
  });
  if (fs.existsSync(report)) {
    const j = JSON.parse(fs.readFileSync(report, 'utf8'));
    passed += j.numPassedTests ?? 0;
    // a suite that fails outside any test (a hook, an import) counts as one failure
    failed += (j.numFailedTests ?? 0) || (j.numFailedTestSuites ?? 0);
    skipped += (j.numPendingTests ?? 0) + (j.numTodoTests ?? 0);
    if ((j.numTotalTestSuites ?? 0) > 0 && j.numTotalTests === 0) broken = true;
  } else {
    broken = true;
  }
  if (r.status !== 0) broken = true;
  console.log(`=== ${stage.name}: ${((Date.now() - s0) / 1000).toFixed(1)} s ===`);
}
console.log(`\nwhole suite: ${((Date.now() - t0) / 1000).toFixed(1)} s`);
console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}`);
process.exit(broken || failed > 0 ? 1 : 0);

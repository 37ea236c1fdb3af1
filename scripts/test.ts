/**
 * npm test: the whole suite in three stages, in order: unit, API against a
 * real PostgreSQL, then the browser end-to-end tests against the web export.
 * Ends with one plain summary line ("N passed, N failed").
 */
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { REPO_ROOT } from './lib/postgres';

const OUT = path.join(REPO_ROOT, 'artifacts');
fs.mkdirSync(OUT, { recursive: true });

interface Stage {
  name: string;
  env?: Record<string, string>;
}
const only = process.argv.slice(2);
const stages: Stage[] = [
  { name: 'unit' },
  { name: 'api' },
  { name: 'e2e', env: { HEADWATER_TEST_DB: 'headwater_e2e' } },
].filter((s) => only.length === 0 || only.includes(s.name));

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
    env: { ...process.env, ...stage.env },
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

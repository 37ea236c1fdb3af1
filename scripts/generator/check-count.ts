/**
 * Counts the failed feed checks of a generated network, by check, and times
 * the generation: the figure to watch when changing the generator.
 *   npx tsx scripts/generator/check-count.ts [sites] [seed] [faultShare]   (default 20000 7 0.02)
 * The failures are those GET /api/checks lists (server/checks/networkChecks.ts).
 */
import { networkCheckFailures } from '@/server/checks/networkChecks';
import { generateNetwork } from './index';

function main(argv: string[]): void {
  const sites = Number(argv[0] ?? 20000);
  const seed = Number(argv[1] ?? 7);
  const faultShare = argv[2] === undefined ? undefined : Number(argv[2]);
  const cpu = process.cpuUsage();
  const started = performance.now();
  const doc = generateNetwork({ sites, seed, faultShare });
  const wallMs = performance.now() - started;
  const used = process.cpuUsage(cpu);
  const { failures } = networkCheckFailures(doc);
  const byCheck = new Map<string, number>();
  for (const f of failures) byCheck.set(f.check.name, (byCheck.get(f.check.name) ?? 0) + 1);
  const offAir = doc.feeds.filter((f) => f.medium === 'off-air').length;
  console.log(`${sites} sites (seed ${seed}): ${doc.carriages.length} carriages, ${doc.feeds.length} feeds (${offAir} off-air)`);
  console.log(`  generated in ${wallMs.toFixed(0)} ms wall, ${((used.user + used.system) / 1000).toFixed(0)} ms CPU`);
  console.log(`  failed checks: ${failures.length}`);
  for (const [name, n] of [...byCheck].sort((a, b) => b[1] - a[1])) console.log(`    ${name}: ${n}`);
}

main(process.argv.slice(2));

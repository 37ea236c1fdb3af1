/**
 * Measures the generator and the import validation at several sizes:
 *   npx tsx scripts/generator/bench.ts [sizes...]   (default 1000 5000 20000 50000)
 * Each size is generated and validated `RUNS` times in this process after one
 * warm-up run; the report gives the median and the worst of the runs, as wall
 * time and as CPU time of this process (less disturbed by other load).
 */
import { validateDocument } from '@/server/interchange/validate';
import { documentToCsv } from '@/server/interchange/csv';
import { validateCsvFiles } from '@/server/interchange/upload';
import { generateNetwork } from './index';

const RUNS = 3;

/** Wall time, and this process's CPU time (user + system) which other load on the machine disturbs less. */
function time<T>(fn: () => T): { ms: number; cpuMs: number; value: T } {
  const cpu = process.cpuUsage();
  const started = performance.now();
  const value = fn();
  const used = process.cpuUsage(cpu);
  return { ms: performance.now() - started, cpuMs: (used.user + used.system) / 1000, value };
}

function summary(samples: number[]): string {
  const sorted = [...samples].sort((a, b) => a - b);
  return `median ${sorted[Math.floor(sorted.length / 2)].toFixed(0)} ms, worst ${sorted[sorted.length - 1].toFixed(0)} ms`;
}

function bench(sites: number): void {
  generateNetwork({ sites, seed: 1 });
  const generate: number[] = [];
  const validate: number[] = [];
  const generateCpu: number[] = [];
  const validateCpu: number[] = [];
  let doc = generateNetwork({ sites, seed: 7 });
  for (let i = 0; i < RUNS; i++) {
    const g = time(() => generateNetwork({ sites, seed: 7 }));
    generate.push(g.ms);
    generateCpu.push(g.cpuMs);
    doc = g.value;
    const v = time(() => validateDocument(doc));
    validate.push(v.ms);
    validateCpu.push(v.cpuMs);
    if (v.value.errors.length > 0) throw new Error(`generated network of ${sites} sites has ${v.value.errors.length} errors: ${v.value.errors[0].message}`);
  }
  const csv = time(() => documentToCsv(doc));
  const files = Object.entries(csv.value).map(([name, text]) => ({ name, text }));
  const csvRead = time(() => validateCsvFiles(files));
  const entities = doc.sites.length + doc.services.length + doc.groups.length + doc.carriages.length + doc.feeds.length;
  console.log(
    [
      `${sites} sites: ${doc.carriages.length} carriages, ${doc.feeds.length} feeds, ${doc.groups.length} groups, ${entities} entities`,
      `  carriages + feeds ${doc.carriages.length + doc.feeds.length}, JSON ${(JSON.stringify(doc).length / 1e6).toFixed(1)} MB`,
      `  generate: wall ${summary(generate)}; CPU ${summary(generateCpu)}`,
      `  validate: wall ${summary(validate)}; CPU ${summary(validateCpu)}`,
      `  CSV write wall ${csv.ms.toFixed(0)} ms, CPU ${csv.cpuMs.toFixed(0)} ms; CSV read + validate wall ${csvRead.ms.toFixed(0)} ms, CPU ${csvRead.cpuMs.toFixed(0)} ms`,
    ].join('\n'),
  );
}

const sizes = process.argv.slice(2).map(Number);
for (const sites of sizes.length > 0 ? sizes : [1000, 5000, 20000, 50000]) bench(sites);

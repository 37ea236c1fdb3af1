/**
 * Import benchmark: generated networks (scripts/generator, the same
 * generator as `npm run gen`) imported into an empty database through the
 * importer, as the route calls it. For each size it reports the wall time
 * of the import (`importMs`) and the event-loop delay while it ran,
 * measured with perf_hooks.monitorEventLoopDelay (`eventLoopP99Ms`,
 * `eventLoopMaxMs`): how long another request could have waited. The
 * import's own stage times come from its progress reports.
 *
 *   npx tsx scripts/bench-import.ts [--out FILE] [sites ...]     (default 20000 100000)
 *
 * Uses the local cluster's database `headwater_bench_import` (fsync on, as
 * `npm start` runs it), dropped and made again for each size, so every
 * import lands in an empty network. Prints one JSON document; --out also
 * writes it to FILE.
 */
import fs from 'node:fs';
import os from 'node:os';
import { monitorEventLoopDelay } from 'node:perf_hooks';
import { openDatabase } from '@/server/db';
import { importNetwork } from '@/server/services/importer';
import type { ImportStage } from '@/shared/schemas/import';
import { generateNetwork } from './generator';
import { resolveDatabaseUrl } from './lib/postgres';

const SEED = 7;

interface SizeResult {
  sites: number;
  records: number;
  importMs: number;
  eventLoopP99Ms: number;
  eventLoopMaxMs: number;
  stagesMs: Partial<Record<ImportStage, number>>;
  loadAverageAtStart: number;
}

async function benchOne(sites: number): Promise<SizeResult> {
  const { url } = await resolveDatabaseUrl('headwater_bench_import', { fresh: true });
  const db = openDatabase(url);
  try {
    await db.migrate();
    const doc = generateNetwork({ sites, seed: SEED });
    const records = doc.sites.length + doc.services.length + doc.groups.length + doc.carriages.length + doc.feeds.length;
    const stagesMs: Partial<Record<ImportStage, number>> = {};
    let stage: ImportStage | undefined;
    let stageStart = 0;
    const delay = monitorEventLoopDelay({ resolution: 10 });
    const loadAverageAtStart = os.loadavg()[0];
    delay.enable();
    const t0 = performance.now();
    const report = await importNetwork(db, doc, {
      actor: { email: 'bench' },
      onProgress: (p) => {
        if (p.stage === stage) return;
        const now = performance.now();
        if (stage) stagesMs[stage] = Math.round(now - stageStart);
        stage = p.stage;
        stageStart = now;
      },
    });
    const importMs = performance.now() - t0;
    delay.disable();
    if (stage) stagesMs[stage] = Math.round(performance.now() - stageStart);
    if (!report.ok) throw new Error(`import failed: ${report.errors.slice(0, 3).map((e) => e.message).join('; ')}`);
    if (report.counts.feeds.created !== doc.feeds.length) throw new Error('not every feed was created');
    const result = {
      sites,
      records,
      importMs: Math.round(importMs),
      eventLoopP99Ms: Math.round(delay.percentile(99) / 1e6),
      eventLoopMaxMs: Math.round(delay.max / 1e6),
      stagesMs,
      loadAverageAtStart: Number(loadAverageAtStart.toFixed(2)),
    };
    console.error(JSON.stringify(result));
    return result;
  } finally {
    await db.close();
  }
}

async function main() {
  const args = process.argv.slice(2);
  const outAt = args.indexOf('--out');
  const out = outAt >= 0 ? args[outAt + 1] : undefined;
  const sizes = args.filter((_, i) => outAt < 0 || (i !== outAt && i !== outAt + 1)).map(Number);
  const results: SizeResult[] = [];
  for (const sites of sizes.length > 0 ? sizes : [20000, 100000]) {
    if (!Number.isInteger(sites) || sites < 1) throw new Error(`a size is a whole number of sites (got ${sites})`);
    results.push(await benchOne(sites));
  }
  const json = JSON.stringify({ at: new Date().toISOString(), cpus: os.cpus().length, node: process.version, results }, null, 2);
  console.log(json);
  if (out) fs.writeFileSync(out, `${json}\n`);
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});

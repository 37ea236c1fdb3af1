/**
 * Import benchmark: generated networks of several sizes imported into an
 * empty database, then imported again (every entity unchanged), then once
 * more as a dry run. Reports wall time per step and the longest event-loop
 * stall seen during each (how long another request could have waited).
 *
 *   npx tsx scripts/bench-import.ts [sites ...]     (default 1000 5000 20000)
 *
 * Uses the local cluster's database `headwater_bench_import`, dropped and
 * made again for each size, so every first import lands in an empty network.
 */
import fs from 'node:fs';
import os from 'node:os';
import { monitorEventLoopDelay } from 'node:perf_hooks';
import { openDatabase, type Database } from '@/server/db';
import { importNetwork } from '@/server/services/importer';
import { generateNetwork } from './generator';
import { resolveDatabaseUrl } from './lib/postgres';

const SEED = 7;

/**
 * Wall time, this process's CPU time (PostgreSQL's own work is not in it),
 * the longest event-loop stall, and the 1-minute load average when the step
 * began: on a shared machine the wall time says as much about the neighbours.
 */
async function timed<T>(db: Database, label: string, run: () => Promise<T>): Promise<T> {
  const stalls = monitorEventLoopDelay({ resolution: 10 });
  stalls.enable();
  const load = os.loadavg()[0];
  const pg0 = await backendTicks(db);
  const cpu0 = process.cpuUsage();
  const t0 = performance.now();
  const out = await run();
  const ms = performance.now() - t0;
  const cpu = process.cpuUsage(cpu0);
  stalls.disable();
  const pg1 = await backendTicks(db);
  let pgTicks = 0;
  for (const [pid, ticks] of pg1) pgTicks += ticks - (pg0.get(pid) ?? 0);
  const pgCpu = Number.isNaN(pgTicks) ? 'n/a' : `${(pgTicks / TICKS_PER_SECOND).toFixed(2)} s`;
  console.log(
    `  ${label.padEnd(22)} ${(ms / 1000).toFixed(2).padStart(6)} s wall | CPU: node ${((cpu.user + cpu.system) / 1e6).toFixed(2)} s, PostgreSQL ${pgCpu}` +
      ` | longest event-loop stall ${(stalls.max / 1e6).toFixed(0)} ms | load ${load.toFixed(1)} on ${os.cpus().length} CPUs`,
  );
  return out;
}

// USER_HZ: 100 on Linux for every common architecture (proc(5), /proc/[pid]/stat fields 14-15).
const TICKS_PER_SECOND = 100;

/**
 * CPU ticks (user + system) of each PostgreSQL backend serving this database,
 * read from /proc: the server's share of the work. Approximate: a backend
 * that exits during a step takes its ticks with it. NaN where /proc cannot
 * be read (another OS, or a server on another machine).
 */
async function backendTicks(db: Database): Promise<Map<number, number>> {
  const [rows] = await db.sequelize.query('SELECT pid FROM pg_stat_activity WHERE datname = current_database()');
  const ticks = new Map<number, number>();
  for (const { pid } of rows as { pid: number }[]) {
    try {
      const stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
      const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
      ticks.set(pid, Number(fields[11]) + Number(fields[12]));
    } catch {
      ticks.set(pid, Number.NaN);
    }
  }
  return ticks;
}

async function benchOne(sites: number) {
  const { url } = await resolveDatabaseUrl('headwater_bench_import', { fresh: true });
  const db = openDatabase(url);
  try {
    await db.migrate();
    const t0 = performance.now();
    const doc = generateNetwork({ sites, seed: SEED });
    const rows =
      doc.sites.length + doc.services.length + doc.groups.length + doc.carriages.length + doc.feeds.length +
      doc.sites.reduce((n, s) => n + (s.groups?.length ?? 0), 0) +
      doc.feeds.reduce((n, f) => n + (f.via?.length ?? 0) + (f.groups?.length ?? 0), 0);
    console.log(
      `\n${sites} sites: ${doc.carriages.length} carriages, ${doc.feeds.length} feeds, ${rows} rows in all, ` +
        `${(JSON.stringify(doc).length / 1e6).toFixed(1)} MB as JSON (generated in ${((performance.now() - t0) / 1000).toFixed(2)} s)`,
    );
    const first = await timed(db, 'import (all created)', () => importNetwork(db, doc, { actor: { email: 'bench' } }));
    if (!first.ok) throw new Error(`import failed: ${first.errors.slice(0, 3).map((e) => e.message).join('; ')}`);
    if (first.counts.feeds.created !== doc.feeds.length) throw new Error('not every feed was created');
    const again = await timed(db, 'import (all unchanged)', () => importNetwork(db, doc, { actor: { email: 'bench' } }));
    if (again.counts.feeds.unchanged !== doc.feeds.length || again.networkVersion !== first.networkVersion) throw new Error('second import changed something');
    await timed(db, 'dry run', () => importNetwork(db, doc, { dryRun: true }));
  } finally {
    await db.close();
  }
}

async function main() {
  const sizes = process.argv.slice(2).map(Number);
  for (const sites of sizes.length > 0 ? sizes : [1000, 5000, 20000]) {
    if (!Number.isInteger(sites) || sites < 1) throw new Error(`a size is a whole number of sites (got ${sites})`);
    await benchOne(sites);
  }
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});

import { monitorEventLoopDelay } from 'node:perf_hooks';
import { generateNetwork } from './generator';
import { buildServedNetwork } from '@/server/services/servedNetwork';
import { diversityCsv, exposureGroupsCsv } from '@/server/services/analysisCsv';
async function main() {
  const m = buildServedNetwork(generateNetwork({ sites: Number(process.argv[2] ?? 20000), seed: 1 }) as never, 1);
  const e = m.engine;
  e.prepare('diversity', Infinity);
  e.exposureGroups();
  const ex = e.exposure();
  const groups = ex.elements.map((r) => ({ elements: [r.element], households: r.households, carriages: r.carriages }));
  const h = monitorEventLoopDelay({ resolution: 5 });
  h.enable();
  let t = performance.now();
  const a = await exposureGroupsCsv(m, { networkVersion: 1, groups });
  console.log('exposure csv', Math.round(performance.now() - t), a.length);
  const eg = e.exposureGroups();
  t = performance.now();
  const b = await exposureGroupsCsv(m, eg);
  console.log('groups csv', Math.round(performance.now() - t), b.length);
  t = performance.now();
  const c = await diversityCsv(m, e.diversity());
  console.log('diversity csv', Math.round(performance.now() - t), c.length);
  h.disable();
  console.log('loop delay max', Math.round(h.max / 1e6), 'p99', Math.round(h.percentile(99) / 1e6));
}
void main();

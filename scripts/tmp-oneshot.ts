import { monitorEventLoopDelay } from 'node:perf_hooks';
import { generateNetwork } from './generator';
import { NetworkEngine } from '@/server/engine/engine';
import { prepared, preparedExposureGroups, preparedSpof } from '@/server/services/prepared';
import { stringifyInTurns } from '@/server/services/stringifyInTurns';
async function main() {
  const sites = Number(process.argv[2] ?? 20000);
  const e = NetworkEngine.build(generateNetwork({ sites, seed: 1 }) as never, 1);
  const step = async (name: string, f: () => Promise<unknown>) => {
    const h = monitorEventLoopDelay({ resolution: 5 });
    h.enable();
    const t0 = performance.now();
    await f();
    h.disable();
    console.log(name, Math.round(performance.now() - t0), 'ms; loop delay max', Math.round(h.max / 1e6), 'p99', Math.round(h.percentile(99) / 1e6));
  };
  await step('prepared resilience', () => prepared(e, 'resilience'));
  await step('exposure groups', () => preparedExposureGroups(e, undefined));
  await step('spof', () => preparedSpof(e, undefined));
  await step('spof text', () => stringifyInTurns(e.spof()));
  await step('groups text', () => stringifyInTurns(e.exposureGroups()));
  await step('exposure (one piece) + text', () => stringifyInTurns(e.exposure()));
}
void main();

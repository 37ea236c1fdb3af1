/**
 * networkx's `immediate_dominators` (Cooper, Harvey & Kennedy's algorithm in
 * Python) as an outside reference for the engine's dominators, through a
 * python3 that has networkx: Debian's /usr/bin/python3 with python3-networkx
 * first, then whatever python3 is on PATH.
 */
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import type { Csr } from '@/server/engine/csr';

const SCRIPT = path.join(__dirname, 'networkx_dominators.py');
let found: { python: string; version: string } | null | undefined;

/** The python3 with networkx, and its networkx version; null when there is none. */
export function findNetworkxPython(): { python: string; version: string } | null {
  if (found !== undefined) return found;
  found = null;
  for (const python of ['/usr/bin/python3', 'python3']) {
    const r = spawnSync(python, [SCRIPT, '--probe'], { encoding: 'utf8', timeout: 30_000 });
    if (r.status === 0 && r.stdout.trim()) {
      found = { python, version: r.stdout.trim() };
      break;
    }
  }
  return found;
}

function graphText(g: Csr, root: number): string {
  const parts: string[] = [`${g.n} ${root} ${g.targets.length}`];
  for (let u = 0; u < g.n; u++) for (let i = g.offsets[u]; i < g.offsets[u + 1]; i++) parts.push(`${u} ${g.targets[i]}`);
  return parts.join('\n');
}

/**
 * networkx's immediate dominators of each graph (-1 for root and unreachable)
 * and the time networkx took on each; one python process for all of them.
 */
export function networkxImmediateDominatorsMany(graphs: { graph: Csr; root: number }[]): { idom: Int32Array; ms: number }[] {
  const py = findNetworkxPython();
  if (!py) throw new Error('no python3 with networkx found (tried /usr/bin/python3 and python3 on PATH)');
  const input = [String(graphs.length), ...graphs.map(({ graph, root }) => graphText(graph, root))].join('\n');
  const r = spawnSync(py.python, [SCRIPT], { input, encoding: 'utf8', maxBuffer: 1 << 30, timeout: 600_000 });
  if (r.status !== 0) throw new Error(`networkx script failed (${String(r.status)}): ${r.stderr}`);
  const out = JSON.parse(r.stdout) as { idom: number[]; ms: number }[];
  return out.map((a) => ({ idom: Int32Array.from(a.idom), ms: a.ms }));
}

/** networkx's immediate dominators of `g` from `root` (-1 for root and unreachable) and the time networkx took. */
export function networkxImmediateDominators(g: Csr, root: number): { idom: Int32Array; ms: number } {
  return networkxImmediateDominatorsMany([{ graph: g, root }])[0];
}

/** Milliseconds networkx spends in `immediate_dominators` on these graphs together; null without networkx. */
export function timeNetworkxDominators(graphs: { graph: Csr; root: number }[]): number | null {
  if (!findNetworkxPython()) return null;
  return networkxImmediateDominatorsMany(graphs).reduce((sum, a) => sum + a.ms, 0);
}

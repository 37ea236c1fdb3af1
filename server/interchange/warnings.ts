/**
 * Import warnings (docs/format.md): the import goes ahead,
 * but the network has a data problem worth a look.
 * - a feed loop with no origin upstream (docs/domain.md rule 3: such a loop never
 *   has programme), with the carriages starved downstream of it;
 * - a carriage with no feed at a site that is not an origin;
 * - a relay with no reserve feed into any of its carriages.
 * Linear in carriages + feeds: one breadth-first walk from the origins, then
 * strongly connected components (Tarjan 1972, iterative) among the carriages
 * the walk did not reach. A generator that pauses (yields `progress`
 * unchanged) when its turn is due (turns.ts): at 100,000 sites the passes
 * cover a million entries.
 */
import type { IssueSink } from './issues';
import type { Turns } from './turns';
import { refAt, type Entry, type NetworkView } from './view';

export function* findWarnings(view: NetworkView, sink: IssueSink, turns: Turns, progress = 0): Generator<number, void> {
  const carriages = [...view.byCode.carriages.values()];
  const n = carriages.length;
  const siteOf: (Entry | undefined)[] = new Array(n);
  for (let i = 0; i < n; i++) {
    const c = carriages[i];
    c.slot = i;
    const code = refAt(c.raw, 'site');
    const site = code === undefined ? undefined : view.byCode.sites.get(code);
    siteOf[i] = site;
    if (site) site.carriages = (site.carriages ?? 0) + 1;
    if (turns.due()) yield progress;
  }
  const slotOf = (code: string | undefined) => (code === undefined ? undefined : view.byCode.carriages.get(code)?.slot);

  const from: number[] = [];
  const to: number[] = [];
  for (const feed of view.byCode.feeds.values()) {
    const f = slotOf(refAt(feed.raw, 'from'));
    const t = slotOf(refAt(feed.raw, 'to'));
    if (f === undefined || t === undefined || f === t) continue;
    from.push(f);
    to.push(t);
    const site = siteOf[t];
    if (feed.raw.role === 'reserve' && site) site.hasReserve = true;
    if (turns.due()) yield progress;
  }
  const graph = compressedSparseRows(n, from, to);

  const reached = new Uint8Array(n);
  const queue = new Int32Array(n);
  let tail = 0;
  for (let i = 0; i < n; i++) {
    if (siteOf[i]?.raw.role === 'origin') {
      reached[i] = 1;
      queue[tail++] = i;
    }
  }
  for (let head = 0; head < tail; head++) {
    const u = queue[head];
    for (let e = graph.start[u]; e < graph.start[u + 1]; e++) {
      const v = graph.target[e];
      if (!reached[v]) {
        reached[v] = 1;
        queue[tail++] = v;
      }
    }
    if (turns.due()) yield progress;
  }

  yield* reportLoops(carriages, graph, reached, sink, turns, progress);

  for (let i = 0; i < n; i++) {
    if (turns.due()) yield progress;
    const entry = carriages[i];
    const site = siteOf[i];
    const role = site?.raw.role;
    if (entry.index < 0 || graph.indegree[i] > 0 || site === undefined || role === 'origin') continue;
    sink.warn('carriages', entry.index, refAt(entry.raw, 'code'), undefined, 'no-feed',
      `no feed comes into it, so it has no programme (site ${refAt(site.raw, 'code')} is a ${String(role)}, not an origin)`);
  }

  for (const site of view.byCode.sites.values()) {
    if (turns.due()) yield progress;
    const count = site.carriages ?? 0;
    if (site.index < 0 || site.raw.role !== 'relay' || count === 0 || site.hasReserve) continue;
    sink.warn('sites', site.index, refAt(site.raw, 'code'), undefined, 'no-reserve',
      `no reserve feed comes into any of its ${count} carriage${count === 1 ? '' : 's'}, so one failure upstream takes this relay off air`);
  }
}

interface Csr {
  start: Int32Array;
  target: Int32Array;
  indegree: Int32Array;
}

function compressedSparseRows(n: number, from: number[], to: number[]): Csr {
  const start = new Int32Array(n + 1);
  const indegree = new Int32Array(n);
  for (let e = 0; e < from.length; e++) {
    start[from[e] + 1]++;
    indegree[to[e]]++;
  }
  for (let i = 0; i < n; i++) start[i + 1] += start[i];
  const fill = start.slice(0, n);
  const target = new Int32Array(from.length);
  for (let e = 0; e < from.length; e++) target[fill[from[e]]++] = to[e];
  return { start, target, indegree };
}

/** One warning per loop (a strongly connected component of two or more unreached carriages). */
function* reportLoops(carriages: Entry[], graph: Csr, reached: Uint8Array, sink: IssueSink, turns: Turns, progress: number): Generator<number, void> {
  const n = carriages.length;
  const order = new Int32Array(n).fill(-1);
  const low = new Int32Array(n);
  const onStack = new Uint8Array(n);
  const stack = new Int32Array(n);
  const callNode = new Int32Array(n);
  const callEdge = new Int32Array(n);
  const claimed = new Uint8Array(n);
  let depth: number;
  let top = 0;
  let counter = 0;
  const loops: number[][] = [];

  for (let root = 0; root < n; root++) {
    if (turns.due()) yield progress;
    if (reached[root] || order[root] !== -1) continue;
    callNode[0] = root;
    callEdge[0] = graph.start[root];
    order[root] = low[root] = counter++;
    stack[top++] = root;
    onStack[root] = 1;
    depth = 1;
    while (depth > 0) {
      const u = callNode[depth - 1];
      const e = callEdge[depth - 1];
      if (e < graph.start[u + 1]) {
        callEdge[depth - 1] = e + 1;
        const v = graph.target[e];
        if (reached[v]) continue;
        if (order[v] === -1) {
          order[v] = low[v] = counter++;
          stack[top++] = v;
          onStack[v] = 1;
          callNode[depth] = v;
          callEdge[depth] = graph.start[v];
          depth++;
        } else if (onStack[v]) {
          low[u] = Math.min(low[u], order[v]);
        }
        continue;
      }
      depth--;
      if (depth > 0) {
        const parent = callNode[depth - 1];
        low[parent] = Math.min(low[parent], low[u]);
      }
      if (low[u] === order[u]) {
        const members: number[] = [];
        let w: number;
        do {
          w = stack[--top];
          onStack[w] = 0;
          members.push(w);
        } while (w !== u);
        if (members.length > 1) loops.push(members);
      }
    }
  }

  for (const members of loops) for (const m of members) claimed[m] = 1;
  for (const members of loops) {
    const downstream = claimDownstream(members, graph, reached, claimed);
    const inDocument = members.filter((m) => carriages[m].index >= 0);
    if (inDocument.length === 0) continue;
    const subject = carriages[inDocument.reduce((a, b) => (carriages[a].index <= carriages[b].index ? a : b))];
    const codes = members.map((m) => refAt(carriages[m].raw, 'code') as string).sort();
    const listed = codes.length > 8 ? `${codes.slice(0, 8).join(', ')} and ${codes.length - 8} more` : codes.join(', ');
    const starved = downstream === 0 ? '' : `, nor do ${downstream} carriage${downstream === 1 ? '' : 's'} downstream of it`;
    sink.warn('carriages', subject.index, refAt(subject.raw, 'code'), undefined, 'loop-without-origin',
      `carriages ${listed} feed each other in a loop with no origin upstream: they have no programme${starved}`);
  }
}

/** Counts unreached carriages downstream of a loop that no earlier loop has claimed (so the walks stay linear overall). */
function claimDownstream(members: number[], graph: Csr, reached: Uint8Array, claimed: Uint8Array): number {
  const queue = [...members];
  let count = 0;
  for (let head = 0; head < queue.length; head++) {
    const u = queue[head];
    for (let e = graph.start[u]; e < graph.start[u + 1]; e++) {
      const v = graph.target[e];
      if (reached[v] || claimed[v]) continue;
      claimed[v] = 1;
      count++;
      queue.push(v);
    }
  }
  return count;
}

/**
 * Edits during an import: `workers` editors each rename sites of their own
 * (read the version, PATCH the name) while one large import runs; every
 * acknowledged edit must be in the database afterwards, and no refused one.
 * A 409 is an intended answer here: the import holds the network lock, so an
 * edit that waits past the lock limit is told "network-busy".
 */
import type { Sequelize } from 'sequelize';
import { percentile } from '../bench-engine';

export interface EditOutcome {
  code: string;
  name: string;
  status: number;
  ms: number;
}

export interface EditRunResult {
  importStatus: number;
  importMs: number;
  edits: { total: number; byStatus: Record<string, number>; p50Ms: number; p99Ms: number };
  lost: string[];
  refusedButStored: string[];
}

interface Options {
  base: string;
  token: string;
  sites: string[];
  workers: number;
  /** the import to run meanwhile: body and query */
  importBody: string;
  sequelize: Sequelize;
  /** keep editing this long after the import has finished */
  afterMs: number;
}

/** status 0: no answer (the connection failed or timed out); such an edit is neither acknowledged nor refused */
async function editOnce(base: string, token: string, code: string, name: string): Promise<EditOutcome> {
  const t0 = performance.now();
  try {
    return await editOnceOrThrow(base, token, code, name, t0);
  } catch {
    return { code, name, status: 0, ms: performance.now() - t0 };
  }
}

async function editOnceOrThrow(base: string, token: string, code: string, name: string, t0: number): Promise<EditOutcome> {
  const headers = { authorization: `Bearer ${token}`, 'content-type': 'application/json' };
  const read = await fetch(`${base}/api/sites/${encodeURIComponent(code)}`, { headers });
  const detail = (await read.json()) as { site?: { version?: number } };
  if (read.status !== 200) return { code, name, status: read.status, ms: performance.now() - t0 };
  const r = await fetch(`${base}/api/sites/${encodeURIComponent(code)}`, { method: 'PATCH', headers, body: JSON.stringify({ version: detail.site?.version, name }) });
  await r.arrayBuffer();
  return { code, name, status: r.status, ms: performance.now() - t0 };
}

export async function editsDuringImport(o: Options): Promise<EditRunResult> {
  const outcomes: EditOutcome[] = [];
  let importDone = false;
  let doneAt = 0;
  const t0 = performance.now();
  const importing = fetch(`${o.base}/api/network/import`, {
    method: 'POST',
    headers: { authorization: `Bearer ${o.token}`, 'content-type': 'application/json' },
    body: o.importBody,
  })
    .then(async (r) => {
      await r.arrayBuffer();
      return r.status;
    })
    // no answer at all (fetch gives up on headers after 300 s on a starved machine): status 0, recorded, not a crash
    .catch(() => 0)
    .then((status) => {
      importDone = true;
      doneAt = performance.now();
      return { status, ms: performance.now() - t0 };
    });
  // let the import reach its lock before the editors start
  await new Promise((r) => setTimeout(r, 300));
  const perWorker = Math.floor(o.sites.length / o.workers);
  await Promise.all(
    Array.from({ length: o.workers }, async (_, w) => {
      const mine = o.sites.slice(w * perWorker, (w + 1) * perWorker);
      for (let n = 0; !importDone || performance.now() - doneAt < o.afterMs; n++) {
        const code = mine[n % mine.length];
        outcomes.push(await editOnce(o.base, o.token, code, `Load edit w${w} n${n}`));
      }
    }),
  );
  const imported = await importing;

  // the last acknowledged name of each site must be stored; no refused name may be
  const lastAck = new Map<string, string>();
  for (const e of outcomes) if (e.status === 200) lastAck.set(e.code, e.name);
  const [rows] = await o.sequelize.query('SELECT code, name FROM sites WHERE code = ANY($1)', { bind: [o.sites] });
  const stored = new Map((rows as { code: string; name: string }[]).map((r) => [r.code, r.name]));
  const lost = [...lastAck].filter(([code, name]) => stored.get(code) !== name).map(([code]) => code);
  // an edit without an answer (status 0) may or may not have landed: neither lost nor wrongly stored
  const refusedButStored = outcomes.filter((e) => e.status !== 200 && e.status !== 0 && stored.get(e.code) === e.name).map((e) => e.code);
  const byStatus: Record<string, number> = {};
  for (const e of outcomes) byStatus[e.status] = (byStatus[e.status] ?? 0) + 1;
  const times = outcomes.map((e) => e.ms);
  return {
    importStatus: imported.status,
    importMs: Math.round(imported.ms),
    edits: { total: outcomes.length, byStatus, p50Ms: times.length ? Math.round(percentile(times, 50)) : 0, p99Ms: times.length ? Math.round(percentile(times, 99)) : 0 },
    lost,
    refusedButStored,
  };
}

/**
 * Progress of running imports, by an id the client chooses and sends with
 * its import (`?progressId=`), so that it can ask how far the import is
 * (GET /api/network/import/progress/:id) while its one request is still
 * open: the import's answer stays the report, as before. Kept in PostgreSQL
 * (table import_progress, migration 0010), so that with several server
 * processes or hosts the poll may reach any of them and hear the same.
 *
 * Writes go through the model on a pooled connection of their own, never
 * inside the import's transaction: the rows must be visible while that
 * transaction is still open. They are throttled so that the import is not
 * slowed: a change of stage is written at once, otherwise at most one write
 * per import every `everyMs` (the latest value, trailing). Writes of one
 * import run one after another, so an older value never overwrites a newer
 * one. A failed write is logged and forgotten: progress is a courtesy, the
 * import's answer is the report. Finished entries stay a few minutes for a
 * last poll; the table holds a bounded number.
 */
import { Op } from 'sequelize';
import { ImportProgressRow } from '@/server/db/models/importProgress';
import type { ImportProgress } from '@/shared/schemas/import';

export const PROGRESS_ID = /^[A-Za-z0-9_-]{8,64}$/;

const KEEP_MS = 5 * 60_000;
const MAX_ENTRIES = 200;
const FINAL = new Set<ImportProgress['stage']>(['done', 'failed']);

interface Pending {
  latest: ImportProgress;
  /** the stage of the last value sent to the database */
  sentStage?: ImportProgress['stage'];
  sentAt: number;
  timer?: ReturnType<typeof setTimeout>;
  /** the writes of this import, in order */
  chain: Promise<void>;
  firstAt: number;
}

export interface ImportProgressBoardOptions {
  /** least time between two writes of the same stage of one import */
  everyMs?: number;
  log?: (message: string, err: unknown) => void;
}

export class ImportProgressBoard {
  private readonly pending = new Map<string, Pending>();
  private readonly everyMs: number;
  private readonly log: (message: string, err: unknown) => void;

  constructor(opts: ImportProgressBoardOptions = {}) {
    this.everyMs = opts.everyMs ?? 250;
    this.log = opts.log ?? ((m, err) => console.error(`[import] ${m}`, err));
  }

  /**
   * Records how far import `id` is. Resolves once the value (or a newer one)
   * is stored, or was throttled into a later write that is now scheduled:
   * await it before answering so that a last poll sees the final stage.
   */
  set(id: string | undefined, progress: ImportProgress): Promise<void> {
    if (id === undefined) return Promise.resolve();
    const now = Date.now();
    let p = this.pending.get(id);
    if (!p) {
      p = { latest: progress, sentAt: 0, chain: Promise.resolve(), firstAt: now };
      this.pending.set(id, p);
      this.forgetStale(now);
      void this.prune();
    }
    p.latest = progress;
    if (p.sentStage !== progress.stage || now - p.sentAt >= this.everyMs) return this.flush(id, p);
    if (!p.timer) {
      const timer = setTimeout(() => void this.flush(id, p), this.everyMs - (now - p.sentAt));
      (timer as { unref?: () => void }).unref?.();
      p.timer = timer;
    }
    return Promise.resolve();
  }

  async get(id: string): Promise<ImportProgress | undefined> {
    const row = await ImportProgressRow.findOne({ where: { id, updatedAt: { [Op.gt]: new Date(Date.now() - KEEP_MS) } } });
    return row ? { stage: row.stage, done: row.done, total: row.total } : undefined;
  }

  /** Waits for every write this process has started (for a clean stop and for tests). */
  async settle(): Promise<void> {
    await Promise.all([...this.pending.values()].map((p) => p.chain));
  }

  private flush(id: string, p: Pending): Promise<void> {
    clearTimeout(p.timer);
    p.timer = undefined;
    const value = p.latest;
    p.sentStage = value.stage;
    p.sentAt = Date.now();
    p.chain = p.chain
      .then(() => ImportProgressRow.upsert({ id, stage: value.stage, done: value.done, total: value.total, updatedAt: new Date() }))
      .then(
        () => undefined,
        (err: unknown) => this.log(`progress of import ${id} was not stored`, err),
      );
    if (FINAL.has(value.stage)) {
      const chain = p.chain;
      void chain.then(() => {
        if (this.pending.get(id)?.chain === chain) this.pending.delete(id);
      });
    }
    return p.chain;
  }

  /** Drops this process's notes of imports that never said done or failed (refused before they started). */
  private forgetStale(now: number): void {
    for (const [id, p] of this.pending) {
      if (now - p.firstAt > KEEP_MS && !p.timer) this.pending.delete(id);
    }
  }

  /** Deletes entries older than the keeping time, and all but the newest MAX_ENTRIES. */
  private async prune(): Promise<void> {
    try {
      await ImportProgressRow.destroy({ where: { updatedAt: { [Op.lt]: new Date(Date.now() - KEEP_MS) } } });
      const beyond = await ImportProgressRow.findAll({ attributes: ['id'], order: [['updatedAt', 'DESC']], offset: MAX_ENTRIES, limit: 1_000 });
      if (beyond.length > 0) await ImportProgressRow.destroy({ where: { id: beyond.map((r) => r.id) } });
    } catch (err) {
      this.log('old import progress was not pruned', err);
    }
  }
}

/**
 * Progress of running imports, by an id the client chooses and sends with
 * its import (`?progressId=`), so that it can ask how far the import is
 * (GET /api/network/import/progress/:id) while its one request is still
 * open: the import's answer stays the report, as before. Kept in this
 * process's memory: with several server processes the poll may reach
 * another one and hear "pending", which the screen shows as "still sending".
 * Finished entries stay a few minutes for a last poll; the board holds a
 * bounded number.
 */
import type { ImportProgress } from '@/shared/schemas/import';

export const PROGRESS_ID = /^[A-Za-z0-9_-]{8,64}$/;

const KEEP_MS = 5 * 60_000;
const MAX_ENTRIES = 200;

interface Entry extends ImportProgress {
  at: number;
}

export class ImportProgressBoard {
  private readonly entries = new Map<string, Entry>();

  set(id: string | undefined, progress: ImportProgress): void {
    if (id === undefined) return;
    this.entries.delete(id);
    this.entries.set(id, { ...progress, at: Date.now() });
    this.prune();
  }

  get(id: string): ImportProgress | undefined {
    const entry = this.entries.get(id);
    if (!entry || Date.now() - entry.at > KEEP_MS) return undefined;
    return { stage: entry.stage, done: entry.done, total: entry.total };
  }

  private prune(): void {
    const now = Date.now();
    // a Map iterates in insertion order and set() re-inserts, so the oldest come first
    for (const [id, entry] of this.entries) {
      if (this.entries.size <= MAX_ENTRIES && now - entry.at <= KEEP_MS) break;
      this.entries.delete(id);
    }
  }
}

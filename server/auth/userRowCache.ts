/**
 * The user rows authenticate read, by user id, per process.
 *
 * Two uses:
 * - Confirmed current: while this process listens for changes to users
 *   (userChanges.ts: a trigger sends NOTIFY user_changed on every insert,
 *   update, delete and truncate), a row read since the listener last
 *   (re)connected, and within the last minute, is what PostgreSQL holds; the
 *   request skips the read. A write in this process forgets the rows once
 *   it is committed (the model's hooks call userRowsChanged), so a role
 *   change, disable or sign-out takes effect on the very next request;
 *   other processes forget on the notification.
 * - Outage fallback: when the database cannot be reached, a row read within
 *   the last minute still lets that person use the read and analysis routes
 *   (which answer from the in-memory network model): an operations desk needs
 *   fault reach most while things are failing. A row older than that is not
 *   trusted, since a role change or disable made meanwhile could not be seen.
 */
import type { Role } from '@/shared/api';

export interface UserRow {
  id: number;
  email: string;
  role: Role;
  disabled: boolean;
  tokenVersion: number;
  mustChangePassword: boolean;
}

export const USER_ROW_MAX_AGE_MS = 60_000;

/** Whether changes to users are being heard, and since which (re)connection. */
export interface ChangeFeed {
  /** increases on every (re)connection; rows read under an older one are not confirmed */
  readonly epoch: number;
  readonly listening: boolean;
}

const NOT_LISTENING: ChangeFeed = { epoch: 0, listening: false };

interface Entry {
  row: UserRow;
  at: number;
  epoch: number;
}

/** Every cache of this process, so that a write anywhere in it reaches all of them. */
const caches = new Set<UserRowCache>();

export class UserRowCache {
  private readonly rows = new Map<number, Entry>();
  /** bumped by every forget: a read that began before it must not be stored */
  private generation = 0;
  feed: ChangeFeed = NOT_LISTENING;

  constructor(
    private readonly maxAgeMs = USER_ROW_MAX_AGE_MS,
    private readonly now: () => number = () => Date.now(),
  ) {
    caches.add(this);
  }

  /** Take before reading a row; hand to put() with the row. */
  ticket(): { generation: number; epoch: number } {
    return { generation: this.generation, epoch: this.feed.epoch };
  }

  /** Keep a row read under `ticket`, unless a change was heard since the read began. */
  put(row: UserRow, ticket = this.ticket()) {
    if (ticket.generation !== this.generation) return;
    this.rows.set(row.id, { row, at: this.now(), epoch: ticket.epoch });
  }

  forget(id: number) {
    this.generation += 1;
    this.rows.delete(id);
  }

  forgetAll() {
    this.generation += 1;
    this.rows.clear();
  }

  /** The row when it is known to be what PostgreSQL holds now, else null (read it). */
  current(id: number): UserRow | null {
    if (!this.feed.listening) return null;
    const hit = this.rows.get(id);
    if (!hit || hit.epoch !== this.feed.epoch || this.now() - hit.at > this.maxAgeMs) return null;
    return hit.row;
  }

  /** The row read within maxAgeMs, or null: the fallback while the database is down. */
  fresh(id: number): UserRow | null {
    const hit = this.rows.get(id);
    if (!hit) return null;
    if (this.now() - hit.at > this.maxAgeMs) {
      this.rows.delete(id);
      return null;
    }
    return hit.row;
  }

  /** Stop taking part in userRowsChanged (the app closed). */
  detach() {
    caches.delete(this);
  }
}

/**
 * A user row changed in this process (id), or some rows did (null): every
 * cache forgets once the change is committed. Inside a transaction that is
 * after the commit, not at the write: until then every reader still gets the
 * old row from PostgreSQL, so forgetting earlier would only let a request
 * between the write and the commit cache the old row again; a rolled-back
 * change is never forgotten, since nothing changed. Without a transaction
 * the write has already committed when the hook runs.
 */
export function userRowsChanged(id: number | null, transaction?: { afterCommit(fn: () => void): void } | null) {
  const forget = () => {
    for (const cache of caches) {
      if (id === null) cache.forgetAll();
      else cache.forget(id);
    }
  };
  if (transaction) transaction.afterCommit(forget);
  else forget();
}

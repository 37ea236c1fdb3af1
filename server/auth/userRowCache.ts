/**
 * The user rows authenticate read recently, by user id. When the database
 * cannot be reached, a row read within the last minute still lets that person
 * use the read and analysis routes (which answer from the in-memory network
 * model): an operations desk needs fault reach most while things are failing.
 * A row older than that is not trusted, since a role change or disable made
 * meanwhile could not be seen.
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

export class UserRowCache {
  private readonly rows = new Map<number, { row: UserRow; at: number }>();
  constructor(
    private readonly maxAgeMs = USER_ROW_MAX_AGE_MS,
    private readonly now: () => number = () => Date.now(),
  ) {}

  put(row: UserRow) {
    this.rows.set(row.id, { row, at: this.now() });
  }

  forget(id: number) {
    this.rows.delete(id);
  }

  /** The row read within maxAgeMs, or null. */
  fresh(id: number): UserRow | null {
    const hit = this.rows.get(id);
    if (!hit) return null;
    if (this.now() - hit.at > this.maxAgeMs) {
      this.rows.delete(id);
      return null;
    }
    return hit.row;
  }
}

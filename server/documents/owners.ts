/**
 * What documents can belong to. Each owner kind says how to check that the
 * owner exists and what deleting the owner does to its documents:
 *   'ask'  - the owner's delete is refused (409, naming the count) unless
 *            the request chooses documents=delete or documents=keep;
 *   'keep' - documents stay, listed under the old code (records kept for the file).
 * A new kind joins with one line here; its routes follow automatically.
 */
import type { Transaction } from 'sequelize';
import type { AppContext } from '../context';

export interface OwnerKind {
  /** "site", for messages */
  noun: string;
  exists(ctx: AppContext, code: string, t?: Transaction): Promise<boolean>;
  onDelete: 'ask' | 'keep';
}

/** An owner kept in a table with a unique `code` column (the table name is from this file, never from a request). */
const rowWithCode =
  (table: string) =>
  async (ctx: AppContext, code: string, transaction?: Transaction): Promise<boolean> => {
    const [rows] = await ctx.db.sequelize.query(`SELECT 1 FROM ${table} WHERE code = $1 LIMIT 1`, { bind: [code], transaction });
    return rows.length > 0;
  };

export const OWNER_KINDS: Record<string, OwnerKind> = {
  sites: { noun: 'site', exists: rowWithCode('sites'), onDelete: 'ask' },
  feeds: { noun: 'feed', exists: rowWithCode('feeds'), onDelete: 'ask' },
  // an incident is never deleted; a planned work only while drafted, and its photos and permits stay on file
  incidents: { noun: 'incident', exists: rowWithCode('incidents'), onDelete: 'keep' },
  works: { noun: 'planned work', exists: rowWithCode('planned_works'), onDelete: 'keep' },
};

export type DocumentsChoice = 'delete' | 'keep';

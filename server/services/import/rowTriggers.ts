/**
 * The per-row foreign-key checks of an import's bulk inserts, left out where
 * PostgreSQL lets this role do so.
 *
 * Each foreign key is checked by a trigger per inserted row (a lookup of the
 * referred row, through the executor, plus a row lock). For a 100,000-site
 * network that is about 1.9 million checks: measured with EXPLAIN ANALYZE on
 * the generated network, the two checks of a carriage took 5.2 s of its
 * table's 12.5 s insert, the feeds' 5.0 s of 9.3 s (load average about 5).
 * Deferring them (DEFERRABLE, SET CONSTRAINTS) would not help: deferred, the
 * same per-row checks run at commit.
 *
 * The rows copyCreated (copy.ts) inserts need no such check: every reference
 * was turned into an id by an inner join against the referred table, inside
 * the same transaction, and the row counts are compared, so an id that is
 * written exists. The row lock that each check would have taken (so that no
 * one deletes the referred row before commit) is what the network version
 * row's lock already gives: every change to the inventory tables runs in a
 * network write (inventory/networkWrite.ts) and waits for this one.
 *
 * PostgreSQL skips those triggers for a transaction that sets
 * `session_replication_role = replica` (what logical replication applies
 * rows with). Only a superuser, or a role granted it
 * (`GRANT SET ON PARAMETER session_replication_role TO ...`, PostgreSQL 15
 * and later), may set it; any other role keeps the per-row checks, which
 * are just as correct, only slower. The setting also stops ON DELETE
 * CASCADE, so it is on only around inserts of new rows and off again
 * before anything else runs in the transaction. It stops every ordinary
 * trigger, not only the foreign keys': the inventory tables have no other,
 * and one added to them later must be declared ENABLE ALWAYS to fire for
 * these inserts too.
 */
import type { Client } from 'pg';

/**
 * Runs `inserts` with the per-row trigger checks off when this role may turn
 * them off; answers whether they were off. A refusal is taken back to a
 * savepoint, so the transaction goes on. If `inserts` throws, the setting is
 * left to the transaction's rollback (an aborted transaction takes no SET).
 */
export async function withoutRowTriggers(client: Client, inserts: () => Promise<void>): Promise<boolean> {
  const off = await turnOff(client);
  await inserts();
  if (off) await client.query('SET LOCAL session_replication_role = origin');
  return off;
}

async function turnOff(client: Client): Promise<boolean> {
  await client.query('SAVEPOINT import_row_triggers');
  try {
    await client.query('SET LOCAL session_replication_role = replica');
  } catch {
    await client.query('ROLLBACK TO SAVEPOINT import_row_triggers');
    return false;
  }
  await client.query('RELEASE SAVEPOINT import_row_triggers');
  return true;
}

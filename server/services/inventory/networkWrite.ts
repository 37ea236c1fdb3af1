/**
 * Every change to the network runs through here: one transaction that first
 * locks the network-version row, so writers (imports and single edits) take
 * turns and each one reads the network as the previous one left it; the
 * version is bumped once (its NOTIFY goes out on commit, server/db/index.ts)
 * and the audit rows carry that version. A write that changes nothing keeps
 * the version where it is.
 *
 * Time limits: waiting for the version row is bounded by the connection's
 * lock_timeout (a few seconds, server/db/index.ts), so an edit that arrives
 * while an import writes gets a 409 "network-busy" soon instead of hanging;
 * once the lock is held, the statements of a large import may run longer than
 * a request's usual limit, so this transaction raises it for itself.
 */
import type { Sequelize } from 'sequelize';
import { bumpNetworkVersion } from '../../db';
import { ChangeCollector, type CodesByKind } from '../../db/networkChange';
import { recordAudit, type Actor, type AuditEntry } from '../audit';
import type { Tx } from './tables';

export interface NetworkWrite extends Tx {
  /** the network version when the lock was taken */
  readonly startVersion: number;
  audit(entry: AuditEntry): void;
  /** the network changed even if no audit entry says so on its own (an import's single entry) */
  markChanged(): void;
}

export interface WriteResult<R> {
  result: R;
  networkVersion: number;
  changed: boolean;
  /** the codes the write created, changed or deleted (null: not named, e.g. an import) */
  codes: CodesByKind | null;
}

/** Thrown inside a write to roll it back and hand a value back instead of an error. */
export class RollBack<R> extends Error {
  constructor(readonly value: R) {
    super('rolled back');
  }
}

/** The statement limit inside a network write (a 20,000-site import writes tens of thousands of rows per statement). */
export const WRITE_STATEMENT_TIMEOUT_MS = 120_000;

export async function withNetworkWrite<R>(sequelize: Sequelize, actor: Actor, work: (w: NetworkWrite) => Promise<R>): Promise<WriteResult<R>> {
  let startVersion = 0;
  try {
    return await sequelize.transaction(async (transaction) => {
      await sequelize.query(`SET LOCAL statement_timeout = ${WRITE_STATEMENT_TIMEOUT_MS}`, { transaction });
      const [locked] = await sequelize.query('SELECT version FROM network_state WHERE id = 1 FOR UPDATE', { transaction });
      startVersion = Number((locked as { version: number }[])[0].version);
      const entries: AuditEntry[] = [];
      const named = new ChangeCollector();
      let changed = false;
      const w: NetworkWrite = {
        sequelize,
        transaction,
        startVersion,
        audit: (entry) => {
          entries.push(entry);
          if (entry.action !== 'import') changed = true;
          named.add(entry.entityKind, entry.entityCode);
        },
        markChanged: () => {
          changed = true;
          named.markUnnamed();
        },
      };
      const result = await work(w);
      const codes = named.result();
      const networkVersion = changed ? await bumpNetworkVersion(sequelize, transaction, codes) : startVersion;
      if (entries.length > 0) await recordAudit(sequelize, transaction, actor, networkVersion, entries);
      return { result, networkVersion, changed, codes };
    });
  } catch (err) {
    if (err instanceof RollBack) return { result: err.value as R, networkVersion: startVersion, changed: false, codes: null };
    throw err;
  }
}

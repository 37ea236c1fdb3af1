/**
 * A replace deletes whatever the document leaves out, so it is carried out
 * only with the confirmation its dry run hands out: `confirmReplace`, a
 * token over the network version the dry run saw and the deletions it
 * counted per kind. The commit recomputes the token from its own plan; a
 * missing token is 428 `replace-not-confirmed`, a token from another version
 * or other deletions is 409 `replace-confirmation-outdated`. Both messages
 * name what would be deleted, so the person knows what they are confirming.
 */
import crypto from 'node:crypto';
import { countOf } from '@/shared/format';
import { ENTITY_KINDS, type EntityKind } from '@/shared/schemas/network';
import { ApiError } from '../../http/errors';
import { KIND_NOUN } from '../../interchange/issues';
import type { ImportPlan } from './plan';

export type Deletions = Record<EntityKind, number>;

export function deletionsOf(plan: ImportPlan): Deletions {
  const out = {} as Deletions;
  for (const kind of ENTITY_KINDS) out[kind] = plan.kinds[kind].remove.length;
  return out;
}

/** The token a dry run hands out and a commit must send back. */
export function replaceToken(version: number, deletions: Deletions): string {
  const text = `${version}:${ENTITY_KINDS.map((k) => deletions[k]).join(',')}`;
  return crypto.createHash('sha256').update(text).digest('hex').slice(0, 16);
}

/** "3 sites, 12 carriages and 40 feeds", or "nothing". */
export function deletionsText(deletions: Deletions): string {
  const parts = ENTITY_KINDS.filter((k) => deletions[k] > 0).map((k) => countOf(deletions[k], KIND_NOUN[k]));
  if (parts.length === 0) return 'nothing';
  return parts.length === 1 ? parts[0] : `${parts.slice(0, -1).join(', ')} and ${parts[parts.length - 1]}`;
}

/** Throws unless `given` is the token of this plan at this version. */
export function requireConfirmation(given: string | undefined, version: number, plan: ImportPlan): void {
  const deletions = deletionsOf(plan);
  if (given === replaceToken(version, deletions)) return;
  const what = `this replace deletes ${deletionsText(deletions)} (everything the file leaves out)`;
  if (given === undefined || given === '') {
    throw new ApiError(428, 'replace-not-confirmed',
      `${what}; check it first with dryRun=true and send the confirmReplace value of that check to carry it out`, { deletions });
  }
  throw new ApiError(409, 'replace-confirmation-outdated',
    `the confirmReplace value does not match: the network or the file changed since the check, and ${what}; check again and confirm what it shows`, { deletions });
}

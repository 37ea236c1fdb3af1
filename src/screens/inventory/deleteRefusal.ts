/**
 * Reading a refused delete (DELETE /api/<kind>/:code answers 409 with
 * details.dependents = { <kind>: { count, codes (the first 20) } }, see
 * server/services/inventory/remove.ts) into what the confirm step shows:
 * the server's own sentence, the dependents by kind, and the words of the
 * "also delete" option. A group's members are not deleted with it, only
 * taken out of it, and the option says so.
 */
import type { EntityKind } from '@/shared/schemas/network';
import { isApiError } from '@/src/api/client';
import { STALE_MESSAGE } from './forms/serverErrors';
import { countOf, WORDS } from './kinds';

export interface Dependents {
  kind: EntityKind;
  count: number;
  /** the codes the server named (it names at most 20) */
  codes: string[];
}

export type DeleteRefusal =
  | { reason: 'dependents'; message: string; dependents: Dependents[]; total: number; cascadeLabel: string }
  | { reason: 'stale'; message: string }
  /** the record has documents (server/documents/README.md): delete or keep them */
  | { reason: 'documents'; message: string; count: number }
  | { reason: 'other'; message: string };

const KINDS: readonly EntityKind[] = ['sites', 'services', 'groups', 'carriages', 'feeds'];

export function deleteRefusal(kind: EntityKind, error: unknown): DeleteRefusal {
  if (!isApiError(error)) return { reason: 'other', message: error instanceof Error ? error.message : 'The delete failed. Try again.' };
  if (error.status === 403) return { reason: 'other', message: 'Your role does not allow changing the network.' };
  const details = error.details as { dependents?: unknown; currentVersion?: unknown } | undefined;
  if (error.status === 409 && details && typeof details.currentVersion === 'number') return { reason: 'stale', message: STALE_MESSAGE };
  const documents = (details as { documents?: unknown } | undefined)?.documents;
  if (error.status === 409 && typeof documents === 'number') {
    // The server ends with the query words to choose; the panel offers the choice instead.
    return { reason: 'documents', message: `${error.message.replace(/;[^;]*documents=delete.*$/, '')}. Choose below what happens to them.`, count: documents };
  }
  if (error.status === 409 && details && details.dependents && typeof details.dependents === 'object') {
    const dependents: Dependents[] = [];
    for (const k of KINDS) {
      const d = (details.dependents as Record<string, { count?: unknown; codes?: unknown }>)[k];
      if (!d || typeof d.count !== 'number' || d.count <= 0) continue;
      dependents.push({ kind: k, count: d.count, codes: Array.isArray(d.codes) ? d.codes.filter((c): c is string => typeof c === 'string') : [] });
    }
    if (dependents.length) {
      const total = dependents.reduce((n, d) => n + d.count, 0);
      const list = dependents.map((d) => countOf(d.kind, d.count)).join(' and ');
      const cascadeLabel = kind === 'groups' ? `Also take its ${total} ${total === 1 ? 'member' : 'members'} out of the group (${list})` : `Also delete ${total} ${total === 1 ? 'dependent' : 'dependents'} (${list})`;
      // The server ends with how to cascade through its API; the panel offers that as a choice instead.
      const naming = error.message.replace(/;[^;]*cascade=true[^;]*$/, '');
      const next = kind === 'groups' ? 'Take them out of the group first, or choose below to do it with the delete.' : 'Delete them first, or choose below to delete them too.';
      return { reason: 'dependents', message: `${naming}. ${next}`, dependents, total, cascadeLabel };
    }
  }
  return { reason: 'other', message: error.message };
}

/** The confirm button's words: "Delete site S1", "Delete site S1 and 12 dependents". */
export function deleteButtonLabel(kind: EntityKind, code: string, cascadeTotal: number | null): string {
  const base = `Delete ${WORDS[kind].one} ${code}`;
  if (!cascadeTotal) return base;
  if (kind === 'groups') return `${base} and release ${cascadeTotal} ${cascadeTotal === 1 ? 'member' : 'members'}`;
  return `${base} and ${cascadeTotal} ${cascadeTotal === 1 ? 'dependent' : 'dependents'}`;
}

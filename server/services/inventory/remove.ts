/**
 * Deleting one entity. What depends on it is never removed silently: a site
 * with carriages or feeds routed via it, a service with carriages, a
 * carriage with feeds, a group with members are refused with 409 naming
 * them (the first 20 and the count). With `cascade` the dependents are
 * deleted too (a group's members only leave the group), in the same
 * transaction, each with its own audit row.
 *
 * Dependents: site -> its carriages, their feeds, and feeds routed via it;
 * service -> its carriages and their feeds; carriage -> its feeds in and
 * out; group -> the sites and feeds in it (their membership).
 */
import { Op, type Sequelize, type Transaction } from 'sequelize';
import type { EntityKind } from '@/shared/schemas/network';
import { conflict, notFound } from '../../http/errors';
import type { Actor } from '../audit';
import { withNetworkWrite, type NetworkWrite, type WriteResult } from './networkWrite';
import { deleteRecord, deleteRecords, feedsViaSite, groupMemberIds, leaveGroupRecords, readRecord, readRecords, type Found } from './records';
import { canonical, NOUN, type Fields } from './shape';
import { auditShape, refusalsAsApiErrors } from './write';

const SHOWN = 20;

type DependentKind = 'carriages' | 'feeds' | 'sites';

export interface DeleteOutcome {
  deleted: Partial<Record<EntityKind, string[]>>;
  /** entities changed rather than deleted: the members a deleted group was taken out of */
  updated: Partial<Record<EntityKind, string[]>>;
}

const listed = (codes: string[], total: number) => (total > codes.length ? `${codes.join(', ')} and ${total - codes.length} more` : codes.join(', '));
const plural = (n: number, noun: string) => `${n} ${noun}${n === 1 ? '' : 's'}`;

export async function deleteEntity(
  sequelize: Sequelize,
  kind: EntityKind,
  code: string,
  opts: { version: number; cascade: boolean; onDeleted?: (t: Transaction, deleted: DeleteOutcome['deleted']) => Promise<void> },
  actor: Actor,
): Promise<WriteResult<DeleteOutcome>> {
  return refusalsAsApiErrors(() =>
    withNetworkWrite(sequelize, actor, async (w) => {
      const current = await readRecord(w, kind, code);
      if (!current) throw notFound(`no ${NOUN[kind]} with code ${code}`, { code });
      const currentVersion = current.entity.version as number;
      if (currentVersion !== opts.version) {
        throw conflict(`${NOUN[kind]} ${code} was changed since you read it (you sent version ${opts.version}, it is now at ${currentVersion}); reload and try again`, {
          currentVersion,
          current: current.entity,
        });
      }
      const dependents = await findDependents(w, kind, current.id);
      const outcome: DeleteOutcome = { deleted: {}, updated: {} };
      if (dependents.some(([, found]) => found.length > 0)) {
        if (!opts.cascade) refuse(kind, code, dependents);
        if (kind === 'groups') await leaveGroup(w, current, dependents, outcome);
        else await deleteDependents(w, dependents, outcome);
      }
      await deleteRecord(w, kind, current);
      w.audit({ action: 'delete', entityKind: kind, entityCode: code, before: auditShape(current.entity) });
      outcome.deleted[kind] = [...(outcome.deleted[kind] ?? []), code];
      // what hangs off the deleted rows outside the network (documents) may refuse or follow, in this transaction
      await opts.onDeleted?.(w.transaction, outcome.deleted);
      return outcome;
    }),
  );
}

/** What depends on the record with this id, in the order a refusal names them. */
async function findDependents(w: NetworkWrite, kind: EntityKind, id: number): Promise<Array<[DependentKind, Found[]]>> {
  switch (kind) {
    case 'sites': {
      const carriages = await readRecords(w, 'carriages', { where: { siteId: id } });
      const ends = carriages.map((c) => c.id);
      const via = await feedsViaSite(w, id);
      return [['carriages', carriages], ['feeds', await readRecords(w, 'feeds', { where: { [Op.or]: [{ fromCarriageId: ends }, { toCarriageId: ends }, { id: via }] } })]];
    }
    case 'services':
      return [
        ['carriages', await readRecords(w, 'carriages', { where: { serviceId: id } })],
        // a feed joins two carriages of one service: its source's service is the feed's
        ['feeds', await readRecords(w, 'feeds', { referred: { from: { serviceId: id } } })],
      ];
    case 'carriages':
      return [['feeds', await readRecords(w, 'feeds', { where: { [Op.or]: [{ fromCarriageId: id }, { toCarriageId: id }] } })]];
    case 'groups':
      return [
        ['sites', await readRecords(w, 'sites', { where: { id: await groupMemberIds(w, 'sites', id) } })],
        ['feeds', await readRecords(w, 'feeds', { where: { id: await groupMemberIds(w, 'feeds', id) } })],
      ];
    case 'feeds':
      return [];
  }
}

function refuse(kind: EntityKind, code: string, dependents: Array<[DependentKind, Found[]]>): never {
  const details: Record<string, { count: number; codes: string[] }> = {};
  const parts: string[] = [];
  for (const [dependent, found] of dependents) {
    if (found.length === 0) continue;
    const codes = found.slice(0, SHOWN).map((f) => f.entity.code as string);
    details[dependent] = { count: found.length, codes };
    parts.push(`${plural(found.length, NOUN[dependent])} (${listed(codes, found.length)})`);
  }
  const what = kind === 'groups' ? 'has members:' : 'still has';
  const fix = kind === 'groups' ? 'take them out of the group first, or delete with cascade=true to take them out' : 'delete them first, or delete with cascade=true to delete them too';
  throw conflict(`${NOUN[kind]} ${code} ${what} ${parts.join(' and ')}; ${fix}`, { dependents: details });
}

/** Feeds first, then carriages: a carriage cannot go while a feed refers to it. */
async function deleteDependents(w: NetworkWrite, dependents: Array<[DependentKind, Found[]]>, outcome: DeleteOutcome): Promise<void> {
  for (const kind of ['feeds', 'carriages'] as const) {
    const found = dependents.find(([k]) => k === kind)?.[1] ?? [];
    if (found.length === 0) continue;
    const codes = found.map((f) => f.entity.code as string);
    await deleteRecords(w, kind, found);
    for (const f of found) w.audit({ action: 'delete', entityKind: kind, entityCode: f.entity.code as string, before: auditShape(f.entity) });
    outcome.deleted[kind] = codes;
  }
}

async function leaveGroup(w: NetworkWrite, group: Found, dependents: Array<[DependentKind, Found[]]>, outcome: DeleteOutcome): Promise<void> {
  const code = group.entity.code as string;
  for (const [kind, found] of dependents) {
    if (found.length === 0 || (kind !== 'sites' && kind !== 'feeds')) continue;
    const versions = await leaveGroupRecords(w, kind, group.id, found);
    for (const f of found) {
      const entity: Fields = canonical(kind, f.entity);
      entity.groups = ((entity.groups as string[] | undefined) ?? []).filter((g) => g !== code);
      const after = { ...canonical(kind, entity), version: versions.get(f.id) };
      w.audit({ action: 'update', entityKind: kind, entityCode: f.entity.code as string, before: auditShape(f.entity), after });
    }
    outcome.updated[kind] = found.map((f) => f.entity.code as string);
  }
}

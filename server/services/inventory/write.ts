/**
 * Creating and changing one entity. Fields are whitelisted by the shared zod
 * schema (a strict object: an unknown field is a 400 naming it), the
 * cross-entity rules run against the stored network (rules.ts), and the
 * record is written through its model (records.ts). Changes use
 * optimistic locking: the request carries the version it read, and a stale
 * one is a 409 with the current version, so no edit silently overwrites
 * another.
 */
import type { Sequelize } from 'sequelize';
import { entitySchemas, versionSchema, type EntityKind } from '@/shared/schemas/network';
import { ApiError, badRequest, conflict, notFound, parseOr400, unprocessable } from '../../http/errors';
import type { Actor } from '../audit';
import { databaseRefusal, refusalError } from './dbErrors';
import { withNetworkWrite, type NetworkWrite, type WriteResult } from './networkWrite';
import { checkBands, checkSecondMain } from './editRules';
import { checkRules, type RuleFindings } from './rules';
import { canonical, NOUN, sameEntity, type Fields } from './shape';
import { createRecord, MODELS, readRecord, updateRecord } from './records';

/** The entity as the audit log keeps it: document fields and version. */
export const auditShape = (entity: Fields) => {
  const { updatedAt: _ignored, ...rest } = entity;
  return rest;
};

function throwFindings(found: RuleFindings): void {
  const raise = (issues: RuleFindings['unprocessable'], make: typeof unprocessable) => {
    const more = issues.length > 1 ? ` (and ${issues.length - 1} more problem${issues.length > 2 ? 's' : ''})` : '';
    throw make(`${issues[0].message}${more}`, issues);
  };
  if (found.unprocessable.length > 0) raise(found.unprocessable, unprocessable);
  if (found.conflicts.length > 0) raise(found.conflicts, conflict);
}

/** A refusal by the database's own constraints is about the input: 409 for a clash, else 422. */
export async function refusalsAsApiErrors<R>(run: () => Promise<R>): Promise<R> {
  try {
    return await run();
  } catch (err) {
    if (err instanceof ApiError) throw err;
    const refusal = databaseRefusal(err);
    if (!refusal) throw err;
    throw refusalError(refusal);
  }
}

/** A record typed in by hand (one POST or PATCH): the rules of editRules.ts apply, with what the request confirmed. */
export interface TypedEdit {
  /** the warnings the person confirmed (`?confirm=`), e.g. second-main-feed */
  confirm: readonly string[];
}

async function typedRules(w: NetworkWrite, kind: EntityKind, entity: Fields, typed: TypedEdit | undefined, previous?: Fields): Promise<void> {
  if (!typed) return;
  await checkBands(w, kind, entity, previous);
  if (kind === 'feeds') await checkSecondMain(w, entity, typed.confirm.includes('second-main-feed'), previous);
}

/** One create inside a network write: validated entity in, stored entity out, audited. */
async function createWithin(w: NetworkWrite, kind: EntityKind, entity: Fields, typed?: TypedEdit): Promise<Fields> {
  const code = entity.code as string;
  if (await MODELS[kind].findOne({ where: { code }, attributes: ['id'], transaction: w.transaction })) throw conflict(`${NOUN[kind]} ${code} already exists; codes are unique within a kind`, { code });
  throwFindings(await checkRules(w, kind, entity));
  await typedRules(w, kind, entity, typed);
  const created = await createRecord(w, kind, entity);
  w.audit({ action: 'create', entityKind: kind, entityCode: code, after: auditShape(created) });
  return created;
}

export async function createEntity(sequelize: Sequelize, kind: EntityKind, body: unknown, actor: Actor, typed: TypedEdit = { confirm: [] }): Promise<WriteResult<Fields>> {
  const entity = canonical(kind, parseOr400(entitySchemas[kind] as never, body, NOUN[kind]) as Fields);
  return refusalsAsApiErrors(() => withNetworkWrite(sequelize, actor, (w) => createWithin(w, kind, entity, typed)));
}

/**
 * Several creates as one change: one transaction, one network version, an
 * audit entry each; the first refusal rolls all of them back.
 */
export async function createEntities(sequelize: Sequelize, items: readonly { kind: EntityKind; body: unknown }[], actor: Actor): Promise<WriteResult<Fields[]>> {
  const entities = items.map(({ kind, body }) => ({ kind, entity: canonical(kind, parseOr400(entitySchemas[kind] as never, body, NOUN[kind]) as Fields) }));
  return refusalsAsApiErrors(() =>
    withNetworkWrite(sequelize, actor, async (w) => {
      const out: Fields[] = [];
      for (const { kind, entity } of entities) out.push(await createWithin(w, kind, entity));
      return out;
    }),
  );
}

/**
 * Body: { version, ...fields }. A field sent as null is cleared; fields not
 * sent keep their value; the code cannot change (it is how everything else
 * refers to the entity). A change that changes nothing answers the entity
 * as it is and moves no version.
 */
export async function updateEntity(sequelize: Sequelize, kind: EntityKind, code: string, body: unknown, actor: Actor, typed: TypedEdit = { confirm: [] }): Promise<WriteResult<Fields>> {
  if (body === null || typeof body !== 'object' || Array.isArray(body)) throw badRequest('the body must be an object: { version, ...fields to change }');
  const { version } = parseOr400(versionSchema, body);
  const { version: _version, ...fields } = body as Record<string, unknown>;
  if ('code' in fields && fields.code !== code) {
    throw badRequest(`code cannot be changed (${NOUN[kind]} ${code}): other entities and the audit log refer to it; create a new ${NOUN[kind]} instead`, [
      { field: 'code', message: 'code cannot be changed' },
    ]);
  }
  return refusalsAsApiErrors(() =>
    withNetworkWrite(sequelize, actor, async (w) => {
      const current = await readRecord(w, kind, code);
      if (!current) throw notFound(`no ${NOUN[kind]} with code ${code}`, { code });
      const currentVersion = current.entity.version as number;
      if (currentVersion !== version) {
        throw conflict(`${NOUN[kind]} ${code} was changed by someone else since you read it (you sent version ${version}, it is now at ${currentVersion}); reload and try again`, {
          currentVersion,
          current: current.entity,
        });
      }
      const before = canonical(kind, current.entity);
      const merged: Fields = { ...before, ...fields };
      for (const [field, value] of Object.entries(fields)) if (value === null) delete merged[field];
      const next = canonical(kind, parseOr400(entitySchemas[kind] as never, merged, NOUN[kind]) as Fields);
      if (sameEntity(kind, before, next)) return current.entity;
      throwFindings(await checkRules(w, kind, next, before));
      await typedRules(w, kind, next, typed, before);
      const updated = await updateRecord(w, kind, current, next, before);
      w.audit({ action: 'update', entityKind: kind, entityCode: code, before: auditShape(current.entity), after: auditShape(updated) });
      return updated;
    }),
  );
}

/**
 * The inventory API, the same five routes for each kind (sites, services,
 * groups, carriages, feeds), paths relative to /api:
 *
 *   GET    /<kind>            list: page (from 1), pageSize (1-200, default 50),
 *                             sort (whitelisted per kind, default code), order asc|desc,
 *                             q (text in code and name; for carriages and feeds also
 *                             in site, service and carriage codes), and filters:
 *                             sites: role, group; carriages: service, site;
 *                             feeds: medium, role, service, fromSite, toSite, group
 *                             -> { items, total, page, pageSize }
 *   GET    /<kind>/:code      the entity with its neighbours (services/inventory/detail.ts)
 *   POST   /<kind>            body: the entity in document form -> 201, the entity
 *   PATCH  /<kind>/:code      body: { version, ...fields }; null clears a field -> 200, the entity
 *                             Both refuse a channel or frequency outside the service kind's bands
 *                             (400 naming the field and range) and a second main feed into one
 *                             carriage unless ?confirm=second-main-feed (409 second-main-feed);
 *                             services/inventory/editRules.ts
 *   DELETE /<kind>/:code      ?version=N (required), ?cascade=true deletes dependents,
 *                             ?documents=delete|keep what happens to the documents of what is
 *                             deleted (sites, feeds); without it, 409 naming the count
 *                             -> { deleted: { kind: [code] }, updated: { kind: [code] }, networkVersion }
 *
 * Entities are in the document shape (codes, never ids) plus `version` (for
 * optimistic locking) and `updatedAt`. Writes answer the new network version
 * in the X-Network-Version header, and only after this process's network
 * model has caught up with it, so a read that follows sees the change.
 */
import type { Request } from 'express';
import { z } from 'zod';
import { can } from '@/shared/api';
import { ENTITY_KINDS } from '@/shared/schemas/network';
import { parseOr400 } from '../http/errors';
import type { RouteTable } from '../http/routes';
import type { AppContext } from '../context';
import type { Actor } from '../services/audit';
import { entityDetail } from '../services/inventory/detail';
import { listEntities, listQuerySchema } from '../services/inventory/read';
import { createEntity, updateEntity } from '../services/inventory/write';
import { CONFIRM_SECOND_MAIN } from '../services/inventory/editRules';
import { deleteEntity } from '../services/inventory/remove';
import type { WriteResult } from '../services/inventory/networkWrite';
import { DOCUMENT_CHOICES } from '@/shared/schemas/documents';
import { ownersDeleted } from '../documents/service';

export const deleteQuerySchema = z.strictObject({
  version: z.coerce
    .number({ error: 'version=N is required: the version you read, so a delete never removes a row changed since' })
    .int('version is a whole number')
    .min(1, 'version is at least 1'),
  cascade: z.enum(['true', 'false'], { error: 'cascade is true or false' }).default('false'),
  documents: z.enum(DOCUMENT_CHOICES, { error: 'documents is delete or keep: what to do with the documents of what is deleted' }).optional(),
});

export const writeQuerySchema = z.strictObject({
  confirm: z.enum([CONFIRM_SECOND_MAIN], { error: `confirm is ${CONFIRM_SECOND_MAIN}: the warning you have seen and accept` }).optional(),
});
const confirmed = (req: Request) => {
  const { confirm } = parseOr400(writeQuerySchema, req.query, 'query');
  return { confirm: confirm ? [confirm] : [] };
};

export const actorOf = (req: Request): Actor => ({ userId: req.auth?.userId, email: req.auth?.email });

/** Waits until this process answers from the network the write produced. */
export async function settled<R>(ctx: AppContext, out: WriteResult<R>): Promise<WriteResult<R>> {
  if (out.changed) await ctx.network.applyChange(out.networkVersion, out.codes);
  return out;
}

export function registerInventoryRoutes(routes: RouteTable, ctx: AppContext) {
  const sequelize = ctx.db.sequelize;
  for (const kind of ENTITY_KINDS) {
    const listSchema = listQuerySchema(kind);

    routes.add('get', `/${kind}`, can.read, async (req, res) => {
      res.json(await listEntities(sequelize, kind, parseOr400(listSchema, req.query, 'query')));
    });

    routes.add('get', `/${kind}/:code`, can.read, async (req, res) => {
      res.json(await entityDetail(kind, String(req.params.code)));
    });

    routes.add('post', `/${kind}`, can.editNetwork, async (req, res) => {
      const out = await settled(ctx, await createEntity(sequelize, kind, req.body, actorOf(req), confirmed(req)));
      res.status(201).set('X-Network-Version', String(out.networkVersion)).json(out.result);
    });

    routes.add('patch', `/${kind}/:code`, can.editNetwork, async (req, res) => {
      const out = await settled(ctx, await updateEntity(sequelize, kind, String(req.params.code), req.body, actorOf(req), confirmed(req)));
      res.set('X-Network-Version', String(out.networkVersion)).json(out.result);
    });

    routes.add('delete', `/${kind}/:code`, can.editNetwork, async (req, res) => {
      const query = parseOr400(deleteQuerySchema, req.query, 'query');
      const out = await settled(ctx, await deleteEntity(sequelize, kind, String(req.params.code), { version: query.version, cascade: query.cascade === 'true', onDeleted: (t, deleted) => ownersDeleted(ctx, t, deleted, query.documents) }, actorOf(req)));
      res.set('X-Network-Version', String(out.networkVersion)).json({ ...out.result, networkVersion: out.networkVersion });
    });
  }
}

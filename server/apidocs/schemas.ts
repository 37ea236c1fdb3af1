/**
 * What each route takes, keyed by "method /api/path" as the RouteTable
 * declares it: a one-line summary and the zod schemas the handler validates
 * with. The OpenAPI document (openapi.ts) joins this to the route table, so a
 * route missing here still appears (path, roles, errors), just without
 * schemas. Keep a new route's entry beside its module's schemas.
 */
import type { z } from 'zod';
import { reachCarriagesQuerySchema, reachQuerySchema, reachRequestSchema } from '@/shared/schemas/analysis';
import { checksQuerySchema } from '@/shared/schemas/checks';
import { drawingDocumentSchema } from '@/shared/schemas/drawing';
import { pageQuerySchema } from '@/shared/schemas/paging';
import { ENTITY_KINDS, entitySchemas, networkDocumentSchema, versionSchema } from '@/shared/schemas/network';
import { invitationSchema, personChangeSchema } from '@/shared/schemas/people';
import { exposureQuery } from '../routes/analysis';
import { carriageSearchQuerySchema, chainQuerySchema, listFormatQuerySchema, spofQuerySchema } from '@/shared/schemas/analysis';
import { loginSchema } from '../routes/auth';
import { historyQuerySchema, sourcesQuerySchema } from '@/shared/schemas/editing';
import { deleteQuerySchema, writeQuerySchema } from '../routes/inventory';
import { auditQuerySchema, exportQuerySchema, importQuerySchema } from '../routes/network';
import { listQuerySchema } from '../services/inventory/read';

export interface RouteDoc {
  summary: string;
  /** query string, an object schema: each property becomes one parameter */
  query?: z.ZodType;
  /** JSON request body */
  body?: z.ZodType;
  /** the 2xx answer, where a zod schema describes it */
  answer?: z.ZodType;
  /** more words, when the summary is not enough */
  description?: string;
}

const singular: Record<(typeof ENTITY_KINDS)[number], string> = { sites: 'site', services: 'service', groups: 'shared-risk group', carriages: 'carriage', feeds: 'feed' };

function inventoryDocs(): Record<string, RouteDoc> {
  const out: Record<string, RouteDoc> = {};
  for (const kind of ENTITY_KINDS) {
    const one = singular[kind];
    out[`get /api/${kind}`] = { summary: `List ${kind}: paged, sorted, filtered`, query: listQuerySchema(kind) };
    out[`get /api/${kind}/:code`] = { summary: `One ${one} with its neighbours` };
    out[`post /api/${kind}`] = { summary: `Create a ${one} (document form)`, body: entitySchemas[kind], query: writeQuerySchema };
    out[`patch /api/${kind}/:code`] = {
      summary: `Change a ${one}`,
      description: 'Body: `version` (the one you read, for optimistic locking) and the fields to change; null clears a field.',
      body: entitySchemas[kind].partial().extend(versionSchema.shape),
      query: writeQuerySchema,
    };
    out[`get /api/${kind}/:code/impact`] = { summary: `What deleting a ${one} would take off air (fault reach): carriages, households, sites` };
    out[`get /api/${kind}/:code/history`] = { summary: `A ${one}'s own change history from the audit log, newest first`, query: historyQuerySchema };
    out[`delete /api/${kind}/:code`] = { summary: `Delete a ${one}`, query: deleteQuerySchema };
  }
  return out;
}

export const routeDocs: Record<string, RouteDoc> = {
  'get /api/health': { summary: 'Ready or not: 200 when the server and its database are up, 503 otherwise' },
  'post /api/auth/login': { summary: 'Sign in: a bearer token and the user', body: loginSchema },
  'get /api/auth/me': { summary: 'The signed-in user' },
  'get /api/users': { summary: 'Everyone who can sign in' },
  'post /api/users': { summary: 'Invite a person', body: invitationSchema },
  'patch /api/users/:id': { summary: "Change a person's role, name or access", body: personChangeSchema },
  'get /api/carriages/:code/sources': { summary: 'Carriages of the same service that could feed this one, nearest first, with distance (km) and bearing (degrees) from its site', query: sourcesQuerySchema },
  'get /api/audit': { summary: 'Who changed what, newest first', query: auditQuerySchema },
  'get /api/network/summary': { summary: 'Counts of the current network' },
  'post /api/network/import': {
    summary: 'Import a network document (JSON body, or multipart "file": .json, .csv or .zip)',
    description:
      'All or nothing; 422 with every error when the document has any. A replace needs confirmReplace from its dry run ' +
      '(428 replace-not-confirmed without it, 409 replace-confirmation-outdated when the network changed since). See docs/format.md.',
    query: importQuerySchema,
    body: networkDocumentSchema,
  },
  'get /api/network/import/progress/:id': {
    summary: 'How far a running import is: { stage, done, total } for the import sent with ?progressId=id',
    description: 'Stages: pending (not heard of by this process: not arrived yet, sent to another process, or finished more than a few minutes ago), reading, validating, writing, rebuilding, done, failed.',
  },
  'get /api/network/drawing': {
    summary: 'The network as the diagram draws it, in columns: sites, services, groups, carriages and feeds with references as array positions',
    description: 'Only the fields drawn; feeds in code order, without their codes. Made once per network version; ETag and gzip as for the export.',
    answer: drawingDocumentSchema,
  },
  'get /api/network/export': { summary: 'The whole network as a document (JSON) or a zip of CSV files', query: exportQuerySchema, answer: networkDocumentSchema },
  'post /api/analysis/reach': { summary: 'What a set of failures takes off air, and for how many households (first=N: counts and the first N rows of each list)', body: reachRequestSchema, query: reachQuerySchema },
  'post /api/analysis/reach/sites': { summary: 'A page of the sites a set of failures touches, off air first, then most households', body: reachRequestSchema, query: pageQuerySchema },
  'post /api/analysis/reach/carriages': { summary: 'A page of the carriages a set of failures takes off air (state=lost) or onto a reserve feed (state=fallback)', body: reachRequestSchema, query: reachCarriagesQuerySchema },
  'get /api/analysis/spof': { summary: 'Single points of failure of every fed carriage (kinds=site,feed,group by default; carriage adds parent transmitters)', query: spofQuerySchema },
  'get /api/analysis/exposure': { summary: 'Elements ranked by the households their failure alone takes off air (format=csv for a file)', query: exposureQuery },
  'get /api/analysis/exposure-groups': {
    summary: 'The exposure ranking with elements that take off exactly the same carriages in one row (format=csv for a file)',
    query: exposureQuery,
  },
  'get /api/analysis/diversity': { summary: 'Carriages whose reserve feed still shares an avoidable single point of failure (format=csv for a file; limit/offset page it, total always)', query: pageQuerySchema.extend(listFormatQuerySchema.shape) },
  'get /api/analysis/unfed': { summary: 'Carriages with no programme even when nothing has failed (format=csv for a file; limit/offset page it, total always)', query: pageQuerySchema.extend(listFormatQuerySchema.shape) },
  'get /api/analysis/carriage-search': { summary: 'Carriages by code, or by site and service together, to mark failed', query: carriageSearchQuerySchema },
  'get /api/carriages/:code/chain': { summary: 'The chain of feeds above (up) or below (down) a carriage', query: chainQuerySchema },
  'get /api/feeds/:code/checks': { summary: "Engineering screening of one feed (see docs/checks.md)" },
  'get /api/checks': { summary: "Every feed's failed checks, worst first", query: checksQuerySchema },
  ...inventoryDocs(),
};

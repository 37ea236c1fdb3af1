/**
 * The network as a whole (docs/format.md and docs/api.md), paths
 * relative to /api:
 *
 *   POST /network/import   ?dryRun=true|false ?replace=true|false ?undoNewer=true|false ?confirmReplace=
 *        body: the network document (application/json), or multipart/form-data
 *        with one or more `file` fields: a .json document, CSV files named by
 *        their kind (sites.csv, ...), or zips of them
 *        -> 200 the import report; 422 the report when it lists errors;
 *           413 an upload past a limit (server/interchange/limits.ts); 429 with
 *           Retry-After when imports are queued up (one runs at a time);
 *           409 stale-base for a replace from an older baseVersion without undoNewer;
 *           a replace needs ?confirmReplace= from its dry run: 428 replace-not-confirmed
 *           without it, 409 replace-confirmation-outdated when the network changed since
 *   GET  /network/import/progress/:id  -> { stage, done, total } of the import sent with ?progressId=id (pending until heard of)
 *        (reading, validating, writing, rebuilding, done, failed); 404 unknown-import
 *        A client that goes away mid-import stops it: the transaction rolls back.
 *   GET  /network/export   ?format=json (default) | csv (a zip of the five CSV files and manifest.csv);
 *        both carry the network version as baseVersion
 *   GET  /network/drawing  the diagram's columns (shared/schemas/drawing.ts), ETag and gzip as the export
 *   GET  /audit            admin only: ?page ?pageSize ?kind ?code ?action
 *        -> { items: [{ id, at, userEmail, action, entityKind, entityCode,
 *             before, after, networkVersion }], total, page, pageSize }, newest first
 */
import type { Request, RequestHandler, Response } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { can } from '@/shared/api';
import { ApiError, badRequest, parseOr400 } from '../http/errors';
import type { RouteTable } from '../http/routes';
import type { AppContext } from '../context';
import { importNetwork } from '../services/importer';
import { readUploads } from '../interchange/upload';
import { UploadLimitError } from '../interchange/limits';
import { ImportQueue } from '../services/import/queue';
import { ImportProgressBoard, PROGRESS_ID } from '../services/import/progress';
import { clip } from '@/shared/clip';
import { loadNetworkDocument } from '../services/networkLoader';
import { drawingJson, exportJson, sendBytes, sendExport } from '../services/exportCache';
import { AUDIT_ACTIONS, AUDIT_KINDS, listAudit, type AuditAction, type AuditKind } from '../services/audit';
import { documentToZip } from '../interchange/csv';
import { MAX_PAGE_SIZE } from '../services/inventory/read';
import { actorOf } from './inventory';

const MAX_FILES = 10;
/** Form fields besides the files: none are read, a few are tolerated, none may be large. */
const MAX_FIELDS = 10;
const MAX_FIELD_BYTES = 1024;
/** How long a refused import is told to wait before trying again. */
const RETRY_AFTER_S = 10;

const flag = (name: string) => z.enum(['true', 'false'], { error: `${name} is true or false` }).default('false').transform((v) => v === 'true');
export const importQuerySchema = z.strictObject({
  dryRun: flag('dryRun'),
  replace: flag('replace'),
  undoNewer: flag('undoNewer'),
  confirmReplace: z.string({ error: 'confirmReplace is the value a replace dry run answered' }).max(64, 'confirmReplace is the value a replace dry run answered').optional(),
  progressId: z.string().regex(PROGRESS_ID, 'progressId is 8 to 64 letters, digits, - or _').optional(),
});
export const progressParamsSchema = z.strictObject({ id: z.string().regex(PROGRESS_ID, 'the id is 8 to 64 letters, digits, - or _') });
export const exportQuerySchema = z.strictObject({ format: z.enum(['json', 'csv'], { error: 'format is json or csv' }).default('json') });
export const auditQuerySchema = z.strictObject({
  page: z.coerce.number({ error: 'page must be a whole number' }).int('page must be a whole number').min(1, 'page is at least 1').default(1),
  pageSize: z.coerce.number({ error: 'pageSize must be a whole number' }).int().min(1).max(MAX_PAGE_SIZE, `pageSize is at most ${MAX_PAGE_SIZE}`).default(50),
  kind: z.enum(AUDIT_KINDS as [AuditKind, ...AuditKind[]], { error: `kind is one of ${AUDIT_KINDS.join(', ')}` }).optional(),
  code: z.string().min(1).max(64).optional(),
  action: z.enum(AUDIT_ACTIONS as [AuditAction, ...AuditAction[]], { error: `action is one of ${AUDIT_ACTIONS.join(', ')}` }).optional(),
});

/** multer for multipart requests only; a body it cannot read is the client's 400, never a 500. */
function multipartFiles(limitMb: number): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: {
      fileSize: Math.floor(limitMb * 1024 * 1024),
      files: MAX_FILES,
      fields: MAX_FIELDS,
      fieldSize: MAX_FIELD_BYTES,
      fieldNameSize: 100,
      parts: MAX_FILES + MAX_FIELDS,
      headerPairs: 100,
    },
  }).array('file', MAX_FILES);
  return (req, res, next) => {
    if (!req.is('multipart/form-data')) return next();
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) return next(err);
      next(badRequest(`the upload cannot be read: ${clip((err as Error).message ?? String(err), 120)}`));
    });
  };
}

/** The progress id the request names, if it is a usable one (the query schema reports a bad one). */
const progressIdOf = (query: unknown): string | undefined => {
  const id = (query as { progressId?: unknown } | undefined)?.progressId;
  return typeof id === 'string' && PROGRESS_ID.test(id) ? id : undefined;
};

/** An AbortSignal that fires when the client goes away before its answer is sent (a closed tab, a dropped line). */
function clientGone(res: Response): AbortSignal {
  const controller = new AbortController();
  res.once('close', () => {
    if (!res.writableFinished) controller.abort(new ClientGoneError());
  });
  return controller.signal;
}

class ClientGoneError extends Error {
  constructor() {
    super('the client closed the connection before the import finished');
  }
}

/** Takes this request's turn in the import queue before its upload is read; gives it back when the answer is done. */
function importTurn(queue: ImportQueue): RequestHandler {
  return async (_req, res, next) => {
    const entered = queue.enter();
    if (!entered) {
      res.set('Retry-After', String(RETRY_AFTER_S));
      throw new ApiError(429, 'import-busy', `another import is running and ${queue.maxWaiting} are waiting; try again in ${RETRY_AFTER_S} seconds`);
    }
    const release = await entered;
    res.once('finish', release);
    res.once('close', release);
    next();
  };
}

export function registerNetworkRoutes(routes: RouteTable, ctx: AppContext) {
  const sequelize = ctx.db.sequelize;

  const queue = new ImportQueue();
  const board = new ImportProgressBoard();
  const reading: RequestHandler = (req, _res, next) => {
    void board.set(progressIdOf(req.query), { stage: 'reading', done: 0, total: 0 });
    next();
  };
  routes.add('post', '/network/import', { roles: can.editNetwork, body: 'large' }, reading, importTurn(queue), multipartFiles(ctx.config.UPLOAD_LIMIT_MB), async (req, res) => {
    const progressId = progressIdOf(req.query);
    try {
      await runImport(req, res, progressId);
    } catch (err) {
      await board.set(progressId, { stage: 'failed', done: 0, total: 0 });
      // nobody is left to answer: the transaction has rolled back, the database is as it was
      if (res.destroyed || err instanceof ClientGoneError) return;
      throw err;
    }
  });

  async function runImport(req: Request, res: Response, progressId: string | undefined) {
    const signal = clientGone(res);
    const { dryRun, replace, undoNewer, confirmReplace } = parseOr400(importQuerySchema, req.query, 'query');
    let input: Awaited<ReturnType<typeof readUploads>>;
    if (req.is('multipart/form-data')) {
      const files = (req.files as Express.Multer.File[] | undefined) ?? [];
      if (files.length === 0) throw badRequest('no file was sent: put the network in a multipart field named "file"', [{ field: 'file', message: 'required' }]);
      try {
        input = await readUploads(files.map((f) => ({ name: f.originalname, data: f.buffer })));
      } catch (err) {
        if (err instanceof UploadLimitError) throw new ApiError(413, 'too-large', err.message);
        throw err;
      }
    } else if (req.is('application/json')) {
      input = { raw: req.body, sourceErrors: [] };
    } else {
      throw new ApiError(415, 'unsupported-media-type', 'send the network document as application/json, or files as multipart/form-data in the field "file"');
    }
    signal.throwIfAborted();
    const report = await importNetwork(ctx.db, input.raw, {
      dryRun, replace, undoNewer, confirmReplace, actor: actorOf(req), rowsOf: input.rowsOf, sourceErrors: input.sourceErrors, moreSourceErrors: input.moreSourceErrors,
      signal, onProgress: (p) => void board.set(progressId, p),
    });
    if (report.ok && !report.dryRun && report.networkVersion !== undefined) {
      void board.set(progressId, { stage: 'rebuilding', done: 0, total: 1 });
      await ctx.network.refresh(report.networkVersion);
    }
    // stored before the answer, so that a poll after the answer hears done
    await board.set(progressId, { stage: 'done', done: 1, total: 1 });
    res.status(report.errors.length > 0 ? 422 : 200).json(report);
  }

  routes.add('get', '/network/import/progress/:id', can.editNetwork, async (req, res) => {
    const { id } = parseOr400(progressParamsSchema, req.params, 'path');
    // An id not heard of is "pending", not a 404: the screen polls from the moment it sends, so its
    // first polls usually arrive before the upload does (and a refused poll would be logged as an error).
    res.json((await board.get(id)) ?? { stage: 'pending', done: 0, total: 0 });
  });

  routes.add('get', '/network/export', can.read, async (req, res) => {
    const { format } = parseOr400(exportQuerySchema, req.query, 'query');
    if (format === 'json') {
      await sendExport(req, res, await exportJson(ctx));
      return;
    }
    const { document, version } = await loadNetworkDocument(sequelize);
    res.set('X-Network-Version', String(version));
    res.type('application/zip').attachment(`network-v${version}.zip`).send(await documentToZip(document, version));
  });

  // The diagram's columns: only what is drawn, a fraction of the export's bytes and parse time.
  routes.add('get', '/network/drawing', can.read, async (req, res) => {
    await sendBytes(req, res, await drawingJson(ctx));
  });

  routes.add('get', '/audit', can.manageUsers, async (req, res) => {
    res.json(await listAudit(sequelize, parseOr400(auditQuerySchema, req.query, 'query')));
  });
}

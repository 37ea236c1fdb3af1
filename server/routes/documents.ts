/**
 * Documents on each owner kind of server/documents/owners.ts, paths relative to /api:
 *   GET    /<kind>/:code/documents               -> { items: [{ id, name, type, size, sha256, createdAt, createdBy, preview }] }
 *   POST   /<kind>/:code/documents               multipart, one file in field `file` (25 MB at most) -> 201, the document
 *   GET    /<kind>/:code/documents/:id           -> 302 to a presigned link (5 minutes); ?as=link -> { url, expiresAt }
 *   GET    /<kind>/:code/documents/:id/preview   -> the small JPEG preview of an image
 *   DELETE /<kind>/:code/documents/:id           -> 204
 * See server/documents/README.md.
 */
import type { Request, Response } from 'express';
import multer from 'multer';
import { can } from '@/shared/api';
import { DOCUMENT_MAX_BYTES } from '@/shared/schemas/documents';
import { ApiError, badRequest } from '../http/errors';
import type { RouteTable } from '../http/routes';
import type { AppContext } from '../context';
import { OWNER_KINDS } from '../documents/owners';
import { deleteDocument, documentLink, findDocument, listDocuments, previewBytes, uploadDocument } from '../documents/service';

const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: DOCUMENT_MAX_BYTES, files: 1, fields: 4, parts: 6 } }).single('file');

/** Multer's refusals as answers that say what to do. */
function receiveFile(req: Request, res: Response): Promise<Express.Multer.File> {
  const declared = Number(req.get('content-length') ?? 0);
  if (declared > DOCUMENT_MAX_BYTES + 64 * 1024) return Promise.reject(tooLarge());
  return new Promise((resolve, reject) => {
    upload(req, res, (err: unknown) => {
      if (err) {
        const code = (err as { code?: string }).code;
        if (code === 'LIMIT_FILE_SIZE') return reject(tooLarge());
        if (code === 'LIMIT_FILE_COUNT') return reject(badRequest('send one file per upload'));
        if (code === 'LIMIT_UNEXPECTED_FILE') return reject(badRequest('the file goes in the multipart field named "file"'));
        return reject(badRequest(`the upload could not be read: ${(err as Error).message ?? 'malformed multipart body'}`));
      }
      if (!req.file) return reject(badRequest('send the file as multipart/form-data in the field named "file"'));
      resolve(req.file);
    });
  });
}

const tooLarge = () => new ApiError(413, 'too-large', `a document is at most ${DOCUMENT_MAX_BYTES / 1024 / 1024} MB`);

export function registerDocumentRoutes(routes: RouteTable, ctx: AppContext) {
  for (const kind of Object.keys(OWNER_KINDS)) {
    const owner = (req: Request) => ({ kind, code: String(req.params.code) });

    routes.add('get', `/${kind}/:code/documents`, can.read, async (req, res) => {
      res.json({ items: await listDocuments(ctx, owner(req)) });
    });

    routes.add('post', `/${kind}/:code/documents`, can.editDocuments, async (req, res) => {
      const file = await receiveFile(req, res);
      // multer reads names as latin1; browsers send UTF-8
      const name = Buffer.from(file.originalname, 'latin1').toString('utf8');
      res.status(201).json(await uploadDocument(ctx, owner(req), { bytes: file.buffer, name }, req.auth?.email ?? ''));
    });

    routes.add('get', `/${kind}/:code/documents/:id`, can.read, async (req, res) => {
      const row = await findDocument(ctx, owner(req), String(req.params.id));
      const link = await documentLink(ctx, row);
      if (req.query.as === 'link') res.json(link);
      else res.redirect(302, link.url);
    });

    routes.add('get', `/${kind}/:code/documents/:id/preview`, can.read, async (req, res) => {
      const row = await findDocument(ctx, owner(req), String(req.params.id));
      res.set('Cache-Control', 'private, max-age=3600').type('image/jpeg').send(await previewBytes(ctx, row));
    });

    routes.add('delete', `/${kind}/:code/documents/:id`, can.editDocuments, async (req, res) => {
      await deleteDocument(ctx, await findDocument(ctx, owner(req), String(req.params.id)));
      res.status(204).end();
    });
  }
}

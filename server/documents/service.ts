/**
 * Documents: the bytes in the object store, the metadata in PostgreSQL.
 * An upload writes the objects first, then the row in a transaction; when
 * the row fails the objects are deleted again, so a failure half-way leaves
 * neither a row nor an orphan object. Deletes remove the row first (the
 * answer the API gives), then the objects.
 */
import crypto from 'node:crypto';
import path from 'node:path';
import type { Transaction } from 'sequelize';
import { Op } from 'sequelize';
import type { DocumentInfo } from '@/shared/schemas/documents';
import { ApiError, conflict, notFound } from '../http/errors';
import type { AppContext } from '../context';
import { DocumentRow } from '../db/models/documents';
import { detectType, isImage } from './fileTypes';
import { OWNER_KINDS, type DocumentsChoice } from './owners';
import { LINK_SECONDS, type ObjectStore } from './storage';

export interface Owner {
  kind: string;
  code: string;
}

const PREVIEW_PX = 320;

export function storeOf(ctx: AppContext): ObjectStore {
  if (!ctx.objects) throw new ApiError(503, 'storage-unavailable', 'document storage is not configured on this server');
  return ctx.objects;
}

async function requireOwner(ctx: AppContext, owner: Owner): Promise<void> {
  const kind = OWNER_KINDS[owner.kind];
  if (!kind || !(await kind.exists(ctx, owner.code))) throw notFound(`no ${kind?.noun ?? owner.kind} with code ${owner.code}`, { code: owner.code });
}

export const toInfo = (r: DocumentRow): DocumentInfo => ({
  id: Number(r.id),
  name: r.name,
  type: r.type,
  size: Number(r.size),
  sha256: r.sha256,
  createdAt: r.createdAt.toISOString(),
  createdBy: r.createdBy,
  preview: Boolean(r.previewKey),
});

/** A file name safe to show and to put in a header: no folders, no control characters. */
export function cleanName(raw: string): string {
  const base = path.basename(raw.replace(/\\/g, '/'))
    // eslint-disable-next-line no-control-regex -- removing control characters is the point of this pattern
    .replace(/[\u0000-\u001f\u007f]/g, '').trim();
  return (base || 'document').slice(0, 255);
}

export async function listDocuments(ctx: AppContext, owner: Owner): Promise<DocumentInfo[]> {
  await requireOwner(ctx, owner);
  const rows = await DocumentRow.findAll({ where: { ownerKind: owner.kind, ownerCode: owner.code }, order: [['createdAt', 'DESC'], ['id', 'DESC']] });
  return rows.map(toInfo);
}

export async function findDocument(ctx: AppContext, owner: Owner, id: string): Promise<DocumentRow> {
  const row = /^\d{1,15}$/.test(id) ? await DocumentRow.findOne({ where: { id: Number(id), ownerKind: owner.kind, ownerCode: owner.code } }) : null;
  if (!row) throw notFound(`no document ${id} on ${OWNER_KINDS[owner.kind]?.noun ?? owner.kind} ${owner.code}`);
  return row;
}

async function makePreview(bytes: Buffer): Promise<Buffer> {
  // loaded on first use, like the S3 SDK: a native module a server without documents need not load
  const { default: sharp } = await import('sharp');
  try {
    return await sharp(bytes, { limitInputPixels: 100_000_000 }).rotate().resize({ width: PREVIEW_PX, height: PREVIEW_PX, fit: 'inside', withoutEnlargement: true }).jpeg({ quality: 70 }).toBuffer();
  } catch {
    throw new ApiError(415, 'unreadable-image', 'the image could not be read: it may be damaged or cut short');
  }
}

export async function uploadDocument(ctx: AppContext, owner: Owner, file: { bytes: Buffer; name: string }, createdBy: string): Promise<DocumentInfo> {
  await requireOwner(ctx, owner);
  const store = storeOf(ctx);
  const name = cleanName(file.name);
  const type = await detectType(file.bytes, name);
  const preview = isImage(type) ? await makePreview(file.bytes) : null;
  const sha256 = crypto.createHash('sha256').update(file.bytes).digest('hex');
  const objectKey = `${owner.kind}/${encodeURIComponent(owner.code)}/${crypto.randomUUID()}`;
  const previewKey = preview ? `${objectKey}.preview.jpg` : null;

  const written: string[] = [];
  try {
    await store.put(objectKey, file.bytes, type);
    written.push(objectKey);
    if (preview && previewKey) {
      await store.put(previewKey, preview, 'image/jpeg');
      written.push(previewKey);
    }
    const row = await ctx.db.sequelize.transaction(async (transaction) => {
      if (!(await OWNER_KINDS[owner.kind].exists(ctx, owner.code, transaction))) throw notFound(`${OWNER_KINDS[owner.kind].noun} ${owner.code} was deleted meanwhile`);
      return DocumentRow.create({ ownerKind: owner.kind, ownerCode: owner.code, name, type, size: file.bytes.length, sha256, objectKey, previewKey, createdBy }, { transaction });
    });
    return toInfo(row);
  } catch (e) {
    await Promise.all(written.map((k) => store.remove(k).catch((err) => console.error(`[documents] could not remove ${k} after a failed upload:`, err))));
    if (e instanceof ApiError) throw e;
    throw new ApiError(503, 'upload-failed', 'the document could not be stored; nothing was kept, try again');
  }
}

export async function documentLink(ctx: AppContext, row: DocumentRow): Promise<{ url: string; expiresAt: string }> {
  return { url: await storeOf(ctx).link(row.objectKey, row.name, row.type), expiresAt: new Date(Date.now() + LINK_SECONDS * 1000).toISOString() };
}

export async function previewBytes(ctx: AppContext, row: DocumentRow): Promise<Buffer> {
  const bytes = row.previewKey ? await storeOf(ctx).get(row.previewKey) : null;
  if (!bytes) throw notFound(`document ${row.id} has no preview`);
  return bytes;
}

async function removeObjects(ctx: AppContext, rows: DocumentRow[]): Promise<void> {
  const store = storeOf(ctx);
  const keys = rows.flatMap((r) => [r.objectKey, r.previewKey ?? '']).filter(Boolean);
  await Promise.all(keys.map((k) => store.remove(k).catch((err) => console.error(`[documents] could not remove object ${k}:`, err))));
}

export async function deleteDocument(ctx: AppContext, row: DocumentRow): Promise<void> {
  await row.destroy();
  await removeObjects(ctx, [row]);
}

/**
 * Called inside the transaction that deletes owners (`deleted`: kind -> codes).
 * Kinds that 'ask' refuse with 409 naming the count unless `choice` is given;
 * with 'delete' the rows go in that transaction and the objects after it commits.
 */
export async function ownersDeleted(ctx: AppContext, transaction: Transaction, deleted: Partial<Record<string, string[]>>, choice?: DocumentsChoice): Promise<void> {
  const rows: DocumentRow[] = [];
  for (const [kind, codes] of Object.entries(deleted)) {
    if (!codes?.length || OWNER_KINDS[kind]?.onDelete !== 'ask') continue;
    rows.push(...(await DocumentRow.findAll({ where: { ownerKind: kind, ownerCode: { [Op.in]: codes } }, transaction })));
  }
  if (rows.length === 0 || choice === 'keep') return;
  if (!choice) {
    const owners = [...new Set(rows.map((r) => `${OWNER_KINDS[r.ownerKind].noun} ${r.ownerCode}`))];
    throw conflict(
      `${owners.join(', ')} ${owners.length === 1 ? 'has' : 'have'} ${rows.length} document${rows.length === 1 ? '' : 's'}; delete again with documents=delete to delete them too, or documents=keep to keep them`,
      { documents: rows.length },
    );
  }
  await DocumentRow.destroy({ where: { id: { [Op.in]: rows.map((r) => r.id) } }, transaction });
  transaction.afterCommit(() => void removeObjects(ctx, rows));
}

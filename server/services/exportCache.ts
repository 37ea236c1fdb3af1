/**
 * The JSON export (and the diagram's columns, GET /network/drawing), made
 * once per network version and served as stored bytes.
 * The in-memory model holds the same document the export would read from
 * PostgreSQL; its document is serialised and gzipped once per version (the
 * text in slices with turns between them, the gzip in the thread pool), and every export of that
 * version sends the same bytes: gzipped to a client that accepts gzip (every
 * browser), plain otherwise, streamed in slices so that a slow phone holds
 * back only its own socket. Fifty engineers exporting at once cost one
 * serialisation, shared even while it is being made.
 *
 * When the model is behind the database (a rebuild under way), the export
 * waits for the rebuild rather than building an answer per request; only if
 * the rebuild fails does it read PostgreSQL for the request.
 */
import crypto from 'node:crypto';
import { Readable, Writable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import zlib from 'node:zlib';
import type { Request, Response } from 'express';
import type { AppContext } from '../context';
import { drawingSteps } from '@/shared/schemas/drawing';
import type { NetworkDocument } from '@/shared/schemas/network';
import { loadNetworkDocument } from './networkLoader';
import { stringifyChunksInTurns } from './stringifyInTurns';
import { Turns, nextTurn, stepsInTurns } from '../interchange/turns';

/**
 * The bytes in pieces of about a megabyte: one buffer of the whole (132 MB
 * of export at 100,000 sites) is a fresh allocation that held the event loop
 * for half a second on a loaded machine, and nothing here needs it whole.
 */
export interface ExportBytes {
  version: number;
  body: Buffer[];
  gzip: Buffer[];
  etag: string;
}

const total = (pieces: readonly Buffer[]) => pieces.reduce((n, b) => n + b.length, 0);

/** The pieces' SHA-1 (base64url), with a turn after every 8 MB or so. */
async function sha1InTurns(pieces: readonly Buffer[]): Promise<string> {
  const hash = crypto.createHash('sha1');
  let since = 0;
  for (const piece of pieces) {
    hash.update(piece);
    if ((since += piece.length) >= 8 << 20) {
      since = 0;
      await nextTurn();
    }
  }
  return hash.digest('base64url');
}

/** gzip of the pieces at zlib's default level, in the thread pool, kept in the pieces zlib gives. */
async function gzipPieces(pieces: readonly Buffer[]): Promise<Buffer[]> {
  const out: Buffer[] = [];
  const keep = new Writable({
    write(chunk: Buffer, _encoding, done) {
      out.push(chunk);
      done();
    },
  });
  await pipeline(Readable.from(pieces, { objectMode: false }), zlib.createGzip(), keep);
  return out;
}

/** Per answer kind, keyed by the model object: a rebuild makes a new one, even at the same version (a test's reset). */
const cache = new Map<string, { model: object; bytes: Promise<ExportBytes> }>();

async function encode(answer: object, version: number, kind: string): Promise<ExportBytes> {
  // In slices, other requests answered between them: a national network's export is over 100 MB of text.
  const body = await stringifyChunksInTurns(answer);
  // zlib's default level: a 20,000-site export shrinks several times over
  const packed = await gzipPieces(body);
  const etag = `"${kind === 'export' ? '' : `${kind}-`}v${version}-${(await sha1InTurns(body)).slice(0, 16)}"`;
  return { version, body, gzip: packed, etag };
}

/**
 * The bytes of one answer made from the network document, for the database's
 * current version (or a newer one the model already holds), made once per
 * model and kind.
 */
async function fromDocument(ctx: AppContext, kind: string, make: (document: NetworkDocument, version: number) => object | Promise<object>): Promise<ExportBytes> {
  const databaseVersion = await ctx.network.databaseVersion();
  if (!ctx.network.model || ctx.network.model.networkVersion < databaseVersion) await ctx.network.refresh(databaseVersion);
  const model = ctx.network.model;
  if (!model || model.networkVersion < databaseVersion) {
    // the rebuild failed (it is retried in the background): the stored network, read for this request
    const { document, version } = await loadNetworkDocument(ctx.db.sequelize);
    return encode(await make(document, version), version, kind);
  }
  const held = cache.get(kind);
  if (held?.model === model) return held.bytes;
  const bytes = Promise.resolve(make(model.document, model.networkVersion)).then((answer) => encode(answer, model.networkVersion, kind));
  const entry = { model, bytes };
  cache.set(kind, entry);
  bytes.catch(() => {
    if (cache.get(kind) === entry) cache.delete(kind);
  });
  return bytes;
}

/** The export bytes of the database's current version (or a newer one the model already holds). */
export function exportJson(ctx: AppContext): Promise<ExportBytes> {
  return fromDocument(ctx, 'export', withBase);
}

/** The diagram's columns (shared/schemas/drawing.ts), made and cached the same way. */
export function drawingJson(ctx: AppContext): Promise<ExportBytes> {
  return fromDocument(ctx, 'drawing', (document, version) => stepsInTurns(drawingSteps(document, version), new Turns(undefined, 1)));
}

/**
 * Makes the diagram's columns in the background (after a start, once the
 * server is quiet: server.ts), so the first
 * person to open the diagram does not wait for them to be made: at 20,000
 * sites that is half a second or more of the first draw. A failure is left
 * for that first request to meet and report.
 */
export async function warmDrawing(ctx: AppContext): Promise<ExportBytes | null> {
  try {
    return await drawingJson(ctx);
  } catch {
    return null;
  }
}

const SLICE = 256 * 1024;

/** Send the export: 304 for a matching ETag, gzip when accepted, streamed in slices. */
export async function sendExport(req: Request, res: Response, bytes: ExportBytes) {
  res.attachment(`network-v${bytes.version}.json`);
  await sendBytes(req, res, bytes);
}

/** Send stored JSON bytes: 304 for a matching ETag, gzip when accepted, streamed in slices. */
export async function sendBytes(req: Request, res: Response, bytes: ExportBytes) {
  res.set('X-Network-Version', String(bytes.version)).type('application/json');
  res.set('ETag', bytes.etag).set('Vary', 'Accept-Encoding');
  if (req.get('if-none-match') === bytes.etag) {
    res.status(304).end();
    return;
  }
  const gzipped = /\bgzip\b/i.test(req.get('accept-encoding') ?? '');
  const payload = gzipped ? bytes.gzip : bytes.body;
  if (gzipped) res.set('Content-Encoding', 'gzip');
  res.set('Content-Length', String(total(payload)));
  if (req.method === 'HEAD') {
    res.end();
    return;
  }
  try {
    await pipeline(Readable.from(slices(payload), { objectMode: false }), res);
  } catch (e) {
    // the client went away mid-answer: nothing left to tell it
    if (!res.destroyed && !req.destroyed) throw e;
  }
}

function* slices(pieces: readonly Buffer[]) {
  for (const buf of pieces) for (let i = 0; i < buf.length; i += SLICE) yield buf.subarray(i, Math.min(buf.length, i + SLICE));
}

/** The export says which version it was made from, so a replace-import from it can tell what it would undo. */
function withBase(document: NetworkDocument, version: number) {
  const { format, ...entities } = document;
  return { format, baseVersion: version, ...entities };
}

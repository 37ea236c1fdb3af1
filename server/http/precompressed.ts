/**
 * Serves the web export's files compressed ahead of time (scripts/lib/precompress.ts
 * writes `name.br` and `name.gz` beside them at build time): brotli to a
 * browser that accepts br, gzip to one that accepts only gzip, the file as it
 * is otherwise, always with `Vary: Accept-Encoding` so a shared cache keeps the
 * answers apart. Compressing on every request would cost CPU per visit and
 * reach only brotli's fast levels; level 11 done once sends about a fifth less
 * script than gzip. A file with no compressed copy beside it (or a request
 * other than GET/HEAD) goes to the next handler.
 */
import fs from 'node:fs';
import path from 'node:path';
import type { RequestHandler, Response } from 'express';

export type Encoding = 'br' | 'gzip' | 'identity';
const SUFFIX = { br: '.br', gzip: '.gz' } as const;

/**
 * The encoding to send for an Accept-Encoding header: br or gzip when the
 * header allows it (q > 0, directly or through `*`), br first when both are
 * equally welcome; identity when it names neither or there is no header.
 */
export function chooseEncoding(header: string | undefined): Encoding {
  if (!header) return 'identity';
  const q = new Map<string, number>();
  for (const part of header.split(',')) {
    const [name, ...params] = part.trim().toLowerCase().split(';');
    if (!name) continue;
    const qParam = params.map((p) => p.trim()).find((p) => p.startsWith('q='));
    const value = qParam ? Number(qParam.slice(2)) : 1;
    q.set(name, Number.isFinite(value) ? Math.min(Math.max(value, 0), 1) : 0);
  }
  const of = (name: string) => q.get(name) ?? q.get('*') ?? 0;
  const br = of('br');
  const gzip = of('gzip');
  if (br > 0 && br >= gzip) return 'br';
  if (gzip > 0) return 'gzip';
  return 'identity';
}

export interface PrecompressedOptions {
  /** Cache-Control max-age in seconds */
  maxAgeSeconds: number;
  /** extra headers for a file (by its uncompressed path), e.g. no-cache for the service worker */
  setHeaders?: (res: Response, file: string) => void;
}

export function precompressed(root: string, options: PrecompressedOptions): RequestHandler {
  const base = path.resolve(root);
  const isFile = (p: string) => fs.promises.stat(p).then((s) => s.isFile(), () => false);
  return (req, res, next) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') return next();
    let rel: string;
    try {
      rel = decodeURIComponent(req.path);
    } catch {
      return next();
    }
    const file = path.join(base, path.normalize(rel));
    if (!file.startsWith(base + path.sep) || rel.includes('\0')) return next();
    void (async () => {
      // only files the build compressed are answered here: both copies exist beside the original
      const [plain, br, gz] = await Promise.all([isFile(file), isFile(file + SUFFIX.br), isFile(file + SUFFIX.gzip)]);
      if (!plain || !br || !gz) return next();
      const encoding = chooseEncoding(req.get('accept-encoding'));
      res.vary('Accept-Encoding');
      res.type(path.extname(file));
      if (encoding !== 'identity') res.setHeader('Content-Encoding', encoding);
      options.setHeaders?.(res, file);
      const sent = encoding === 'identity' ? file : file + SUFFIX[encoding];
      res.sendFile(sent, { maxAge: options.maxAgeSeconds * 1000, dotfiles: 'deny' }, (err?: NodeJS.ErrnoException) => {
        // a browser that leaves the page mid-download is not an error of ours
        if (err && err.code !== 'ECONNABORTED' && !res.headersSent) next(err);
      });
    })().catch(next);
  };
}

/**
 * The entries of an uploaded zip, inflated one at a time as streams (yauzl),
 * never as whole strings. Before anything is inflated, the sizes the central
 * directory declares are checked against the request's budget; while an
 * entry inflates, yauzl checks its real bytes against the declared size (a
 * directory that lies is an error as soon as the lie shows) and the CSV
 * reader counts them against the budget as well (csv-read.ts).
 */
import type { Readable } from 'node:stream';
import yauzl from 'yauzl';
import { clip } from '@/shared/clip';
import type { UploadBudget } from './limits';
import { formatCount } from '@/shared/format';

export interface ZipEntryInfo {
  name: string;
  declaredBytes: number;
  open(): Promise<Readable>;
}

/** A zip that cannot be read (not a zip, a broken or lying directory, an encrypted entry): the report says so. */
export class BadZipError extends Error {}

const fromBuffer = (data: Buffer) =>
  new Promise<yauzl.ZipFile>((resolve, reject) => {
    yauzl.fromBuffer(data, { lazyEntries: true, autoClose: false, validateEntrySizes: true, strictFileNames: false }, (err, zip) => (err ? reject(err) : resolve(zip)));
  });

// macOS archivers add "__MACOSX/" and "._name" copies holding file metadata, not data.
const isMetadata = (name: string) => name.startsWith('__MACOSX/') || (name.split('/').pop() ?? '').startsWith('._');

/**
 * Reads the directory of a zip and hands back its file entries (folders and
 * archiver metadata left out); call close() when done with them.
 */
export async function zipEntries(data: Uint8Array, budget: UploadBudget): Promise<{ entries: ZipEntryInfo[]; close: () => void }> {
  let zip: yauzl.ZipFile;
  try {
    zip = await fromBuffer(Buffer.isBuffer(data) ? data : Buffer.from(data.buffer, data.byteOffset, data.byteLength));
  } catch (err) {
    throw new BadZipError(`the upload is not a readable zip: ${clip((err as Error).message, 120)}`);
  }
  if (zip.entryCount > budget.limits.maxZipEntries) {
    zip.close();
    throw new BadZipError(`the zip holds ${formatCount(zip.entryCount)} entries; a network has five files`);
  }
  const raw: yauzl.Entry[] = [];
  try {
    await new Promise<void>((resolve, reject) => {
      zip.on('entry', (entry: yauzl.Entry) => {
        raw.push(entry);
        zip.readEntry();
      });
      zip.on('end', () => resolve());
      zip.on('error', reject);
      zip.readEntry();
    });
  } catch (err) {
    zip.close();
    throw new BadZipError(`the zip cannot be read: ${clip((err as Error).message, 120)}`);
  }
  const files = raw.filter((e) => !e.fileName.endsWith('/') && !isMetadata(e.fileName));
  try {
    budget.checkDeclared(files.reduce((n, e) => n + e.uncompressedSize, 0));
  } catch (err) {
    zip.close();
    throw err;
  }
  const entries = files.map((entry) => ({
    name: clip(entry.fileName, 120),
    declaredBytes: entry.uncompressedSize,
    open: () =>
      new Promise<Readable>((resolve, reject) => {
        zip.openReadStream(entry, (err, stream) => (err ? reject(new BadZipError(`${clip(entry.fileName, 120)} cannot be read from the zip: ${clip(err.message, 120)}`)) : resolve(stream)));
      }),
  }));
  return { entries, close: () => zip.close() };
}

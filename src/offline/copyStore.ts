/**
 * The last network document this browser fetched, kept in IndexedDB (through
 * idb-keyval) so that fault reach still answers with no connection
 * (src/offline/README.md). One copy per browser profile, replaced whole when
 * the server's network version moves on, deleted on sign-out.
 *
 * The copy is kept as the export's JSON text, one string: IndexedDB stores
 * and returns a string in milliseconds, where a 20,000-site document as
 * objects took seconds of the page's only thread to store, read back and
 * check (structured clone, then the schema). The text is parsed and checked
 * only when the copy is first used, which is when there is no connection.
 *
 * A stored entry that is not of this shape (a half-written entry, an older
 * layout, a hand-edited store) is deleted and treated as missing; a text that
 * turns out not to be a valid network document when first used is deleted
 * too. Either way, the next time the server is reachable a fresh one is
 * fetched.
 */
import { createStore, del, get, set, type UseStore } from 'idb-keyval';
import { Platform } from 'react-native';
import { z } from 'zod';
import { copyOverText, type OfflineCopy, type StoredCopy } from './copy';
import { COPY_LOCATION } from './location';

export { copyOfDocument, UnreadableCopyError, type OfflineCopy } from './copy';

const KEY = COPY_LOCATION.key;
const storedSchema = z.strictObject({
  networkVersion: z.number().int().min(0),
  fetchedAt: z.iso.datetime(),
  text: z.string().min(2),
});

/** A copy over stored text that deletes itself from the store when its text turns out unreadable. */
export const makeCopy = (stored: StoredCopy): OfflineCopy => copyOverText(stored, () => void clearCopy());

let store: UseStore | null = null;
function theStore(): UseStore {
  store ??= createStore(COPY_LOCATION.database, COPY_LOCATION.store);
  return store;
}

/** Only the web app keeps a copy: a browser with IndexedDB. */
export function offlineCopySupported(): boolean {
  return Platform.OS === 'web' && typeof indexedDB !== 'undefined';
}

export type CopyRead = { copy: OfflineCopy } | { copy: null; discarded: boolean };

/** The stored copy, or null; an entry that fails validation is deleted (discarded: true). */
export async function readCopy(): Promise<CopyRead> {
  if (!offlineCopySupported()) return { copy: null, discarded: false };
  const raw = await get(KEY, theStore());
  if (raw === undefined) return { copy: null, discarded: false };
  const parsed = storedSchema.safeParse(raw);
  if (!parsed.success) {
    await del(KEY, theStore());
    return { copy: null, discarded: true };
  }
  return { copy: makeCopy(parsed.data) };
}

export async function writeCopy(copy: OfflineCopy): Promise<void> {
  if (!offlineCopySupported()) return;
  // the stored fields only: cloning the copy itself would read (parse) its document
  const stored: StoredCopy = { networkVersion: copy.networkVersion, fetchedAt: copy.fetchedAt, text: copy.text };
  await set(KEY, stored, theStore());
}

export async function clearCopy(): Promise<void> {
  if (!offlineCopySupported()) return;
  await del(KEY, theStore());
}


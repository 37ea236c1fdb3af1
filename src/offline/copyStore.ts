/**
 * The last network document this browser fetched, kept in IndexedDB (through
 * idb-keyval) so that fault reach still answers with no connection
 * (src/offline/README.md). One copy per browser profile, replaced whole when
 * the server's network version moves on, deleted on sign-out.
 *
 * A copy that does not read back as a valid network document (a half-written
 * entry, an older layout, a hand-edited store) is deleted and treated as
 * missing: the next time the server is reachable a fresh one is fetched.
 */
import { createStore, del, get, set, type UseStore } from 'idb-keyval';
import { Platform } from 'react-native';
import { z } from 'zod';
import { networkDocumentSchema, type NetworkDocument } from '@/shared/schemas/network';
import { COPY_LOCATION } from './location';

export interface OfflineCopy {
  networkVersion: number;
  /** when this browser fetched it (ISO 8601) */
  fetchedAt: string;
  document: NetworkDocument;
}

const KEY = COPY_LOCATION.key;
const storedSchema = z.strictObject({
  networkVersion: z.number().int().min(0),
  fetchedAt: z.iso.datetime(),
  document: networkDocumentSchema,
});

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
  return { copy: parsed.data as OfflineCopy };
}

export async function writeCopy(copy: OfflineCopy): Promise<void> {
  if (!offlineCopySupported()) return;
  await set(KEY, copy, theStore());
}

export async function clearCopy(): Promise<void> {
  if (!offlineCopySupported()) return;
  await del(KEY, theStore());
}


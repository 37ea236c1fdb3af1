/**
 * The offline copy as the app holds it: the export's JSON text with its
 * version and time, and the document read from that text the first time it
 * is asked for (src/offline/copyStore.ts says why). No browser API here, so
 * the unit tests can use it.
 */
import { networkDocumentSchema, type NetworkDocument } from '@/shared/schemas/network';

export interface StoredCopy {
  networkVersion: number;
  /** when this browser fetched it (ISO 8601) */
  fetchedAt: string;
  /** the export as the server sent it (JSON) */
  text: string;
}

export interface OfflineCopy extends StoredCopy {
  /** the document, parsed and checked on first use; throws UnreadableCopyError (and deletes the copy) when it is not valid */
  readonly document: NetworkDocument;
}

export class UnreadableCopyError extends Error {
  override name = 'UnreadableCopyError';
}

/** A copy over stored text; its document is read once, when first asked for. */
export function copyOverText(stored: StoredCopy, onUnreadable: () => void = () => undefined): OfflineCopy {
  let document: NetworkDocument | null = null;
  return {
    networkVersion: stored.networkVersion,
    fetchedAt: stored.fetchedAt,
    text: stored.text,
    get document(): NetworkDocument {
      if (document) return document;
      const checked = (() => {
        try {
          return networkDocumentSchema.safeParse(JSON.parse(stored.text));
        } catch {
          return null;
        }
      })();
      if (!checked?.success) {
        onUnreadable();
        throw new UnreadableCopyError('the stored copy of the network could not be read; it has been deleted, and a fresh one is fetched once there is a connection');
      }
      document = checked.data as NetworkDocument;
      return document;
    },
  };
}

/** A copy of a document at hand (tests, and anything that already holds one). */
export function copyOfDocument(document: NetworkDocument, networkVersion: number, fetchedAt: string): OfflineCopy {
  return copyOverText({ networkVersion, fetchedAt, text: JSON.stringify(document) });
}


/**
 * Documents on sites and feeds (server/documents/README.md). Uploads are
 * multipart, so they go through `fetch` here with the session's token rather
 * than the JSON `send`; previews are fetched the same way and shown from a
 * blob: URL (an <img> cannot carry the bearer token).
 */
import { useEffect, useMemo } from 'react';
import useSWR, { useSWRConfig } from 'swr';
import { api } from '@/shared/api';
import { documentLinkSchema, documentListSchema, documentSchema } from '@/shared/schemas/documents';
import { useSession } from '@/src/session/SessionProvider';
import { useSend } from '../ApiProvider';
import { ApiError, parseAnswer } from '../client';
import { useApiQuery } from '../useApiQuery';

export type DocumentOwnerKind = 'sites' | 'feeds' | 'incidents' | 'works';
export const documentsKey = (kind: DocumentOwnerKind, code: string) => api.documents(kind, code);

export const useDocuments = (kind: DocumentOwnerKind, code: string) => useApiQuery(documentsKey(kind, code), documentListSchema, 'network');

async function failure(res: Response): Promise<ApiError> {
  try {
    const body = (await res.json()) as { error?: { code?: string; message?: string } };
    if (body.error?.message) return new ApiError(res.status, body.error.code ?? `http-${res.status}`, body.error.message);
  } catch {
    // not JSON: fall through
  }
  return new ApiError(res.status, `http-${res.status}`, `The server answered ${res.status}.`);
}

/** The small preview of an image document as a blob: URL, released when no longer shown. */
export function usePreview(kind: DocumentOwnerKind, code: string, id: number, enabled: boolean) {
  const { tokenRef } = useSession();
  const key = enabled ? api.documentPreview(kind, code, id) : null;
  const answer = useSWR<string, ApiError>(
    key,
    async (path: string) => {
      const res = await fetch(path, { headers: { Authorization: `Bearer ${tokenRef.current ?? ''}` } });
      if (!res.ok) throw await failure(res);
      return URL.createObjectURL(await res.blob());
    },
    { revalidateOnFocus: false, dedupingInterval: 3_600_000 },
  );
  const url = answer.data;
  useEffect(() => () => (url ? URL.revokeObjectURL(url) : undefined), [url]);
  return answer;
}

export function useDocumentActions(kind: DocumentOwnerKind, code: string) {
  const send = useSend();
  const { tokenRef } = useSession();
  const { mutate } = useSWRConfig();
  return useMemo(
    () => ({
      upload: async (file: Blob, name: string) => {
        const form = new FormData();
        form.append('file', file, name);
        let res: Response;
        try {
          res = await fetch(api.documents(kind, code), { method: 'POST', body: form, headers: { Authorization: `Bearer ${tokenRef.current ?? ''}` } });
        } catch {
          throw new ApiError(0, 'network', 'Could not reach the Headwater server. Check the connection and try again.');
        }
        if (!res.ok) throw await failure(res);
        const doc = parseAnswer(documentSchema, api.documents(kind, code), await res.json());
        await mutate(documentsKey(kind, code));
        return doc;
      },
      /** A short-lived download link, opened by the caller. */
      link: async (id: number) => parseAnswer(documentLinkSchema, api.document(kind, code, id), await send(`${api.document(kind, code, id)}?as=link`)),
      remove: async (id: number) => {
        await send(api.document(kind, code, id), { method: 'DELETE' });
        await mutate(documentsKey(kind, code));
      },
    }),
    [kind, code, send, tokenRef, mutate],
  );
}

/**
 * The network as a whole: import (POST /api/network/import, multipart field
 * `file`, ?dryRun, ?replace) and export (GET /api/network/export, JSON or
 * ?format=csv for a zip), as in server/routes/network.ts.
 *
 * They go through `sendRaw` (ApiProvider), the same client as every other
 * call with the same errors and 401 handling, because they are not JSON
 * requests: an upload is multipart, an export is a file. A 422 from the
 * import is not a failure here but the report listing the errors.
 */
import { useMemo } from 'react';
import { useSWRConfig } from 'swr';
import { api } from '@/shared/api';
import type { ImportReport } from '@/shared/schemas/import';
import { useSendRaw } from '../ApiProvider';
import { parseAnswer } from '../client';
import { importProgressSchema, importReportSchema } from '../schemas';
import { useApiQuery } from '../useApiQuery';
import { isNetworkKey } from './inventory';

/** A file to upload: a Blob on the web, a local file URI on a phone. */
export interface UploadFile {
  name: string;
  /** bytes, when known */
  size: number | null;
  part: Blob | { uri: string; name: string; type: string };
}

export interface ImportOptions {
  dryRun: boolean;
  replace: boolean;
  /** carry out a replace made from an older network version, undoing the changes since */
  undoNewer?: boolean;
  /** a replace's confirmation: the value its dry run answered */
  confirmReplace?: string;
  /** an id of the caller's choosing, to follow the import with useImportProgress */
  progressId?: string;
}

export interface DownloadedFile {
  name: string;
  blob: Blob;
}

export const importPath = ({ dryRun, replace, undoNewer, confirmReplace, progressId }: ImportOptions) =>
  `${api.importNetwork}?dryRun=${dryRun}&replace=${replace}${undoNewer ? '&undoNewer=true' : ''}` +
  `${confirmReplace ? `&confirmReplace=${encodeURIComponent(confirmReplace)}` : ''}${progressId ? `&progressId=${encodeURIComponent(progressId)}` : ''}`;

/** A fresh id for one import's progress (letters and digits, as the route takes them). */
export const newProgressId = () => `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 12)}`.padEnd(8, '0');

/** How far the import sent with this progress id is; null waits. Polled twice a second. */
export function useImportProgress(progressId: string | null) {
  return useApiQuery(progressId ? api.importProgress(progressId) : null, importProgressSchema, 'progress');
}
export const exportPath = (format: 'json' | 'csv') => (format === 'csv' ? `${api.exportNetwork}?format=csv` : api.exportNetwork);

/** The file name a Content-Disposition header gives (RFC 6266: filename*=UTF-8''... or filename="..."), else the fallback. */
export function attachmentName(header: string | null, fallback: string): string {
  if (!header) return fallback;
  const star = /filename\*\s*=\s*UTF-8''([^;]+)/i.exec(header);
  if (star) {
    try {
      return decodeURIComponent(star[1].trim());
    } catch {
      // a malformed escape: fall through to the plain parameter
    }
  }
  const plain = /filename\s*=\s*"?([^";]+)"?/i.exec(header);
  return plain ? plain[1].trim() : fallback;
}

export function useNetworkTransfer() {
  const sendRaw = useSendRaw();
  const { mutate } = useSWRConfig();

  return useMemo(() => {
    return {
      /** Sends the files; resolves with the report, errors included (a 422 is a report too). */
      importFiles: async (files: readonly UploadFile[], options: ImportOptions): Promise<ImportReport> => {
        if (files.length === 0) throw new Error('choose a file to import first');
        const form = new FormData();
        for (const f of files) {
          if (f.part instanceof Blob) form.append('file', f.part, f.name);
          // React Native's FormData takes { uri, name, type } for a local file.
          else form.append('file', f.part as unknown as Blob);
        }
        const path = importPath(options);
        const res = await sendRaw(path, { method: 'POST', body: form, answers: [422] });
        const report = parseAnswer(importReportSchema, path, await res.json()) as ImportReport;
        if (!options.dryRun && report.ok) await mutate(isNetworkKey);
        return report;
      },
      /** The network document (JSON) or the zip of its CSV files. */
      exportFile: async (format: 'json' | 'csv'): Promise<DownloadedFile> => {
        const res = await sendRaw(exportPath(format), { accept: format === 'csv' ? 'application/zip' : 'application/json' });
        const fallback = format === 'csv' ? 'network.zip' : 'network.json';
        return { name: attachmentName(res.headers.get('Content-Disposition'), fallback), blob: await res.blob() };
      },
    };
  }, [sendRaw, mutate]);
}


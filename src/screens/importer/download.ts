/** Saving an exported file on a phone is not offered yet; the web app downloads it (download.web.ts). */
import type { DownloadedFile } from '@/src/api/queries/network';

export function saveFile(file: DownloadedFile): void {
  throw new Error(`Saving ${file.name} works in the web app; on a phone, open Headwater in a browser to export.`);
}

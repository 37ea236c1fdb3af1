/** Words for a document's size and type. */
import { formatBytes } from '@/shared/format';

/** The one file-size form (shared/format.ts). */
export const sizeText = formatBytes;

const TYPES: Record<string, string> = {
  'image/jpeg': 'JPEG photo',
  'image/png': 'PNG image',
  'image/webp': 'WebP image',
  'application/pdf': 'PDF',
  'text/plain': 'Text',
  'text/csv': 'CSV table',
};
export const typeText = (t: string) => TYPES[t] ?? t;

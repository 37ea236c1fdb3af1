/** Words for a document's size and type. */
import { formatCount } from '@/shared/format';

export function sizeText(bytes: number): string {
  if (bytes < 1024) return `${formatCount(bytes)} bytes`;
  if (bytes < 1024 * 1024) return `${formatCount(Math.round(bytes / 1024))} kB`;
  return `${(bytes / 1024 / 1024).toFixed(1)} MB`;
}

const TYPES: Record<string, string> = {
  'image/jpeg': 'JPEG photo',
  'image/png': 'PNG image',
  'image/webp': 'WebP image',
  'application/pdf': 'PDF',
  'text/plain': 'Text',
  'text/csv': 'CSV table',
};
export const typeText = (t: string) => TYPES[t] ?? t;

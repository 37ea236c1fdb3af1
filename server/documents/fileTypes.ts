/**
 * What a file is, decided from its bytes (file-type's signatures; text is
 * valid UTF-8 without NUL bytes), never from its name or the browser's
 * Content-Type. A name whose extension claims another accepted type is a
 * lie and refused, so a PDF renamed .jpg never reaches a gallery.
 */
import { ApiError } from '../http/errors';

export const ACCEPTED = {
  'image/jpeg': { label: 'JPEG image', extensions: ['jpg', 'jpeg'] },
  'image/png': { label: 'PNG image', extensions: ['png'] },
  'image/webp': { label: 'WebP image', extensions: ['webp'] },
  'application/pdf': { label: 'PDF', extensions: ['pdf'] },
  'text/plain': { label: 'plain text', extensions: ['txt', 'text', 'log'] },
  'text/csv': { label: 'CSV text', extensions: ['csv'] },
} as const;
export type AcceptedType = keyof typeof ACCEPTED;

export const isImage = (type: string) => type.startsWith('image/');

const byExtension = new Map<string, AcceptedType>(
  (Object.entries(ACCEPTED) as Array<[AcceptedType, { extensions: readonly string[] }]>).flatMap(([type, v]) => v.extensions.map((e) => [e, type] as [string, AcceptedType])),
);

const unsupported = (what: string) =>
  new ApiError(415, 'unsupported-type', `${what}; accepted are JPEG, PNG and WebP images, PDF, and plain text or CSV`);

function isText(bytes: Buffer): boolean {
  if (bytes.includes(0)) return false;
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(bytes);
    return true;
  } catch {
    return false;
  }
}

export async function detectType(bytes: Buffer, name: string): Promise<AcceptedType> {
  const { fileTypeFromBuffer } = await import('file-type');
  const found = await fileTypeFromBuffer(bytes);
  const ext = /\.([A-Za-z0-9]{1,8})$/.exec(name)?.[1].toLowerCase();
  const claimed = ext ? byExtension.get(ext) : undefined;
  let type: AcceptedType;
  if (found) {
    if (!(found.mime in ACCEPTED)) throw unsupported(`the file's bytes are ${found.ext.toUpperCase()} (${found.mime})`);
    type = found.mime as AcceptedType;
  } else if (isText(bytes)) {
    type = claimed === 'text/csv' ? 'text/csv' : 'text/plain';
  } else {
    throw unsupported('the file is not a type the server recognises from its bytes');
  }
  const sameFamily = claimed && (claimed === type || (claimed.startsWith('text/') && type.startsWith('text/')));
  if (claimed && !sameFamily) {
    throw unsupported(`the name says .${ext} (${ACCEPTED[claimed].label}) but the bytes are ${ACCEPTED[type].label}`);
  }
  return type;
}

/** Documents on sites, feeds (and later incidents and planned works): the answer of /api/<kind>/:code/documents. */
import { z } from 'zod';

export const DOCUMENT_MAX_BYTES = 25 * 1024 * 1024;

export const documentSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  /** the media type decided from the bytes */
  type: z.string(),
  size: z.number().int(),
  sha256: z.string(),
  createdAt: z.string(),
  createdBy: z.string(),
  /** true when a small preview image exists (images only) */
  preview: z.boolean(),
});
export type DocumentInfo = z.infer<typeof documentSchema>;

export const documentListSchema = z.object({ items: z.array(documentSchema) });
export type DocumentList = z.infer<typeof documentListSchema>;

export const documentLinkSchema = z.object({ url: z.string(), expiresAt: z.string() });

/** ?documents= on the delete of an owner that has documents */
export const DOCUMENT_CHOICES = ['delete', 'keep'] as const;

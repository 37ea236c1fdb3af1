/**
 * What the client keeps across reloads: the bearer token and the user it was
 * issued to. Kept as one versioned JSON record; anything unreadable (older
 * version, hand-edited storage, wrong shape) reads as "signed out" rather than
 * crashing the app before the sign-in screen can show.
 */
import { z } from 'zod';
import { userSchema } from '@/src/api/schemas';

export const SESSION_STORAGE_KEY = 'headwater.session.v1';

export const persistedSessionSchema = z.object({
  version: z.literal(1),
  token: z.string().min(1).nullable().default(null),
  user: userSchema.nullable().default(null),
});
export type PersistedSession = z.infer<typeof persistedSessionSchema>;

export const SIGNED_OUT: PersistedSession = { version: 1, token: null, user: null };

export function readPersistedSession(raw: string | null | undefined): PersistedSession {
  if (raw == null || raw === '') return SIGNED_OUT;
  let value: unknown;
  try {
    value = JSON.parse(raw);
  } catch {
    return SIGNED_OUT;
  }
  const parsed = persistedSessionSchema.safeParse(value);
  if (!parsed.success) return SIGNED_OUT;
  // A token without its user (or the reverse) cannot drive the shell.
  if (!parsed.data.token || !parsed.data.user) return SIGNED_OUT;
  return parsed.data;
}

export function writePersistedSession(session: PersistedSession): string {
  return JSON.stringify(persistedSessionSchema.parse(session));
}

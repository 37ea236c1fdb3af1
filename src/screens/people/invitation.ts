/**
 * The invite form's rules: the shared schema the server's invite check uses
 * (POST /api/users: an e-mail address, a name of at most 200 characters,
 * one of the four roles, a password of at least 10 characters, at most 72
 * bytes and not a commonly used one), so the person
 * sees the problem beside the field before anything is sent.
 */
import { invitationSchema } from '@/shared/schemas/people';
import { isApiError } from '@/src/api/client';
import type { Invitation } from '@/src/api/queries/accounts';

export { invitationSchema, PASSWORD_MIN, PASSWORD_MAX_BYTES } from '@/shared/schemas/people';

export type InvitationField = keyof Invitation;
export type InvitationErrors = Partial<Record<InvitationField | 'form', string>>;

export interface InvitationDraft {
  email: string;
  name: string;
  role: string | null;
  password: string;
}

export function checkInvitation(draft: InvitationDraft): { ok: true; invitation: Invitation } | { ok: false; errors: InvitationErrors } {
  const r = invitationSchema.safeParse(draft);
  if (r.success) return { ok: true, invitation: r.data };
  const errors: InvitationErrors = {};
  for (const issue of r.error.issues) {
    const field = String(issue.path[0] ?? 'form') as InvitationField | 'form';
    errors[field] ??= issue.message;
  }
  return { ok: false, errors };
}

const FIELDS: readonly string[] = ['email', 'name', 'role', 'password'];

/**
 * Places a refusal from the server: a 400's `details` ([{ field, message }])
 * go beside their fields, a 409 (address already in use) beside the email,
 * anything else above the form.
 */
export function invitationErrorsFromServer(error: unknown): InvitationErrors {
  if (!isApiError(error)) return { form: 'The invitation could not be sent. Try again.' };
  if (error.status === 409) return { email: error.message };
  const errors: InvitationErrors = {};
  if (error.status === 400 && Array.isArray(error.details)) {
    for (const d of error.details as unknown[]) {
      if (!d || typeof d !== 'object') continue;
      const { field, message } = d as { field?: unknown; message?: unknown };
      if (typeof field === 'string' && typeof message === 'string' && FIELDS.includes(field)) {
        errors[field as InvitationField] ??= message;
      }
    }
  }
  if (Object.keys(errors).length === 0) errors.form = error.message;
  return errors;
}

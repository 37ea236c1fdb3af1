/** The change-password form's checks: the shared rule before sending, the server's refusal after. */
import { passwordChangeSchema } from '@/shared/schemas/people';
import { isApiError } from '@/src/api/client';

type Field = 'currentPassword' | 'newPassword' | 'repeat' | 'form';
export type PasswordFormErrors = Partial<Record<Field, string>>;

/** The form's own check: the shared rule, and the two new entries alike. */
export function checkPasswordChange(currentPassword: string, newPassword: string, repeat: string): PasswordFormErrors {
  const errors: PasswordFormErrors = {};
  const r = passwordChangeSchema.safeParse({ currentPassword, newPassword });
  if (!r.success) {
    for (const issue of r.error.issues) {
      const field = issue.path[0] === 'currentPassword' ? 'currentPassword' : 'newPassword';
      errors[field] ??= issue.message;
    }
  }
  if (!errors.newPassword && newPassword !== repeat) errors.repeat = 'The two new passwords are not the same.';
  return errors;
}

/** The server's refusal, beside the field it names; anything else above the form, worded by `describe` (describeError in the form). */
export function passwordErrorsFromServer(e: unknown, describe: (e: unknown) => string = (x) => (x instanceof Error ? x.message : 'Something went wrong.')): PasswordFormErrors {
  if (isApiError(e) && Array.isArray(e.details)) {
    const out: PasswordFormErrors = {};
    for (const d of e.details as { field?: string; message?: string }[]) {
      if ((d.field === 'currentPassword' || d.field === 'newPassword') && d.message) out[d.field] ??= d.message;
    }
    if (Object.keys(out).length > 0) return out;
  }
  return { form: describe(e) };
}


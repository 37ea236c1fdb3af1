/** People: the invite and change bodies of /api/users, checked the same way by the form and the server. */
import { z } from 'zod';
import { ROLES } from '../api';
import commonPasswords from '../data/common-passwords.json';

export const PASSWORD_MIN = 10;
/** bcrypt reads only the first 72 bytes of a password; anything longer would be silently cut. */
export const PASSWORD_MAX_BYTES = 72;

const COMMON = new Set<string>(commonPasswords as string[]);
const utf8Bytes = (s: string) => new TextEncoder().encode(s).length;

/**
 * The one password rule, for the forms and the server alike: at least 10
 * characters, at most 72 bytes once encoded (bcrypt's limit, counted in
 * UTF-8 so an accented or non-Latin password is measured as it is hashed),
 * and not one of the 1,000 most used passwords (shared/data/README.md).
 */
export const passwordSchema = (what = 'A password') =>
  z
    .string({ error: `Enter ${what.toLowerCase()}.` })
    .min(PASSWORD_MIN, `${what} has at least ${PASSWORD_MIN} characters.`)
    .refine((p) => utf8Bytes(p) <= PASSWORD_MAX_BYTES, `${what} is at most ${PASSWORD_MAX_BYTES} bytes (about ${PASSWORD_MAX_BYTES} plain letters; accented letters and other scripts count 2-4 each).`)
    .refine((p) => !COMMON.has(p.toLowerCase()), `${what} is one of the most used passwords, which are tried first by anyone guessing; choose another.`);

const role = z.enum(ROLES, { error: 'Pick a role: admin, engineer, operator or viewer.' });

export const invitationSchema = z.strictObject({
  email: z.string({ error: 'Enter an email address.' }).trim().min(1, 'Enter an email address.').pipe(z.email('That does not look like an email address.')),
  name: z.string().trim().max(200, 'A name is at most 200 characters.').default(''),
  role,
  password: passwordSchema('A starting password'),
});

export const personChangeSchema = z
  .strictObject({
    role: role.optional(),
    disabled: z.boolean({ error: 'disabled is true or false' }).optional(),
    name: z.string().trim().max(200, 'A name is at most 200 characters.').optional(),
  })
  .refine((v) => Object.keys(v).length > 0, 'send at least one of role, disabled, name');

/** POST /api/auth/password: the signed-in person changes their own password. */
export const passwordChangeSchema = z
  .strictObject({
    currentPassword: z.string({ error: 'Enter your current password.' }).min(1, 'Enter your current password.').max(1000, 'That is not your current password.'),
    newPassword: passwordSchema('The new password'),
  })
  .refine((v) => v.currentPassword !== v.newPassword, { path: ['newPassword'], message: 'The new password must differ from the current one.' });

/** PUT /api/users/:id/password: an admin sets a temporary password, to be changed at the next sign-in. */
export const temporaryPasswordSchema = z.strictObject({
  password: passwordSchema('A temporary password'),
});

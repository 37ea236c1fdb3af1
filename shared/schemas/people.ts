/** People: the invite and change bodies of /api/users, checked the same way by the form and the server. */
import { z } from 'zod';
import { ROLES } from '../api';

export const PASSWORD_MIN = 10;
export const PASSWORD_MAX = 200;

const role = z.enum(ROLES, { error: 'Pick a role: admin, engineer, operator or viewer.' });

export const invitationSchema = z.strictObject({
  email: z.string({ error: 'Enter an email address.' }).trim().min(1, 'Enter an email address.').pipe(z.email('That does not look like an email address.')),
  name: z.string().trim().max(200, 'A name is at most 200 characters.').default(''),
  role,
  password: z
    .string({ error: 'Enter a starting password.' })
    .min(PASSWORD_MIN, `A starting password has at least ${PASSWORD_MIN} characters.`)
    .max(PASSWORD_MAX, `A starting password has at most ${PASSWORD_MAX} characters.`),
});

export const personChangeSchema = z
  .strictObject({
    role: role.optional(),
    disabled: z.boolean({ error: 'disabled is true or false' }).optional(),
    name: z.string().trim().max(200, 'A name is at most 200 characters.').optional(),
  })
  .refine((v) => Object.keys(v).length > 0, 'send at least one of role, disabled, name');

/** Notices by e-mail: subscription choices, outside contacts, the sent list and the local mailbox. */
import { z } from 'zod';

const codes = (what: string) =>
  z
    .array(z.string().trim().min(1, `a ${what} code is not empty`).max(64, `a ${what} code is at most 64 characters`), { error: `${what}s is a list of codes` })
    .max(500, `at most 500 ${what}s`)
    .default([]);

/** { everything: true } or { services: [...], sites: [...] } */
export const subscriptionChoiceSchema = z
  .strictObject({
    everything: z.boolean({ error: 'everything is true or false' }).default(false),
    services: codes('service'),
    sites: codes('site'),
  })
  .refine((v) => v.everything || v.services.length + v.sites.length > 0, 'choose everything, or at least one service or site');
export type SubscriptionChoice = z.output<typeof subscriptionChoiceSchema>;

export const subscriptionSchema = z.object({ everything: z.boolean(), services: z.array(z.string()), sites: z.array(z.string()), email: z.string(), updatedAt: z.string().nullable() });
export type SubscriptionInfo = z.infer<typeof subscriptionSchema>;

const contactFields = {
  name: z.string({ error: 'Enter a name.' }).trim().min(1, 'Enter a name.').max(200, 'A name is at most 200 characters.'),
  email: z.string({ error: 'Enter an email address.' }).trim().min(1, 'Enter an email address.').max(320).pipe(z.email('That does not look like an email address.')),
  organisation: z.string().trim().max(200, 'An organisation is at most 200 characters.').default(''),
  everything: z.boolean({ error: 'everything is true or false' }).default(false),
  services: codes('service'),
  sites: codes('site'),
};
export const contactInputSchema = z
  .strictObject(contactFields)
  .refine((v) => v.everything || v.services.length + v.sites.length > 0, 'choose everything, or at least one service or site');
export type ContactInput = z.input<typeof contactInputSchema>;

export const contactSchema = z.object({
  id: z.number(),
  name: z.string(),
  email: z.string(),
  organisation: z.string(),
  everything: z.boolean(),
  services: z.array(z.string()),
  sites: z.array(z.string()),
  createdAt: z.string(),
});
export type ContactInfo = z.infer<typeof contactSchema>;
export const contactListSchema = z.object({ items: z.array(contactSchema) });

export const NOTICE_STATUSES = ['waiting', 'sent', 'failed'] as const;
export const noticeSchema = z.object({
  id: z.number(),
  eventKind: z.string(),
  eventCode: z.string(),
  address: z.string(),
  subject: z.string(),
  status: z.enum(NOTICE_STATUSES),
  attempts: z.number(),
  lastError: z.string().nullable(),
  createdAt: z.string(),
  sentAt: z.string().nullable(),
});
export type NoticeInfo = z.infer<typeof noticeSchema>;
export const noticeListSchema = z.object({
  items: z.array(noticeSchema),
  counts: z.object({ waiting: z.number(), sent: z.number(), failed: z.number() }),
});
export type NoticeList = z.infer<typeof noticeListSchema>;
export const noticeQuerySchema = z.strictObject({ status: z.enum(NOTICE_STATUSES, { error: 'status is waiting, sent or failed' }).optional() });

export const mailSchema = z.object({ id: z.string(), receivedAt: z.string(), from: z.string(), to: z.array(z.string()), subject: z.string(), text: z.string(), html: z.string() });
export type MailInfo = z.infer<typeof mailSchema>;
export const mailboxSchema = z.object({ items: z.array(mailSchema), folder: z.string() });
export type Mailbox = z.infer<typeof mailboxSchema>;

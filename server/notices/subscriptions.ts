/**
 * Who wants to be told: a signed-in person's own choice (one row per person)
 * and outside contacts kept by admins. Codes are checked against the live
 * network so a typo is a 422 rather than a subscription that never fires.
 */
import { Op } from 'sequelize';
import type { ContactInfo, SubscriptionChoice, SubscriptionInfo } from '@/shared/schemas/notices';
import type { z } from 'zod';
import type { contactInputSchema } from '@/shared/schemas/notices';
import { conflict, notFound, unprocessable } from '../http/errors';
import type { AppContext } from '../context';
import { Contact, Notice, Subscription } from '../db/models/notices';
import { User } from '../db/models/user';
import type { Subscriber } from './unsubscribe';

function checkCodes(ctx: AppContext, choice: { services: string[]; sites: string[] }) {
  const model = ctx.network.model;
  const unknown = [
    ...choice.services.filter((c) => !model?.services.has(c)).map((c) => `service ${c}`),
    ...choice.sites.filter((c) => !model?.sites.has(c)).map((c) => `site ${c}`),
  ];
  if (unknown.length) throw unprocessable(`not in the network: ${unknown.slice(0, 10).join(', ')}${unknown.length > 10 ? ` and ${unknown.length - 10} more` : ''}`, { unknown });
}

const uniq = (codes: string[]) => [...new Set(codes)].sort();
const choiceOf = (c: SubscriptionChoice) => (c.everything ? { everything: true, services: [], sites: [] } : { everything: false, services: uniq(c.services), sites: uniq(c.sites) });

export async function getSubscription(userId: number, email: string): Promise<SubscriptionInfo> {
  const row = await Subscription.findOne({ where: { userId } });
  return { everything: row?.everything ?? false, services: row?.services ?? [], sites: row?.sites ?? [], email, updatedAt: row?.updatedAt.toISOString() ?? null };
}

export async function setSubscription(ctx: AppContext, userId: number, email: string, choice: SubscriptionChoice): Promise<SubscriptionInfo> {
  checkCodes(ctx, choice);
  await Subscription.upsert({ userId, ...choiceOf(choice) });
  return getSubscription(userId, email);
}

export async function removeSubscription(userId: number): Promise<void> {
  await Subscription.destroy({ where: { userId } });
}

const contactInfo = (c: Contact): ContactInfo => ({
  id: c.id,
  name: c.name,
  email: c.email,
  organisation: c.organisation,
  everything: c.everything,
  services: c.services,
  sites: c.sites,
  createdAt: c.createdAt.toISOString(),
});

export async function listContacts(): Promise<ContactInfo[]> {
  return (await Contact.findAll({ order: [['name', 'ASC'], ['id', 'ASC']] })).map(contactInfo);
}

async function emailTaken(email: string, exceptId?: number) {
  const other = await Contact.findOne({ where: { email: { [Op.iLike]: email.replace(/[\\%_]/g, '\\$&') }, ...(exceptId ? { id: { [Op.ne]: exceptId } } : {}) } });
  if (other) throw conflict(`a contact with the address ${email} exists already (${other.name})`);
}

type ContactInput = z.output<typeof contactInputSchema>;

export async function createContact(ctx: AppContext, input: ContactInput): Promise<ContactInfo> {
  checkCodes(ctx, input);
  await emailTaken(input.email);
  return contactInfo(await Contact.create({ ...input, ...choiceOf(input) }));
}

export async function updateContact(ctx: AppContext, id: number, input: ContactInput): Promise<ContactInfo> {
  const row = await Contact.findByPk(id);
  if (!row) throw notFound(`no contact ${id}`);
  checkCodes(ctx, input);
  await emailTaken(input.email, id);
  await row.update({ ...input, ...choiceOf(input) });
  return contactInfo(row);
}

export async function deleteContact(id: number): Promise<void> {
  const n = await Contact.destroy({ where: { id } });
  if (!n) throw notFound(`no contact ${id}`);
}

/** Stops all mail to the subscriber a verified token names. Idempotent: a second call changes nothing. */
export async function unsubscribe(who: Subscriber): Promise<void> {
  if (who.kind === 'user') {
    const user = await User.findByPk(who.id);
    // the token was issued to this address: an account that changed its address keeps its choice
    if (user && user.email.toLowerCase() === who.email.toLowerCase()) await Subscription.destroy({ where: { userId: who.id } });
  } else {
    const contact = await Contact.findByPk(who.id);
    if (contact && contact.email.toLowerCase() === who.email.toLowerCase()) await contact.update({ everything: false, services: [], sites: [] });
  }
}

export async function listNotices(status?: string) {
  const rows = await Notice.findAll({ where: status ? { status } : {}, order: [['createdAt', 'DESC'], ['id', 'DESC']], limit: 200 });
  const [counts] = await Notice.sequelize!.query(`SELECT status, count(*)::int AS n FROM notices GROUP BY status`);
  const c = { waiting: 0, sent: 0, failed: 0 };
  for (const r of counts as Array<{ status: keyof typeof c; n: number }>) c[r.status] = r.n;
  return {
    items: rows.map((n) => ({
      id: Number(n.id),
      eventKind: n.eventKind,
      eventCode: n.eventCode,
      address: n.address,
      subject: n.subject,
      status: n.status,
      attempts: n.attempts,
      lastError: n.lastError,
      createdAt: n.createdAt.toISOString(),
      sentAt: n.sentAt?.toISOString() ?? null,
    })),
    counts: c,
  };
}

/**
 * Notices by e-mail, paths relative to /api (server/notices/README.md):
 *   GET|POST|DELETE /subscriptions         the signed-in person's own choice
 *   GET|POST /contacts, PUT|DELETE /contacts/:id   outside contacts (admin)
 *   GET /notices?status=                   the latest 200 notices and counts (admin)
 *   GET /mailbox                           the SMTP stand-in's mail (admin; only while it runs)
 *   GET|POST /unsubscribe?token=           public: a page with one button, and the button
 */
import { rateLimit } from 'express-rate-limit';
import { can } from '@/shared/api';
import { contactInputSchema, noticeQuerySchema, subscriptionChoiceSchema } from '@/shared/schemas/notices';
import { ApiError, notFound, parseOr400 } from '../http/errors';
import type { RouteTable } from '../http/routes';
import type { AppContext } from '../context';
import { readUnsubscribeToken } from '../notices/unsubscribe';
import {
  createContact,
  deleteContact,
  getSubscription,
  listContacts,
  listNotices,
  removeSubscription,
  setSubscription,
  unsubscribe,
  updateContact,
} from '../notices/subscriptions';

const idOf = (raw: unknown) => {
  const id = Number(raw);
  if (!Number.isInteger(id) || id < 1 || id > 2_147_483_647) throw notFound(`no contact ${String(raw).slice(0, 20)}`);
  return id;
};

const page = (title: string, body: string) =>
  `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1"><title>${title}</title></head>` +
  `<body style="font-family:sans-serif;max-width:32rem;margin:2rem auto;padding:0 1rem;line-height:1.5"><h1 style="font-size:1.3rem">${title}</h1>${body}</body></html>`;

export function registerNoticeRoutes(routes: RouteTable, ctx: AppContext) {
  routes.add('get', '/subscriptions', can.subscribe, async (req, res) => {
    res.json(await getSubscription(req.auth!.userId, req.auth!.email));
  });
  routes.add('post', '/subscriptions', can.subscribe, async (req, res) => {
    res.json(await setSubscription(ctx, req.auth!.userId, req.auth!.email, parseOr400(subscriptionChoiceSchema, req.body)));
  });
  routes.add('delete', '/subscriptions', can.subscribe, async (req, res) => {
    await removeSubscription(req.auth!.userId);
    res.status(204).end();
  });

  routes.add('get', '/contacts', can.manageNotices, async (_req, res) => {
    res.json({ items: await listContacts() });
  });
  routes.add('post', '/contacts', can.manageNotices, async (req, res) => {
    res.status(201).json(await createContact(ctx, parseOr400(contactInputSchema, req.body)));
  });
  routes.add('put', '/contacts/:id', can.manageNotices, async (req, res) => {
    const id = idOf(req.params.id);
    res.json(await updateContact(ctx, id, parseOr400(contactInputSchema, req.body)));
  });
  routes.add('delete', '/contacts/:id', can.manageNotices, async (req, res) => {
    await deleteContact(idOf(req.params.id));
    res.status(204).end();
  });

  routes.add('get', '/notices', can.manageNotices, async (req, res) => {
    res.json(await listNotices(parseOr400(noticeQuerySchema, req.query, 'query').status));
  });

  routes.add('get', '/mailbox', can.manageNotices, async (_req, res) => {
    if (!ctx.mailbox) throw new ApiError(404, 'no-mailbox', 'there is no local mailbox: mail goes to the SMTP server in SMTP_URL');
    res.json({ items: ctx.mailbox.list(100), folder: ctx.mailbox.folder });
  });

  // Public, so limited: the token is the only key, and guessing one is hopeless, but a flood is still a flood.
  const limiter = rateLimit({ windowMs: 60_000, limit: 30, standardHeaders: 'draft-8', legacyHeaders: false });
  const subscriberOf = (token: unknown) => {
    const who = typeof token === 'string' ? readUnsubscribeToken(token, ctx.config.JWT_SECRET) : null;
    if (!who) throw new ApiError(400, 'bad-token', 'this unsubscribe link is not valid or has expired; sign in to change your notices');
    return who;
  };
  // A GET never changes anything (mail scanners follow links): it shows one button that POSTs.
  routes.add('get', '/unsubscribe', 'public', limiter, async (req, res) => {
    const who = subscriberOf(req.query.token);
    const action = `?token=${encodeURIComponent(String(req.query.token))}`;
    res
      .type('html')
      .send(page('Stop Headwater notices', `<p>Stop all notice mail to <strong>${who.email.replace(/[<>&"]/g, '')}</strong>?</p><form method="post" action="${action}"><button type="submit" style="min-height:44px;padding:0 1rem">Stop these mails</button></form>`));
  });
  // Also the one-click target of the List-Unsubscribe-Post header: idempotent, the same answer every time.
  routes.add('post', '/unsubscribe', 'public', limiter, async (req, res) => {
    const who = subscriberOf(req.query.token);
    await unsubscribe(who);
    if (req.accepts(['html', 'json']) === 'json') res.json({ unsubscribed: true, email: who.email });
    else res.type('html').send(page('Notices stopped', `<p>No more notice mail goes to ${who.email.replace(/[<>&"]/g, '')}. A signed-in person can choose again under My notices.</p>`));
  });
}

/**
 * Sign-in, sessions and people, paths relative to /api:
 *
 *   POST  /auth/login      public: { email, password } -> { token, user } (user.mustChangePassword)
 *   POST  /auth/logout     ends every session of the signed-in person -> 204
 *   POST  /auth/password   { currentPassword, newPassword } -> { token, user }: a new token, every older one ends
 *   GET   /auth/me         -> { user }
 *   GET   /users           admin: every account
 *   POST  /users           admin: invite { email, name, role, password }
 *   PATCH /users/:id       admin: { role?, disabled?, name? }; 409 for one's own role or the last admin
 *   PUT   /users/:id/password  admin: { password } a temporary password, changed at the next sign-in
 *
 * While a temporary password is unchanged, only /auth/password and
 * /auth/logout answer; everything else is 403 password-change-required.
 * Every change to people and every sign-in goes to the audit log.
 */
import type { Request } from 'express';
import { MemoryStore, rateLimit } from 'express-rate-limit';
import { z } from 'zod';
import { can } from '@/shared/api';
import { invitationSchema, passwordChangeSchema, personChangeSchema, temporaryPasswordSchema } from '@/shared/schemas/people';
import { checkPassword, DECOY_HASH } from '../auth/passwords';
import { signToken } from '../auth/tokens';
import { ApiError, notFound, parseOr400 } from '../http/errors';
import type { RouteTable } from '../http/routes';
import { recordPeopleAudit, type Actor, type PeopleAction } from '../services/audit';
import { changeOwnPassword, endSessions, findUserByEmail, inviteUser, setTemporaryPassword, updateUser } from '../services/users';
import { User } from '../db/models/user';
import type { AppContext } from '../context';

export const loginSchema = z.strictObject({
  email: z
    .string({ error: 'email is required' })
    .trim()
    .min(1, 'email is required')
    .max(320, 'email is at most 320 characters')
    .refine((s) => !s.includes('\0'), 'email must not contain NUL characters'),
  password: z.string({ error: 'password is required' }).min(1, 'password is required').max(1000, 'password is at most 1000 characters'),
});

const BAD_LOGIN = 'email or password not recognised';

const sessionUser = (u: User) => ({ id: u.id, email: u.email, name: u.name, role: u.role, mustChangePassword: u.mustChangePassword });
const actorOf = (req: Request): Actor => ({ userId: req.auth?.userId, email: req.auth?.email });

function userId(raw: string | string[] | undefined): number {
  const id = Number(raw);
  if (!Number.isInteger(id) || id < 1 || id > 2_147_483_647) throw notFound(`no user with id ${String(raw)}`);
  return id;
}

export function registerAuthRoutes(routes: RouteTable, ctx: AppContext) {
  const sequelize = ctx.db.sequelize;
  const token = (u: User) => signToken({ sub: String(u.id), email: u.email, role: u.role, tv: u.tokenVersion }, ctx.config.JWT_SECRET, ctx.config.JWT_TTL);

  // Nine quick failures are allowed; the tenth within the window gets 429.
  // Keyed by req.ip, which honours X-Forwarded-For only when TRUST_PROXY says so.
  const store = new MemoryStore();
  ctx.resetLoginLimits = () => store.resetAll();
  const loginLimiter = rateLimit({
    store,
    windowMs: 15 * 60 * 1000,
    limit: 9,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    // An X-Forwarded-For from an untrusted client is expected noise, not a misconfiguration: TRUST_PROXY decides.
    validate: { xForwardedForHeader: false },
    handler: (_req, res) => {
      res.status(429).json({ error: { code: 'too-many-attempts', message: 'too many failed sign-ins; wait 15 minutes and try again' } });
    },
  });

  routes.add('post', '/auth/login', 'public', loginLimiter, async (req, res) => {
    const { email, password } = parseOr400(loginSchema, req.body);
    const user = await findUserByEmail(email);
    // compare against a decoy when the user is unknown, so both cases take the same time
    const ok = await checkPassword(password, user?.passwordHash ?? DECOY_HASH);
    if (!user || !ok || user.disabled) {
      const reason = !user ? 'no such account' : !ok ? 'wrong password' : 'account disabled';
      await recordPeopleAudit(sequelize, {}, { action: 'sign-in-failed', email, after: { reason } });
      throw new ApiError(401, 'bad-credentials', BAD_LOGIN);
    }
    await recordPeopleAudit(sequelize, { userId: user.id, email: user.email }, { action: 'sign-in', email: user.email });
    res.json({ token: token(user), user: sessionUser(user) });
  });

  routes.add('post', '/auth/logout', { roles: can.read, whilePasswordChangeDue: true }, async (req, res) => {
    await sequelize.transaction(async (transaction) => {
      await endSessions(req.auth!.userId, transaction);
      await recordPeopleAudit(sequelize, actorOf(req), { action: 'sign-out', email: req.auth!.email }, transaction);
    });
    res.status(204).end();
  });

  routes.add('post', '/auth/password', { roles: can.read, whilePasswordChangeDue: true }, async (req, res) => {
    const { currentPassword, newPassword } = parseOr400(passwordChangeSchema, req.body);
    const user = await sequelize.transaction(async (transaction) => {
      const u = await changeOwnPassword(req.auth!.userId, currentPassword, newPassword, transaction);
      await recordPeopleAudit(sequelize, actorOf(req), { action: 'password-change', email: u.email }, transaction);
      return u;
    });
    res.json({ token: token(user), user: sessionUser(user) });
  });

  routes.add('get', '/auth/me', can.read, async (req, res) => {
    const user = await User.findByPk(req.auth!.userId);
    if (!user) throw notFound('this account no longer exists');
    res.json({ user: sessionUser(user) });
  });

  routes.add('get', '/users', can.manageUsers, async (_req, res) => {
    const users = await User.findAll({ order: [['email', 'ASC']] });
    res.json({ users: users.map((u) => u.toPublic()) });
  });

  routes.add('post', '/users', can.manageUsers, async (req, res) => {
    const input = parseOr400(invitationSchema, req.body);
    const user = await sequelize.transaction(async (transaction) => {
      const u = await inviteUser(input, transaction);
      await recordPeopleAudit(sequelize, actorOf(req), { action: 'invite', email: u.email, after: { name: u.name, role: u.role } }, transaction);
      return u;
    });
    res.status(201).json({ user: user.toPublic() });
  });

  routes.add('patch', '/users/:id', can.manageUsers, async (req, res) => {
    const id = userId(req.params.id);
    const change = parseOr400(personChangeSchema, req.body);
    const user = await sequelize.transaction(async (transaction) => {
      const { user: u, before } = await updateUser(id, change, req.auth!.userId, transaction);
      const events: PeopleAction[] = [];
      if (before.role !== u.role) events.push('role-change');
      if (before.disabled !== u.disabled) events.push(u.disabled ? 'disable' : 'enable');
      for (const action of events) {
        const pick = action === 'role-change' ? (p: typeof before) => ({ role: p.role }) : (p: typeof before) => ({ disabled: p.disabled });
        await recordPeopleAudit(sequelize, actorOf(req), { action, email: u.email, before: pick(before), after: pick(u.toPublic()) }, transaction);
      }
      return u;
    });
    res.json({ user: user.toPublic() });
  });

  routes.add('put', '/users/:id/password', can.manageUsers, async (req, res) => {
    const id = userId(req.params.id);
    const { password } = parseOr400(temporaryPasswordSchema, req.body);
    const user = await sequelize.transaction(async (transaction) => {
      const u = await setTemporaryPassword(id, password, transaction);
      await recordPeopleAudit(sequelize, actorOf(req), { action: 'password-set', email: u.email, after: { mustChangePassword: true } }, transaction);
      return u;
    });
    res.json({ user: user.toPublic() });
  });
}

import { MemoryStore, rateLimit } from 'express-rate-limit';
import { z } from 'zod';
import { can } from '@/shared/api';
import { invitationSchema, personChangeSchema } from '@/shared/schemas/people';
import { checkPassword, DECOY_HASH } from '../auth/passwords';
import { signToken } from '../auth/tokens';
import { ApiError, notFound, parseOr400 } from '../http/errors';
import type { RouteTable } from '../http/routes';
import { findUserByEmail, inviteUser, updateUser } from '../services/users';
import { User } from '../db/models/user';
import type { AppContext } from '../context';

export const loginSchema = z.strictObject({
  email: z.string({ error: 'email is required' }).trim().min(1, 'email is required').max(320),
  password: z.string({ error: 'password is required' }).min(1, 'password is required').max(200),
});

const BAD_LOGIN = 'email or password not recognised';

export function registerAuthRoutes(routes: RouteTable, ctx: AppContext) {
  // Nine quick failures are allowed; the tenth within the window gets 429.
  const store = new MemoryStore();
  ctx.resetLoginLimits = () => store.resetAll();
  const loginLimiter = rateLimit({
    store,
    windowMs: 15 * 60 * 1000,
    limit: 9,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, res) => {
      res.status(429).json({ error: { code: 'too-many-attempts', message: 'too many failed sign-ins; wait 15 minutes and try again' } });
    },
  });

  routes.add('post', '/auth/login', 'public', loginLimiter, async (req, res) => {
    const { email, password } = parseOr400(loginSchema, req.body);
    const user = await findUserByEmail(email);
    // compare against a decoy when the user is unknown, so both cases take the same time
    const ok = await checkPassword(password, user?.passwordHash ?? DECOY_HASH);
    if (!user || !ok || user.disabled) throw new ApiError(401, 'bad-credentials', BAD_LOGIN);
    const token = signToken({ sub: String(user.id), email: user.email, role: user.role }, ctx.config.JWT_SECRET, ctx.config.JWT_TTL);
    res.json({ token, user: { id: user.id, email: user.email, name: user.name, role: user.role } });
  });

  routes.add('get', '/auth/me', can.read, async (req, res) => {
    const user = await User.findByPk(req.auth!.userId);
    if (!user) throw notFound('this account no longer exists');
    res.json({ user: { id: user.id, email: user.email, name: user.name, role: user.role } });
  });

  routes.add('get', '/users', can.manageUsers, async (_req, res) => {
    const users = await User.findAll({ order: [['email', 'ASC']] });
    res.json({ users: users.map((u) => u.toPublic()) });
  });

  routes.add('post', '/users', can.manageUsers, async (req, res) => {
    const input = parseOr400(invitationSchema, req.body);
    const user = await inviteUser(input);
    res.status(201).json({ user: user.toPublic() });
  });

  routes.add('patch', '/users/:id', can.manageUsers, async (req, res) => {
    const id = Number(req.params.id);
    if (!Number.isInteger(id) || id < 1) throw notFound(`no user with id ${req.params.id}`);
    const change = parseOr400(personChangeSchema, req.body);
    const user = await updateUser(id, change, req.auth!.userId);
    res.json({ user: user.toPublic() });
  });
}

import { Op } from 'sequelize';
import type { Role } from '@/shared/api';
import { User } from '../db/models/user';
import { hashPassword } from '../auth/passwords';
import { ApiError, conflict, notFound } from '../http/errors';

export const findUserByEmail = (email: string) => User.findOne({ where: { email: { [Op.iLike]: email.trim() } } });

/** Make sure this account exists, is enabled, and has this role and password. */
export async function ensureUser(email: string, password: string, role: Role, name = ''): Promise<User> {
  const passwordHash = await hashPassword(password);
  const existing = await findUserByEmail(email);
  if (existing) {
    await existing.update({ passwordHash, role, disabled: false, ...(name ? { name } : {}) });
    return existing;
  }
  return User.create({ email: email.trim(), name, role, passwordHash });
}

export async function inviteUser(input: { email: string; name: string; role: Role; password: string }) {
  if (await findUserByEmail(input.email)) throw conflict(`a user with e-mail ${input.email} already exists`);
  return User.create({ email: input.email.trim(), name: input.name, role: input.role, passwordHash: await hashPassword(input.password) });
}

export async function updateUser(id: number, change: { role?: Role; disabled?: boolean; name?: string }, actingUserId: number) {
  const user = await User.findByPk(id);
  if (!user) throw notFound(`no user with id ${id}`);
  if (id === actingUserId && (change.disabled === true || (change.role && change.role !== 'admin'))) {
    throw new ApiError(409, 'conflict', 'you cannot disable yourself or take away your own admin role');
  }
  await user.update(change);
  return user;
}

export async function isActiveUser(id: number): Promise<boolean> {
  if (!Number.isInteger(id)) return false;
  const u = await User.findByPk(id, { attributes: ['id', 'disabled'] });
  return !!u && !u.disabled;
}

/**
 * People: look-up by e-mail, invitations, role and disable changes, passwords
 * and sessions. The rules that guard the admin role live here:
 * nobody changes their own role or disables themselves, and the last active
 * admin cannot be demoted or disabled.
 */
import { fn, col, where, type Transaction } from 'sequelize';
import type { Role } from '@/shared/api';
import { User } from '../db/models/user';
import { checkPassword, hashPassword } from '../auth/passwords';
import { userRowsChanged, type UserRow } from '../auth/userRowCache';
import { ApiError, conflict, notFound } from '../http/errors';

/**
 * The account with this e-mail, compared without regard to case but
 * literally: `%` and `_` are ordinary characters (no LIKE pattern). Uses the
 * unique index on lower(email).
 */
export const findUserByEmail = (email: string, transaction?: Transaction) =>
  User.findOne({ where: where(fn('lower', col('email')), email.trim().toLowerCase()), transaction });

/** What authenticate needs of the row (read per request unless its cache confirms it). */
export async function loadUserRow(id: number): Promise<UserRow | null> {
  const u = await User.findByPk(id, { attributes: ['id', 'email', 'role', 'disabled', 'tokenVersion', 'mustChangePassword'] });
  return u ? { id: u.id, email: u.email, role: u.role, disabled: u.disabled, tokenVersion: u.tokenVersion, mustChangePassword: u.mustChangePassword } : null;
}

/**
 * Make sure this account exists, is enabled and has this role and password
 * (ADMIN_EMAIL / ADMIN_PASSWORD at start: a way back in). A password that
 * really changes ends the account's sessions.
 */
export async function ensureUser(email: string, password: string, role: Role, name = ''): Promise<User> {
  const existing = await findUserByEmail(email);
  if (!existing) return User.create({ email: email.trim(), name, role, passwordHash: await hashPassword(password) });
  const samePassword = await checkPassword(password, existing.passwordHash);
  await existing.update({
    role,
    disabled: false,
    ...(name ? { name } : {}),
    ...(samePassword ? {} : { passwordHash: await hashPassword(password), tokenVersion: existing.tokenVersion + 1, mustChangePassword: false }),
  });
  return existing;
}

export async function inviteUser(input: { email: string; name: string; role: Role; password: string }, transaction?: Transaction) {
  if (await findUserByEmail(input.email, transaction)) throw conflict(`a user with e-mail ${input.email} already exists`);
  const passwordHash = await hashPassword(input.password);
  return User.create({ email: input.email.trim(), name: input.name, role: input.role, passwordHash }, { transaction });
}

export interface PersonChange {
  role?: Role;
  disabled?: boolean;
  name?: string;
}

/** Active admins other than this one. */
async function otherActiveAdmins(id: number, transaction: Transaction) {
  const admins = await User.findAll({ where: { role: 'admin', disabled: false }, attributes: ['id'], transaction });
  return admins.filter((a) => a.id !== id).length;
}

/**
 * Changes to people run one at a time (a transaction-scoped advisory lock),
 * so two admins demoting each other at once cannot both pass the last-admin
 * check, and no two row locks can be taken in opposite orders.
 */
const PEOPLE_LOCK = 0x70656f70; // an arbitrary constant, 'peop'
async function lockPeople(transaction: Transaction) {
  await User.sequelize!.query('SELECT pg_advisory_xact_lock($1)', { bind: [PEOPLE_LOCK], transaction });
}

/** Returns the user after the change and the row before it (for the audit log). */
export async function updateUser(id: number, change: PersonChange, actingUserId: number, transaction: Transaction) {
  await lockPeople(transaction);
  const user = await User.findByPk(id, { transaction });
  if (!user) throw notFound(`no user with id ${id}`);
  const before = user.toPublic();
  const roleChanges = change.role !== undefined && change.role !== user.role;
  if (id === actingUserId && roleChanges) throw new ApiError(409, 'own-role', 'You cannot change your own role; ask another admin.');
  if (id === actingUserId && change.disabled === true) throw new ApiError(409, 'own-account', 'You cannot disable your own account; ask another admin.');
  const losesAdmin = user.role === 'admin' && !user.disabled && ((roleChanges && change.role !== 'admin') || change.disabled === true);
  if (losesAdmin && (await otherActiveAdmins(id, transaction)) === 0) {
    throw new ApiError(409, 'last-admin', `${user.email} is the last active admin: make someone else an admin first.`);
  }
  await user.update(change, { transaction });
  return { user, before };
}

/** The person's own change: needs the current password; ends every session, including this one. */
export async function changeOwnPassword(id: number, currentPassword: string, newPassword: string, transaction: Transaction) {
  const user = await User.findByPk(id, { lock: transaction.LOCK.UPDATE, transaction });
  if (!user) throw notFound('this account no longer exists');
  if (!(await checkPassword(currentPassword, user.passwordHash))) {
    throw new ApiError(400, 'wrong-password', 'The current password is not right.', [{ field: 'currentPassword', message: 'The current password is not right.' }]);
  }
  await user.update({ passwordHash: await hashPassword(newPassword), mustChangePassword: false, tokenVersion: user.tokenVersion + 1 }, { transaction });
  return user;
}

/** An admin sets a temporary password: the person's sessions end and the next sign-in asks for a new one. */
export async function setTemporaryPassword(id: number, password: string, transaction: Transaction) {
  const user = await User.findByPk(id, { lock: transaction.LOCK.UPDATE, transaction });
  if (!user) throw notFound(`no user with id ${id}`);
  await user.update({ passwordHash: await hashPassword(password), mustChangePassword: true, tokenVersion: user.tokenVersion + 1 }, { transaction });
  return user;
}

/** Sign-out: every token of this person stops working. */
export async function endSessions(id: number, transaction?: Transaction) {
  await User.increment('tokenVersion', { by: 1, where: { id }, transaction });
  // increment runs no model hooks
  userRowsChanged(id, transaction);
}

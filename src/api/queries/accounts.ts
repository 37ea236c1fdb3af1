/** People who may sign in (admin only on the server: shared/api.ts `can.manageUsers`). */
import { mutate } from 'swr';
import { api, type Role } from '@/shared/api';
import type { Send } from '../ApiProvider';
import { accountsAnswerSchema } from '../schemas';
import { useApiQuery } from '../useApiQuery';

export const accountsKey = () => api.users;

export function useAccounts(enabled = true) {
  return useApiQuery(enabled ? accountsKey() : null, accountsAnswerSchema, 'admin');
}

export interface Invitation {
  email: string;
  name: string;
  role: Role;
  password: string;
}

export async function inviteAccount(send: Send, invitation: Invitation) {
  const answer = await send(api.users, { method: 'POST', body: invitation });
  await mutate(accountsKey());
  return answer;
}

export interface AccountChange {
  role?: Role;
  disabled?: boolean;
}

export async function changeAccount(send: Send, id: number | string, change: AccountChange) {
  if (change.role === undefined && change.disabled === undefined) {
    throw new Error('changeAccount: give a role or disabled to change');
  }
  const answer = await send(api.user(id), { method: 'PATCH', body: change });
  await mutate(accountsKey());
  return answer;
}

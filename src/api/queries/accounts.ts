/** People who may sign in (admin only on the server: shared/api.ts `can.manageUsers`). */
import { useMemo } from 'react';
import { useSWRConfig } from 'swr';
import { api, type Role } from '@/shared/api';
import { useSend } from '../ApiProvider';
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

export interface AccountChange {
  role?: Role;
  disabled?: boolean;
}

/** Invite and change accounts; each refreshes the list when the server has answered. */
export function useAccountActions() {
  const send = useSend();
  const { mutate } = useSWRConfig();
  return useMemo(
    () => ({
      invite: async (invitation: Invitation) => {
        const answer = await send(api.users, { method: 'POST', body: invitation });
        await mutate(accountsKey());
        return answer;
      },
      change: async (id: number | string, change: AccountChange) => {
        if (change.role === undefined && change.disabled === undefined) {
          throw new Error('changing an account needs a role or disabled');
        }
        const answer = await send(api.user(id), { method: 'PATCH', body: change });
        await mutate(accountsKey());
        return answer;
      },
      /** A temporary password: the person's sessions end and they choose a new one at the next sign-in. */
      setTemporaryPassword: async (id: number | string, password: string) => {
        const answer = await send(api.userPassword(id), { method: 'PUT', body: { password } });
        await mutate(accountsKey());
        return answer;
      },
    }),
    [send, mutate],
  );
}

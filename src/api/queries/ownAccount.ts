/**
 * The signed-in person's own account: change the password (the server hands
 * back a new token, since every older one ends) and sign out everywhere.
 */
import { useMemo } from 'react';
import { api } from '@/shared/api';
import { useSession } from '@/src/session/SessionProvider';
import { parseAnswer, request } from '../client';
import { useSend } from '../ApiProvider';
import { loginAnswerSchema, type LoginAnswer } from '../schemas';

/** POST /api/auth/password with a given token: also used before a session exists (a temporary password). */
export async function changePasswordWith(token: string, currentPassword: string, newPassword: string): Promise<LoginAnswer> {
  const answer = await request(api.ownPassword, { method: 'POST', token, body: { currentPassword, newPassword } });
  return parseAnswer(loginAnswerSchema, api.ownPassword, answer);
}

export function useOwnAccountActions() {
  const send = useSend();
  const session = useSession();
  return useMemo(
    () => ({
      changePassword: async (currentPassword: string, newPassword: string) => {
        const answer = parseAnswer(loginAnswerSchema, api.ownPassword, await send(api.ownPassword, { method: 'POST', body: { currentPassword, newPassword } }));
        session.signIn(answer.token, answer.user);
      },
      /**
       * Ends the session here first (its requests in flight are aborted, so
       * none comes back refused), then on the server for every device, with
       * the token just ended. Here it ends even if the server cannot be reached.
       */
      signOutEverywhere: async () => {
        const token = session.tokenRef.current;
        session.signOut('chosen');
        if (token) await request(api.logout, { method: 'POST', token });
      },
    }),
    [send, session],
  );
}

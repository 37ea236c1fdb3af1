/** Notices by e-mail: my subscription, outside contacts, notices sent and the local mailbox (server/notices/README.md). */
import { useMemo } from 'react';
import { useSWRConfig } from 'swr';
import { api } from '@/shared/api';
import { contactListSchema, mailboxSchema, noticeListSchema, subscriptionSchema, type ContactInput, type SubscriptionChoice } from '@/shared/schemas/notices';
import { useSend } from '../ApiProvider';
import { useApiQuery } from '../useApiQuery';

export const subscriptionKey = () => api.subscriptions;
export const contactsKey = () => api.contacts;
export const noticesKey = () => api.notices;
export const mailboxKey = () => api.mailbox;

export const useSubscription = () => useApiQuery(subscriptionKey(), subscriptionSchema, 'admin');
export const useContacts = (enabled = true) => useApiQuery(enabled ? contactsKey() : null, contactListSchema, 'admin');
/** Polled like an incident: a person waiting for a notice to go out watches it change. */
export const useNotices = (enabled = true) => useApiQuery(enabled ? noticesKey() : null, noticeListSchema, 'incident');
export const useMailbox = (enabled = true) => useApiQuery(enabled ? mailboxKey() : null, mailboxSchema, 'incident');

export function useNoticeActions() {
  const send = useSend();
  const { mutate } = useSWRConfig();
  return useMemo(
    () => ({
      subscribe: async (choice: SubscriptionChoice) => {
        await send(api.subscriptions, { method: 'POST', body: choice });
        await mutate(subscriptionKey());
      },
      unsubscribe: async () => {
        await send(api.subscriptions, { method: 'DELETE' });
        await mutate(subscriptionKey());
      },
      addContact: async (contact: ContactInput) => {
        await send(api.contacts, { method: 'POST', body: contact });
        await mutate(contactsKey());
      },
      removeContact: async (id: number) => {
        await send(api.contact(id), { method: 'DELETE' });
        await mutate(contactsKey());
      },
    }),
    [send, mutate],
  );
}

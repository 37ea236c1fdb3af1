/**
 * People (admins only): who may sign in, their roles, and inviting someone.
 * Other roles get a plain "not allowed" state; the server refuses them anyway.
 */
import { StyleSheet, View } from 'react-native';
import { can } from '@/shared/api';
import { useAccounts } from '@/src/api/queries/accounts';
import { Columns } from '@/src/components/layout/Columns';
import { Screen } from '@/src/components/layout/Screen';
import { Section } from '@/src/components/layout/Section';
import { EmptyState, ErrorState, LoadingState } from '@/src/components/states';
import { useSession } from '@/src/session/SessionProvider';
import { InviteForm } from './InviteForm';
import { PersonCard } from './PersonCard';

export function PeopleScreen() {
  const { user } = useSession();
  const allowed = !!user && can.manageUsers.includes(user.role);
  const accounts = useAccounts(allowed);

  if (!allowed) {
    return (
      <Screen title="People" testID="people-screen">
        <EmptyState title="Not allowed" message="Only admins can see and change who may sign in. Ask an admin if your role needs to change." testID="not-allowed" />
      </Screen>
    );
  }

  const list = accounts.data?.users;
  return (
    <Screen title="People" subtitle="Who may sign in, and with which role" testID="people-screen">
      <Section title="Accounts" note={list ? `${list.length} ${list.length === 1 ? 'account' : 'accounts'}` : undefined}>
        {list ? (
          list.length === 0 ? (
            <EmptyState title="No accounts" message="Invite someone below." />
          ) : (
            <Columns max={3}>
              {list.map((a) => (
                <PersonCard key={String(a.id)} account={a} isSelf={String(a.id) === String(user.id)} />
              ))}
            </Columns>
          )
        ) : accounts.error ? (
          <ErrorState what="the list of people" error={accounts.error} onRetry={() => void accounts.mutate()} />
        ) : (
          <LoadingState what="the list of people" />
        )}
      </Section>
      <Section title="Invite someone">
        <View style={styles.narrow}>
          <InviteForm />
        </View>
      </Section>
    </Screen>
  );
}

const styles = StyleSheet.create({
  narrow: { maxWidth: 640 },
});

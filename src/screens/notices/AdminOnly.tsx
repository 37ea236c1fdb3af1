/** The frame of the notices admin screens: admins only, with links between them. */
import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { can } from '@/shared/api';
import { Screen } from '@/src/components/layout/Screen';
import { EmptyState } from '@/src/components/states';
import { LinkButton } from '@/src/screens/inventory/parts/LinkButton';
import { useSession } from '@/src/session/SessionProvider';
import { space } from '@/src/theme';

export function useIsNoticeAdmin(): boolean {
  const { user } = useSession();
  return !!user && can.manageNotices.includes(user.role);
}

export function AdminOnly({ title, subtitle, testID, children }: { title: string; subtitle: string; testID: string; children: ReactNode }) {
  const allowed = useIsNoticeAdmin();
  return (
    <Screen title={title} subtitle={subtitle} testID={testID}>
      {allowed ? (
        <>
          <View style={styles.links}>
            <LinkButton href="/admin/notices" label="Notices sent" />
            <LinkButton href="/admin/contacts" label="Outside contacts" />
            <LinkButton href="/admin/mailbox" label="Local mailbox" />
          </View>
          {children}
        </>
      ) : (
        <EmptyState title="Not allowed" message="Only admins can see this. Your own notices are under My notices." testID="not-allowed" />
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({ links: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm } });

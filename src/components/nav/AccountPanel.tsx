/**
 * Who is signed in (name, email, role) and the sign-out button. Shown at the
 * foot of the side navigation and on the phone's More screen.
 */
import { StyleSheet, Text, View } from 'react-native';
import { useSession } from '@/src/session/SessionProvider';
import { colors, fonts, space, type } from '@/src/theme';
import { Badge } from '../Badge';
import { Button } from '../Button';

export function AccountPanel({ compact = false }: { compact?: boolean }) {
  const { user, signOut } = useSession();
  if (!user) return null;
  return (
    <View style={[styles.panel, compact && styles.compact]} testID="account-panel">
      <Text style={styles.label}>Signed in as</Text>
      <Text style={styles.name} numberOfLines={1}>
        {user.name}
      </Text>
      <Text style={styles.email} numberOfLines={1} testID="account-email" selectable>
        {user.email}
      </Text>
      <View style={styles.roleRow}>
        <Text style={styles.label}>Role</Text>
        <Badge label={user.role} tone="accent" testID="account-role" />
      </View>
      <Button label="Sign out" icon="signOut" variant="secondary" onPress={() => signOut('chosen')} testID="sign-out" />
    </View>
  );
}

const styles = StyleSheet.create({
  panel: { gap: space.xs, paddingTop: space.md, borderTopWidth: 1, borderTopColor: colors.line },
  compact: { borderTopWidth: 0, paddingTop: 0 },
  label: { ...type.small, fontSize: 14 },
  name: { ...type.label, fontSize: 17 },
  email: { fontFamily: fonts.mono, fontSize: 14, lineHeight: 20, color: colors.ink },
  roleRow: { flexDirection: 'row', alignItems: 'center', gap: space.sm, marginBottom: space.sm },
});

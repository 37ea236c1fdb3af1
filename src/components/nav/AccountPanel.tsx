/**
 * Who is signed in (name, email, role), changing the password, and signing
 * out. Signing out ends every session of this person (the server bumps the
 * account's token version), so the button says so. Shown at the foot of the
 * side navigation and on the phone's More screen.
 */
import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { useOwnAccountActions } from '@/src/api/queries/ownAccount';
import { useSession } from '@/src/session/SessionProvider';
import { colors, fonts, space, type } from '@/src/theme';
import { ChangePasswordForm } from '../account/ChangePasswordForm';
import { Badge } from '../Badge';
import { Button } from '../Button';

export function AccountPanel({ compact = false }: { compact?: boolean }) {
  const { user } = useSession();
  const actions = useOwnAccountActions();
  const [changing, setChanging] = useState(false);
  const [changed, setChanged] = useState(false);
  const [leaving, setLeaving] = useState(false);
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
      {changing ? (
        <ChangePasswordForm
          onSubmit={async (current, next) => {
            await actions.changePassword(current, next);
            setChanging(false);
            setChanged(true);
          }}
          onCancel={() => setChanging(false)}
          testID="account-password"
        />
      ) : (
        <Button
          label="Change password"
          variant="quiet"
          onPress={() => {
            setChanged(false);
            setChanging(true);
          }}
          testID="change-password"
        />
      )}
      {changed ? (
        <Text style={styles.note} accessibilityRole="alert" testID="password-changed">
          Password changed. Your other sessions have ended.
        </Text>
      ) : null}
      <Text style={styles.note}>Signing out ends your sessions on every device.</Text>
      <Button
        label="Sign out everywhere"
        icon="signOut"
        variant="secondary"
        busy={leaving}
        onPress={() => {
          setLeaving(true);
          // the session here ends whatever the server answers
          void actions.signOutEverywhere().catch(() => undefined);
        }}
        testID="sign-out"
      />
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
  note: { ...type.small },
});

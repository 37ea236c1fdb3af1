/** Invite someone: email, name, role and a starting password they are told out of band. */
import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { ROLES } from '@/shared/api';
import { useAccountActions } from '@/src/api/queries/accounts';
import { Button } from '@/src/components/Button';
import { Card } from '@/src/components/Card';
import { Choice } from '@/src/components/Choice';
import { TextField } from '@/src/components/TextField';
import { colors, fonts, space, type } from '@/src/theme';
import { checkInvitation, invitationErrorsFromServer, PASSWORD_MIN, type InvitationDraft, type InvitationErrors } from './invitation';

const EMPTY: InvitationDraft = { email: '', name: '', role: null, password: '' };

const ROLE_HINTS: Record<(typeof ROLES)[number], string> = {
  admin: 'admin: everything, including people',
  engineer: 'engineer: edits the network and imports',
  operator: 'operator: faults, planned work, analyses',
  viewer: 'viewer: reads only',
};

export function InviteForm() {
  const actions = useAccountActions();
  const [draft, setDraft] = useState<InvitationDraft>(EMPTY);
  const [errors, setErrors] = useState<InvitationErrors>({});
  const [busy, setBusy] = useState(false);
  const [done, setDone] = useState<string | null>(null);
  const set = (patch: Partial<InvitationDraft>) => {
    setDraft((d) => ({ ...d, ...patch }));
    setDone(null);
  };

  async function submit() {
    const checked = checkInvitation(draft);
    if (!checked.ok) {
      setErrors(checked.errors);
      return;
    }
    setErrors({});
    setBusy(true);
    try {
      await actions.invite(checked.invitation);
      setDraft(EMPTY);
      setDone(`${checked.invitation.email} can now sign in as ${checked.invitation.role}. Give them the starting password in person or by phone.`);
    } catch (e) {
      setErrors(invitationErrorsFromServer(e));
    } finally {
      setBusy(false);
    }
  }

  return (
    <Card testID="invite-form">
      {errors.form ? (
        <Text style={styles.failure} accessibilityRole="alert" testID="invite-error">
          {`⚠ ${errors.form}`}
        </Text>
      ) : null}
      <View style={styles.fields}>
        <TextField label="Email" value={draft.email} onChangeText={(email) => set({ email })} error={errors.email} keyboardType="email-address" autoCapitalize="none" autoCorrect={false} autoComplete="off" testID="invite-email" />
        <TextField label="Name" value={draft.name} onChangeText={(name) => set({ name })} error={errors.name} hint="Optional; shown beside the email." autoComplete="off" testID="invite-name" />
        <Choice label="Role" options={ROLES.map((r) => ({ value: r, label: r }))} value={draft.role as (typeof ROLES)[number] | null} onChange={(role) => set({ role })} error={errors.role} testID="invite-role" />
        <View>
          {ROLES.map((r) => (
            <Text key={r} style={styles.hint}>
              {ROLE_HINTS[r]}
            </Text>
          ))}
        </View>
        <TextField
          label="Starting password"
          value={draft.password}
          onChangeText={(password) => set({ password })}
          error={errors.password}
          hint={`At least ${PASSWORD_MIN} characters, not a commonly used password.`}
          secureTextEntry
          autoComplete="new-password"
          testID="invite-password"
        />
      </View>
      <Button label="Invite" onPress={() => void submit()} busy={busy} testID="invite-submit" style={styles.submit} />
      {done ? (
        <Text style={styles.done} accessibilityLiveRegion="polite" testID="invite-done">
          {done}
        </Text>
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  fields: { gap: space.lg },
  hint: { ...type.small },
  submit: { alignSelf: 'flex-start', marginTop: space.sm },
  failure: { ...type.body, color: colors.bad, fontFamily: fonts.textBold },
  done: { ...type.body, color: colors.good },
});

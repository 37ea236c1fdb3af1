/**
 * One account on the People screen: who, role, whether they may sign in,
 * and (for anyone but yourself) changing the role, disabling the account or
 * setting a temporary password. The server refuses changes to your own role
 * or account, and demoting or disabling the last active admin; its refusal
 * is shown as the sentence it sends.
 */
import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { ROLES, type Role } from '@/shared/api';
import { useAccountActions, type AccountChange } from '@/src/api/queries/accounts';
import type { Account } from '@/src/api/schemas';
import { Badge } from '@/src/components/Badge';
import { Button } from '@/src/components/Button';
import { Card } from '@/src/components/Card';
import { Choice } from '@/src/components/Choice';
import { describeError } from '@/src/components/states';
import { TextField } from '@/src/components/TextField';
import { temporaryPasswordSchema } from '@/shared/schemas/people';
import { colors, fonts, space, type } from '@/src/theme';

type Mode = 'view' | 'role' | 'confirmDisable' | 'password';

function joinedOn(createdAt: string): string {
  const d = new Date(createdAt);
  return Number.isNaN(d.getTime()) ? createdAt : d.toISOString().slice(0, 10);
}

export function PersonCard({ account, isSelf }: { account: Account; isSelf: boolean }) {
  const actions = useAccountActions();
  const [mode, setMode] = useState<Mode>('view');
  const [role, setRole] = useState<Role>(account.role);
  const [busy, setBusy] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);
  const [temporary, setTemporary] = useState('');
  const [done, setDone] = useState<string | null>(null);
  const id = `person-${account.id}`;

  async function setPassword() {
    const checked = temporaryPasswordSchema.safeParse({ password: temporary });
    if (!checked.success) {
      setFailure(checked.error.issues[0]?.message ?? 'That password cannot be used.');
      return;
    }
    setBusy(true);
    setFailure(null);
    try {
      await actions.setTemporaryPassword(account.id, temporary);
      setTemporary('');
      setMode('view');
      setDone(`Temporary password set. Give it to ${account.email} in person; their sessions have ended and they must choose a new password at the next sign-in.`);
    } catch (e) {
      setFailure(describeError(e));
    } finally {
      setBusy(false);
    }
  }

  async function apply(change: AccountChange) {
    setBusy(true);
    setFailure(null);
    try {
      await actions.change(account.id, change);
      setMode('view');
    } catch (e) {
      setFailure(describeError(e));
    } finally {
      setBusy(false);
    }
  }

  return (
    <Card testID={id}>
      <View style={styles.head}>
        <Text style={styles.name}>{account.name || 'No name given'}</Text>
        {isSelf ? <Badge label="you" tone="neutral" /> : null}
      </View>
      <Text style={styles.email} selectable>
        {account.email}
      </Text>
      <View style={styles.badges}>
        <Badge label={account.role} tone="accent" testID={`${id}-role`} />
        {account.disabled ? (
          <Badge label="disabled: cannot sign in" tone="bad" shape="cross" testID={`${id}-status`} />
        ) : (
          <Badge label="active" tone="good" shape="solid" testID={`${id}-status`} />
        )}
      </View>
      <Text style={styles.meta}>Added {joinedOn(account.createdAt)}</Text>
      {account.mustChangePassword ? <Text style={styles.meta}>Has a temporary password: must choose a new one at the next sign-in.</Text> : null}

      {isSelf ? (
        <Text style={styles.meta}>This is your account. Another admin can change its role or disable it.</Text>
      ) : mode === 'role' ? (
        <View style={styles.block}>
          <Choice label={`New role for ${account.email}`} options={ROLES.map((r) => ({ value: r, label: r }))} value={role} onChange={setRole} disabled={busy} testID={`${id}-role-choice`} />
          <View style={styles.actions}>
            <Button label="Save role" onPress={() => void apply({ role })} busy={busy} disabled={role === account.role} testID={`${id}-save-role`} />
            <Button label="Cancel" variant="quiet" onPress={() => { setRole(account.role); setMode('view'); setFailure(null); }} disabled={busy} />
          </View>
        </View>
      ) : mode === 'password' ? (
        <View style={styles.block}>
          <TextField
            label={`Temporary password for ${account.email}`}
            value={temporary}
            onChangeText={setTemporary}
            hint="At least 10 characters, not a commonly used password. They must change it when they next sign in."
            autoCapitalize="none"
            autoCorrect={false}
            autoComplete="off"
            testID={`${id}-temporary`}
          />
          <View style={styles.actions}>
            <Button label="Set temporary password" onPress={() => void setPassword()} busy={busy} testID={`${id}-save-password`} />
            <Button label="Cancel" variant="quiet" onPress={() => { setTemporary(''); setMode('view'); setFailure(null); }} disabled={busy} />
          </View>
        </View>
      ) : mode === 'confirmDisable' ? (
        <View style={styles.block}>
          <Text style={styles.body}>Disable {account.email}? They will not be able to sign in until an admin enables the account again.</Text>
          <View style={styles.actions}>
            <Button label="Disable account" variant="danger" onPress={() => void apply({ disabled: true })} busy={busy} testID={`${id}-confirm-disable`} />
            <Button label="Keep it" variant="quiet" onPress={() => setMode('view')} disabled={busy} />
          </View>
        </View>
      ) : (
        <View style={styles.actions}>
          <Button label="Change role" variant="secondary" accessibilityLabel={`Change role of ${account.email}`} onPress={() => { setDone(null); setMode('role'); }} testID={`${id}-change-role`} />
          <Button label="Set temporary password" variant="secondary" accessibilityLabel={`Set a temporary password for ${account.email}`} onPress={() => { setDone(null); setMode('password'); }} testID={`${id}-set-password`} />
          {account.disabled ? (
            <Button label="Enable" variant="secondary" accessibilityLabel={`Enable ${account.email}`} onPress={() => void apply({ disabled: false })} busy={busy} testID={`${id}-enable`} />
          ) : (
            <Button label="Disable" variant="danger" accessibilityLabel={`Disable ${account.email}`} onPress={() => setMode('confirmDisable')} testID={`${id}-disable`} />
          )}
        </View>
      )}
      {done ? (
        <Text style={styles.body} accessibilityRole="alert" testID={`${id}-done`}>
          {done}
        </Text>
      ) : null}
      {failure ? (
        <Text style={styles.failure} accessibilityRole="alert" testID={`${id}-error`}>
          {`⚠ ${failure}`}
        </Text>
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  head: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  name: { ...type.label, fontSize: 18, lineHeight: 24 },
  email: { fontFamily: fonts.mono, fontSize: 15, lineHeight: 21, color: colors.ink },
  badges: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  meta: { ...type.small },
  body: { ...type.body },
  block: { gap: space.md },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, marginTop: space.xs },
  failure: { ...type.body, color: colors.bad, fontFamily: fonts.textBold },
});

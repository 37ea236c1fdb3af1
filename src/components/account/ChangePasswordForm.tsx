/**
 * Choosing a new password: the current (or temporary) one, the new one twice.
 * Checked with the same rule as the server (shared/schemas/people.ts
 * passwordChangeSchema) before anything is sent; the server's refusal is
 * shown beside the field it names. Used by the sign-in screen (a temporary
 * password must be changed first) and the account panel.
 */
import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { PASSWORD_MIN, PASSWORD_MAX_BYTES } from '@/shared/schemas/people';
import { Button } from '../Button';
import { TextField } from '../TextField';
import { describeError } from '../states';
import { checkPasswordChange, passwordErrorsFromServer, type PasswordFormErrors } from './passwordChange';
import { colors, fonts, space, type } from '@/src/theme';

export interface ChangePasswordFormProps {
  /** what the first field holds: "Current password" or "Temporary password" */
  currentLabel?: string;
  submitLabel?: string;
  onSubmit: (currentPassword: string, newPassword: string) => Promise<void>;
  onCancel?: () => void;
  testID?: string;
}

export function ChangePasswordForm({ currentLabel = 'Current password', submitLabel = 'Change password', onSubmit, onCancel, testID = 'change-password' }: ChangePasswordFormProps) {
  const [current, setCurrent] = useState('');
  const [next, setNext] = useState('');
  const [repeat, setRepeat] = useState('');
  const [errors, setErrors] = useState<PasswordFormErrors>({});
  const [busy, setBusy] = useState(false);

  async function submit() {
    if (busy) return;
    const found = checkPasswordChange(current, next, repeat);
    setErrors(found);
    if (Object.keys(found).length > 0) return;
    setBusy(true);
    try {
      await onSubmit(current, next);
    } catch (e) {
      setErrors(passwordErrorsFromServer(e, describeError));
      setBusy(false);
    }
  }

  return (
    <View style={styles.form} role="form" aria-label="Change password" testID={testID}>
      {errors.form ? (
        <Text style={styles.failure} accessibilityRole="alert" testID={`${testID}-error`}>
          {`⚠ ${errors.form}`}
        </Text>
      ) : null}
      <TextField label={currentLabel} value={current} onChangeText={setCurrent} error={errors.currentPassword} secureTextEntry autoCapitalize="none" autoComplete="current-password" textContentType="password" testID={`${testID}-current`} />
      <TextField
        label="New password"
        value={next}
        onChangeText={setNext}
        error={errors.newPassword}
        hint={`At least ${PASSWORD_MIN} characters and at most ${PASSWORD_MAX_BYTES} bytes; not a commonly used password.`}
        secureTextEntry
        autoCapitalize="none"
        autoComplete="new-password"
        textContentType="newPassword"
        testID={`${testID}-new`}
      />
      <TextField label="New password again" value={repeat} onChangeText={setRepeat} error={errors.repeat} secureTextEntry autoCapitalize="none" autoComplete="new-password" textContentType="newPassword" onSubmitEditing={() => void submit()} testID={`${testID}-repeat`} />
      <Text style={styles.note}>Changing the password signs you out everywhere else; this device stays signed in.</Text>
      <View style={styles.actions}>
        <Button label={submitLabel} onPress={() => void submit()} busy={busy} testID={`${testID}-submit`} />
        {onCancel ? <Button label="Cancel" variant="quiet" onPress={onCancel} disabled={busy} /> : null}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.md },
  note: { ...type.small },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  failure: { ...type.body, color: colors.bad, fontFamily: fonts.textBold },
});

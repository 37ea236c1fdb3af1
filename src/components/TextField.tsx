/**
 * A labelled text input with its error said in words right under it.
 * The visible label is also the accessible name (so tests and screen readers
 * find the field by "Email", "Password", ...).
 *
 *   <TextField label="Email" value={email} onChangeText={setEmail}
 *     error={errors.email} keyboardType="email-address" autoComplete="email" />
 */
import { useState, type Ref } from 'react';
import { StyleSheet, Text, TextInput, View, type TextInputProps } from 'react-native';
import { colors, fonts, radius, space, TOUCH_MIN, type } from '@/src/theme';
import { webAria } from './webAria';

export interface TextFieldProps extends Omit<TextInputProps, 'style' | 'accessibilityLabel'> {
  label: string;
  /** Shown under the field in words; also marks the field invalid. */
  error?: string | null;
  /** A short help line shown when there is no error. */
  hint?: string;
  /** Codes, channels and frequencies read better in the monospaced face. */
  mono?: boolean;
  testID?: string;
  ref?: Ref<TextInput>;
}

export function TextField({ label, error, hint, mono, testID, onFocus, onBlur, ref, ...input }: TextFieldProps) {
  const [focused, setFocused] = useState(false);
  const note = error || hint;
  return (
    <View style={styles.wrap}>
      <Text style={styles.label}>{label}</Text>
      <TextInput
        {...input}
        ref={ref}
        accessibilityLabel={label}
        {...webAria({ 'aria-invalid': !!error })}
        testID={testID}
        placeholderTextColor={colors.inkMuted}
        onFocus={(e) => {
          setFocused(true);
          onFocus?.(e);
        }}
        onBlur={(e) => {
          setFocused(false);
          onBlur?.(e);
        }}
        style={[styles.input, mono && styles.mono, focused && styles.focused, !!error && styles.invalid]}
      />
      {note ? (
        <Text
          style={[styles.note, error ? styles.errorText : null]}
          accessibilityLiveRegion={error ? 'polite' : 'none'}
          testID={error && testID ? `${testID}-error` : undefined}
        >
          {error ? `⚠ ${error}` : hint}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs, alignSelf: 'stretch' },
  label: { ...type.label },
  input: {
    ...type.body,
    minHeight: TOUCH_MIN + 4,
    paddingHorizontal: space.md,
    paddingVertical: space.sm,
    borderWidth: 2,
    borderColor: colors.lineStrong,
    borderRadius: radius.md,
    backgroundColor: colors.surface,
  },
  mono: { fontFamily: fonts.mono },
  focused: { borderColor: colors.accent },
  invalid: { borderColor: colors.bad },
  note: { ...type.small },
  errorText: { color: colors.bad, fontFamily: fonts.textBold },
});

/**
 * A press target at least 44 px high (docs/screens.md). `label` is also the
 * accessible name unless `accessibilityLabel` says more.
 *
 *   <Button label="Sign in" onPress={submit} busy={sending} />
 *   <Button label="Disable" variant="danger" onPress={...} />
 */
import { ActivityIndicator, Pressable, StyleSheet, Text, View, type StyleProp, type ViewStyle } from 'react-native';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/src/theme';
import { Icon, type IconName } from './icons/Icon';

export type ButtonVariant = 'primary' | 'secondary' | 'quiet' | 'danger';

export interface ButtonProps {
  label: string;
  onPress: () => void;
  variant?: ButtonVariant;
  icon?: IconName;
  disabled?: boolean;
  /** Shows a spinner and blocks presses while an action runs. */
  busy?: boolean;
  accessibilityLabel?: string;
  testID?: string;
  style?: StyleProp<ViewStyle>;
}

const LOOK: Record<ButtonVariant, { fill: string; ink: string; border: string }> = {
  primary: { fill: colors.accent, ink: colors.accentInk, border: colors.accent },
  secondary: { fill: colors.surface, ink: colors.accent, border: colors.accent },
  quiet: { fill: 'transparent', ink: colors.accent, border: 'transparent' },
  danger: { fill: colors.surface, ink: colors.bad, border: colors.bad },
};

export function Button({ label, onPress, variant = 'primary', icon, disabled, busy, accessibilityLabel, testID, style }: ButtonProps) {
  const look = LOOK[variant];
  const inactive = disabled || busy;
  return (
    <Pressable
      accessibilityRole="button"
      accessibilityLabel={accessibilityLabel ?? label}
      accessibilityState={{ disabled: !!inactive, busy: !!busy }}
      disabled={inactive}
      onPress={onPress}
      testID={testID}
      style={({ pressed }) => [
        styles.base,
        { backgroundColor: look.fill, borderColor: look.border },
        pressed && styles.pressed,
        inactive && styles.inactive,
        style,
      ]}
    >
      <View style={styles.row}>
        {busy ? <ActivityIndicator size="small" color={look.ink} accessibilityLabel={`${label}: working`} /> : icon ? <Icon name={icon} size={20} color={look.ink} /> : null}
        <Text style={[styles.label, { color: look.ink }]}>{label}</Text>
      </View>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  base: {
    minHeight: TOUCH_MIN,
    minWidth: TOUCH_MIN,
    paddingHorizontal: space.lg,
    borderRadius: radius.md,
    borderWidth: 2,
    justifyContent: 'center',
    alignItems: 'center',
  },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  label: { fontFamily: fonts.textBold, fontSize: 17, lineHeight: 22 },
  pressed: { opacity: 0.8 },
  inactive: { opacity: 0.55 },
});

/**
 * Pick one of a few options, all visible at once (a radio group of buttons,
 * each at least 44 px). The chosen option is marked by a dot in its ring and
 * bold text as well as colour.
 *
 *   <Choice label="Role" options={ROLES.map((r) => ({ value: r, label: r }))}
 *     value={role} onChange={setRole} />
 */
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { colors, fonts, space, type } from '@/src/theme';
import { toggleOn, toggleOnText, toggleOption, togglePressed, toggleText } from './toggleStyles';
import { RadioMark } from './RadioMark';

export interface ChoiceOption<T extends string> {
  value: T;
  label: string;
}

export interface ChoiceProps<T extends string> {
  label: string;
  options: readonly ChoiceOption<T>[];
  value: T | null;
  onChange: (value: T) => void;
  disabled?: boolean;
  error?: string | null;
  testID?: string;
}

export function Choice<T extends string>({ label, options, value, onChange, disabled, error, testID }: ChoiceProps<T>) {
  return (
    <View style={styles.wrap} testID={testID}>
      <Text style={styles.label} nativeID={testID ? `${testID}-label` : undefined}>
        {label}
      </Text>
      <View style={styles.options} accessibilityRole="radiogroup" accessibilityLabel={label}>
        {options.map((o) => {
          const chosen = o.value === value;
          return (
            <Pressable
              key={o.value}
              accessibilityRole="radio"
              accessibilityLabel={o.label}
              accessibilityState={{ checked: chosen, disabled: !!disabled }}
              aria-checked={chosen}
              disabled={disabled}
              onPress={() => onChange(o.value)}
              testID={testID ? `${testID}-${o.value}` : undefined}
              style={({ pressed }) => [styles.option, chosen && styles.chosen, pressed && styles.pressed, disabled && styles.disabled]}
            >
              <RadioMark chosen={chosen} size={14} />
              <Text style={[styles.optionText, chosen && styles.chosenText]}>{o.label}</Text>
            </Pressable>
          );
        })}
      </View>
      {error ? <Text style={styles.error}>{`⚠ ${error}`}</Text> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  label: { ...type.label },
  options: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  option: toggleOption,
  chosen: toggleOn,
  pressed: togglePressed,
  disabled: { opacity: 0.55 },
  optionText: toggleText,
  chosenText: toggleOnText,
  error: { ...type.small, color: colors.bad, fontFamily: fonts.textBold },
});

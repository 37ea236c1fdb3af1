/**
 * Filter chips, several may be on: each is a checkbox with a drawn box and tick, so its state
 * shows by shape and bold text as well as colour. At least 44 px high.
 */
import { Pressable, StyleSheet, Text, View } from 'react-native';
import Svg, { Path, Rect } from 'react-native-svg';
import { colors, radius, space, type } from '@/src/theme';
import { toggleOn, toggleOnText, toggleOption, togglePressed, toggleText } from '@/src/components/toggleStyles';

export interface ChipOption<T extends string> {
  value: T;
  label: string;
}

function Box({ on }: { on: boolean }) {
  const ink = on ? colors.accent : colors.lineStrong;
  return (
    <Svg width={16} height={16} viewBox="0 0 16 16" aria-hidden accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
      <Rect x={1} y={1} width={14} height={14} rx={2} fill={on ? colors.accent : 'none'} stroke={ink} strokeWidth={2} />
      {on ? <Path d="M4 8.2l2.6 2.6L12 5.4" stroke={colors.accentInk} strokeWidth={2} fill="none" strokeLinecap="round" strokeLinejoin="round" /> : null}
    </Svg>
  );
}

export function CheckChips<T extends string>({ label, options, chosen, onToggle, testID }: { label: string; options: readonly ChipOption<T>[]; chosen: readonly T[]; onToggle: (value: T) => void; testID?: string }) {
  return (
    <View style={styles.wrap} testID={testID}>
      <Text style={styles.label}>{label}</Text>
      <View style={styles.chips} role="group" aria-label={label}>
        {options.map((o) => {
          const on = chosen.includes(o.value);
          return (
            <Pressable
              key={o.value}
              accessibilityRole="checkbox"
              accessibilityLabel={o.label}
              accessibilityState={{ checked: on }}
              // react-native-web leaves aria-checked out for a checkbox; axe requires it.
              aria-checked={on}
              onPress={() => onToggle(o.value)}
              testID={testID ? `${testID}-${o.value}` : undefined}
              style={({ pressed }) => [styles.chip, on && styles.on, pressed && styles.pressed]}
            >
              <Box on={on} />
              <Text style={[styles.text, on && styles.onText]}>{o.label}</Text>
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  label: { ...type.label },
  chips: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  chip: { ...toggleOption, borderRadius: radius.pill },
  on: toggleOn,
  pressed: togglePressed,
  text: toggleText,
  onText: toggleOnText,
});

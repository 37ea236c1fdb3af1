/** Map or schematic: the two views of the network, as a pair of choices with a shape and a word each. */
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { StatusShape } from '@/src/components/StatusShape';
import { toggleOn, toggleOnText, toggleOption, togglePressed, toggleText } from '@/src/components/toggleStyles';
import { colors, space } from '@/src/theme';
import type { DiagramMode } from './networkHref';

const CHOICES: { mode: DiagramMode; label: string; hint: string }[] = [
  { mode: 'map', label: 'Map', hint: 'sites by position' },
  { mode: 'schematic', label: 'Schematic', hint: 'each service as a tree from its origins' },
];

export function ViewSwitch({ mode, onChange }: { mode: DiagramMode; onChange: (m: DiagramMode) => void }) {
  return (
    <View style={styles.row} accessibilityRole="radiogroup" accessibilityLabel="View">
      {CHOICES.map((c) => {
        const on = c.mode === mode;
        return (
          <Pressable
            key={c.mode}
            accessibilityRole="radio"
            aria-checked={on}
            accessibilityLabel={`${c.label}: ${c.hint}`}
            onPress={() => onChange(c.mode)}
            style={({ pressed }) => [styles.option, on && toggleOn, pressed && togglePressed]}
            testID={`network-view-${c.mode}`}
          >
            <StatusShape shape={on ? 'solid' : 'ring'} color={on ? colors.accent : colors.lineStrong} size={12} />
            <Text style={[toggleText, on && toggleOnText]}>{c.label}</Text>
          </Pressable>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  option: { ...toggleOption, gap: space.xs },
});

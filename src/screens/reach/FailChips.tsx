/** The failure set as chips, each with a button that takes the element out again. */
import { Platform, Pressable, StyleSheet, Text, View } from 'react-native';
import type { Element } from '@/shared/schemas/analysis';
import { StatusShape } from '@/src/components/StatusShape';
import { colors, fonts, radius, space, TOUCH_MIN, type } from '@/src/theme';

/** Web only: a browser would break a code at its hyphens and dots; the chip moves whole to the next line instead. */
const noWrap = (Platform.OS === 'web' ? { whiteSpace: 'nowrap' } : {}) as object;

export function FailChips({ elements, onRemove, onClear }: { elements: readonly Element[]; onRemove: (e: Element) => void; onClear: () => void }) {
  if (elements.length === 0) return null;
  return (
    <View style={styles.wrap} testID="reach-fail-set">
      <Text style={styles.label}>{`Failure set (${elements.length})`}</Text>
      <View style={styles.chips}>
        {elements.map((e) => (
          <View key={`${e.kind}:${e.code}`} style={styles.chip} testID={`fail-chip-${e.kind}-${e.code}`}>
            <StatusShape shape="cross" color={colors.bad} size={14} />
            <Text style={styles.kind}>{e.kind}</Text>
            <Text style={styles.code}>{e.code}</Text>
            <Pressable
              accessibilityRole="button"
              accessibilityLabel={`Remove ${e.kind} ${e.code} from the failure set`}
              onPress={() => onRemove(e)}
              style={({ pressed }) => [styles.remove, pressed && styles.pressed]}
            >
              <Text style={styles.removeText} aria-hidden>
                ×
              </Text>
            </Pressable>
          </View>
        ))}
        {elements.length > 1 ? (
          <Pressable accessibilityRole="button" accessibilityLabel="Clear the failure set" onPress={onClear} style={({ pressed }) => [styles.clear, pressed && styles.pressed]}>
            <Text style={styles.clearText}>Clear all</Text>
          </Pressable>
        ) : null}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  label: { ...type.label },
  chips: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  // A chip moves to the next line whole: it never shrinks, and its words never break inside.
  chip: {
    flexShrink: 0,
    maxWidth: '100%',
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.xs,
    paddingLeft: space.md,
    minHeight: TOUCH_MIN,
    borderRadius: radius.pill,
    borderWidth: 2,
    borderColor: colors.bad,
    backgroundColor: colors.badSoft,
  },
  kind: { ...type.label, fontSize: 13, color: colors.bad, ...noWrap },
  code: { fontFamily: fonts.monoBold, fontSize: 15, color: colors.ink, ...noWrap },
  remove: { width: TOUCH_MIN, height: TOUCH_MIN, alignItems: 'center', justifyContent: 'center', borderRadius: radius.pill },
  removeText: { fontSize: 24, lineHeight: 26, color: colors.bad, fontFamily: fonts.textBold },
  clear: { minHeight: TOUCH_MIN, justifyContent: 'center', paddingHorizontal: space.md },
  clearText: { ...type.label, color: colors.accent, textDecorationLine: 'underline' },
  pressed: { opacity: 0.7 },
});

/**
 * Which service the diagram shows: all, or one. On a wide screen the choices
 * wrap onto as many rows as they need; on a phone they stay on one row that
 * scrolls sideways, with its scroll bar shown and the count of choices said,
 * so nothing runs off the edge unseen.
 */
import { Pressable, ScrollView, StyleSheet, Text, View } from 'react-native';
import { compareCodes } from '@/shared/schemas/network';
import { RadioMark } from '@/src/components/RadioMark';
import { useBreakpoints } from '@/src/hooks/useBreakpoints';
import { colors, fonts, space, type } from '@/src/theme';
import { toggleOn, toggleOption, togglePressed } from '@/src/components/toggleStyles';

export function ServiceFilter({ services, value, onChange }: { services: { code: string; name: string }[]; value: string | null; onChange: (code: string | null) => void }) {
  const { wide } = useBreakpoints();
  const options = [{ code: null as string | null, name: 'All services' }, ...[...services].sort(compareCodes)];
  const choices = (
    <View style={[styles.row, wide && styles.wrapRow]} accessibilityRole="radiogroup" accessibilityLabel="Service">
      {options.map((o) => {
        const chosen = o.code === value;
        return (
          <Pressable
            key={o.code ?? '*'}
            accessibilityRole="radio"
            accessibilityLabel={o.code ? `${o.code} ${o.name}` : o.name}
            aria-checked={chosen}
            onPress={() => onChange(o.code)}
            style={({ pressed }) => [styles.option, chosen && styles.chosen, pressed && styles.pressed]}
            testID={`network-service-${o.code ?? 'all'}`}
          >
            <RadioMark chosen={chosen} size={12} />
            <Text style={[styles.text, chosen && styles.chosenText]}>{o.code ?? o.name}</Text>
          </Pressable>
        );
      })}
    </View>
  );
  return (
    <View style={styles.wrap} testID="network-services">
      <Text style={styles.label} nativeID="network-service-label">
        {wide ? 'Service' : `Service (${options.length} choices; the row scrolls sideways)`}
      </Text>
      {wide ? (
        choices
      ) : (
        <ScrollView horizontal focusable accessibilityLabel="Services (scrolls sideways)" style={styles.scroller} contentContainerStyle={styles.row} showsHorizontalScrollIndicator>
          {choices}
        </ScrollView>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs, maxWidth: '100%' },
  label: { ...type.label },
  scroller: { maxWidth: '100%', flexGrow: 0 },
  row: { flexDirection: 'row', gap: space.sm, paddingVertical: space.xxs },
  wrapRow: { flexWrap: 'wrap' },
  option: { ...toggleOption, gap: space.xs },
  chosen: toggleOn,
  pressed: togglePressed,
  text: { fontFamily: fonts.mono, fontSize: 15, color: colors.ink },
  chosenText: { fontFamily: fonts.monoBold, color: colors.accent },
});

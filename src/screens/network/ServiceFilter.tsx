/** Which service the diagram shows: all, or one (a row of choices that scrolls sideways on a phone). */
import { Pressable, ScrollView, StyleSheet, Text, View } from 'react-native';
import { StatusShape } from '@/src/components/StatusShape';
import { colors, fonts, space, type } from '@/src/theme';
import { toggleOn, toggleOption, togglePressed } from '@/src/components/toggleStyles';

export function ServiceFilter({ services, value, onChange }: { services: { code: string; name: string }[]; value: string | null; onChange: (code: string | null) => void }) {
  const options = [{ code: null as string | null, name: 'All services' }, ...[...services].sort((a, b) => a.code.localeCompare(b.code))];
  return (
    <View style={styles.wrap}>
      <Text style={styles.label} nativeID="network-service-label">
        Service
      </Text>
      <ScrollView horizontal focusable accessibilityLabel="Services (scrolls sideways)" contentContainerStyle={styles.row} showsHorizontalScrollIndicator={false}>
        <View style={styles.row} accessibilityRole="radiogroup" accessibilityLabel="Service">
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
                <StatusShape shape={chosen ? 'solid' : 'ring'} color={chosen ? colors.accent : colors.lineStrong} size={12} />
                <Text style={[styles.text, chosen && styles.chosenText]}>{o.code ?? o.name}</Text>
              </Pressable>
            );
          })}
        </View>
      </ScrollView>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  label: { ...type.label },
  row: { flexDirection: 'row', gap: space.sm, paddingVertical: space.xxs },
  option: { ...toggleOption, gap: space.xs },
  chosen: toggleOn,
  pressed: togglePressed,
  text: { fontFamily: fonts.mono, fontSize: 15, color: colors.ink },
  chosenText: { fontFamily: fonts.monoBold, color: colors.accent },
});

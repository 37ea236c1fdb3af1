/**
 * A record's fields as label and value pairs: side by side on a wide screen,
 * the label over the value on a phone. A value is text (with its unit in the
 * words) or any element, such as links.
 *
 *   <FieldList items={[{ label: 'Mast height', value: '173 m', mono: true }]} />
 */
import type { ReactNode } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { useBreakpoints } from '@/src/hooks/useBreakpoints';
import { colors, fonts, space, type } from '@/src/theme';

export interface FieldItem {
  label: string;
  value: ReactNode;
  /** codes and figures in the monospaced face */
  mono?: boolean;
  testID?: string;
}

export function FieldList({ items, testID }: { items: readonly FieldItem[]; testID?: string }) {
  const { wide } = useBreakpoints();
  return (
    <View style={styles.list} testID={testID}>
      {items.map((item) => (
        <View key={item.label} style={[styles.item, wide && styles.itemWide]} testID={item.testID}>
          <Text style={[styles.label, wide && styles.labelWide]}>{item.label}</Text>
          <View style={styles.value}>
            {typeof item.value === 'string' || typeof item.value === 'number' ? (
              <Text style={[styles.text, item.mono && styles.mono]} selectable>
                {item.value}
              </Text>
            ) : (
              item.value
            )}
          </View>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { borderTopWidth: 1, borderTopColor: colors.line },
  item: { paddingVertical: space.sm, borderBottomWidth: 1, borderBottomColor: colors.line, gap: space.xxs },
  itemWide: { flexDirection: 'row', alignItems: 'flex-start', gap: space.lg },
  label: { ...type.label, color: colors.inkMuted },
  labelWide: { width: 200, paddingTop: 2 },
  value: { flex: 1, flexDirection: 'row', flexWrap: 'wrap', columnGap: space.md },
  text: { ...type.body },
  mono: { fontFamily: fonts.mono, fontVariant: ['tabular-nums'] },
});

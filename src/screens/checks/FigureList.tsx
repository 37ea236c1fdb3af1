/**
 * Labelled figures in a wrapping row: "Distance / 12.00 km". Figures use tabular digits so
 * columns of them line up.
 */
import { StyleSheet, Text, View } from 'react-native';
import { colors, radius, space, type } from '@/src/theme';

export interface FigureItem {
  label: string;
  value: string;
  /** A muted line under the value: where a bearing points, what a figure assumes. */
  hint?: string;
  testID?: string;
}

export function FigureList({ items, testID }: { items: readonly FigureItem[]; testID?: string }) {
  return (
    <View style={styles.row} testID={testID}>
      {items.map((f) => (
        <View key={f.label} style={styles.figure} testID={f.testID}>
          <Text style={styles.label}>{f.label}</Text>
          <Text style={styles.value} selectable>
            {f.value}
          </Text>
          {f.hint ? <Text style={styles.hint}>{f.hint}</Text> : null}
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  figure: {
    flexGrow: 1,
    flexBasis: 150,
    backgroundColor: colors.sunken,
    borderRadius: radius.md,
    paddingHorizontal: space.md,
    paddingVertical: space.sm,
    gap: space.xxs,
  },
  label: { ...type.small, color: colors.inkMuted },
  value: { ...type.figure, fontSize: 20, lineHeight: 26 },
  hint: { ...type.small, fontSize: 14, lineHeight: 18 },
});

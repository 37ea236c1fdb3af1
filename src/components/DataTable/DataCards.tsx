/**
 * A DataTable's rows as cards on a phone: nothing sits in a column
 * off-screen. Each card leads with one figure (households, say) large, then
 * the row's title, then every other column as "label (unit): value".
 * Long tables keep rendering only the cards on screen (VirtualList).
 */
import type { ReactNode } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { colors, fonts, radius, space, TOUCH_MIN, type } from '@/src/theme';
import { VirtualList } from '../VirtualList';
import type { DataColumn, DataTableProps } from './DataTable';

type Props<Row> = DataTableProps<Row> & {
  cards: { lead: string; title: (row: Row) => string; hide?: string[] };
  display: (col: DataColumn<Row>, row: Row) => string;
};

/** Beyond this many cards, only those on screen are rendered. */
const VIRTUAL_FROM = 40;

export function DataCards<Row>({ caption, columns, rows, rowKey, onRowPress, rowLabel, emptyText = 'Nothing to list.', testID, cards, display }: Props<Row>) {
  const lead = columns.find((c) => c.key === cards.lead);
  const rest = columns.filter((c) => c.key !== cards.lead && !cards.hide?.includes(c.key));
  const card = (row: Row): ReactNode => {
    const body = (
      <>
        {lead ? (
          <View style={styles.leadLine}>
            <Text style={styles.leadFigure}>{display(lead, row)}</Text>
            <Text style={styles.leadLabel}>{lead.unit ? `${lead.label.toLowerCase()} ${lead.unit}` : lead.label.toLowerCase()}</Text>
          </View>
        ) : null}
        <Text style={styles.title}>{cards.title(row)}</Text>
        <View style={styles.pairs}>
          {rest.map((c) => (
            <View key={c.key} style={styles.pair}>
              <Text style={styles.label}>{c.unit ? `${c.label} (${c.unit})` : c.label}</Text>
              {c.render ? c.render(row) : <Text style={[styles.value, (c.mono || c.numeric) && styles.mono]}>{display(c, row)}</Text>}
            </View>
          ))}
        </View>
      </>
    );
    const key = rowKey(row);
    return onRowPress ? (
      <Pressable
        key={key}
        accessibilityRole="button"
        // The card's name is what it shows (figures included), so what is read out matches what is seen; rowLabel says the action.
        accessibilityHint={rowLabel ? rowLabel(row) : undefined}
        onPress={() => onRowPress(row)}
        style={({ pressed }) => [styles.card, pressed && styles.pressed]}
        testID={testID ? `${testID}-card` : undefined}
      >
        {body}
      </Pressable>
    ) : (
      <View key={key} style={styles.card} testID={testID ? `${testID}-card` : undefined}>
        {body}
      </View>
    );
  };
  if (rows.length === 0) return <Text style={styles.empty}>{emptyText}</Text>;
  if (rows.length > VIRTUAL_FROM) return <VirtualList data={rows} keyOf={rowKey} renderRow={card} label={caption} testID={testID} framed={false} />;
  return (
    <View style={styles.list} role="list" aria-label={caption} testID={testID}>
      {rows.map(card)}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
  card: {
    minHeight: TOUCH_MIN,
    backgroundColor: colors.surface,
    borderWidth: 1,
    borderColor: colors.line,
    borderRadius: radius.lg,
    padding: space.md,
    gap: space.xs,
    marginBottom: space.sm,
  },
  pressed: { backgroundColor: colors.accentSoft },
  leadLine: { flexDirection: 'row', alignItems: 'baseline', flexWrap: 'wrap', columnGap: space.sm },
  leadFigure: { fontFamily: fonts.monoBold, fontSize: 24, lineHeight: 30, color: colors.ink, fontVariant: ['tabular-nums'] },
  leadLabel: { ...type.small },
  title: { ...type.label, fontSize: 16, lineHeight: 22 },
  pairs: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.lg, rowGap: space.xxs },
  pair: { flexDirection: 'row', alignItems: 'baseline', gap: space.xs },
  label: { ...type.small },
  value: { ...type.body, fontSize: 15, lineHeight: 20 },
  mono: { fontFamily: fonts.mono, fontVariant: ['tabular-nums'] },
  empty: { ...type.small, padding: space.lg },
});

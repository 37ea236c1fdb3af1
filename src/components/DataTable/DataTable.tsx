/**
 * A table of records: units in the header, figures in tabular (monospaced)
 * digits and right-aligned, header buttons that sort. On a narrow phone the
 * table scrolls sideways rather than squeezing columns.
 *
 *   <DataTable
 *     caption="Feeds"
 *     rows={feeds}
 *     rowKey={(f) => f.code}
 *     columns={[
 *       { key: 'code', label: 'Feed', mono: true, value: (f) => f.code },
 *       { key: 'km', label: 'Distance', unit: 'km', numeric: true, value: (f) => f.km,
 *         format: (v) => (v as number).toFixed(1) },
 *     ]}
 *     initialSort={{ column: 'km', direction: 'desc' }}
 *   />
 */
import { useMemo, useState, type ReactElement, type ReactNode } from 'react';
import { Pressable, ScrollView, StyleSheet, Text, View } from 'react-native';
import Svg, { Path } from 'react-native-svg';
import { colors, fonts, space, TOUCH_MIN, type } from '@/src/theme';
import { useBreakpoints } from '@/src/hooks/useBreakpoints';
import { VirtualList } from '../VirtualList';
import { webAria } from '../webAria';
import { DataCards } from './DataCards';
import { nextSort, sortRows, type Sortable, type SortState } from './sortRows';

export interface DataColumn<Row> {
  key: string;
  label: string;
  /** Shown in the header: "Distance (km)". */
  unit?: string;
  /** Right-aligned tabular figures. */
  numeric?: boolean;
  /** Monospaced text (codes, channels). */
  mono?: boolean;
  /** Minimum width in px (default 140, numeric 110). */
  width?: number;
  /** The cell's value, used to sort and, without `render`, to display. */
  value: (row: Row) => Sortable;
  /** Display text for the value (units stay in the header). */
  format?: (value: Sortable, row: Row) => string;
  /** A custom cell (a badge, a link). Sorting still uses `value`. */
  render?: (row: Row) => ReactNode;
  sortable?: boolean;
}

export interface DataTableProps<Row> {
  /** What the table lists; its accessible name. */
  caption: string;
  columns: DataColumn<Row>[];
  rows: readonly Row[];
  rowKey: (row: Row) => string;
  initialSort?: SortState;
  /**
   * Sorted elsewhere (a list paged on the server): the headers show `sort` and
   * report a press to `onSort`, and the rows are drawn in the order given.
   */
  sort?: SortState | null;
  onSort?: (next: SortState) => void;
  onRowPress?: (row: Row) => void;
  /** Accessible name of a pressable row (default: the first column's text). */
  rowLabel?: (row: Row) => string;
  emptyText?: string;
  testID?: string;
  /**
   * Render only the body rows on screen, in a scrolling box under the header
   * (for tables of hundreds of rows and more). Its rows get `<testID>-body-row`.
   */
  virtual?: boolean;
  /** With `virtual`: called when the last rows come into view (to fetch the next page of a server-paged list). */
  onEndReached?: () => void;
  /** With `virtual`: shown after the last row (e.g. how many rows of how many have arrived). */
  footer?: ReactElement | null;
  /**
   * On a phone, one card per row instead of columns that would sit off-screen:
   * the `lead` column's figure first and large, then every other column as
   * "label: value", so every number stays on screen. `hide` leaves out
   * columns the title already says.
   */
  cardsOnPhone?: { lead: string; title: (row: Row) => string; hide?: string[] };
}

export function display<Row>(col: DataColumn<Row>, row: Row): string {
  const v = col.value(row);
  if (col.format) return col.format(v, row);
  if (v === null || v === undefined || v === '') return '—';
  if (v instanceof Date) return v.toISOString().slice(0, 10);
  return String(v);
}

function Caret({ direction }: { direction: 'asc' | 'desc' | null }) {
  const d = direction === 'asc' ? 'M2 8l4-5 4 5z' : direction === 'desc' ? 'M2 4l4 5 4-5z' : 'M2 5l4-3.5 4 3.5zM2 7l4 3.5 4-3.5z';
  return (
    <Svg width={12} height={12} viewBox="0 0 12 12" aria-hidden accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
      <Path d={d} fill={direction ? colors.accent : colors.lineStrong} />
    </Svg>
  );
}

export function DataTable<Row>(props: DataTableProps<Row>) {
  const { caption, columns, rows, rowKey, initialSort, onSort, onRowPress, rowLabel, emptyText = 'Nothing to list.', testID, virtual, onEndReached, footer, cardsOnPhone } = props;
  const { wide } = useBreakpoints();
  const [ownSort, setOwnSort] = useState<SortState | null>(initialSort ?? null);
  const sort = onSort ? (props.sort ?? null) : ownSort;
  const sorted = useMemo(() => {
    const col = !onSort && sort && columns.find((c) => c.key === sort.column);
    return col ? sortRows(rows, col.value, sort.direction) : [...rows];
  }, [rows, columns, sort, onSort]);
  const pressSort = (column: string) => (onSort ? onSort(nextSort(sort, column)) : setOwnSort((s) => nextSort(s, column)));

  const widthOf = (c: DataColumn<Row>) => c.width ?? (c.numeric ? 110 : 140);
  const minWidth = columns.reduce((sum, c) => sum + widthOf(c), 0);

  if (cardsOnPhone && !wide) {
    return <DataCards {...props} rows={sorted} cards={cardsOnPhone} display={display} />;
  }

  const bodyRow = (row: Row) => {
    const cells = columns.map((c) => (
      <View key={c.key} style={[styles.cell, { flexBasis: widthOf(c), minWidth: widthOf(c) }]} role="cell">
        {c.render ? (
          c.render(row)
        ) : (
          <Text style={[styles.cellText, (c.mono || c.numeric) && styles.mono, c.numeric && styles.right]}>{display(c, row)}</Text>
        )}
      </View>
    ));
    const key = rowKey(row);
    return onRowPress ? (
      <Pressable
        key={key}
        role="row"
        accessibilityRole="button"
        accessibilityLabel={rowLabel ? rowLabel(row) : display(columns[0], row)}
        onPress={() => onRowPress(row)}
        style={({ pressed }) => [styles.row, styles.bodyRow, pressed && styles.pressed]}
      >
        {cells}
      </Pressable>
    ) : (
      <View key={key} style={[styles.row, styles.bodyRow]} role="row">
        {cells}
      </View>
    );
  };

  return (
    <ScrollView horizontal contentContainerStyle={styles.scroller} testID={testID}>
      <View style={[styles.table, { minWidth }]} role="table" aria-label={caption}>
        <View style={[styles.row, styles.headRow]} role="row">
          {columns.map((c) => {
            const active = sort?.column === c.key ? sort.direction : null;
            const text = c.unit ? `${c.label} (${c.unit})` : c.label;
            const cellStyle = [styles.cell, { flexBasis: widthOf(c), minWidth: widthOf(c) }];
            if (c.sortable === false) {
              return (
                <View key={c.key} style={cellStyle} role="columnheader">
                  <Text style={[styles.headText, c.numeric && styles.right]}>{text}</Text>
                </View>
              );
            }
            const state = active === 'asc' ? 'ascending' : active === 'desc' ? 'descending' : undefined;
            return (
              <View key={c.key} style={cellStyle} role="columnheader" {...webAria({ 'aria-sort': state ?? 'none' })}>
                <Pressable
                  accessibilityRole="button"
                  accessibilityLabel={`Sort by ${text}${state ? `, now ${state}` : ''}`}
                  onPress={() => pressSort(c.key)}
                  style={({ pressed }) => [styles.sortButton, c.numeric && styles.sortButtonRight, pressed && styles.pressed]}
                  testID={testID ? `${testID}-sort-${c.key}` : undefined}
                >
                  <Text style={[styles.headText, c.numeric && styles.right]}>{text}</Text>
                  <Caret direction={active} />
                </Pressable>
              </View>
            );
          })}
        </View>
        {sorted.length === 0 ? (
          <Text style={styles.empty}>{emptyText}</Text>
        ) : (
          virtual ? (
            <VirtualList data={sorted} keyOf={rowKey} renderRow={bodyRow} framed={false} as="rows" label={caption} testID={testID ? `${testID}-body` : undefined} onEndReached={onEndReached} footer={footer} />
          ) : (
            sorted.map(bodyRow)
          )
        )}
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  scroller: { minWidth: '100%' },
  table: { flexGrow: 1, borderWidth: 1, borderColor: colors.line, borderRadius: 8, backgroundColor: colors.surface, overflow: 'hidden' },
  row: { flexDirection: 'row', alignItems: 'stretch' },
  headRow: { backgroundColor: colors.sunken, borderBottomWidth: 2, borderBottomColor: colors.lineStrong },
  bodyRow: { minHeight: TOUCH_MIN, borderBottomWidth: 1, borderBottomColor: colors.line },
  cell: { flexGrow: 1, flexShrink: 0, justifyContent: 'center', paddingHorizontal: space.md, paddingVertical: space.sm },
  sortButton: { minHeight: TOUCH_MIN, flexDirection: 'row', alignItems: 'center', gap: space.xs },
  sortButtonRight: { justifyContent: 'flex-end' },
  headText: { ...type.label, fontSize: 15 },
  cellText: { ...type.body, fontSize: 16, lineHeight: 22 },
  mono: { fontFamily: fonts.mono, fontVariant: ['tabular-nums'] },
  right: { textAlign: 'right' },
  empty: { ...type.small, padding: space.lg },
  pressed: { backgroundColor: colors.accentSoft },
});

/**
 * A framed list that shows its first rows and a button for the rest, so a
 * long answer does not bury what follows it. "Show all" opens the whole list
 * in its own scrolling box that renders only the rows on screen
 * (src/components/VirtualList), so thousands of rows open at once. A list
 * paged on the server (`loadingAll`, `onEndReached`) opens on its first page
 * and reads the next as it scrolls.
 */
import { useCallback, useMemo, useState, type ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { formatCount } from '@/shared/format';
import { Button } from '@/src/components/Button';
import { LoadingState } from '@/src/components/states';
import { VirtualList } from '@/src/components/VirtualList';
import { colors, radius, space } from '@/src/theme';

export interface CappedProps<T> {
  items: readonly T[];
  render: (item: T) => ReactNode;
  /** What the rows are, plural ("sites"): the button and the list's name use it. */
  what: string;
  first?: number;
  /** The key of a row (default: the rendered element's own key is not enough for the long list). */
  keyOf?: (item: T, index: number) => string;
  /** Fixed row height in px when every row has it (faster scrolling). */
  rowHeight?: number;
  /** Test id of the long list (its rows get `<testID>-row`). */
  testID?: string;
  /** When `items` is only the first page: the length of the whole list, and how to fetch it on "Show all". */
  total?: number;
  onShowAll?: () => void;
  /**
   * A list paged on the server: true while "Show all" waits for its first page,
   * false to open the long list at once on the rows `items` holds (without it,
   * the list waits until `items` holds the whole list).
   */
  loadingAll?: boolean;
  /** Asks for the next page as the long list nears its end. */
  onEndReached?: () => void;
}

export function Capped<T>({ items, render, what, first = 20, keyOf, rowHeight, testID, total, onShowAll, loadingAll, onEndReached }: CappedProps<T>) {
  const [all, setAll] = useState(false);
  const indexed = useMemo(() => items.map((item, i) => ({ item, i })), [items]);
  const rowKey = useCallback(({ item, i }: { item: T; i: number }) => (keyOf ? keyOf(item, i) : String(i)), [keyOf]);
  const renderRow = useCallback(({ item }: { item: T }) => render(item), [render]);
  const whole = Math.max(total ?? 0, items.length);
  const more = whole > first;
  const toggle = more ? (
    <View style={styles.more}>
      <Button
        variant="quiet"
        label={all ? `Show the first ${first}` : `Show all ${formatCount(whole)} ${what}`}
        onPress={() => {
          if (!all) onShowAll?.();
          setAll((a) => !a);
        }}
      />
    </View>
  ) : null;
  if (all && more && (loadingAll ?? items.length < whole)) {
    return (
      <View style={styles.gap}>
        <LoadingState what={`all ${formatCount(whole)} ${what}`} />
        {toggle}
      </View>
    );
  }
  if (all && more) {
    return (
      <View style={styles.gap}>
        <VirtualList
          data={indexed}
          keyOf={rowKey}
          renderRow={renderRow}
          rowHeight={rowHeight}
          label={`All ${formatCount(whole)} ${what}`}
          testID={testID}
          onEndReached={onEndReached}
        />
        {toggle}
      </View>
    );
  }
  return (
    <View style={styles.list}>
      {items.slice(0, first).map(render)}
      {toggle}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, overflow: 'hidden' },
  gap: { gap: space.xs },
  more: { padding: space.xs, backgroundColor: colors.surface },
});

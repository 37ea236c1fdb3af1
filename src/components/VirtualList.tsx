/**
 * A long list that renders only the rows in (and just around) its own
 * scrolling box: React Native's FlatList with windowing set for a phone, in
 * a box no taller than most of the window so the page around it stays
 * within reach. Rows of one fixed height (`rowHeight`) skip measuring
 * altogether (getItemLayout), which keeps a fast fling smooth.
 *
 * Each row is wrapped in an element whose test id is `<testID>-row`, so a
 * test or a benchmark can count how many rows are actually in the page.
 *
 *   <VirtualList testID="reach-by-site-list" label="Sites, most off air first"
 *     data={sites} keyOf={(s) => s.site} rowHeight={76} renderRow={(s) => <SiteRow site={s} />} />
 */
import { useCallback, type ReactElement, type ReactNode } from 'react';
import { FlatList, StyleSheet, useWindowDimensions, View, type ListRenderItemInfo } from 'react-native';
import { colors, radius } from '@/src/theme';

/** Rows drawn beyond the box, in box heights above and below (FlatList windowSize counts both plus the box). */
const WINDOW_SIZE = 5;

export interface VirtualListProps<T> {
  data: readonly T[];
  keyOf: (item: T) => string;
  renderRow: (item: T, index: number) => ReactNode;
  /** The height of every row in px, when all rows are equal (rows must then not grow). */
  rowHeight?: number;
  /** Estimated row height for the first render when rows vary (default 72). */
  estimatedRowHeight?: number;
  /** Tallest the box may be, px (default: 70 % of the window, 320-640). */
  maxHeight?: number;
  /** The list's accessible name; screen readers hear it before the rows. */
  label: string;
  testID?: string;
  /** Called when the last rows come into view (to fetch the next page). */
  onEndReached?: () => void;
  footer?: ReactElement | null;
  framed?: boolean;
  /** 'rows': the body of a table (a rowgroup of rows that carry their own role), not a list of items */
  as?: 'list' | 'rows';
}

export function VirtualList<T>({ data, keyOf, renderRow, rowHeight, estimatedRowHeight = 72, maxHeight, label, testID, onEndReached, footer, framed = true, as = 'list' }: VirtualListProps<T>) {
  const { height: windowHeight } = useWindowDimensions();
  const boxHeight = maxHeight ?? Math.round(Math.min(640, Math.max(320, windowHeight * 0.7)));
  const perScreen = Math.ceil(boxHeight / (rowHeight ?? estimatedRowHeight)) + 2;
  const getItemLayout = useCallback(
    (_: ArrayLike<T> | null | undefined, index: number) => ({ length: rowHeight!, offset: rowHeight! * index, index }),
    [rowHeight],
  );
  const renderItem = useCallback(
    ({ item, index }: ListRenderItemInfo<T>) => (
      <View testID={testID ? `${testID}-row` : undefined} role={as === 'list' ? 'listitem' : undefined} style={rowHeight ? { height: rowHeight, overflow: 'hidden' } : undefined}>
        {renderRow(item, index)}
      </View>
    ),
    [renderRow, rowHeight, testID, as],
  );
  return (
    <FlatList
      data={data}
      keyExtractor={keyOf}
      renderItem={renderItem}
      getItemLayout={rowHeight ? getItemLayout : undefined}
      initialNumToRender={perScreen}
      maxToRenderPerBatch={perScreen}
      updateCellsBatchingPeriod={40}
      windowSize={WINDOW_SIZE}
      removeClippedSubviews
      nestedScrollEnabled
      onEndReached={onEndReached}
      onEndReachedThreshold={1}
      ListFooterComponent={footer}
      style={[framed && styles.frame, { maxHeight: boxHeight }]}
      role={as === 'list' ? 'list' : 'rowgroup'}
      aria-label={label}
      accessibilityLabel={label}
      testID={testID}
    />
  );
}

const styles = StyleSheet.create({
  frame: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, backgroundColor: colors.surface, flexGrow: 0 },
});

/**
 * Lays its children out in columns: one on a phone (or `phone`), two on a
 * wide window, three on a roomy one (src/breakpoints.ts), never more than `max`.
 * Children keep their order, filling rows left to right.
 *
 *   <Columns max={3}>{tiles}</Columns>
 */
import { Children, isValidElement, type ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { useBreakpoints } from '@/src/hooks/useBreakpoints';
import { space } from '@/src/theme';

export interface ColumnsProps {
  children?: ReactNode;
  /** Upper limit on columns (default 3). */
  max?: 1 | 2 | 3;
  /** Columns on a phone (default 1); 2 suits small tiles such as counts. */
  phone?: 1 | 2;
  /** Gap between cells in px (default space.md). */
  gap?: number;
  testID?: string;
}

export function Columns({ children, max = 3, phone = 1, gap = space.md, testID }: ColumnsProps) {
  const { columns } = useBreakpoints();
  const n = Math.min(Math.max(columns, phone), max);
  const items = Children.toArray(children);
  // Negative margins with half-gap padding keep equal gutters and exact
  // percentage widths; percentage widths with `gap` would overflow the row.
  return (
    <View style={[styles.row, { marginHorizontal: -gap / 2, marginVertical: -gap / 2 }]} testID={testID}>
      {items.map((child, i) => (
        <View key={isValidElement(child) && child.key != null ? child.key : i} style={{ width: `${100 / n}%`, padding: gap / 2 }}>
          {child}
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap' },
});

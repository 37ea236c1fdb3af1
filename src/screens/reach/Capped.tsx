/** A framed list that shows its first rows and a button for the rest, so a long answer does not bury what follows it. */
import { useState, type ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { Button } from '@/src/components/Button';
import { colors, radius, space } from '@/src/theme';

export function Capped<T>({ items, render, what, first = 20 }: { items: readonly T[]; render: (item: T) => ReactNode; what: string; first?: number }) {
  const [all, setAll] = useState(false);
  const shown = all ? items : items.slice(0, first);
  return (
    <View style={styles.list}>
      {shown.map(render)}
      {items.length > first ? (
        <View style={styles.more}>
          <Button variant="quiet" label={all ? `Show the first ${first}` : `Show all ${items.length} ${what}`} onPress={() => setAll((a) => !a)} />
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, overflow: 'hidden' },
  more: { padding: space.xs, backgroundColor: colors.surface },
});

/**
 * A chain too big to send whole (an origin's downstream tree at 20,000
 * sites): the count of carriages at each hop, and a button per hop that
 * lists that hop's carriages a page at a time as the list scrolls
 * (GET .../chain?level=K). Each carriage links to its own chain, which opens
 * folded the same way: that is how a branch is followed.
 */
import { useCallback, useMemo, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { formatCount } from '@/shared/format';
import type { ChainRow } from '@/shared/schemas/analysis';
import { useChainLevelRows } from '@/src/api/queries/analysis';
import { Button } from '@/src/components/Button';
import { ErrorState, LoadingState } from '@/src/components/states';
import { VirtualList } from '@/src/components/VirtualList';
import { colors, radius, space, type } from '@/src/theme';
import { foldedSummary, levelItem, levelRowWords, type ChainItem } from './chainLayout';
import { Hop } from './ChainList';

export interface ChainFoldedProps {
  code: string;
  direction: 'up' | 'down';
  levels: number[];
  size: number;
}

export function ChainFolded({ code, direction, levels, size }: ChainFoldedProps) {
  // The first hop opens at once: the screen starts with something to read, and a small page of it.
  const [open, setOpen] = useState<ReadonlySet<number>>(() => new Set([1]));
  const toggle = useCallback((hop: number) => setOpen((o) => {
    const next = new Set(o);
    if (next.has(hop)) next.delete(hop);
    else next.add(hop);
    return next;
  }), []);
  return (
    <>
      <Text style={styles.summary} testID="chain-summary">
        {foldedSummary(code, direction, levels, size)}
      </Text>
      <View style={styles.box} testID="chain-levels" role="list" aria-label="Carriages by hop">
        {levels.slice(1).map((count, i) => (
          <HopLevel key={i + 1} code={code} direction={direction} hop={i + 1} count={count} open={open.has(i + 1)} onToggle={toggle} />
        ))}
      </View>
    </>
  );
}

function HopLevel({ code, direction, hop, count, open, onToggle }: { code: string; direction: 'up' | 'down'; hop: number; count: number; open: boolean; onToggle: (hop: number) => void }) {
  return (
    <View role="listitem" style={styles.level}>
      <View style={styles.row}>
        <Text style={styles.words}>
          <Text style={styles.figure}>{formatCount(count)}</Text>
          {` carriage${count === 1 ? '' : 's'} at hop ${hop}`}
        </Text>
        <Button
          label={open ? `Hide hop ${hop}` : `Show hop ${hop}`}
          variant="quiet"
          accessibilityLabel={open ? `Hide the ${formatCount(count)} carriages at hop ${hop}` : `Show the ${formatCount(count)} carriages at hop ${hop}`}
          onPress={() => onToggle(hop)}
          testID={`chain-hop-toggle-${hop}`}
        />
      </View>
      {open ? <HopRows code={code} direction={direction} hop={hop} /> : null}
    </View>
  );
}

function HopRows({ code, direction, hop }: { code: string; direction: 'up' | 'down'; hop: number }) {
  const pages = useChainLevelRows(code, direction, hop);
  const items = useMemo(() => pages.rows.map(levelItem), [pages.rows]);
  const words = useMemo(() => new Map<string, string>(pages.rows.map((r: ChainRow, i) => [items[i].id, levelRowWords(r, direction)])), [pages.rows, items, direction]);
  const renderHop = useCallback((it: ChainItem) => <Hop item={it} direction={direction} isRoot={false} extra={words.get(it.id)} />, [direction, words]);
  if (!pages.first) {
    return pages.error ? <ErrorState what={`the carriages at hop ${hop}`} error={pages.error} onRetry={pages.retry} /> : <LoadingState what={`the carriages at hop ${hop}`} />;
  }
  const footer = (
    <View style={styles.row} testID={`chain-hop-footer-${hop}`}>
      <Text style={styles.note}>{pages.more ? `Showing ${formatCount(pages.rows.length)} of ${formatCount(pages.total)} at hop ${hop}` : `All ${formatCount(pages.total)} at hop ${hop} shown`}</Text>
      {pages.more ? <Button label={pages.loadingMore ? 'Loading more…' : 'Show more'} variant="quiet" disabled={pages.loadingMore} onPress={pages.loadMore} /> : null}
    </View>
  );
  return <VirtualList data={items} keyOf={itemKey} renderRow={renderHop} estimatedRowHeight={130} label={`Carriages at hop ${hop}`} testID="chain-list" onEndReached={pages.loadMore} footer={footer} />;
}

const itemKey = (it: ChainItem) => it.id;

const styles = StyleSheet.create({
  summary: { ...type.body },
  box: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, backgroundColor: colors.surface, paddingHorizontal: space.md, paddingVertical: space.xs, gap: space.xs },
  level: { gap: space.xs },
  row: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', flexWrap: 'wrap', gap: space.sm },
  words: { ...type.body, fontSize: 16 },
  figure: { ...type.figure, fontSize: 16 },
  note: { ...type.small },
});

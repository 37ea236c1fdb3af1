/**
 * The chain as an indented list, hop by hop, in reading order: every feed's
 * medium, role, distance, state, via-sites and full warning text, and every
 * carriage with a link to walk on and a fold button. The drawing above it
 * shows the shape; this says it all in words (and is what a screen reader uses).
 */
import { Link } from 'expo-router';
import { useCallback } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { FeedSwatch } from '@/src/components/charts/FeedSwatch';
import { feedWords } from '@/src/components/charts/feedStyle';
import { formatKm } from '@/shared/format';
import { StatusShape } from '@/src/components/StatusShape';
import { VirtualList } from '@/src/components/VirtualList';
import { colors, fonts, radius, space, TOUCH_MIN, type } from '@/src/theme';
import { nodeNotes, type ChainItem } from './chainLayout';

const INDENT = 14;
const MAX_INDENT_LEVELS = 8;

/** One carriage and the feed that reaches it; `extra` adds a line of words under it (where it hangs in a folded chain). */
export function Hop({ item, direction, onFold, isRoot, extra }: { item: ChainItem; direction: 'up' | 'down'; onFold?: (id: string) => void; isRoot: boolean; extra?: string }) {
  const n = item.node;
  const via = n.via;
  const notes = nodeNotes(n, direction);
  return (
    <View style={[styles.hop, { marginLeft: Math.min(item.depth, MAX_INDENT_LEVELS) * INDENT }]} testID={`chain-hop-${item.id}`}>
      {via ? (
        <View style={styles.via}>
          <FeedSwatch medium={via.medium} role={via.role} width={36} />
          <View style={styles.viaTexts}>
            <Text style={styles.viaText}>
              {`${direction === 'up' ? 'Fed by' : 'Feeds'} ${feedWords(via.medium, via.role)} `}
              <Text style={styles.code}>{via.feed}</Text>
              {`, ${formatKm(via.distanceKm)}, ${via.up ? 'carries programme' : 'no programme at its source'}`}
              {via.hops.length > 0 ? `, via ${via.hops.join(', ')}` : ''}
            </Text>
            {via.warnings.map((w, i) => (
              <View key={i} style={styles.warning}>
                <StatusShape shape="triangle" color={colors.warn} size={14} />
                <Text style={styles.warningText}>{w}</Text>
              </View>
            ))}
          </View>
        </View>
      ) : null}
      <View style={styles.node}>
        <StatusShape shape={n.onAir ? 'solid' : 'cross'} color={n.onAir ? colors.good : colors.bad} size={14} />
        <View style={styles.nodeTexts}>
          {isRoot ? (
            <Text style={styles.name}>
              {`${n.siteName} `}
              <Text style={styles.code}>{n.carriage}</Text>
            </Text>
          ) : (
            <Link href={`/carriages/${encodeURIComponent(n.carriage)}?direction=${direction}`} asChild>
              <Pressable accessibilityRole="link" style={styles.open}>
                <Text style={[styles.name, styles.linkText]}>
                  {`${n.siteName} `}
                  <Text style={styles.code}>{n.carriage}</Text>
                </Text>
              </Pressable>
            </Link>
          )}
          <Text style={[styles.notes, !n.onAir && styles.bad]}>{[n.onAir ? 'on air' : null, ...notes].filter(Boolean).join('; ')}</Text>
          {extra ? <Text style={styles.notes}>{extra}</Text> : null}
        </View>
        {item.childCount > 0 && onFold ? (
          <Pressable
            accessibilityRole="button"
            accessibilityLabel={item.folded ? `Unfold ${n.carriage}: show ${item.hiddenCount} more` : `Fold ${n.carriage}: hide what hangs from it`}
            aria-expanded={!item.folded}
            onPress={() => onFold(item.id)}
            style={({ pressed }) => [styles.fold, pressed && styles.pressed]}
          >
            <Text style={styles.foldText}>{item.folded ? `+${item.hiddenCount}` : '−'}</Text>
          </Pressable>
        ) : null}
      </View>
    </View>
  );
}

/**
 * Every shown hop in a scrolling box that renders only the hops on screen: an
 * origin's downstream tree holds thousands of carriages.
 */
export function ChainList({ items, direction, onFold }: { items: ChainItem[]; direction: 'up' | 'down'; onFold: (id: string) => void }) {
  const renderHop = useCallback((it: ChainItem) => <Hop item={it} direction={direction} onFold={onFold} isRoot={it.depth === 0} />, [direction, onFold]);
  return <VirtualList data={items} keyOf={itemKey} renderRow={renderHop} estimatedRowHeight={110} label="The chain, hop by hop" testID="chain-list" />;
}

const itemKey = (it: ChainItem) => it.id;

const styles = StyleSheet.create({
  hop: { gap: space.xs, marginVertical: space.xxs, marginRight: space.xs, borderLeftWidth: 2, borderLeftColor: colors.line, paddingLeft: space.sm, paddingVertical: space.xs },
  via: { flexDirection: 'row', gap: space.sm, alignItems: 'flex-start' },
  viaTexts: { flex: 1, gap: space.xxs },
  viaText: { ...type.small, color: colors.ink },
  warning: { flexDirection: 'row', gap: space.xs, alignItems: 'flex-start', backgroundColor: colors.warnSoft, borderRadius: radius.sm, padding: space.xs },
  warningText: { ...type.small, color: colors.ink, flex: 1 },
  node: { flexDirection: 'row', alignItems: 'center', gap: space.sm, minHeight: TOUCH_MIN },
  nodeTexts: { flex: 1 },
  open: { minHeight: TOUCH_MIN, justifyContent: 'center' },
  name: { ...type.body, fontSize: 16, fontFamily: fonts.textBold },
  linkText: { color: colors.accent, textDecorationLine: 'underline' },
  code: { fontFamily: fonts.mono, fontSize: 14 },
  notes: { ...type.small },
  bad: { color: colors.bad },
  fold: { minWidth: TOUCH_MIN, minHeight: TOUCH_MIN, alignItems: 'center', justifyContent: 'center', borderWidth: 2, borderColor: colors.accent, borderRadius: radius.md, paddingHorizontal: space.xs },
  foldText: { fontFamily: fonts.monoBold, fontSize: 15, color: colors.accent },
  pressed: { backgroundColor: colors.accentSoft },
});

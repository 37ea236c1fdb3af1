/**
 * The chain of one carriage, upstream to its origins or downstream to all it
 * feeds: the tree drawing (scrolls sideways on a phone, can be shrunk), a
 * legend one tap away, and the hop-by-hop list. Big trees open folded.
 * Downstream, the server sends the tree whole only when it is small; a big
 * one comes as counts per hop, each hop listed on request (ChainFolded).
 */
import { useRouter } from 'expo-router';
import { useCallback, useEffect, useMemo, useState } from 'react';
import { countOf, formatCount } from '@/shared/format';
import { ScrollView, StyleSheet, Text, View } from 'react-native';
import Svg, { Path, Rect } from 'react-native-svg';
import type { ChainNode } from '@/shared/schemas/analysis';
import { useChain, useChainLevels } from '@/src/api/queries/analysis';
import { Button } from '@/src/components/Button';
import { FeedLegend, type LegendMark } from '@/src/components/charts/FeedLegend';
import { Choice } from '@/src/components/Choice';
import { Section } from '@/src/components/layout/Section';
import { ErrorState, LoadingState } from '@/src/components/states';
import { useBreakpoints } from '@/src/hooks/useBreakpoints';
import { colors, radius, space, type } from '@/src/theme';
import { ChainFolded } from './ChainFolded';
import { ChainList } from './ChainList';
import { DEFAULT_SIZES, flattenChain, foldsToLevel, initialFolds, layoutChain, levelCounts, toggleFold, type LayoutSizes } from './chainLayout';
import { ChainLevels } from './ChainLevels';
import { ChainTree } from './ChainTree';

const ZOOMS = [0.5, 0.75, 1, 1.25] as const;
/** Past this many carriages, unfolding everything at once would draw more than anyone can read; fold by fold still works. */
const MAX_UNFOLD_ALL = 300;
/** The drawing holds at most this many boxes; past it the hop-by-hop list (which renders only what is on screen) carries the tree. */
const MAX_DRAWN = 150;

const box = (extra: React.ReactNode) => (
  <Svg width={40} height={22} aria-hidden accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
    {extra}
  </Svg>
);

const NODE_MARKS: LegendMark[] = [
  { key: 'origin', label: 'origin (double frame)', sample: box(<><Rect x={2} y={2} width={36} height={18} rx={3} fill="none" stroke={colors.lineStrong} strokeWidth={1.5} /><Rect x={5} y={5} width={30} height={12} rx={2} fill="none" stroke={colors.lineStrong} /></>) },
  { key: 'off', label: 'off air (dashed red frame with a cross)', sample: box(<><Rect x={2} y={2} width={36} height={18} rx={3} fill="none" stroke={colors.bad} strokeWidth={1.5} strokeDasharray="5 3" /><Path d="M24 7l8 8m0-8l-8 8" stroke={colors.bad} strokeWidth={2} /></>) },
  { key: 'loop', label: 'loop: the walk stops (dashed frame, loop mark)', sample: box(<><Rect x={2} y={2} width={36} height={18} rx={3} fill="none" stroke={colors.lineStrong} strokeWidth={1.5} strokeDasharray="5 3" /><Path d="M26 8a4 4 0 1 1-2 4" stroke={colors.warn} strokeWidth={2} fill="none" /></>) },
  { key: 'dead', label: 'dead end: no feed comes in (bar at the right)', sample: box(<><Rect x={2} y={2} width={36} height={18} rx={3} fill="none" stroke={colors.lineStrong} strokeWidth={1.5} /><Rect x={32} y={5} width={3} height={12} fill={colors.bad} /></>) },
  { key: 'repeated', label: 'shown once, where it first appears (dotted frame)', sample: box(<Rect x={2} y={2} width={36} height={18} rx={3} fill="none" stroke={colors.lineStrong} strokeWidth={1.5} strokeDasharray="2 3" />) },
];

function countNodes(n: ChainNode): number {
  return 1 + n.children.reduce((s, c) => s + countNodes(c), 0);
}

export function ChainSection({ code, direction }: { code: string; direction: 'up' | 'down' }) {
  const router = useRouter();
  const { wide } = useBreakpoints();
  // Upstream chains are short and come whole; downstream ones come folded by hop unless small.
  const whole = useChain(direction === 'up' ? code : null, direction);
  const byLevel = useChainLevels(direction === 'down' ? code : null, direction);
  const chain = direction === 'up' ? whole : byLevel;
  const folds = direction === 'down' && byLevel.data && !byLevel.data.complete ? byLevel.data : null;
  const [folded, setFolded] = useState<Set<string>>(new Set());
  const [zoom, setZoom] = useState(wide ? 2 : 1);
  const [legend, setLegend] = useState(false);
  const root = folds ? undefined : chain.data?.root;

  // A new tree (another carriage or direction, or a new network version) opens with fresh folds.
  useEffect(() => {
    if (root) setFolded(initialFolds(root, wide ? 40 : 24));
  }, [root, wide]);

  const sizes: LayoutSizes = wide ? { ...DEFAULT_SIZES, boxWidth: 220, gap: 200 } : { ...DEFAULT_SIZES, gap: 185 };
  const items = useMemo(() => (root ? flattenChain(root, folded) : []), [root, folded]);
  const drawn = items.length <= MAX_DRAWN;
  const layout = useMemo(() => (root && drawn ? layoutChain(root, folded, sizes) : null), [root, folded, drawn, sizes.boxWidth, sizes.gap]); // eslint-disable-line react-hooks/exhaustive-deps
  const levels = useMemo(() => (root ? levelCounts(root) : []), [root]);

  const setDirection = (d: 'up' | 'down') => router.setParams({ direction: d });
  const onFold = useCallback((id: string) => setFolded((f) => toggleFold(f, id)), []);
  const openTo = useCallback((depth: number) => root && setFolded(foldsToLevel(root, depth)), [root]);
  const onOpen = (carriage: string) => router.push(`/carriages/${encodeURIComponent(carriage)}?direction=${direction}`);

  let body: React.ReactNode;
  if (chain.error && !chain.data) body = <ErrorState what={`the ${direction === 'up' ? 'upstream' : 'downstream'} chain`} error={chain.error} onRetry={() => void chain.mutate()} testID="chain-error" />;
  else if (folds) body = <ChainFolded key={`${code} ${direction}`} code={code} direction={direction} levels={folds.levels} size={folds.size} />;
  else if (!root) body = <LoadingState what="the chain" testID="chain-loading" />;
  else {
    const total = countNodes(root);
    const word = direction === 'up' ? 'upstream' : 'downstream';
    const summary =
      root.children.length === 0
        ? direction === 'up'
          ? root.origin
            ? `${code} is at an origin: programme enters the network here.`
            : `${code} has no feed coming in: a dead end.`
          : `${code} feeds no other carriage.`
        : `The ${word} chain of ${code}: ${countOf(total, 'carriage')}${total > items.length ? `, ${formatCount(items.length)} shown and ${formatCount(total - items.length)} folded away` : ''}.`;
    body = (
      <>
        <Text style={styles.summary} testID="chain-summary">
          {summary}
        </Text>
        <View style={styles.tools}>
          <Button label="Smaller" variant="secondary" disabled={zoom === 0 || !layout} onPress={() => setZoom((z) => Math.max(0, z - 1))} />
          <Button label="Larger" variant="secondary" disabled={zoom === ZOOMS.length - 1 || !layout} onPress={() => setZoom((z) => Math.min(ZOOMS.length - 1, z + 1))} />
          <Button label={legend ? 'Hide legend' : 'Legend'} variant="quiet" onPress={() => setLegend((l) => !l)} testID="chain-legend-toggle" />
          {folded.size > 0 && total <= MAX_UNFOLD_ALL ? <Button label="Unfold all" variant="quiet" onPress={() => setFolded(new Set())} /> : null}
        </View>
        {legend ? <FeedLegend marks={NODE_MARKS} testID="chain-legend" /> : null}
        {levels.length > 2 ? <ChainLevels levels={levels} onOpenTo={openTo} /> : null}
        {layout ? (
          <>
            <ScrollView horizontal focusable accessibilityLabel="Chain drawing (scrolls sideways)" style={styles.scroller} contentContainerStyle={styles.scrollContent} testID="chain-scroller">
              <ChainTree layout={layout} sizes={sizes} direction={direction} zoom={ZOOMS[zoom]} summary={summary} onOpen={onOpen} onFold={onFold} />
            </ScrollView>
            <Text style={styles.hint}>Press a box to walk the chain from that carriage; the round button folds or unfolds what hangs from it. Warnings come from the feed screening checks.</Text>
          </>
        ) : (
          <Text style={styles.hint} testID="chain-not-drawn">{`${formatCount(items.length)} carriages are unfolded: more than the drawing holds (${MAX_DRAWN}). The list below has every one of them; fold some, or open fewer hops, to draw the tree.`}</Text>
        )}
        <Section title="Hop by hop" testID="chain-hops">
          <ChainList items={items} direction={direction} onFold={onFold} />
        </Section>
      </>
    );
  }

  return (
    <Section title="Chain" note={direction === 'up' ? 'Upstream: where the programme comes from, back to the origins.' : 'Downstream: every carriage that takes its programme from this one.'} testID="chain-section">
      <Choice
        label="Direction"
        options={[
          { value: 'up', label: 'Upstream' },
          { value: 'down', label: 'Downstream' },
        ]}
        value={direction}
        onChange={setDirection}
        testID="chain-direction"
      />
      {body}
    </Section>
  );
}

const styles = StyleSheet.create({
  summary: { ...type.body },
  tools: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  scroller: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, backgroundColor: colors.canvas },
  scrollContent: { padding: space.xs },
  hint: { ...type.small },
});

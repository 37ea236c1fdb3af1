/**
 * The chain drawn as a tree (react-native-svg): one box per carriage, one
 * elbow line per feed with its medium and role in pattern and words, its
 * distance, whether it carries programme, and how many screening warnings
 * it has. A node's shape says what stops the walk there: origin (double
 * frame), loop (loop mark), dead end (end bar), shown elsewhere (dotted
 * frame), off air (dashed frame with a cross).
 *
 * Pressing a box re-roots the tree on that carriage; the round button at a
 * box's right folds or unfolds what hangs from it. The same actions are in
 * the text list under the drawing (ChainList), which screen readers use.
 */
import { Circle, G, Path, Rect, Svg, Text as SvgText } from 'react-native-svg';
import { feedStrokes, MEDIUM_LABEL } from '@/src/components/charts/feedStyle';
import { formatKm } from '@/shared/format';
import { feedRoleWord } from '@/shared/words';
import { colors, fonts } from '@/src/theme';
import type { ChainLayout, LayoutSizes, PlacedLink, PlacedNode } from './chainLayout';

const BOX_GAP = 20;
const TRUNK = 18;

function clip(text: string, maxChars: number): string {
  return text.length <= maxChars ? text : `${text.slice(0, Math.max(1, maxChars - 1))}…`;
}

function statusWord(n: PlacedNode['item']['node']): string {
  if (n.loop) return 'loop: walk stops';
  if (n.deadEnd) return 'dead end: no feed in';
  if (n.repeated) return 'shown once, elsewhere';
  if (n.origin) return n.onAir ? 'origin, on air' : 'origin, off air';
  return n.onAir ? 'on air' : 'off air';
}

function NodeBox({ placed, sizes, isRoot, onOpen, onFold }: { placed: PlacedNode; sizes: LayoutSizes; isRoot: boolean; onOpen: () => void; onFold: () => void }) {
  const { item, x, y } = placed;
  const n = item.node;
  const h = sizes.rowHeight - BOX_GAP;
  const top = y - h / 2;
  const w = sizes.boxWidth;
  const chars = Math.floor((w - 20) / 8);
  const border = !n.onAir ? colors.bad : isRoot ? colors.accent : colors.lineStrong;
  const dash = n.repeated ? '2 3' : !n.onAir || n.loop ? '7 4' : undefined;
  return (
    <G>
      <G onPress={isRoot ? undefined : onOpen}>
        <Rect x={x} y={top} width={w} height={h} rx={8} fill={colors.surface} stroke={border} strokeWidth={isRoot ? 3 : 1.5} strokeDasharray={dash} />
        {n.origin ? <Rect x={x + 4} y={top + 4} width={w - 8} height={h - 8} rx={5} fill="none" stroke={border} strokeWidth={1.2} /> : null}
        {n.deadEnd ? <Rect x={x + w - 7} y={top + 6} width={4} height={h - 12} fill={colors.bad} /> : null}
        {n.loop ? (
          <Path d={`M${x + w - 26} ${top + 14} a7 7 0 1 1 -3 6 m0 0 l-3 -3 m3 3 l4 -1`} stroke={colors.warn} strokeWidth={2} fill="none" strokeLinecap="round" />
        ) : null}
        {!n.onAir ? <Path d={`M${x + w - 24} ${top + h - 22} l10 10 m0 -10 l-10 10`} stroke={colors.bad} strokeWidth={2.2} strokeLinecap="round" /> : null}
        <SvgText x={x + 12} y={top + 22} fontFamily={fonts.textBold} fontSize={15} fill={colors.ink}>
          {clip(n.siteName, chars)}
        </SvgText>
        <SvgText x={x + 12} y={top + 41} fontFamily={fonts.mono} fontSize={13} fill={colors.ink}>
          {clip(n.carriage, chars)}
        </SvgText>
        <SvgText x={x + 12} y={top + 60} fontFamily={fonts.text} fontSize={13} fill={n.onAir ? colors.inkMuted : colors.bad}>
          {clip(statusWord(n), chars + 2)}
        </SvgText>
      </G>
      {item.childCount > 0 ? (
        <G onPress={onFold}>
          {/* A 44 px target around a 26 px disc. */}
          <Rect x={x + w - 4} y={y - 22} width={44} height={44} fill="transparent" />
          <Circle cx={x + w + 14} cy={y} r={13} fill={item.folded ? colors.accent : colors.surface} stroke={colors.accent} strokeWidth={2} />
          <SvgText x={x + w + 14} y={y + 5} textAnchor="middle" fontFamily={fonts.monoBold} fontSize={item.folded && item.hiddenCount > 9 ? 10 : 14} fill={item.folded ? colors.accentInk : colors.accent}>
            {item.folded ? `+${item.hiddenCount > 99 ? '99' : item.hiddenCount}` : '−'}
          </SvgText>
        </G>
      ) : null}
    </G>
  );
}

function FeedLink({ link, direction }: { link: PlacedLink; direction: 'up' | 'down' }) {
  const via = link.child.node.via;
  if (!via) return null;
  const trunkX = link.x0 + TRUNK + 14;
  const d = `M${link.x0 + 28} ${link.y0} H${trunkX} V${link.y1} H${link.x1}`;
  const layers = feedStrokes(via.medium, via.role, 1.2, colors.canvas);
  const labelX = trunkX + 6;
  // Programme flows toward the root upstream, away from it downstream.
  const arrow =
    direction === 'down'
      ? `M${link.x1 - 9} ${link.y1 - 5} L${link.x1 - 1} ${link.y1} L${link.x1 - 9} ${link.y1 + 5}`
      : `M${trunkX + 9} ${link.y1 - 5} L${trunkX + 1} ${link.y1} L${trunkX + 9} ${link.y1 + 5}`;
  const warn = via.warnings.length;
  return (
    <G>
      {layers.map((l, i) => (
        <Path key={i} d={d} stroke={l.stroke} strokeWidth={l.width} strokeDasharray={l.dash} fill="none" />
      ))}
      <Path d={arrow} stroke={colors.ink} strokeWidth={1.8} fill="none" strokeLinejoin="round" />
      <SvgText x={labelX} y={link.y1 - 9} fontFamily={fonts.text} fontSize={12} fill={colors.ink}>
        {`${MEDIUM_LABEL[via.medium]}, ${feedRoleWord(via.role)}`}
      </SvgText>
      {/* The proportional face: in the mono face this line ran under the next box on a phone. */}
      <SvgText x={labelX} y={link.y1 + 18} fontFamily={fonts.text} fontSize={11} fill={via.up ? colors.inkMuted : colors.bad}>
        {`${formatKm(via.distanceKm)}, ${via.up ? 'carries programme' : 'no programme'}`}
      </SvgText>
      {warn > 0 ? (
        <G>
          <Path d={`M${labelX} ${link.y1 + 36} l6 -11 l6 11 z`} stroke={colors.warn} strokeWidth={1.5} fill={colors.warnSoft} strokeLinejoin="round" />
          <SvgText x={labelX + 16} y={link.y1 + 35} fontFamily={fonts.textBold} fontSize={11} fill={colors.warn}>
            {`${warn} warning${warn === 1 ? '' : 's'}`}
          </SvgText>
        </G>
      ) : null}
    </G>
  );
}

export interface ChainTreeProps {
  layout: ChainLayout;
  sizes: LayoutSizes;
  direction: 'up' | 'down';
  zoom: number;
  summary: string;
  onOpen: (carriage: string) => void;
  onFold: (id: string) => void;
}

export function ChainTree({ layout, sizes, direction, zoom, summary, onOpen, onFold }: ChainTreeProps) {
  const width = layout.width + 44;
  return (
    <Svg
      width={width * zoom}
      height={layout.height * zoom}
      viewBox={`0 0 ${width} ${layout.height}`}
      accessibilityRole="image"
      accessibilityLabel={summary}
      testID="chain-tree"
    >
      <Rect x={0} y={0} width={width} height={layout.height} fill={colors.canvas} />
      {layout.links.map((l) => (
        <FeedLink key={l.child.id} link={l} direction={direction} />
      ))}
      {layout.nodes.map((p) => (
        <NodeBox key={p.item.id} placed={p} sizes={sizes} isRoot={p.item.depth === 0} onOpen={() => onOpen(p.item.node.carriage)} onFold={() => onFold(p.item.id)} />
      ))}
    </Svg>
  );
}

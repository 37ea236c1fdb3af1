/**
 * The schematic view: one service's tree from its origins down
 * (./schematicModel.ts), in a box that scrolls both ways on a phone and a
 * wide screen. Lines and role shapes are one SVG of a few paths; each node's
 * name is a real button (tap: the site's card) and each folded count another
 * (tap: show or hide the relays below), so what is drawn is also a list a
 * screen reader and the tests can walk. Only the rows near the scrolled
 * window are placed, so a tree of thousands stays light.
 * The failure overlay: off air is a cross and the words "off air", on
 * reserve a half-filled ring and "on reserve"; a folded count says how many
 * of its relays are off air.
 */
import { useEffect, useMemo, useState } from 'react';
import { Pressable, ScrollView, StyleSheet, Text, View, type NativeScrollEvent, type NativeSyntheticEvent } from 'react-native';
import Svg, { Path } from 'react-native-svg';
import { countOf, formatCount } from '@/shared/format';
import { colors, fonts, space, type } from '@/src/theme';
import type { SiteStatus } from './diagramModel';
import { SvgOff, SvgReserve, SvgRole } from './diagramMarks';
import { crossShape, halfShape, ringShape, siteShape } from './diagramPaths';
import { FAIL_MARK, ROLE_PAINT_ORDER } from './markStyle';
import { recording } from '@/src/testHooks';
import { branchMarks, buildSchematic, layoutSchematic, ROW_PX, ROW_TEXT_PX, type SchematicSource } from './schematicModel';

const PAD = 16;
const MARK_R = 6;
/** Rows placed beyond the scrolled window, each way. */
const OVERSCAN_PX = 600;

interface SchematicHook {
  service: string;
  nodes: number;
  placed: { carriage: string; site: string; role: string; leaf: boolean; status: SiteStatus | 'on-air'; relays: number; relaysOff: number }[];
}

declare global {
  interface Window {
    __headwaterSchematic?: SchematicHook;
  }
}

const STATUS_WORD: Record<SiteStatus, string> = { 'off-air': 'off air', 'on-reserve': 'on reserve' };
const ROLE_WORD = { origin: 'Origin', main: 'Main station', relay: 'Relay' } as const;

export function SchematicView({ doc, service, statuses, height, onChoose }: { doc: SchematicSource; service: string; statuses: ReadonlyMap<string, SiteStatus>; height: number; onChoose: (site: string) => void }) {
  const t = useMemo(() => buildSchematic(doc, service), [doc, service]);
  const [open, setOpen] = useState<ReadonlySet<string>>(new Set());
  useEffect(() => setOpen(new Set()), [t]);
  const laid = useMemo(() => layoutSchematic(t, open), [t, open]);
  const [scrollY, setScrollY] = useState(0);
  const onScroll = (e: NativeSyntheticEvent<NativeScrollEvent>) => setScrollY(e.nativeEvent.contentOffset.y);

  const y0 = scrollY - OVERSCAN_PX;
  const y1 = scrollY + height + OVERSCAN_PX;
  // Rows are evenly spaced, so the rows near the window are an index range.
  const first = Math.max(0, Math.floor((y0 - PAD) / ROW_PX));
  const last = Math.min(laid.nodes.length - 1, Math.ceil((y1 - PAD) / ROW_PX));
  const rowOf = useMemo(() => new Map(laid.nodes.map((n, i) => [n, i])), [laid]);
  const visible: number[] = [];
  for (let i = first; i <= last; i++) visible.push(i);
  const drawn = useMemo(() => {
    const edges: string[] = [];
    const leafEdges: string[] = [];
    const marks = { origin: [] as string[], main: [] as string[], relay: [] as string[] };
    const cross: string[] = [];
    const ring: string[] = [];
    const half: string[] = [];
    laid.nodes.forEach((n, i) => {
      const x = laid.x[i] + PAD + MARK_R;
      const y = laid.y[i] + PAD + ROW_PX / 2;
      const p = n.parent && n.parent.depth > 0 ? rowOf.get(n.parent) : undefined;
      if (p !== undefined) {
        const py = laid.y[p] + PAD + ROW_PX / 2;
        if (Math.max(py, y) >= y0 && Math.min(py, y) <= y1) {
          const px = laid.x[p] + PAD + MARK_R;
          // An elbow: down from the parent's mark, then across to the child.
          (n.data.leaf ? leafEdges : edges).push(`M${px} ${py + MARK_R}V${y}H${x - MARK_R}`);
        }
      }
      if (y < y0 || y > y1) return;
      marks[n.data.role].push(siteShape(n.data.role, x, y, MARK_R));
      const st = statuses.get(n.data.site);
      const f = MARK_R + FAIL_MARK.gap;
      if (st === 'off-air') cross.push(crossShape(x, y, f));
      else if (st === 'on-reserve') {
        ring.push(ringShape(x, y, f));
        half.push(halfShape(x, y, f));
      }
    });
    return { edges: edges.join(''), leafEdges: leafEdges.join(''), marks, cross: cross.join(''), ring: ring.join(''), half: half.join('') };
  }, [laid, rowOf, statuses, y0, y1]);

  useEffect(() => {
    if (!recording()) return;
    window.__headwaterSchematic = {
      service,
      nodes: laid.nodes.length,
      placed: visible.map((i) => {
        const n = laid.nodes[i];
        const m = branchMarks(n.data, t, statuses);
        return { carriage: n.data.carriage, site: n.data.site, role: n.data.role, leaf: !!n.data.leaf, status: m.self ?? 'on-air', relays: n.data.relays.length, relaysOff: m.off };
      }),
    };
  });

  const w = laid.width + 2 * PAD;
  const h = laid.height + 2 * PAD;
  const toggle = (c: string) =>
    setOpen((o) => {
      const next = new Set(o);
      if (next.has(c)) next.delete(c);
      else next.add(c);
      return next;
    });

  let branches = 0;
  let relays = 0;
  for (const n of laid.nodes) {
    if (n.data.leaf) continue;
    branches++;
    relays += n.data.relays.length;
  }
  return (
    <View style={styles.wrap} testID="network-schematic">
      <Text style={styles.small} testID="network-schematic-summary">
        {`Service ${service}: ${countOf(t.carriages, 'carriage')} in ${countOf(t.roots.length, 'tree')}, from the origins down. ${countOf(branches, 'origin or main station')} drawn as branches, ${countOf(relays, 'relay')} folded beneath them (press a count to show them).${t.unfedRoots > 0 ? ` ${countOf(t.unfedRoots, 'tree')} start at a carriage with no main feed and no origin.` : ''}`}
      </Text>
      <ScrollView style={[styles.box, { height }]} onScroll={onScroll} scrollEventThrottle={32} nestedScrollEnabled testID="network-schematic-scroll">
        <ScrollView horizontal nestedScrollEnabled showsHorizontalScrollIndicator>
          <View style={{ width: w, height: h }}>
            <Svg width={w} height={h} style={StyleSheet.absoluteFill} aria-hidden accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
              {drawn.leafEdges ? <Path d={drawn.leafEdges} stroke={colors.lineStrong} strokeWidth={1} fill="none" /> : null}
              {drawn.edges ? <Path d={drawn.edges} stroke={colors.ink} strokeWidth={2} fill="none" /> : null}
              <SvgReserve ring={drawn.ring} half={drawn.half} />
              {ROLE_PAINT_ORDER.map((role) => (
                <SvgRole key={role} role={role} d={drawn.marks[role].join('')} />
              ))}
              <SvgOff d={drawn.cross} />
            </Svg>
            {visible.map((i) => {
              const n = laid.nodes[i];
              const m = branchMarks(n.data, t, statuses);
              const word = m.self ? `, ${STATUS_WORD[m.self]}` : '';
              const left = laid.x[i] + PAD + 2 * MARK_R + 8;
              const top = laid.y[i] + PAD;
              return (
                <View key={n.data.carriage} style={[styles.row, { left, top, width: ROW_TEXT_PX - 2 * MARK_R - 8 }]}>
                  <Pressable
                    accessibilityRole="button"
                    accessibilityLabel={`${ROLE_WORD[n.data.role]} ${n.data.siteName}, carriage ${n.data.carriage}${word}`}
                    onPress={() => onChoose(n.data.site)}
                    style={({ pressed }) => [styles.name, pressed && styles.pressed]}
                    testID={`schematic-node-${n.data.carriage}`}
                  >
                    <Text style={styles.nameText} numberOfLines={1}>
                      {n.data.siteName}
                    </Text>
                    <Text style={[styles.small, m.self === 'off-air' && styles.offText]} numberOfLines={1}>
                      {`${n.data.carriage}${word}`}
                    </Text>
                  </Pressable>
                  {n.data.relays.length > 0 ? (
                    <Pressable
                      accessibilityRole="button"
                      accessibilityLabel={`${open.has(n.data.carriage) ? 'Hide' : 'Show'} ${countOf(n.data.relays.length, 'relay')} below ${n.data.siteName}${m.off > 0 ? `, ${formatCount(m.off)} off air` : ''}`}
                      aria-expanded={open.has(n.data.carriage)}
                      onPress={() => toggle(n.data.carriage)}
                      style={({ pressed }) => [styles.count, pressed && styles.pressed]}
                      testID={`schematic-fold-${n.data.carriage}`}
                    >
                      <Text style={styles.countText}>{`${open.has(n.data.carriage) ? '−' : '+'}${formatCount(n.data.relays.length)}`}</Text>
                      {m.off > 0 ? <Text style={[styles.small, styles.offText]}>{`${formatCount(m.off)} off`}</Text> : null}
                    </Pressable>
                  ) : null}
                </View>
              );
            })}
          </View>
        </ScrollView>
      </ScrollView>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  box: { borderWidth: 1, borderColor: colors.line, borderRadius: 8, backgroundColor: colors.surface },
  row: { position: 'absolute', height: ROW_PX, flexDirection: 'row', alignItems: 'center', gap: 4 },
  name: { flex: 1, minHeight: 44, justifyContent: 'center', paddingHorizontal: 4, borderRadius: 4 },
  nameText: { fontFamily: fonts.text, fontSize: 14, color: colors.ink },
  count: { minWidth: 52, minHeight: 44, alignItems: 'center', justifyContent: 'center', borderWidth: 1, borderColor: colors.accent, borderRadius: 6, paddingHorizontal: 4, backgroundColor: colors.surface },
  countText: { fontFamily: fonts.mono, fontSize: 13, color: colors.accent },
  pressed: { backgroundColor: colors.accentSoft },
  small: { ...type.small },
  offText: { color: colors.bad },
});

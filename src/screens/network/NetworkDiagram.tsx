/**
 * The network drawn by position: sites as role shapes, feeds as lines whose
 * pattern says medium and role, failure marks over the sites. Pan by
 * dragging, zoom with the wheel, a pinch, or the buttons; tap a site to
 * choose it. Only what is on screen is drawn, in a dozen paths in all
 * (./diagramPaths.ts), so a network of thousands of sites stays smooth.
 * Main and reserve feeds differ by line at every density (a single line and
 * a double line); a distance scale, true at the centre, follows the zoom.
 */
import { memo, useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { PanResponder, Platform, StyleSheet, Text, View, type GestureResponderEvent, type ViewStyle } from 'react-native';
import type { GeoProjection } from 'd3-geo';
import type { SiteRole } from '@/shared/schemas/network';
import Svg, { Circle, G, Path, Rect, Text as SvgText } from 'react-native-svg';
import { feedStrokes, MEDIUM_ORDER, ROLE_ORDER } from '@/src/components/charts/feedStyle';
import { colors, fonts, space, type } from '@/src/theme';
import type { DiagramModel, PlacedDiagram, SiteStatus } from './diagramModel';
import { crossShape, halfShape, linkPaths, ringShape, siteShape } from './diagramPaths';
import { plainStrokes } from './denseLines';
import { SvgOff, SvgReserve, SvgRole } from './diagramMarks';
import { FAIL_MARK, ROLE_PAINT_ORDER, SELECTED_RING, SITE_R } from './markStyle';
import { scaleBar } from './scaleBar';
import { cullPoints, cullSegments, gestureTransform, nearestPoint, panBy, showLabels, showPatterns, visibleWorld, zoomAt, type View as ViewT } from './viewport';
import { GeoCanvas } from './GeoCanvas';
import type { FramePlan } from './framePlan';
import { buildLodIndex, MAX_LEVEL } from './lod';

/** The web draws on a canvas with level of detail; native keeps the SVG drawing. */
const CANVAS = Platform.OS === 'web' && typeof document !== 'undefined';
/** A tap on a group zooms in by this much about it. */
const GROUP_TAP_ZOOM = 2.5;

export interface DrawnCounts {
  /** Sites and feed lines on screen. */
  sites: number;
  links: number;
  labels: boolean;
  /** False when lines are drawn plain because too many are in view. */
  patterns: boolean;
  /** Groups of nearby sites drawn as one circle (the canvas drawing's level of detail), and the sites in them. */
  groups?: number;
  sitesInGroups?: number;
}

export interface NetworkDiagramProps {
  model: DiagramModel;
  placed: PlacedDiagram;
  width: number;
  height: number;
  view: ViewT;
  onView: (v: ViewT) => void;
  statuses: ReadonlyMap<string, SiteStatus>;
  selected: number | null;
  onSelect: (index: number | null) => void;
  onDrawn: (counts: DrawnCounts, inView: number[]) => void;
  /** Land outline in diagram px at zoom 1 (optional). */
  land?: string | null;
  /** The projection that placed the sites: gives the distance scale. */
  projection?: GeoProjection | null;
  summary: string;
}

const TAP_SLOP = 6;
const TAP_RADIUS = 22;

function Drawing({ model, placed, width, height, view, statuses, selected, land, onDrawn }: Omit<NetworkDiagramProps, 'onView' | 'onSelect' | 'summary' | 'projection'>) {
  const { xs, ys, linkFrom, linkTo } = placed;
  const drawn = useMemo(() => {
    // Drawn a third of the box beyond each edge, so a pan shows content before the redraw.
    const rect = visibleWorld(view, width, height, Math.max(width, height) / 3);
    const onScreen = visibleWorld(view, width, height, 8);
    const siteIdx = cullPoints(xs, ys, rect);
    const linkIdx = cullSegments(xs, ys, linkFrom, linkTo, rect, view.k, 1);
    const inView = cullPoints(xs, ys, onScreen);
    const linksInView = cullSegments(xs, ys, linkFrom, linkTo, onScreen, view.k, 1).length;
    const margin = Math.max(width, height) / 3;
    const paths = linkPaths(xs, ys, model.links, linkIdx, view, { x0: -margin, y0: -margin, x1: width + margin, y1: height + margin });
    const grow = Math.min(2, 1 + Math.log2(view.k) / 4);
    const byRole: Record<SiteRole, string[]> = { origin: [], main: [], relay: [] };
    const cross: string[] = [];
    const ring: string[] = [];
    const half: string[] = [];
    for (const i of siteIdx) {
      const s = model.sites[i];
      const x = xs[i] * view.k + view.tx;
      const y = ys[i] * view.k + view.ty;
      const r = SITE_R[s.role] * grow;
      byRole[s.role].push(siteShape(s.role, x, y, r));
      const st = statuses.get(s.code);
      const f = r + FAIL_MARK.gap;
      if (st === 'off-air') cross.push(crossShape(x, y, f));
      else if (st === 'on-reserve') {
        ring.push(ringShape(x, y, f));
        half.push(halfShape(x, y, f));
      }
    }
    const labels = showLabels(inView.length, width, height);
    const patterns = showPatterns(linkIdx.length);
    return { siteIdx, inView, linksInView, linkIdx, paths, patterns, byRole: { origin: byRole.origin.join(''), main: byRole.main.join(''), relay: byRole.relay.join('') }, cross: cross.join(''), ring: ring.join(''), half: half.join(''), labels, grow };
  }, [xs, ys, linkFrom, linkTo, model, view, width, height, statuses]);

  useEffect(() => {
    onDrawn({ sites: drawn.inView.length, links: drawn.linksInView, labels: drawn.labels, patterns: drawn.patterns }, drawn.inView);
  }, [drawn, onDrawn]);

  return (
    <Svg width={width} height={height} aria-hidden accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
      <Rect x={0} y={0} width={width} height={height} fill={colors.surface} />
      {land ? <Path d={land} transform={`translate(${view.tx} ${view.ty}) scale(${view.k})`} fill={colors.sunken} stroke={colors.line} strokeWidth={1} vectorEffect="non-scaling-stroke" testID="network-land" /> : null}
      {ROLE_ORDER.flatMap((role) =>
        MEDIUM_ORDER.map((medium) => {
          const d = drawn.paths.get(`${medium}|${role}`);
          if (!d) return null;
          if (!drawn.patterns) return plainStrokes(role).map((l, i) => <Path key={`${medium}|${role}|${i}`} d={d} stroke={l.stroke} strokeWidth={l.width} fill="none" />);
          return feedStrokes(medium, role, 0.8).map((l, i) => <Path key={`${medium}|${role}|${i}`} d={d} stroke={l.stroke} strokeWidth={l.width} strokeDasharray={l.dash} fill="none" />);
        }),
      )}
      <SvgReserve ring={drawn.ring} half={drawn.half} />
      {ROLE_PAINT_ORDER.map((role) => (
        <SvgRole key={role} role={role} d={drawn.byRole[role]} />
      ))}
      <SvgOff d={drawn.cross} />
      {selected !== null && selected < xs.length ? (
        <Circle cx={xs[selected] * view.k + view.tx} cy={ys[selected] * view.k + view.ty} r={SELECTED_RING.r} fill="none" stroke={SELECTED_RING.stroke} strokeWidth={SELECTED_RING.width} />
      ) : null}
      {drawn.labels ? (
        <G>
          {/* A white halo under each name keeps it readable over lines (stroke copy first, then the fill). */}
          {(['halo', 'ink'] as const).map((layer) =>
            drawn.inView.map((i) => (
              <SvgText
                key={`${layer}-${model.sites[i].code}`}
                x={xs[i] * view.k + view.tx + 9 * drawn.grow}
                y={ys[i] * view.k + view.ty + 4}
                fontFamily={fonts.text}
                fontSize={12}
                fill={layer === 'ink' ? colors.ink : colors.surface}
                stroke={layer === 'halo' ? colors.surface : undefined}
                strokeWidth={layer === 'halo' ? 3 : undefined}
              >
                {model.sites[i].name}
              </SvgText>
            )),
          )}
        </G>
      ) : null}
    </Svg>
  );
}

const MemoDrawing = memo(Drawing);

type Point = { x: number; y: number };
const touchesOf = (e: GestureResponderEvent): Point[] => (e.nativeEvent.touches ?? []).map((t) => ({ x: t.pageX, y: t.pageY }));

const WHEEL_SETTLE_MS = 180;

export function NetworkDiagram(props: NetworkDiagramProps) {
  const { width, height, view, onView, onSelect, placed, summary } = props;
  const box = useRef<View>(null);
  const origin = useRef<Point>({ x: 0, y: 0 });
  // While a gesture runs, `live` is where it has got to: the drawn picture is
  // moved and scaled to match, and redrawn once when the gesture ends.
  const [live, setLiveState] = useState<ViewT | null>(null);
  const liveRef = useRef<ViewT | null>(null);
  const setLive = (v: ViewT | null) => {
    liveRef.current = v;
    setLiveState(v);
  };
  const start = useRef<{ view: ViewT; pinch: number | null; moved: boolean }>({ view, pinch: null, moved: false });
  const latest = useRef({ view, width, height, placed, onView, onSelect });
  latest.current = { view, width, height, placed, onView, onSelect };
  const wheelTimer = useRef<ReturnType<typeof setTimeout> | null>(null);

  // On the canvas a tap meets what the last frame drew: a group zooms in about itself, a site is chosen.
  const planRef = useRef<FramePlan | null>(null);
  const tapCanvas = (sx: number, sy: number) => {
    const { view: v, width: w, height: h, onView: setV, onSelect: choose } = latest.current;
    const plan = planRef.current;
    let best: FramePlan['marks'][number] | null = null;
    let bestD = Infinity;
    for (const m of plan?.marks ?? []) {
      const d = Math.hypot(m.x - sx, m.y - sy);
      if (d <= Math.max(TAP_RADIUS, m.r + 4) && d < bestD) {
        best = m;
        bestD = d;
      }
    }
    if (!best) choose(null);
    else if (best.role === null) setV(zoomAt(v, GROUP_TAP_ZOOM, best.x, best.y, w, h));
    else choose(best.site);
  };

  const commit = () => {
    const v = liveRef.current;
    if (v) latest.current.onView(v);
    setLive(null);
  };

  const measure = () => {
    box.current?.measureInWindow?.((x, y) => {
      origin.current = { x, y };
    });
  };
  // Where the box is on the page now. On the web it is read at once (the
  // page may have scrolled since the last measure, which answers later).
  const originNow = (): Point => {
    const node = box.current as unknown as HTMLElement | null;
    if (Platform.OS === 'web' && node && typeof node.getBoundingClientRect === 'function') {
      const r = node.getBoundingClientRect();
      return { x: r.left + window.scrollX, y: r.top + window.scrollY };
    }
    return origin.current;
  };

  const responder = useMemo(
    () =>
      PanResponder.create({
        onStartShouldSetPanResponder: () => true,
        onMoveShouldSetPanResponder: () => true,
        onPanResponderGrant: (e) => {
          measure();
          origin.current = originNow();
          const t = touchesOf(e);
          start.current = { view: liveRef.current ?? latest.current.view, pinch: null, moved: false };
          if (t.length === 2) start.current.pinch = Math.hypot(t[0].x - t[1].x, t[0].y - t[1].y);
        },
        onPanResponderMove: (e, g) => {
          const { width: w, height: h } = latest.current;
          const t = touchesOf(e);
          if (t.length === 2) {
            const dist = Math.hypot(t[0].x - t[1].x, t[0].y - t[1].y);
            const mid = { x: (t[0].x + t[1].x) / 2 - origin.current.x, y: (t[0].y + t[1].y) / 2 - origin.current.y };
            if (start.current.pinch === null) {
              start.current = { view: liveRef.current ?? latest.current.view, pinch: dist, moved: true };
              return;
            }
            start.current.moved = true;
            setLive(zoomAt(start.current.view, dist / start.current.pinch, mid.x, mid.y, w, h));
            return;
          }
          if (Math.abs(g.dx) > TAP_SLOP || Math.abs(g.dy) > TAP_SLOP) start.current.moved = true;
          if (start.current.moved && start.current.pinch === null) setLive(panBy(start.current.view, g.dx, g.dy, w, h));
        },
        onPanResponderRelease: (e) => {
          if (start.current.moved) {
            commit();
            return;
          }
          const { placed: p, view: v, onSelect: choose } = latest.current;
          const at = originNow();
          const sx = e.nativeEvent.pageX - at.x;
          const sy = e.nativeEvent.pageY - at.y;
          if (CANVAS) {
            tapCanvas(sx, sy);
            return;
          }
          const all = Array.from({ length: p.xs.length }, (_, i) => i);
          const hit = nearestPoint(p.xs, p.ys, all, v, sx, sy, TAP_RADIUS);
          choose(hit >= 0 ? hit : null);
        },
        onPanResponderTerminate: () => commit(),
        onPanResponderTerminationRequest: () => false,
      }),
    [], // eslint-disable-line react-hooks/exhaustive-deps
  );

  // The wheel zooms about the pointer (web only; the page must not scroll
  // meanwhile), redrawing once the wheel has been still for a moment.
  useEffect(() => {
    if (Platform.OS !== 'web') return;
    const node = box.current as unknown as HTMLElement | null;
    if (!node || typeof node.addEventListener !== 'function') return;
    const onWheel = (ev: WheelEvent) => {
      ev.preventDefault();
      const r = node.getBoundingClientRect();
      const { view: v, width: w, height: h } = latest.current;
      setLive(zoomAt(liveRef.current ?? v, Math.exp(-ev.deltaY * 0.0015), ev.clientX - r.left, ev.clientY - r.top, w, h));
      if (wheelTimer.current) clearTimeout(wheelTimer.current);
      wheelTimer.current = setTimeout(commit, WHEEL_SETTLE_MS);
    };
    node.addEventListener('wheel', onWheel, { passive: false });
    return () => {
      node.removeEventListener('wheel', onWheel);
      if (wheelTimer.current) clearTimeout(wheelTimer.current);
    };
  }, []); // eslint-disable-line react-hooks/exhaustive-deps

  const lod = useMemo(() => (CANVAS ? buildLodIndex(props.model, placed) : null), [props.model, placed]);
  const siteIndex = useMemo(() => new Map(props.model.sites.map((s, i) => [s.code, i])), [props.model]);
  // Every level is built once, one per idle turn after the first draw, so no zoom later waits for one.
  useEffect(() => {
    if (!lod) return;
    let next = 0;
    let timer: ReturnType<typeof setTimeout> | null = null;
    const step = () => {
      if (next > MAX_LEVEL) return;
      lod.level(next++);
      timer = setTimeout(step, 0);
    };
    timer = setTimeout(step, 100);
    return () => {
      if (timer) clearTimeout(timer);
    };
  }, [lod]);
  const { onDrawn } = props;
  const onCanvasDrawn = useCallback(
    (plan: FramePlan) => {
      const inView = cullPoints(placed.xs, placed.ys, visibleWorld(view, width, height, 8));
      const links = cullSegments(placed.xs, placed.ys, placed.linkFrom, placed.linkTo, visibleWorld(view, width, height, 8), view.k, 1).length;
      onDrawn({ sites: inView.length, links, labels: true, patterns: plan.patterns, groups: plan.counts.groups, sitesInGroups: plan.counts.sitesInGroups }, inView);
    },
    [placed, view, width, height, onDrawn],
  );
  const t = live && !CANVAS ? gestureTransform(view, live) : null;
  const scale = props.projection ? scaleBar(props.projection, live ?? view, width, height, Math.min(140, width / 3)) : null;
  return (
    <View
      ref={box}
      style={[styles.box, webGestures, { width, height }]}
      testID="network-diagram"
      accessibilityRole="image"
      accessibilityLabel={summary}
      onLayout={measure}
      {...responder.panHandlers}
    >
      {CANVAS && lod ? (
        <GeoCanvas
          model={props.model}
          lod={lod}
          siteIndex={siteIndex}
          width={width}
          height={height}
          view={live ?? view}
          gesture={live !== null}
          statuses={props.statuses}
          land={props.land ?? null}
          selected={props.selected}
          xs={placed.xs}
          ys={placed.ys}
          planRef={planRef}
          onDrawn={onCanvasDrawn}
        />
      ) : (
        <View style={[styles.moving, webLayer, t ? { transform: [{ translateX: t.dx }, { translateY: t.dy }, { scale: t.s }] } : null]}>
          <MemoDrawing {...drawingProps(props)} />
        </View>
      )}
      {/* Presses land on this plain view: the responder system does not see through SVG elements on the web. */}
      <View style={StyleSheet.absoluteFill} />
      {scale ? (
        <View style={styles.scale} pointerEvents="none" testID="network-scale" accessibilityLabel={`Scale: the bar is ${scale.label}`}>
          <View style={[styles.scaleBar, { width: Math.round(scale.px) }]} />
          <Text style={styles.scaleText}>{scale.label}</Text>
        </View>
      ) : null}
    </View>
  );
}

function drawingProps({ onView: _v, onSelect: _s, summary: _m, projection: _p, ...rest }: NetworkDiagramProps) {
  return rest;
}

// The browser must leave drags and pinches on the diagram to us (no page scroll or zoom).
const webGestures = Platform.OS === 'web' ? ({ touchAction: 'none', cursor: 'grab' } as unknown as ViewStyle) : null;
// Its own compositing layer, so moving the drawn picture during a gesture does not repaint it.
const webLayer = Platform.OS === 'web' ? ({ willChange: 'transform' } as unknown as ViewStyle) : null;

const styles = StyleSheet.create({
  box: { overflow: 'hidden', borderRadius: 8 },
  moving: { transformOrigin: 'top left' },
  scale: { position: 'absolute', left: space.sm, bottom: space.sm, paddingHorizontal: space.xs, paddingVertical: 2, borderRadius: 4, backgroundColor: 'rgba(255,255,255,0.85)' },
  // A bar with end ticks: a bottom edge and two short sides.
  scaleBar: { height: 6, borderColor: colors.ink, borderBottomWidth: 2, borderLeftWidth: 2, borderRightWidth: 2 },
  scaleText: { ...type.small, color: colors.ink, fontFamily: fonts.text, marginTop: 2, paddingLeft: 4 },
});

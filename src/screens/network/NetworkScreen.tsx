/**
 * The network at a glance (docs/screens.md, Network): sites placed by position,
 * feeds between them, a service filter (?service=CODE), pan and zoom, and a
 * failure set overlaid (?fail=..., the same as on the reach screen).
 */
import { useRouter } from 'expo-router';
import { useCallback, useEffect, useMemo, useState } from 'react';
import { StyleSheet, Text, useWindowDimensions, View } from 'react-native';
import { useSend } from '@/src/api/ApiProvider';
import { useReach } from '@/src/api/queries/analysis';
import { askReachAhead } from '@/src/api/queries/reachAhead';
import { useDiagramDrawing } from '@/src/api/queries/networkDrawing';
import { Button } from '@/src/components/Button';
import { FeedLegend } from '@/src/components/charts/FeedLegend';
import { countOf, formatCount } from '@/shared/format';
import { Screen } from '@/src/components/layout/Screen';
import { EmptyState, ErrorState, LoadingState } from '@/src/components/states';
import { useBreakpoints } from '@/src/hooks/useBreakpoints';
import { formatFailSet, parseFailSet } from '@/src/screens/reach/failSet';
import { LinkRow } from '@/src/screens/reach/LinkRow';
import { colors, space, type } from '@/src/theme';
import { expandDrawing } from '@/shared/schemas/drawing';
import { buildDiagram, placeDiagram, siteStatuses } from './diagramModel';
import { DIAGRAM_MARKS } from './diagramMarks';
import { DEMO_COAST_CORNERS, LAND_CREDIT, landGeometry, landKindFor, landPath } from './landOutline';
import { NetworkDiagram, type DrawnCounts } from './NetworkDiagram';
import { networkHref, type DiagramMode } from './networkHref';
import { SchematicView } from './SchematicView';
import { ViewSwitch } from './ViewSwitch';
import { ServiceFilter } from './ServiceFilter';
import { SitesInView } from './SitesInView';
import { SiteCard } from './SiteCard';
import { SiteSheet } from './SiteSheet';
import { IDENTITY, zoomAt, type View as ViewT } from './viewport';
import { rememberDiagramWidth, rememberedDiagramWidth } from './widthHint';
import { compareCodes } from '@/shared/schemas/network';

const NO_PLACES: readonly { code: string; lat: number; lon: number }[] = [];

export function NetworkScreen({ service, failParam, mode = 'map' }: { service: string | null; failParam: string | string[] | undefined; mode?: DiagramMode }) {
  const router = useRouter();
  const { wide } = useBreakpoints();
  const win = useWindowDimensions();
  const drawing = useDiagramDrawing();
  const failed = useMemo(() => parseFailSet(failParam).elements, [failParam]);
  const failText = formatFailSet(failed);
  const reach = useReach(failed, failText);
  const send = useSend();

  // The box's width: remembered from the last visit in a window this wide (./widthHint.ts), then measured.
  const [width, setWidth] = useState(() => rememberedDiagramWidth(win.width));
  const measured = useCallback(
    (w: number) => {
      setWidth(w);
      rememberDiagramWidth(win.width, w);
    },
    [win.width],
  );
  // Fixed once per layout kind: a phone browser's window grows and shrinks
  // as its address bar slides, and the picture must not re-fit under a finger.
  const height = useMemo(
    () => Math.round(wide ? Math.max(420, Math.min(720, win.height - 240)) : Math.max(320, Math.min(560, win.height * 0.58))),
    [wide], // eslint-disable-line react-hooks/exhaustive-deps
  );
  const [view, setView] = useState<ViewT>(IDENTITY);
  const [selected, setSelected] = useState<number | null>(null);
  const [legend, setLegend] = useState(false);
  const [showLand, setShowLand] = useState(true);
  const [drawn, setDrawn] = useState<{ counts: DrawnCounts; inView: number[] }>({ counts: { sites: 0, links: 0, labels: false, patterns: true }, inView: [] });

  const schematic = mode === 'schematic';
  const knownService = !service || !drawing.data || drawing.data.services.some((s) => s.code === service);
  const model = useMemo(() => (drawing.data ? buildDiagram(drawing.data, knownService ? service : null) : null), [drawing.data, service, knownService]);
  // Rows only for the schematic (its tree reads codes); the map reads the columns.
  const rows = useMemo(() => (schematic && drawing.data ? expandDrawing(drawing.data) : null), [schematic, drawing.data]);
  const landKind = useMemo(() => landKindFor(model?.sites ?? []), [model]);
  // On the demo island the fit takes in the whole coast, so the picture shows the island entire.
  const alsoShow = landKind === 'demo' ? DEMO_COAST_CORNERS : NO_PLACES;
  const placed = useMemo(() => (model && width > 0 ? placeDiagram(model, width, height, 28, alsoShow) : null), [model, width, height, alsoShow]);
  // The schematic shows one service: the chosen one, or the first by code.
  const schematicService = service ?? (drawing.data ? ([...drawing.data.services].sort(compareCodes)[0]?.code ?? null) : null);
  const schematicStatuses = useMemo(() => siteStatuses(failed.length > 0 ? reach.data : undefined, schematicService), [reach.data, schematicService, failed.length]);
  const statuses = useMemo(() => siteStatuses(failed.length > 0 ? reach.data : undefined, service), [reach.data, service, failed.length]);
  // The fit that placed the sites: the land and the scale line up with them.
  const fit = placed?.fit ?? null;
  const land = useMemo(() => (showLand && fit ? landPath(landGeometry(landKind), fit.projection, width, height) : null), [showLand, fit, landKind, width, height]);

  // A new network or filter starts from the whole picture. (Not a new box
  // width: a scrollbar coming or going must not throw away the person's view.)
  useEffect(() => {
    setView(IDENTITY);
    setSelected(null);
  }, [model]);

  const onDrawn = useCallback((counts: DrawnCounts, inView: number[]) => setDrawn({ counts, inView }), []);
  const zoomBy = (f: number) => setView((v) => zoomAt(v, f, width / 2, height / 2, width, height));

  let statusCounts = { off: 0, reserve: 0 };
  for (const st of statuses.values()) statusCounts = st === 'off-air' ? { ...statusCounts, off: statusCounts.off + 1 } : { ...statusCounts, reserve: statusCounts.reserve + 1 };

  const summary = model
    ? `${formatCount(drawn.counts.sites)} of ${countOf(model.sites.length, 'site')} and ${formatCount(drawn.counts.links)} of ${countOf(model.links.length, 'feed line')} in view (${countOf(model.feedCount, 'feed')}).${drawn.counts.groups ? ` Nearby sites are drawn together as ${countOf(drawn.counts.groups, 'numbered circle')} holding ${countOf(drawn.counts.sitesInGroups ?? 0, 'site')}, and their feeds as one line per pair; zoom in or tap a circle to separate them.` : ''}${drawn.counts.labels ? '' : ' Zoom in to read site names.'}${drawn.counts.patterns ? '' : ' Lines are drawn without their medium’s pattern until fewer are in view (main still a single line, reserve a double line); zoom in to see each medium’s pattern.'}${failed.length > 0 ? ` Failure set: ${statusCounts.off} sites off air, ${statusCounts.reserve} on reserve.` : ''}`
    : '';

  let body: React.ReactNode;
  if (drawing.error && !drawing.data) body = <ErrorState what="the network" error={drawing.error} onRetry={() => void drawing.mutate()} testID="network-error" />;
  else if (!drawing.data || !model) {
    // Laid out at the diagram's width already, so the drawing can be placed as soon as the data is in.
    body = (
      <View style={styles.measure} onLayout={(e) => measured(Math.floor(e.nativeEvent.layout.width))}>
        <LoadingState what="the network" testID="network-loading" />
      </View>
    );
  } else if (drawing.data.sites.code.length === 0) body = <EmptyState title="The network is empty" message="There are no sites to draw yet. Add them in Inventory, or import a network document." testID="network-empty" />;
  else if (!knownService) body = <EmptyState title={`No service with code ${service}`} message="Choose a service above, or show them all." testID="network-unknown-service" />;
  else if (model.sites.length === 0) body = <EmptyState title="Nothing carries this service" message="No site has a carriage of the chosen service." testID="network-no-sites" />;
  else {
    const site = selected !== null && selected >= 0 ? (model.sites[selected] ?? null) : null;
    // The failure set with the chosen site added, in its canonical text (the overlay link's address).
    const withSite = site ? formatFailSet([...failed, { kind: 'site', code: site.code }]) : '';
    body = (
      <>
        {schematic ? null : (
          <View style={styles.tools}>
            <Button label="+" accessibilityLabel="Zoom in" variant="secondary" onPress={() => zoomBy(1.6)} testID="network-zoom-in" />
            <Button label="−" accessibilityLabel="Zoom out" variant="secondary" onPress={() => zoomBy(1 / 1.6)} testID="network-zoom-out" />
            <Button label="Fit" accessibilityLabel="Fit the whole network" variant="secondary" onPress={() => setView(IDENTITY)} />
            <Button label={legend ? 'Hide legend' : 'Legend'} variant="quiet" onPress={() => setLegend((l) => !l)} testID="network-legend-toggle" />
            <Button label={showLand ? 'Hide land' : 'Show land'} variant="quiet" onPress={() => setShowLand((s) => !s)} />
          </View>
        )}
        <View style={styles.stage}>
          {schematic && schematicService && rows ? (
            <SchematicView doc={rows} service={schematicService} statuses={schematicStatuses} height={height} onChoose={(code) => setSelected(model.sites.findIndex((s) => s.code === code))} />
          ) : (
            <View style={styles.diagramWrap} onLayout={(e) => measured(Math.floor(e.nativeEvent.layout.width))}>
              {placed && width > 0 ? (
                <NetworkDiagram
                  model={model}
                  placed={placed}
                  width={width}
                  height={height}
                  view={view}
                  onView={setView}
                  statuses={statuses}
                  selected={selected}
                  onSelect={setSelected}
                  onDrawn={onDrawn}
                  land={land}
                  projection={fit?.projection ?? null}
                  summary={summary}
                />
              ) : (
                <View style={{ height }} />
              )}
            </View>
          )}
          {site ? (
            <SiteSheet wide={wide} height={height} name={site.name}>
              <SiteCard
                site={site}
                status={statuses.get(site.code)}
                failed={failed}
                onClose={() => setSelected(null)}
                overlayHref={networkHref(service, withSite, mode)}
                // the overlay's reach is asked for as its link is pressed (reachAhead.ts)
                onOverlay={() => askReachAhead(send, withSite)}
              />
            </SiteSheet>
          ) : null}
        </View>
        {schematic ? null : (
          <Text style={styles.summary} accessibilityLiveRegion="polite" testID="network-summary">
            {summary}
          </Text>
        )}
        {showLand && !schematic ? <Text style={styles.small} testID="network-land-credit">{`Land: ${LAND_CREDIT[landKind]}.${land === '' ? ' None of it falls within this area.' : ''}`}</Text> : null}
        <Text style={styles.small}>
          {schematic
            ? 'Scroll both ways to follow the tree; tap a name for its summary, a count to show the relays below it. Lines are main feeds; a thin grey line joins a relay to the branch it hangs under, directly or through other relays.'
            : 'Drag to move, wheel or pinch to zoom, tap a site for its summary and a numbered circle to separate its sites. The scale bar is true at the centre of the view (the map stretches away from the equator).'}
        </Text>
        {legend && !schematic ? <FeedLegend marks={DIAGRAM_MARKS} testID="network-legend" /> : null}
        {schematic ? null : <SitesInView sites={model.sites} inView={drawn.inView} statuses={statuses} onChoose={setSelected} />}
      </>
    );
  }

  return (
    <Screen title="Network" subtitle="Sites by position, feeds between them." testID="network-screen">
      {drawing.data ? (
        <ServiceFilter services={drawing.data.services} value={service} onChange={(code) => router.replace(networkHref(code ?? (mode === 'schematic' ? service : null), failText, mode))} />
      ) : null}
      {drawing.data && drawing.data.services.length > 0 ? (
        <ViewSwitch
          mode={mode}
          onChange={(m) => router.replace(networkHref(m === 'schematic' ? schematicService : service, failText, m))}
        />
      ) : null}
      {failed.length > 0 ? (
        <View style={styles.failBox}>
          <LinkRow href={`/reach?fail=${failText}`} title={`Failure set: ${failed.map((e) => `${e.kind} ${e.code}`).join(', ')}`} detail={reach.data ? `${statusCounts.off} sites off air, ${statusCounts.reserve} on reserve. Open the fault reach.` : reach.error ? 'Could not compute the reach; open the fault reach for details.' : 'Working out what goes off air…'} status={statusCounts.off > 0 ? 'off-air' : 'on-reserve'} />
        </View>
      ) : null}
      {body}
    </Screen>
  );
}

const styles = StyleSheet.create({
  tools: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  stage: { position: 'relative' },
  measure: { width: '100%' },
  diagramWrap: { width: '100%', borderWidth: 1, borderColor: colors.line, borderRadius: 8, overflow: 'hidden', backgroundColor: colors.surface },
  summary: { ...type.body, fontSize: 16 },
  small: { ...type.small },
  failBox: { borderWidth: 1, borderColor: colors.line, borderRadius: 8, overflow: 'hidden' },
});

/**
 * Where are we exposed? (docs/screens.md, Resilience): elements ranked by the
 * households their failure alone takes off air, carriages whose reserve does
 * not protect them (diversity gaps), carriages with no programme at all
 * (unfed), and counts per service, with charts. Two or three columns on a
 * wide screen, one on a phone.
 */
import { useCallback, useState } from 'react';
import { StyleSheet, Text } from 'react-native';
import { useDiversity, useNamedExposure, useUnfed } from '@/src/api/queries/analysis';
import { useNetworkDrawing } from '@/src/api/queries/networkDrawing';
import { BarChart } from '@/src/components/charts/BarChart';
import { countOf, formatCount } from '@/shared/format';
import { Card } from '@/src/components/Card';
import { Columns } from '@/src/components/layout/Columns';
import { Screen } from '@/src/components/layout/Screen';
import { Section } from '@/src/components/layout/Section';
import { EmptyState, ErrorState, LoadingState } from '@/src/components/states';
import { type } from '@/src/theme';
import type { ElementNamer } from './elementNames';
import { Button } from '@/src/components/Button';
import { EXPOSURE_SHOWN, ExposurePanel } from './ExposurePanel';
import { DiversityList, UnfedList } from './GapLists';
import { GroupedExposure } from './GroupedExposure';
import { PairsPanel } from './PairsPanel';
import { PlanPanel, ProposalsList } from './ProposalsPanel';
import { ServiceTable } from './ServiceTable';

/** Gaps listed before "Show all"; the rest load when asked for. */
const DIVERSITY_FIRST = 10;

/** Counts per service need the whole network and every gap, so they load only when asked for. */
function PerService() {
  const drawing = useNetworkDrawing();
  const diversity = useDiversity();
  const unfed = useUnfed();
  return (
    <ServiceTable
      drawing={drawing.data}
      diversity={diversity.data}
      unfed={unfed.data}
      error={drawing.error ?? diversity.error ?? unfed.error}
      onRetry={() => void Promise.all([drawing.mutate(), diversity.mutate(), unfed.mutate()])}
    />
  );
}

export function ResilienceScreen() {
  // Names come with the ranking, and the gaps a first page at a time: a 20,000-site network is
  // 26 MB whole and 3 MB of gaps, too much to load on a phone before the screen answers.
  const exposure = useNamedExposure(EXPOSURE_SHOWN);
  const diversity = useDiversity(DIVERSITY_FIRST);
  const unfed = useUnfed();
  const [perService, setPerService] = useState(false);
  const names = exposure.data?.names;
  const name = useCallback<ElementNamer>((e) => names?.[`${e.kind}:${e.code}`], [names]);
  const gapCount = diversity.data ? (diversity.data.total ?? diversity.data.carriages.length) : undefined;

  const top10 = (exposure.data?.elements ?? []).slice(0, 10).map((r) => ({ key: `${r.element.kind}:${r.element.code}`, label: r.element.code, value: r.households }));

  const exposureBody = exposure.data ? (
    exposure.data.elements.length === 0 ? (
      <EmptyState title="Nothing is exposed" message="No single element's failure takes any household off air (or the network has no households recorded)." testID="exposure-empty" />
    ) : (
      <ExposurePanel rows={exposure.data.elements} networkVersion={exposure.data.networkVersion} name={name} />
    )
  ) : exposure.error ? (
    <ErrorState what="the exposure ranking" error={exposure.error} onRetry={() => void exposure.mutate()} />
  ) : (
    <LoadingState what="the exposure ranking" />
  );

  return (
    <Screen title="Resilience" subtitle="Single points of failure ranked by households, reserves that are not diverse, and carriages with no programme." testID="resilience-screen">
      <Columns max={3}>
        <Card title="Most exposed element" testID="resilience-top">
          {exposure.data && exposure.data.elements[0] ? (
            <Text style={styles.big}>{`${exposure.data.elements[0].element.kind} ${exposure.data.elements[0].element.code}: ${formatCount(exposure.data.elements[0].households)} households`}</Text>
          ) : (
            <Text style={styles.small}>{exposure.data ? 'None' : exposure.error ? 'Not available' : 'Loading…'}</Text>
          )}
        </Card>
        <Card title="Diversity gaps" testID="resilience-gap-count">
          <Text style={styles.big}>{gapCount !== undefined ? countOf(gapCount, 'carriage') : diversity.error ? 'Not available' : 'Loading…'}</Text>
        </Card>
        <Card title="Unfed carriages" testID="resilience-unfed-count">
          <Text style={styles.big}>{unfed.data ? countOf(unfed.data.carriages.length, 'carriage') : unfed.error ? 'Not available' : 'Loading…'}</Text>
        </Card>
      </Columns>

      <Section title="Exposure" note={`The ${EXPOSURE_SHOWN} elements whose failure alone takes the most households off air. The download holds the whole ranking.`} testID="resilience-exposure">
        {exposureBody}
      </Section>

      <Section title="Same loss, one row" note="Elements that take off exactly the same carriages, ranked by households; open a row to see them. Files for spreadsheets below." testID="resilience-exposure-groups">
        <GroupedExposure name={name} />
      </Section>

      <Columns max={2}>
        <Section title="Top 10 by households" testID="resilience-chart">
          {top10.length > 0 ? <BarChart title="Households off air if this element alone fails" unit="households" rows={top10} testID="exposure-chart" /> : exposure.data ? <Text style={styles.small}>Nothing to chart.</Text> : <LoadingState what="the chart" />}
        </Section>
        <Section title="Per service" testID="resilience-services">
          {perService ? (
            <PerService />
          ) : (
            <Button label="Show counts per service" variant="secondary" onPress={() => setPerService(true)} testID="service-counts-show" />
          )}
        </Section>
      </Columns>

      <Columns max={2}>
        <Section
          title="Diversity gaps"
          note="Carriages with a reserve feed that still have a weak point another feed could avoid. A weak point that holds every origin of its service cannot be avoided by any feed and is listed apart."
          testID="resilience-diversity"
        >
          {diversity.data ? <DiversityList first={diversity.data.carriages} total={gapCount ?? 0} /> : diversity.error ? <ErrorState what="the diversity gaps" error={diversity.error} onRetry={() => void diversity.mutate()} /> : <LoadingState what="the diversity gaps" />}
        </Section>
        <Section title="Unfed carriages" note="A data problem: no programme reaches them even with nothing failed, so they are left out of every reach." testID="resilience-unfed">
          {unfed.data ? <UnfedList unfed={unfed.data.carriages} /> : unfed.error ? <ErrorState what="the unfed carriages" error={unfed.error} onRetry={() => void unfed.mutate()} /> : <LoadingState what="the unfed carriages" />}
        </Section>
      </Columns>

      <Columns max={2}>
        <Section title="Reserve feeds that would close a gap" note="The best new reserve feed for each gap, by households protected." testID="resilience-proposals">
          <ProposalsList />
        </Section>
        <Section title="Plan several feeds" note="Picks feeds one at a time, each on the network with the earlier picks added, and shows the result in a sandbox first." testID="resilience-plan">
          <PlanPanel />
        </Section>
      </Columns>

      <Section title="Failures that hurt most together" note="Pairs of sites and groups whose joint failure takes off air what neither takes alone: the question behind planned-work clashes." testID="resilience-pairs">
        <PairsPanel name={name} />
      </Section>
    </Screen>
  );
}

const styles = StyleSheet.create({
  big: { ...type.body, fontSize: 18, lineHeight: 24 },
  small: { ...type.small },
});

/**
 * Home: what needs attention now (panels other features register in
 * ./attention.ts), then the network's record counts from
 * GET /api/network/summary.
 */
import { StyleSheet, Text } from 'react-native';
import { useSummary } from '@/src/api/queries/summary';
import type { NetworkSummary } from '@/src/api/schemas';
import { Columns } from '@/src/components/layout/Columns';
import { Screen } from '@/src/components/layout/Screen';
import { Section } from '@/src/components/layout/Section';
import { EmptyState, ErrorState, LoadingState } from '@/src/components/states';
import { type } from '@/src/theme';
import { ATTENTION_PANELS } from './attention';
import { CountTile } from './CountTile';

function Counts({ summary }: { summary: NetworkSummary }) {
  const { counts, sitesByRole } = summary;
  if (counts.sites === 0 && counts.services === 0) {
    return <EmptyState title="The network is empty" message="No sites or services have been entered yet. Add them in Inventory, or import a network document there." testID="network-empty" />;
  }
  return (
    <Columns max={3} phone={2}>
      <CountTile
        label="Sites"
        count={counts.sites}
        testID="count-sites"
        parts={[
          { label: 'Origin', count: sitesByRole.origin, testID: 'count-sites-origin' },
          { label: 'Main station', count: sitesByRole.main, testID: 'count-sites-main' },
          { label: 'Relay', count: sitesByRole.relay, testID: 'count-sites-relay' },
        ]}
      />
      <CountTile label="Carriages" count={counts.carriages} testID="count-carriages" />
      <CountTile label="Feeds" count={counts.feeds} testID="count-feeds" />
      <CountTile label="Services" count={counts.services} testID="count-services" />
      <CountTile label="Groups" count={counts.groups} testID="count-groups" />
    </Columns>
  );
}

export function HomeScreen() {
  const summary = useSummary();
  return (
    <Screen title="Home" testID="home-screen">
      {ATTENTION_PANELS.length > 0 ? (
        <Section title="Needs attention now" testID="attention">
          {ATTENTION_PANELS.map(({ id, Panel }) => (
            <Panel key={id} />
          ))}
        </Section>
      ) : null}

      <Section title="The network" note={summary.data ? `Network version ${summary.data.networkVersion}` : undefined} testID="network-counts">
        {summary.data ? (
          <Counts summary={summary.data} />
        ) : summary.error ? (
          <ErrorState what="the network summary" error={summary.error} onRetry={() => void summary.mutate()} />
        ) : (
          <LoadingState what="the network summary" />
        )}
        {summary.data && summary.error ? <Text style={styles.stale}>Showing the last counts received; refreshing failed.</Text> : null}
      </Section>
    </Screen>
  );
}

const styles = StyleSheet.create({
  stale: { ...type.small },
});

/** Incidents: open ones first, and opening one from scratch. */
import { Link } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import type { Element } from '@/shared/schemas/analysis';
import { useIncidents } from '@/src/api/queries/incidents';
import { Card } from '@/src/components/Card';
import { formatCount } from '@/shared/format';
import { Screen } from '@/src/components/layout/Screen';
import { Section } from '@/src/components/layout/Section';
import { EmptyState, ErrorState, LoadingState } from '@/src/components/states';
import { StatusShape } from '@/src/components/StatusShape';
import { colors, space, type } from '@/src/theme';
import { ElementSearch } from '../reach/ElementSearch';
import { FailChips } from '../reach/FailChips';
import { addToFailSet, removeFromFailSet } from '../reach/failSet';
import { OpenIncident } from './OpenIncident';
import { localText } from './time';

export function IncidentsScreen() {
  const list = useIncidents();
  const [elements, setElements] = useState<Element[]>([]);
  return (
    <Screen title="Incidents" subtitle="What has failed, step by step, with the reach recorded at each step." testID="incidents-screen">
      <Section title="Open an incident" note="Pick what has failed. From the fault reach screen it is one button away.">
        <ElementSearch chosen={elements} onAdd={(e) => setElements(addToFailSet(elements, e))} />
        <FailChips elements={elements} onRemove={(e) => setElements(removeFromFailSet(elements, e))} onClear={() => setElements([])} />
        {elements.length ? <OpenIncident elements={elements} startOpen /> : null}
      </Section>
      <Section title="Recorded incidents">
        {list.error && !list.data ? (
          <ErrorState what="incidents" error={list.error} onRetry={() => void list.mutate()} />
        ) : !list.data ? (
          <LoadingState what="incidents" />
        ) : list.data.items.length === 0 ? (
          <EmptyState title="No incidents recorded" />
        ) : (
          <View style={styles.list}>
            {list.data.items.map((i) => (
              <Card key={i.code} title={`${i.code} · ${i.title}`} emphasis={i.open ? 'attention' : 'none'} testID={`incident-${i.code}`}>
                <View style={styles.row}>
                  <StatusShape shape={i.open ? 'cross' : 'ring'} color={i.open ? colors.bad : colors.good} />
                  <Text style={styles.plain}>{i.open ? `Open since ${localText(i.startedAt)}` : `Closed ${localText(i.endedAt)}`}</Text>
                </View>
                {i.householdMinutes !== null ? <Text style={styles.small}>{`${formatCount(i.householdMinutes)} household-minutes off air`}</Text> : null}
                <Link href={`/incidents/${i.code}`} style={styles.link}>{`Open ${i.code}`}</Link>
              </Card>
            ))}
          </View>
        )}
      </Section>
    </Screen>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.md },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  plain: { ...type.body },
  small: { ...type.small },
  link: { ...type.label, color: colors.accent, minHeight: 44, paddingVertical: space.md },
});

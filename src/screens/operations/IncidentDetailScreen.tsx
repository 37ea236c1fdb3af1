/**
 * One incident: its timeline, each step with the reach recorded at that
 * moment (and the network version it was computed at), adding a note or
 * failed elements, restoring some, closing; household-minutes once closed.
 */
import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import type { Element } from '@/shared/schemas/analysis';
import { elementKey } from '@/shared/schemas/analysis';
import { useIncident, useIncidentActions } from '@/src/api/queries/incidents';
import { Button } from '@/src/components/Button';
import { Card } from '@/src/components/Card';
import { formatCount } from '@/shared/format';
import { Screen } from '@/src/components/layout/Screen';
import { DocumentsPanel } from '@/src/screens/documents/DocumentsPanel';
import { useCanEditDocuments } from '@/src/screens/inventory/useCanEdit';
import { Section } from '@/src/components/layout/Section';
import { describeError, ErrorState, LoadingState } from '@/src/components/states';
import { TextField } from '@/src/components/TextField';
import { colors, space, type } from '@/src/theme';
import { ElementSearch } from '../reach/ElementSearch';
import { ClashList, ReachFacts } from './parts';
import { durationText, localText } from './time';

export function IncidentDetailScreen({ code }: { code: string }) {
  const canEditDocuments = useCanEditDocuments();
  const inc = useIncident(code);
  const actions = useIncidentActions();
  const [note, setNote] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  if (inc.error && !inc.data) return <Screen title={code}><ErrorState what={`incident ${code}`} error={inc.error} onRetry={() => void inc.mutate()} /></Screen>;
  if (!inc.data) return <Screen title={code}><LoadingState what={`incident ${code}`} /></Screen>;
  const i = inc.data;
  const send = async (change: { note?: string; add?: Element[]; restore?: Element[]; close?: boolean }) => {
    setBusy(true);
    setError(null);
    try {
      await actions.update(i.code, { version: i.version, ...change });
      setNote('');
      await inc.mutate();
    } catch (e) {
      setError(describeError(e));
    } finally {
      setBusy(false);
    }
  };
  const minutes = i.carriageMinutes ? Object.entries(i.carriageMinutes).sort((a, b) => b[1] - a[1]) : [];
  return (
    <Screen title={`${i.code} · ${i.title}`} subtitle={i.open ? `Open since ${localText(i.startedAt)}` : `${localText(i.startedAt)} to ${localText(i.endedAt)}`} testID="incident-detail">
      {i.householdMinutes !== null ? (
        <Section title="Impact" note="Households of each site with a carriage off air, times the minutes, summed over the steps.">
          <Text style={styles.big} testID="incident-household-minutes">{`${formatCount(i.householdMinutes)} household-minutes off air`}</Text>
          {minutes.map(([c, m]) => (
            <Text key={c} style={styles.small}>{`${c}: ${durationText(m)} off air`}</Text>
          ))}
        </Section>
      ) : null}
      {i.open ? (
        <Section title="Update" note="A restoration changes the reach from the moment it is recorded.">
          <Text style={styles.label}>Still failed — tap to restore</Text>
          <View style={styles.row}>
            {i.elements.map((e) => (
              <Button key={elementKey(e)} label={`Restore ${e.kind} ${e.code}`} variant="secondary" onPress={() => void send({ restore: [e] })} busy={busy} testID={`restore-${e.code}`} />
            ))}
          </View>
          <ElementSearch chosen={i.elements} onAdd={(e) => void send({ add: [e] })} />
          <TextField label="Note" value={note} onChangeText={setNote} multiline testID="incident-note" />
          <View style={styles.row}>
            <Button label="Add the note" variant="secondary" disabled={!note.trim()} onPress={() => void send({ note })} busy={busy} testID="incident-add-note" />
            <Button label="Close: everything is back" variant="danger" onPress={() => void send({ close: true, note: note || undefined })} busy={busy} testID="incident-close" />
          </View>
          {error ? <Text style={styles.error} accessibilityRole="alert">{error}</Text> : null}
        </Section>
      ) : null}
      {i.open ? (
        <Section title="Clashes with planned work">
          <ClashList clashes={i.clashes} />
        </Section>
      ) : null}
      <Section title="Timeline" note="Each step keeps the reach computed when it was recorded; later network changes do not alter it.">
        <View style={styles.list}>
          {[...i.steps].reverse().map((s, k) => (
            <Card key={k} title={localText(s.at)} testID={`step-${i.steps.length - 1 - k}`}>
              <Text style={styles.small}>{`By ${s.by ?? 'unknown'}`}</Text>
              {s.note ? <Text style={styles.plain}>{s.note}</Text> : null}
              {s.added.length ? <Text style={styles.plain}>{`Failed: ${s.added.map((e) => `${e.kind} ${e.code}`).join(', ')}`}</Text> : null}
              {s.restored.length ? <Text style={styles.plain}>{`Restored: ${s.restored.map((e) => `${e.kind} ${e.code}`).join(', ')}`}</Text> : null}
              <ReachFacts reach={s.reach} networkVersion={s.networkVersion} />
            </Card>
          ))}
        </View>
      </Section>
      <DocumentsPanel kind="incidents" code={i.code} canEdit={canEditDocuments} photos />
    </Screen>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.md },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  label: { ...type.label },
  plain: { ...type.body },
  small: { ...type.small },
  big: { ...type.heading },
  error: { ...type.body, color: colors.bad },
});

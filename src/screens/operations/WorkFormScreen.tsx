/**
 * Plan a work: title, elements taken out (the fault reach search), the
 * window typed in local time with the zone named, notes; save as a draft or
 * send for approval at once.
 */
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import type { Element } from '@/shared/schemas/analysis';
import { useWorkActions } from '@/src/api/queries/works';
import { Button } from '@/src/components/Button';
import { Screen } from '@/src/components/layout/Screen';
import { Section } from '@/src/components/layout/Section';
import { describeError } from '@/src/components/states';
import { TextField } from '@/src/components/TextField';
import { colors, space, type } from '@/src/theme';
import { ElementSearch } from '../reach/ElementSearch';
import { FailChips } from '../reach/FailChips';
import { addToFailSet, removeFromFailSet } from '../reach/failSet';
import { WorkCautions } from './parts';
import { fromLocalInput, toLocalInput, zoneName } from './time';

export function WorkFormScreen() {
  const router = useRouter();
  const actions = useWorkActions();
  const tomorrow = new Date(Date.now() + 86_400_000);
  tomorrow.setHours(6, 0, 0, 0);
  const [title, setTitle] = useState('');
  const [elements, setElements] = useState<Element[]>([]);
  const [start, setStart] = useState(toLocalInput(tomorrow));
  const [end, setEnd] = useState(toLocalInput(new Date(tomorrow.getTime() + 4 * 3_600_000)));
  const [notes, setNotes] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const startIso = fromLocalInput(start);
  const endIso = fromLocalInput(end);

  const save = async (submit: boolean) => {
    if (!title.trim()) return setError('Give the work a title.');
    if (!elements.length) return setError('Add at least one site, carriage, feed or group the work takes out.');
    if (!startIso || !endIso) return setError('Type start and end as YYYY-MM-DD HH:MM.');
    setBusy(true);
    setError(null);
    try {
      const w = await actions.create({ title: title.trim(), elements, start: startIso, end: endIso, notes, submit });
      router.replace(`/works/${w.code}`);
    } catch (e) {
      setError(describeError(e));
    } finally {
      setBusy(false);
    }
  };

  return (
    <Screen title="Plan work" subtitle="What the work takes out of service, and when." testID="work-form">
      <Section title="The work">
        <TextField label="Title" value={title} onChangeText={setTitle} placeholder="e.g. Replace the line card at the main station" testID="work-title" />
      </Section>
      <Section title="Taken out of service" note="The same search as the fault reach: sites, feeds, shared-risk groups.">
        <ElementSearch chosen={elements} onAdd={(e) => setElements(addToFailSet(elements, e) as Element[])} />
        <FailChips elements={elements} onRemove={(e) => setElements(removeFromFailSet(elements, e) as Element[])} onClear={() => setElements([])} />
      </Section>
      <Section title="Window" note={`Local time, ${zoneName()}. At most 90 days.`}>
        <View style={styles.row}>
          <TextField label={`Start (${zoneName()})`} value={start} onChangeText={setStart} mono error={startIso ? null : 'YYYY-MM-DD HH:MM'} testID="work-start" />
          <TextField label={`End (${zoneName()})`} value={end} onChangeText={setEnd} mono error={endIso ? null : 'YYYY-MM-DD HH:MM'} testID="work-end" />
        </View>
        <TextField label="Notes" value={notes} onChangeText={setNotes} multiline testID="work-notes" />
      </Section>
      {error ? (
        <Text style={styles.error} accessibilityRole="alert" testID="work-form-error">
          {error}
        </Text>
      ) : null}
      <View style={styles.row}>
        <Button label="Send for approval" onPress={() => void save(true)} busy={busy} testID="work-submit" />
        <Button label="Keep as a draft" variant="secondary" onPress={() => void save(false)} busy={busy} testID="work-draft" />
      </View>
      <WorkCautions />
    </Screen>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  error: { ...type.body, color: colors.bad },
});

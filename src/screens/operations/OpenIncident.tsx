/**
 * "Open an incident for this failure set": the first tap shows the title
 * (filled in) and when it started (now); the second opens it and goes to the
 * incident. Used on the fault reach screen and for an incident from scratch.
 */
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import type { Element } from '@/shared/schemas/analysis';
import { useIncidentActions } from '@/src/api/queries/incidents';
import { Button } from '@/src/components/Button';
import { describeError } from '@/src/components/states';
import { TextField } from '@/src/components/TextField';
import { colors, radius, space, type } from '@/src/theme';

export const defaultIncidentTitle = (elements: readonly Element[]) =>
  `Failure: ${elements.slice(0, 3).map((e) => `${e.kind} ${e.code}`).join(', ')}${elements.length > 3 ? ` and ${elements.length - 3} more` : ''}`;

export function OpenIncident({ elements, startOpen = false }: { elements: readonly Element[]; startOpen?: boolean }) {
  const router = useRouter();
  const actions = useIncidentActions();
  const [open, setOpen] = useState(startOpen);
  const [title, setTitle] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  if (!open) return <Button label="Open an incident for this failure set" variant="secondary" onPress={() => setOpen(true)} testID="open-incident" />;
  const go = async () => {
    setBusy(true);
    setError(null);
    try {
      const i = await actions.open({ title: title.trim() || defaultIncidentTitle(elements), elements: [...elements] });
      router.push(`/incidents/${i.code}`);
    } catch (e) {
      setError(describeError(e));
    } finally {
      setBusy(false);
    }
  };
  return (
    <View style={styles.box} testID="open-incident-panel">
      <TextField label="Incident title" value={title} onChangeText={setTitle} placeholder={defaultIncidentTitle(elements)} testID="incident-title" />
      <Text style={styles.small}>Starts now; a late record can set an earlier start on the incident afterwards.</Text>
      <View style={styles.row}>
        <Button label="Open the incident" onPress={() => void go()} busy={busy} disabled={elements.length === 0} testID="open-incident-confirm" />
        {!startOpen ? <Button label="Not now" variant="quiet" onPress={() => setOpen(false)} /> : null}
      </View>
      {error ? <Text style={styles.error} accessibilityRole="alert">{error}</Text> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.sm, borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, padding: space.md },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  small: { ...type.small },
  error: { ...type.body, color: colors.bad },
});

/**
 * Deleting a record, in steps on the page (no browser dialog): "Delete" asks
 * to confirm and shows what the delete would take off air; the server may refuse because other records depend on this
 * one, and then the panel names them in the server's words and offers an
 * explicit "also delete N dependents" choice before trying again with
 * cascade.
 */
import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import type { EntityKind } from '@/shared/schemas/network';
import { useInventoryActions } from '@/src/api/queries/inventory';
import { Button } from '@/src/components/Button';
import { Choice } from '@/src/components/Choice';
import { colors, fonts, radius, space, type } from '@/src/theme';
import { deleteButtonLabel, deleteRefusal, type DeleteRefusal } from '../deleteRefusal';
import { countOf, WORDS } from '../kinds';
import { DeleteImpactNote } from './DeleteImpactNote';

export interface DeletePanelProps {
  kind: EntityKind;
  code: string;
  version: number;
  onDeleted: () => void;
  /** refetch the record after a refusal because it changed */
  onReload: () => void;
}

type Step = 'idle' | 'confirm';

export function DeletePanel({ kind, code, version, onDeleted, onReload }: DeletePanelProps) {
  const actions = useInventoryActions();
  const [step, setStep] = useState<Step>('idle');
  const [refusal, setRefusal] = useState<DeleteRefusal | null>(null);
  const [cascade, setCascade] = useState(false);
  /** cascade as last sent: a documents refusal comes after the dependents were accepted */
  const [cascadeSent, setCascadeSent] = useState(false);
  const [documents, setDocuments] = useState<'delete' | 'keep' | null>(null);
  const [busy, setBusy] = useState(false);
  const one = WORDS[kind].one;

  const reset = () => {
    setStep('idle');
    setRefusal(null);
    setCascade(false);
    setCascadeSent(false);
    setDocuments(null);
  };

  async function remove() {
    setBusy(true);
    try {
      const withCascade = (cascade && refusal?.reason === 'dependents') || (cascadeSent && refusal?.reason === 'documents');
      setCascadeSent(withCascade);
      await actions.remove(kind, code, version, withCascade, refusal?.reason === 'documents' ? (documents ?? undefined) : undefined);
      onDeleted();
    } catch (e) {
      setRefusal(deleteRefusal(kind, e));
      setCascade(false);
      setDocuments(null);
    } finally {
      setBusy(false);
    }
  }

  if (step === 'idle') {
    return <Button label={`Delete ${one}`} variant="danger" onPress={() => setStep('confirm')} testID="delete-start" style={styles.left} />;
  }

  const dependents = refusal?.reason === 'dependents' ? refusal : null;
  return (
    <View style={styles.box} accessibilityRole="summary" accessibilityLabel={`Delete ${one} ${code}`} testID="delete-panel">
      <Text style={styles.title}>{`Delete ${one} ${code}?`}</Text>
      <Text style={styles.body}>{`This removes the ${one} from the network for everyone. The audit log keeps what it was.`}</Text>
      <DeleteImpactNote kind={kind} code={code} />
      {refusal ? (
        <View style={styles.refusal} accessibilityRole="alert" testID="delete-refusal">
          <Text style={styles.refusalText}>{`⚠ ${refusal.message}`}</Text>
          {dependents
            ? dependents.dependents.map((d) => (
                <Text key={d.kind} style={styles.codes} selectable>
                  {`${countOf(d.kind, d.count)}: ${d.codes.join(', ')}${d.count > d.codes.length ? ` and ${d.count - d.codes.length} more` : ''}`}
                </Text>
              ))
            : null}
          {refusal.reason === 'stale' ? (
            <Button
              label="Reload"
              icon="retry"
              variant="secondary"
              onPress={() => {
                reset();
                onReload();
              }}
              testID="delete-reload"
              style={styles.left}
            />
          ) : null}
        </View>
      ) : null}
      {dependents ? (
        <Choice
          label="What depends on it"
          options={[
            { value: 'keep', label: `Keep them: do not delete the ${one}` },
            { value: 'cascade', label: dependents.cascadeLabel },
          ]}
          value={cascade ? 'cascade' : 'keep'}
          onChange={(v) => setCascade(v === 'cascade')}
          testID="delete-cascade"
        />
      ) : null}
      {refusal?.reason === 'documents' ? (
        <Choice
          label="Its documents"
          options={[
            { value: 'keep', label: `Keep the ${refusal.count === 1 ? 'document' : `${refusal.count} documents`} in storage` },
            { value: 'delete', label: `Delete the ${refusal.count === 1 ? 'document' : `${refusal.count} documents`} too` },
          ]}
          value={documents}
          onChange={setDocuments}
          testID="delete-documents"
        />
      ) : null}
      <View style={styles.buttons}>
        {refusal?.reason !== 'stale' ? (
          <Button
            label={deleteButtonLabel(kind, code, cascade && dependents ? dependents.total : null)}
            variant="danger"
            busy={busy}
            disabled={(!!dependents && !cascade) || (refusal?.reason === 'documents' && !documents)}
            onPress={() => void remove()}
            testID="delete-confirm"
          />
        ) : null}
        <Button label="Keep it" variant="quiet" onPress={reset} testID="delete-cancel" />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  left: { alignSelf: 'flex-start' },
  box: { gap: space.md, padding: space.lg, borderRadius: radius.lg, borderWidth: 2, borderColor: colors.bad, backgroundColor: colors.surface },
  title: { ...type.heading },
  body: { ...type.body },
  refusal: { gap: space.sm, padding: space.md, borderRadius: radius.md, backgroundColor: colors.badSoft },
  refusalText: { ...type.body, fontFamily: fonts.textBold, color: colors.bad },
  codes: { fontFamily: fonts.mono, fontSize: 15, lineHeight: 22, color: colors.ink },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});

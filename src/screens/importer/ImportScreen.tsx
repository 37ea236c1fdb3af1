/**
 * Import and export of the whole network (docs/format.md).
 * Choosing a file runs a dry run at once, so the person sees what the import
 * would do (and every problem in the file) before anything is written;
 * "Commit import" is offered only when that check found no error, and it
 * sends the same files with the same options. Export downloads the network
 * document or the zip of its CSV files; every role may export, only
 * engineers and admins import.
 */
import { countOf, formatBytes } from '@/shared/format';
import { useRef, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import type { ImportReport } from '@/shared/schemas/import';
import { newProgressId, useNetworkTransfer, type UploadFile } from '@/src/api/queries/network';
import { Button } from '@/src/components/Button';
import { Choice } from '@/src/components/Choice';
import { Screen } from '@/src/components/layout/Screen';
import { Section } from '@/src/components/layout/Section';
import { describeError } from '@/src/components/states';
import { StatusShape } from '@/src/components/StatusShape';
import { colors, fonts, radius, space, type } from '@/src/theme';
import { InventoryNav } from '../inventory/parts/InventoryNav';
import { useCanEdit } from '../inventory/useCanEdit';
import { saveFile } from './download';
import { FilePicker } from './FilePicker';
import { canCommit, deletionsText, needsDeleteConfirmation, staleText, totals } from './report';
import { ImportProgressView } from './ImportProgressView';
import { ReportView } from './ReportView';

type Phase = 'idle' | 'checking' | 'committing';

const sizeText = (bytes: number | null) => (bytes === null ? '' : formatBytes(bytes));

export function ImportScreen() {
  const canEdit = useCanEdit();
  return (
    <Screen title="Import and export" subtitle="The whole network as one document or as CSV files" testID="import-screen">
      <InventoryNav current="import" />
      {canEdit ? <ImportSection /> : <Text style={styles.body}>Your role can export the network but not import into it; ask an engineer or an admin.</Text>}
      <ExportSection />
    </Screen>
  );
}

function ImportSection() {
  const transfer = useNetworkTransfer();
  const [files, setFiles] = useState<UploadFile[]>([]);
  const [replace, setReplace] = useState(false);
  const [phase, setPhase] = useState<Phase>('idle');
  const [report, setReport] = useState<ImportReport | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  // A second, deliberate step: a replace from an older version undoes later changes only once this is confirmed.
  const [undoConfirmed, setUndoConfirmed] = useState(false);
  // A replace that deletes records is carried out only once the person has read the deletions and agreed.
  const [deletesConfirmed, setDeletesConfirmed] = useState(false);
  // Only the answer to the latest request counts: a slow check must not overwrite a newer one.
  const latest = useRef(0);
  // The running request's progress id: its stages and bar show until the answer comes.
  const [running, setRunning] = useState<{ id: string; dryRun: boolean } | null>(null);

  async function run(chosen: UploadFile[], withReplace: boolean, dryRun: boolean) {
    if (chosen.length === 0) return;
    const ticket = ++latest.current;
    setPhase(dryRun ? 'checking' : 'committing');
    setFailure(null);
    if (dryRun) {
      setReport(null);
      setUndoConfirmed(false);
      setDeletesConfirmed(false);
    }
    const progressId = newProgressId();
    setRunning({ id: progressId, dryRun });
    try {
      const confirmReplace = !dryRun && withReplace ? report?.confirmReplace : undefined;
      const answer = await transfer.importFiles(chosen, { dryRun, replace: withReplace, undoNewer: !dryRun && undoConfirmed, confirmReplace, progressId });
      if (ticket === latest.current) setReport(answer);
    } catch (e) {
      if (ticket === latest.current) setFailure(`${dryRun ? 'The check' : 'The import'} failed: ${describeError(e)}`);
    } finally {
      if (ticket === latest.current) {
        setPhase('idle');
        setRunning(null);
      }
    }
  }

  const pick = (chosen: UploadFile[]) => {
    setFiles(chosen);
    void run(chosen, replace, true);
  };
  const chooseReplace = (value: boolean) => {
    setReplace(value);
    void run(files, value, true);
  };

  const committed = report !== null && !report.dryRun && report.ok;
  return (
    <Section title="Import" note="First a check that writes nothing; then, if the file has no errors, the import itself, all or nothing." testID="import-section">
      <FilePicker label="Network file" onPick={pick} disabled={phase !== 'idle'} testID="import-file" />
      {files.length ? (
        <Text style={styles.files} testID="import-chosen">
          {`Chosen: ${files.map((f) => `${f.name}${f.size !== null ? ` (${sizeText(f.size)})` : ''}`).join(', ')}`}
        </Text>
      ) : null}
      <Choice
        label="What the import does"
        options={[
          { value: 'merge', label: 'Add and update records' },
          { value: 'replace', label: 'Replace the whole network' },
        ]}
        value={replace ? 'replace' : 'merge'}
        onChange={(v) => chooseReplace(v === 'replace')}
        disabled={phase !== 'idle'}
        testID="import-mode"
      />
      {replace ? (
        <View style={styles.warning} accessibilityRole="alert" testID="import-replace-warning">
          <View style={styles.warningHead}>
            <StatusShape shape="triangle" color={colors.warn} size={18} />
            <Text style={styles.warningTitle}>Replace deletes what the file does not list</Text>
          </View>
          <Text style={styles.body}>The network becomes exactly the file: every site, service, group, carriage and feed missing from it is deleted. The check below counts them before anything happens.</Text>
        </View>
      ) : null}
      <View style={styles.buttons}>
        <Button label="Check again" variant="secondary" onPress={() => void run(files, replace, true)} disabled={files.length === 0 || phase !== 'idle'} busy={phase === 'checking'} testID="import-check" />
        <Button
          label="Commit import"
          onPress={() => void run(files, replace, false)}
          disabled={!canCommit(report, { undo: undoConfirmed, deletes: deletesConfirmed }) || phase !== 'idle'}
          busy={phase === 'committing'}
          testID="import-commit"
        />
      </View>
      {report && needsDeleteConfirmation(report) ? (
        <View style={styles.warning} accessibilityRole="alert" testID="import-deletions">
          <View style={styles.warningHead}>
            <StatusShape shape="triangle" color={colors.warn} size={18} />
            <Text style={styles.warningTitle}>{`This replace deletes ${countOf(totals(report).deleted, 'record')}`}</Text>
          </View>
          <Text style={styles.body}>{`Deleted: ${deletionsText(report)}, everything the file does not list. Export the network first if you may want them back.`}</Text>
          <Button
            label={deletesConfirmed ? `Confirmed: delete ${countOf(totals(report).deleted, 'record')}` : `Delete ${countOf(totals(report).deleted, 'record')} and replace`}
            variant="secondary"
            onPress={() => setDeletesConfirmed((v) => !v)}
            disabled={phase !== 'idle'}
            testID="import-confirm-deletions"
          />
        </View>
      ) : null}
      {report?.dryRun && report.stale ? (
        <View style={styles.warning} accessibilityRole="alert" testID="import-stale">
          <View style={styles.warningHead}>
            <StatusShape shape="triangle" color={colors.warn} size={18} />
            <Text style={styles.warningTitle}>The file is older than the network</Text>
          </View>
          <Text style={styles.body}>{staleText(report.stale)}</Text>
          <Button
            label={undoConfirmed ? 'Undo confirmed: commit will undo those changes' : 'Undo those changes too'}
            variant="secondary"
            onPress={() => setUndoConfirmed((v) => !v)}
            disabled={phase !== 'idle'}
            testID="import-undo-newer"
          />
        </View>
      ) : null}
      {running ? <ImportProgressView key={running.id} progressId={running.id} dryRun={running.dryRun} /> : null}
      {failure ? (
        <Text style={styles.failure} accessibilityRole="alert" testID="import-failure">
          {`⚠ ${failure}`}
        </Text>
      ) : null}
      {committed ? (
        <Text style={styles.done} accessibilityRole="alert" testID="import-done">
          {`The network is now at version ${report.networkVersion ?? '?'}. Every screen shows the imported records.`}
        </Text>
      ) : null}
      {report ? <ReportView report={report} /> : null}
    </Section>
  );
}

function ExportSection() {
  const transfer = useNetworkTransfer();
  const [busy, setBusy] = useState<'json' | 'csv' | null>(null);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);

  async function download(format: 'json' | 'csv') {
    setBusy(format);
    setMessage(null);
    try {
      const file = await transfer.exportFile(format);
      saveFile(file);
      setMessage({ ok: true, text: `Downloaded ${file.name} (${sizeText(file.blob.size)}).` });
    } catch (e) {
      setMessage({ ok: false, text: `The export failed: ${describeError(e)}` });
    } finally {
      setBusy(null);
    }
  }

  return (
    <Section title="Export" note="The network as it is now. Imported into an empty network, either file gives back the same network." testID="export-section">
      <View style={styles.buttons}>
        <Button label="Export JSON" variant="secondary" onPress={() => void download('json')} busy={busy === 'json'} disabled={busy !== null} testID="export-json" />
        <Button label="Export CSV" variant="secondary" onPress={() => void download('csv')} busy={busy === 'csv'} disabled={busy !== null} testID="export-csv" />
      </View>
      <Text style={styles.hint}>JSON: one network document. CSV: a .zip with sites.csv, services.csv, groups.csv, carriages.csv and feeds.csv.</Text>
      {message ? (
        <Text style={message.ok ? styles.done : styles.failure} accessibilityRole={message.ok ? undefined : 'alert'} accessibilityLiveRegion="polite" testID="export-message">
          {message.ok ? message.text : `⚠ ${message.text}`}
        </Text>
      ) : null}
    </Section>
  );
}

const styles = StyleSheet.create({
  body: { ...type.body },
  hint: { ...type.small },
  files: { ...type.body, fontFamily: fonts.mono, fontSize: 15 },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  warning: { gap: space.xs, padding: space.md, borderRadius: radius.md, borderWidth: 1, borderLeftWidth: 6, borderColor: colors.warn, backgroundColor: colors.warnSoft },
  warningHead: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  warningTitle: { ...type.label, color: colors.warn },
  failure: { ...type.body, color: colors.bad, fontFamily: fonts.textBold },
  done: { ...type.body, color: colors.good, fontFamily: fonts.textBold },
});

/**
 * One planned work: window, state, reach at the current network version,
 * clashes, and the next steps (submit, approve with the clash sentence shown
 * first, start, finish, cancel, delete a draft).
 */
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { WORK_STATE_LABELS, type WorkState } from '@/shared/schemas/operations';
import { useSession } from '@/src/session/SessionProvider';
import { useWork, useWorkActions } from '@/src/api/queries/works';
import { Button } from '@/src/components/Button';
import { Screen } from '@/src/components/layout/Screen';
import { DocumentsPanel } from '@/src/screens/documents/DocumentsPanel';
import { useCanEditDocuments } from '@/src/screens/inventory/useCanEdit';
import { Section } from '@/src/components/layout/Section';
import { describeError, ErrorState, LoadingState } from '@/src/components/states';
import { colors, space, type } from '@/src/theme';
import { ClashList, clashSentence, ReachFacts, StateBadge, WorkCautions } from './parts';
import { localText } from './time';

const MOVES: Partial<Record<WorkState, { to: WorkState; label: string }[]>> = {
  draft: [{ to: 'requested', label: 'Send for approval' }, { to: 'cancelled', label: 'Cancel the work' }],
  requested: [{ to: 'draft', label: 'Back to draft' }, { to: 'cancelled', label: 'Cancel the work' }],
  approved: [{ to: 'in-progress', label: 'Work has started' }, { to: 'cancelled', label: 'Cancel the work' }],
  'in-progress': [{ to: 'done', label: 'Work is finished' }],
};

export function WorkDetailScreen({ code }: { code: string }) {
  const canEditDocuments = useCanEditDocuments();
  const router = useRouter();
  const work = useWork(code);
  const actions = useWorkActions();
  const { user } = useSession();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [confirming, setConfirming] = useState(false);

  if (work.error && !work.data) return <Screen title={code}><ErrorState what={`planned work ${code}`} error={work.error} onRetry={() => void work.mutate()} /></Screen>;
  if (!work.data) return <Screen title={code}><LoadingState what={`planned work ${code}`} /></Screen>;
  const w = work.data;
  const run = async (fn: () => Promise<unknown>) => {
    setBusy(true);
    setError(null);
    try {
      await fn();
      await work.mutate();
      setConfirming(false);
    } catch (e) {
      setError(describeError(e));
    } finally {
      setBusy(false);
    }
  };
  const canApprove = w.state === 'requested' && (user?.role === 'admin' || (user?.role === 'engineer' && user?.email !== w.requestedBy));
  const firm = w.clashes;

  return (
    <Screen title={`${w.code} · ${w.title}`} subtitle={`${localText(w.start)} to ${localText(w.end)}`} testID="work-detail">
      <Section title="State">
        <View style={styles.row}>
          <StateBadge state={w.state} label={w.stateLabel} />
          <Text style={styles.small}>{`Requested by ${w.requestedBy ?? 'unknown'}${w.approvedBy ? ` · approved by ${w.approvedBy}` : ''}`}</Text>
        </View>
        {w.notes ? <Text style={styles.plain}>{w.notes}</Text> : null}
        <Text style={styles.small}>{`Takes out: ${w.elements.map((e) => `${e.kind} ${e.code}`).join(', ')}`}</Text>
        {w.missing.length ? <Text style={styles.warn}>{`No longer in the network (left out of the reach): ${w.missing.map((e) => `${e.kind} ${e.code}`).join(', ')}`}</Text> : null}
      </Section>
      <Section title="What it takes off air" note="Recomputed whenever the network changes.">
        <ReachFacts reach={w.reach} networkVersion={w.networkVersion} testID="work-reach" />
      </Section>
      <Section title="Clashes" note="Other planned work or open incidents that overlap in time and together take off air what neither does alone.">
        <ClashList clashes={w.clashes} testID="work-clashes" />
      </Section>
      <Section title="Next step">
        {canApprove && !confirming ? <Button label="Approve…" onPress={() => setConfirming(true)} testID="work-approve" /> : null}
        {confirming ? (
          <View style={styles.confirm} testID="approve-confirm">
            {firm.length ? (
              firm.map((c) => (
                <Text key={c.work} style={styles.warn} testID={`approve-clash-${c.work}`}>{`${clashSentence(c, 'Approving this puts')}.`}</Text>
              ))
            ) : (
              <Text style={styles.plain}>No clash with other work or an open incident.</Text>
            )}
            <View style={styles.row}>
              <Button label="Approve the work" onPress={() => void run(() => actions.approve(w.code, w.version))} busy={busy} testID="work-approve-confirm" />
              <Button label="Not now" variant="quiet" onPress={() => setConfirming(false)} />
            </View>
          </View>
        ) : null}
        <View style={styles.row}>
          {(MOVES[w.state] ?? []).map((m) => (
            <Button key={m.to} label={m.label} variant={m.to === 'cancelled' ? 'danger' : 'secondary'} onPress={() => void run(() => actions.move(w.code, m.to, w.version))} busy={busy} testID={`work-to-${m.to}`} />
          ))}
          {w.state === 'draft' ? (
            <Button label="Delete the draft" variant="danger" onPress={() => void run(async () => { await actions.remove(w.code); router.replace('/works'); })} busy={busy} testID="work-delete" />
          ) : null}
        </View>
        {w.state === 'done' || w.state === 'cancelled' ? <Text style={styles.small}>{`This work is ${WORK_STATE_LABELS[w.state].toLowerCase()}; it no longer changes.`}</Text> : null}
        {error ? <Text style={styles.error} accessibilityRole="alert">{error}</Text> : null}
      </Section>
      <WorkCautions />
      <DocumentsPanel kind="works" code={w.code} canEdit={canEditDocuments} photos />
    </Screen>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'center' },
  confirm: { gap: space.sm },
  plain: { ...type.body },
  small: { ...type.small },
  warn: { ...type.body, color: colors.warn },
  error: { ...type.body, color: colors.bad },
});

/**
 * A running import, step by step: the stages it goes through (each marked
 * waiting, now or done in words, not colour alone) and a bar for the stage
 * it is in, from the progress route polled while the import's request is
 * open (src/api/queries/network.ts useImportProgress). Before the server
 * has heard of the import (the file is still on its way) it says so.
 */
import { StyleSheet, Text, View } from 'react-native';
import { formatCount } from '@/shared/format';
import type { ImportProgress, ImportStage } from '@/shared/schemas/import';
import { useImportProgress } from '@/src/api/queries/network';
import { colors, fonts, space, type } from '@/src/theme';

const STEPS: Array<{ stage: ImportStage; label: string; unit: string }> = [
  { stage: 'reading', label: 'Sending and reading the file', unit: '' },
  { stage: 'validating', label: 'Checking every record', unit: 'records' },
  { stage: 'writing', label: 'Writing to the database', unit: 'records' },
  { stage: 'rebuilding', label: 'Rebuilding the served network', unit: '' },
];

export function stepsFor(dryRun: boolean) {
  return dryRun ? STEPS.slice(0, 2) : STEPS;
}

/** Percent of the current stage, 0 to 100. */
export function stagePercent(p: ImportProgress | undefined): number {
  if (!p || p.total <= 0) return 0;
  return Math.max(0, Math.min(100, Math.round((100 * p.done) / p.total)));
}

export function ImportProgressView({ progressId, dryRun }: { progressId: string; dryRun: boolean }) {
  const answer = useImportProgress(progressId).data;
  // pending: the upload has not reached the server yet
  const data = answer && answer.stage !== 'pending' ? answer : undefined;
  const steps = stepsFor(dryRun);
  const current = data ? steps.findIndex((s) => s.stage === data.stage) : 0;
  const finished = data?.stage === 'done';
  const step = steps[Math.max(0, current)];
  const percent = finished ? 100 : stagePercent(data);
  const figures = data && data.total > 0 && step.unit ? ` (${formatCount(data.done)} of ${formatCount(data.total)} ${step.unit})` : '';
  const headline = finished ? 'Finishing' : `${step.label}: ${percent} %${figures}`;
  return (
    <View style={styles.wrap} testID="import-progress">
      {steps.map((s, i) => {
        const state = finished || (current >= 0 && i < current) ? 'done' : i === Math.max(0, current) ? 'now' : 'waiting';
        return (
          <Text key={s.stage} style={[styles.step, state === 'now' ? styles.now : null]} testID={`import-stage-${s.stage}`}>
            {`${state === 'done' ? '✓' : state === 'now' ? '▶' : '○'} ${s.label} — ${state === 'done' ? 'done' : state === 'now' ? 'now' : 'waiting'}`}
          </Text>
        );
      })}
      <View
        accessibilityRole="progressbar"
        accessibilityLabel={headline}
        accessibilityValue={{ min: 0, max: 100, now: percent }}
        testID="import-progress-bar"
        style={styles.track}
      >
        <View style={[styles.bar, { width: `${Math.max(2, percent)}%` }]} />
      </View>
      <Text style={styles.body} accessibilityLiveRegion="polite" testID="import-progress-text">
        {data ? headline : 'Sending the file to the server…'}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  step: { ...type.body, fontSize: 15 },
  now: { fontFamily: fonts.textBold },
  body: { ...type.body, fontSize: 16 },
  track: { height: 12, borderRadius: 6, backgroundColor: colors.accentSoft, overflow: 'hidden' },
  bar: { height: 12, backgroundColor: colors.accent },
});

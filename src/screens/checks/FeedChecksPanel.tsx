/**
 * One feed's engineering screening (GET /api/feeds/:code/checks), for the feed's own page:
 * failures first, then where the receive antenna points, then every check in words.
 *
 *   <FeedChecksPanel code="R-GWN.MX2.M" />
 */
import { StyleSheet, Text, View } from 'react-native';
import { useFeedChecks } from '@/src/api/queries/checks';
import type { FeedChecksReply } from '@/src/api/schemas';
import { Section } from '@/src/components/layout/Section';
import { ErrorState, LoadingState } from '@/src/components/states';
import { StatusShape } from '@/src/components/StatusShape';
import { colors, radius, space, type } from '@/src/theme';
import { CheckRow } from './CheckRow';
import { CHECK_SHORT, verdictOf } from './checkWords';
import { FigureList } from './FigureList';
import { formatBearing, formatFigure } from '@/shared/format';
import { MastCautions } from './MastCautions';
import { ScreeningCaution } from './ScreeningCaution';

const VERDICT_LOOK = {
  fails: { shape: 'cross', ink: colors.bad, fill: colors.badSoft },
  clear: { shape: 'solid', ink: colors.good, fill: colors.goodSoft },
  noneApply: { shape: 'ring', ink: colors.inkMuted, fill: colors.surface },
} as const;

function VerdictBox({ answer }: { answer: FeedChecksReply }) {
  const v = verdictOf(answer.checks, answer.warnings);
  const look = VERDICT_LOOK[v.kind];
  return (
    <View style={[styles.verdict, { borderColor: look.ink, backgroundColor: look.fill }]} accessibilityRole={v.kind === 'fails' ? 'alert' : undefined} testID="feed-checks-verdict">
      <View style={styles.verdictHead}>
        <StatusShape shape={look.shape} color={look.ink} size={18} />
        <Text style={[styles.verdictTitle, { color: v.kind === 'noneApply' ? colors.ink : look.ink }]}>{v.words}</Text>
      </View>
      {answer.warnings.map((w) => (
        <Text key={w} style={styles.warning} selectable>
          {w}
        </Text>
      ))}
      {v.reason ? <Text style={styles.warning}>{v.reason}</Text> : null}
      {v.notComputed > 0 ? (
        <Text style={styles.missing}>{`${v.notComputed === 1 ? '1 check was' : `${v.notComputed} checks were`} not computed: a value is missing from the record (see below).`}</Text>
      ) : null}
    </View>
  );
}

function Geometry({ answer }: { answer: FeedChecksReply }) {
  const items = [
    { label: 'Distance (WGS84)', value: formatFigure(answer.distanceKm, 'km'), testID: 'feed-checks-distance' },
    { label: 'Bearing to the source site', value: formatBearing(answer.bearingDeg), hint: 'where the receive antenna points (true north)', testID: 'feed-checks-bearing' },
    { label: 'Reverse bearing', value: formatBearing(answer.reverseBearingDeg), hint: 'from the source site towards this relay', testID: 'feed-checks-reverse-bearing' },
  ];
  if (answer.rxFrequencyMHz != null) items.push({ label: 'Receive frequency', value: formatFigure(answer.rxFrequencyMHz, 'MHz'), testID: 'feed-checks-frequency' });
  return <FigureList items={items} />;
}

export function FeedChecksPanel({ code }: { code: string }) {
  const query = useFeedChecks(code);
  const answer = query.data;
  return (
    <Section title="Feed checks" note={answer ? `Screening of feed ${answer.feed}, ${answer.medium}` : undefined} testID="feed-checks">
      {answer ? (
        <>
          <VerdictBox answer={answer} />
          <Geometry answer={answer} />
          {verdictOf(answer.checks, answer.warnings).kind === 'noneApply' ? (
            // Eight rows all saying "does not apply" for the same reason tell nothing more than one line.
            <Text style={styles.noneApply} testID="feed-checks-none-apply">{`Not screened for a ${answer.medium} feed: ${answer.checks.map((c) => CHECK_SHORT[c.name].toLowerCase()).join(', ')}.`}</Text>
          ) : (
            <View style={styles.list} role="list" aria-label={`Checks of feed ${answer.feed}`}>
              {answer.checks.map((c) => (
                <CheckRow key={c.name} check={c} />
              ))}
            </View>
          )}
          {query.error ? <Text style={styles.stale}>Showing the last checks received; refreshing failed.</Text> : null}
          <ScreeningCaution />
          <MastCautions />
        </>
      ) : query.error ? (
        <ErrorState what={`the checks of feed ${code}`} error={query.error} onRetry={() => void query.mutate()} />
      ) : (
        <LoadingState what={`the checks of feed ${code}`} />
      )}
    </Section>
  );
}

const styles = StyleSheet.create({
  verdict: { borderWidth: 1, borderLeftWidth: 6, borderRadius: radius.md, padding: space.md, gap: space.xs },
  verdictHead: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  verdictTitle: { ...type.label, fontSize: 17, lineHeight: 22 },
  warning: { ...type.body, fontSize: 16, lineHeight: 22 },
  missing: { ...type.body, fontSize: 15, lineHeight: 20, color: colors.ink },
  list: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.lg, backgroundColor: colors.surface, overflow: 'hidden' },
  stale: { ...type.small },
  noneApply: { ...type.small },
});

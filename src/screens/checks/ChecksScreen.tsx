/**
 * Every failing feed check in the network, worst first (GET /api/checks), with filters by
 * kind of check and severity kept in the URL. Cards on a phone, a table on a wide window.
 */
import { Link } from 'expo-router';
import { useMemo } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import type { CheckSeverity } from '@/shared/schemas/checks';
import { useCheckFailures } from '@/src/api/queries/checks';
import { Choice } from '@/src/components/Choice';
import { Screen } from '@/src/components/layout/Screen';
import { Section } from '@/src/components/layout/Section';
import { EmptyState, ErrorState, LoadingState } from '@/src/components/states';
import { useBreakpoints } from '@/src/hooks/useBreakpoints';
import { colors, radius, space, TOUCH_MIN, type } from '@/src/theme';
import { CheckChips } from './CheckChips';
import { CHECK_SHORT } from './checkWords';
import { applyFilter, chipLabel, countFailures, summaryWords, toggleCheck, type FailureFilter } from './failureList';
import { FailureCards, FailureTable } from './FailureViews';
import { MastCautions } from './MastCautions';
import { ScreeningCaution } from './ScreeningCaution';

const SEVERITY_OPTIONS: readonly { value: CheckSeverity; label: string }[] = [
  { value: 'error', label: 'Errors only' },
  { value: 'warning', label: 'Errors and warnings' },
];

export interface ChecksScreenProps {
  filter: FailureFilter;
  onFilter: (next: FailureFilter) => void;
}

function CalculatorLink() {
  return (
    <Link href={'/calculator'} asChild>
      <Pressable accessibilityRole="link" accessibilityLabel="Open the calculator" style={styles.calcLink} testID="open-calculator">
        <Text style={styles.calcLinkText}>Open the calculator</Text>
      </Pressable>
    </Link>
  );
}

export function ChecksScreen({ filter, onFilter }: ChecksScreenProps) {
  const { wide } = useBreakpoints();
  // One request for every failure: switching severity then filters at once, without a round trip.
  const query = useCheckFailures('warning');
  const all = useMemo(() => query.data?.failures ?? [], [query.data]);
  const shown = useMemo(() => applyFilter(all, filter), [all, filter]);
  const allCounts = useMemo(() => countFailures(all), [all]);
  const shownCounts = useMemo(() => countFailures(shown), [shown]);

  // Chips for every kind that fails somewhere, plus any already chosen (so it can be turned off).
  const chipKinds = allCounts.byCheck.map((b) => b.name);
  for (const name of filter.checks) if (!chipKinds.includes(name)) chipKinds.push(name);
  const chipOptions = chipKinds.map((name) => ({ value: name, label: chipLabel(name, allCounts.byCheck.find((b) => b.name === name)?.count ?? 0) }));

  const filtered = shown.length !== all.length;
  const note = query.data ? `${summaryWords(shownCounts)}${filtered ? ` (of ${allCounts.total} in all)` : ''}` : undefined;

  return (
    <Screen title="Checks" subtitle="Feed checks that fail anywhere in the network, worst first" actions={<CalculatorLink />} testID="checks-screen">
      <Section title="Show" testID="checks-filters">
        <Choice label="Severity" options={SEVERITY_OPTIONS} value={filter.severity} onChange={(severity) => onFilter({ ...filter, severity })} testID="severity" />
        {chipOptions.length > 0 ? (
          <CheckChips label="Kind of check (none chosen: all)" options={chipOptions} chosen={filter.checks} onToggle={(name) => onFilter(toggleCheck(filter, name))} testID="check-kind" />
        ) : null}
      </Section>

      <Section title="Failing checks" note={note} testID="failing-checks">
        {query.data ? (
          <>
            <View style={styles.counts} testID="failing-checks-counts">
              <Text style={styles.count}>{`Errors: ${shownCounts.errors}`}</Text>
              <Text style={styles.count}>{`Warnings: ${shownCounts.warnings}`}</Text>
              <Text style={styles.count}>{`Feeds: ${shownCounts.feeds}`}</Text>
              {query.data.networkVersion !== undefined ? <Text style={styles.version}>{`Network version ${query.data.networkVersion}`}</Text> : null}
            </View>
            {shown.length === 0 ? (
              all.length === 0 ? (
                <EmptyState title="No check fails" message="Every feed passes the checks that could be computed. Checks that could not be computed are listed on each feed's page." testID="failing-checks-none" />
              ) : (
                <EmptyState
                  title="Nothing matches these filters"
                  message={`${allCounts.total} failing checks are hidden by the filters${filter.checks.length ? ` (${filter.checks.map((c) => CHECK_SHORT[c]).join(', ')})` : ''}.`}
                  testID="failing-checks-filtered-out"
                />
              )
            ) : wide ? (
              <FailureTable failures={shown} />
            ) : (
              <FailureCards failures={shown} />
            )}
            {query.error ? <Text style={styles.stale}>Showing the last list received; refreshing failed.</Text> : null}
          </>
        ) : query.error ? (
          <ErrorState what="the failing checks" error={query.error} onRetry={() => void query.mutate()} />
        ) : (
          <LoadingState what="the failing checks" />
        )}
      </Section>

      <ScreeningCaution />
      <MastCautions />
    </Screen>
  );
}

const styles = StyleSheet.create({
  counts: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'center' },
  count: { ...type.figure, backgroundColor: colors.surface, borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, paddingHorizontal: space.md, paddingVertical: space.xs },
  version: { ...type.small },
  stale: { ...type.small },
  calcLink: { minHeight: TOUCH_MIN, justifyContent: 'center', paddingHorizontal: space.lg, borderWidth: 2, borderColor: colors.accent, borderRadius: radius.md, backgroundColor: colors.surface, alignSelf: 'flex-start' },
  calcLinkText: { ...type.label, fontSize: 17, color: colors.accent },
});
